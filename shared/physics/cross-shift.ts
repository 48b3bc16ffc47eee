// The cross-shift check: the same amplitude under every [i,j⟩ shift. For a consistent theory all
// valid shifts agree; at n = 4 this is the four-particle test (Benincasa & Cachazo,
// arXiv:0705.4305; higher spins McGady & Rodina, arXiv:1311.2938 — references from memory):
// spin 1, 3, 4 without colour give different residue sums under different shifts.
import { type Complex, Fraction, SingularError, complexField, rationalField as Q, type Field } from './field'
import { ddField } from './double-double'
import { fromDoubleDouble, rationalPoint, toDoubleDouble } from './kinematics'
import { det, momentumSum, sandwichOf, type Kin } from './spinors'
import { bcfw, splitRankOne } from './bcfw'
import { shiftedKin } from './falloff'
import { cubicScalarAllChannels } from './targets/cubic-scalar'
import { isValidShift, type Process } from './theories'

export interface CrossShiftRow<T> {
  /** 1-based. */
  shift: [number, number]
  valid: boolean
  /** Null when the shift meets a singular pole at this point. */
  value: T | null
}

export interface CrossShiftResult<T> {
  rows: CrossShiftRow<T>[]
  /** max |v_a − v_b| / max |v| over valid shifts (0 when fewer than two). */
  spread: number
  /** Every valid shift gives the same value (exactly, in exact arithmetic). */
  agree: boolean
  /**
   * Which test decided `agree`: `shifts` (the valid shifts agree), or `factorisation` where no
   * shift is valid (a single scalar species: every shift has a boundary term) and the candidate
   * amplitude, the sum of all cubic diagrams, is checked for the right residue on every pole.
   */
  test: 'shifts' | 'factorisation'
  /** With test `factorisation`: each pole (1-based legs of one side) and whether its residue is A_L·A_R. */
  poles?: { pole: number[]; factorises: boolean }[]
}

/** δ of the residue limit: the O(δ) remainder is far below the 1e-20 the check allows. */
const RESIDUE_DELTA = new Fraction(1n, 10n ** 40n)

/**
 * Factorisation of the all-diagram scalar amplitude at a seeded rational point: on every pole
 * P_S² = 0, reached along a shift [i,j⟩ with i ∈ S, j ∉ S, lim (z − z*) A(z) must equal
 * A_L(z*) A_R(z*) / ⟨i|P|j], since P̂² = ⟨i|P|j] (z − z*). The limit is taken at z* + δ exactly.
 */
export function scalarFactorisation(n: number, seed: number | string = 'factorisation', amplitude: (k: Kin<Fraction>) => Fraction = (k) => cubicScalarAllChannels(Q, k)): { pole: number[]; factorises: boolean }[] {
  const k = rationalPoint(n, `${String(seed)}:${n}`)
  const out: { pole: number[]; factorises: boolean }[] = []
  for (let mask = 1; mask < 1 << n; mask++) {
    const S = Array.from({ length: n }, (_, t) => t).filter((t) => mask & (1 << t))
    if (!S.includes(0) || S.length < 2 || S.length > n - 2) continue
    const R = Array.from({ length: n }, (_, t) => t).filter((t) => !S.includes(t))
    const i = 0
    const j = R[0]!
    const P = momentumSum(Q, k, S)
    const ipj = sandwichOf(Q, k.lambda[i]!, P, k.lambdaTilde[j]!)
    const zs = det(Q, P).neg().div(ipj)
    const near = amplitude(shiftedKin(k, i, j, zs.add(RESIDUE_DELTA)))
    const residue = near.mul(RESIDUE_DELTA)
    // the two sides at z*, the internal leg −P̂ on the left and +P̂ on the right
    const at = shiftedKin(k, i, j, zs)
    const Phat = momentumSum(Q, at, S)
    const sp = splitRankOne(Q, Phat)
    const side = (legs: number[], lt: [Fraction, Fraction]) =>
      cubicScalarAllChannels(Q, { lambda: [...legs.map((t) => at.lambda[t]!), sp.lambda], lambdaTilde: [...legs.map((t) => at.lambdaTilde[t]!), lt] })
    const expected = side(S, [sp.lambdaTilde[0].neg(), sp.lambdaTilde[1].neg()]).mul(side(R, sp.lambdaTilde)).div(ipj)
    out.push({ pole: S.map((t) => t + 1), factorises: residue.sub(expected).abs().compare(expected.abs().mul(new Fraction(1n, 10n ** 20n))) <= 0 })
  }
  return out
}

export function crossShift<T>(F: Field<T>, p: Process, k: Kin<T>, h: number[], tolerance = 1e-9): CrossShiftResult<T> {
  if ((F as unknown) === complexField && p.theory !== 'gluon') {
    // gravitons, spin s and the cubic scalar in doubles: evaluate in double-double (see toDoubleDouble), report doubles
    // T is Complex here (F is complexField): TypeScript cannot narrow a type parameter by a value.
    const r = crossShift(ddField, p, toDoubleDouble(k as unknown as Kin<Complex>), h, tolerance)
    const rows = r.rows.map((x) => ({ ...x, value: x.value === null ? null : (fromDoubleDouble(x.value) as unknown as T) }))
    return { ...r, rows }
  }
  const n = h.length
  const rows: CrossShiftRow<T>[] = []
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
    if (i === j) continue
    let value: T | null = null
    try {
      value = bcfw(F, p, k, h, [i, j]).value
    }
    catch (e) {
      if (!(e instanceof SingularError)) throw e
    }
    rows.push({ shift: [i + 1, j + 1], valid: isValidShift(p, h, i, j), value })
  }
  const vals = rows.filter((r) => r.valid && r.value !== null).map((r) => r.value as T)
  let spread = 0
  let exactAgree = true
  const scale = Math.max(0, ...vals.map((v) => F.abs(v)))
  for (let a = 0; a < vals.length; a++) for (let b = a + 1; b < vals.length; b++) {
    const d = F.sub(vals[a]!, vals[b]!)
    if (!F.isZero(d)) exactAgree = false
    if (scale > 0) spread = Math.max(spread, F.abs(d) / scale)
  }
  if (p.s === 0 && !p.colourOrdered) {
    const poles = scalarFactorisation(n)
    return { rows, spread, agree: poles.every((x) => x.factorises), test: 'factorisation', poles }
  }
  return { rows, spread, agree: F.kind === 'exact' ? exactAgree : spread <= tolerance, test: 'shifts' }
}
