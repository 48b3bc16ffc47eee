// Parke–Taylor formula for colour-ordered gluon amplitudes (Parke & Taylor, PRL 56 (1986) 2459),
// in the conventions of docs/conventions.md:
//   MHV:       A_n(…i⁻…j⁻…) = ⟨ij⟩⁴ / (⟨12⟩⟨23⟩…⟨n1⟩)
//   conjugate: A_n(…i⁺…j⁺…) = (−1)ⁿ [ij]⁴ / ([12][23]…[n1])
// The BCFW core calls this for MHV sub-blocks, so the loop allocates nothing beyond the Field ops.
import { SingularError, negligible, spinorSize, type Field } from '../field'
import type { Kin } from '../spinors'
import { PhysicsError } from '../errors'

/** Which closed form applies: two minus legs (MHV), two plus legs (anti-MHV), or neither. */
export interface MhvClass {
  kind: 'mhv' | 'anti-mhv' | 'vanishing' | 'other'
  /** The two special legs (0-based), when kind is mhv or anti-mhv. */
  i: number
  j: number
}

/**
 * Classifies gluon helicities (±1). n ≥ 4 with fewer than two minus or two plus helicities
 * vanishes identically at tree level. At n = 4 (−−++ type) MHV is reported first.
 */
export function classifyGluon(helicities: readonly number[]): MhvClass {
  const n = helicities.length
  let minus = 0
  let plus = 0
  let m0 = -1, m1 = -1, p0 = -1, p1 = -1
  for (let a = 0; a < n; a++) {
    const h = helicities[a]!
    if (h === -1) {
      if (minus === 0) m0 = a
      else if (minus === 1) m1 = a
      minus++
    }
    else if (h === 1) {
      if (plus === 0) p0 = a
      else if (plus === 1) p1 = a
      plus++
    }
    else {
      throw new PhysicsError(`helicities[${a}]`, `a gluon has helicity ±1`)
    }
  }
  if (minus === 2) return { kind: 'mhv', i: m0, j: m1 }
  if (plus === 2) return { kind: 'anti-mhv', i: p0, j: p1 }
  if (n >= 4 && (minus < 2 || plus < 2)) return { kind: 'vanishing', i: -1, j: -1 }
  return { kind: 'other', i: -1, j: -1 }
}

/** The checks every target makes: at least three legs, and one spinor pair per helicity. */
export function checkTargetPoint<T>(k: Kin<T>, n: number, target: string): void {
  if (n < 3) throw new PhysicsError('target', `${target} needs at least three legs`)
  if (k.lambda.length !== n || k.lambdaTilde.length !== n) {
    throw new PhysicsError('target', 'the kinematics and the helicities have different lengths')
  }
}

/** Parke–Taylor for MHV or anti-MHV helicities; zero for the identically vanishing classes. */
export function parkeTaylor<T>(F: Field<T>, k: Kin<T>, helicities: number[]): T {
  checkTargetPoint(k, helicities.length, 'Parke–Taylor')
  const c = classifyGluon(helicities)
  if (c.kind === 'vanishing') return F.zero
  if (c.kind === 'other') {
    throw new PhysicsError('target', 'Parke–Taylor applies only to MHV helicities and their parity conjugate')
  }
  return c.kind === 'mhv' ? parkeTaylorMhv(F, k, c.i, c.j) : parkeTaylorAntiMhv(F, k, c.i, c.j)
}

const ADJ_ANGLE = 'an angle bracket of adjacent legs vanishes'
const ADJ_SQUARE = 'a square bracket of adjacent legs vanishes'

// The two closed forms are written out separately (not through a bracket callback): the BCFW core
// calls them for every MHV sub-block.

/** ⟨ij⟩⁴ / (⟨12⟩…⟨n1⟩) with negative-helicity legs i, j (0-based); no helicity checks. */
export function parkeTaylorMhv<T>(F: Field<T>, k: Kin<T>, i: number, j: number): T {
  const L = k.lambda
  const n = L.length
  let den = F.one
  for (let a = 0; a < n; a++) {
    const x = L[a]!
    const y = L[a + 1 === n ? 0 : a + 1]!
    const b = F.sub(F.mul(x[0], y[1]), F.mul(x[1], y[0]))
    if (F.zeroTolerance !== undefined && negligible(F, b, spinorSize(F, x) * spinorSize(F, y))) throw new SingularError(ADJ_ANGLE)
    den = F.mul(den, b)
  }
  const li = L[i]!, lj = L[j]!
  const ij = F.sub(F.mul(li[0], lj[1]), F.mul(li[1], lj[0]))
  const ij2 = F.mul(ij, ij)
  return F.div(F.mul(ij2, ij2), den, ADJ_ANGLE)
}

/** (−1)ⁿ [ij]⁴ / ([12]…[n1]) with positive-helicity legs i, j (0-based); no helicity checks. */
export function parkeTaylorAntiMhv<T>(F: Field<T>, k: Kin<T>, i: number, j: number): T {
  const Lt = k.lambdaTilde
  const n = Lt.length
  let den = F.one
  for (let a = 0; a < n; a++) {
    const x = Lt[a]!
    const y = Lt[a + 1 === n ? 0 : a + 1]!
    const b = F.sub(F.mul(x[1], y[0]), F.mul(x[0], y[1]))
    if (F.zeroTolerance !== undefined && negligible(F, b, spinorSize(F, x) * spinorSize(F, y))) throw new SingularError(ADJ_SQUARE)
    den = F.mul(den, b)
  }
  const ti = Lt[i]!, tj = Lt[j]!
  const ij = F.sub(F.mul(ti[1], tj[0]), F.mul(ti[0], tj[1]))
  const ij2 = F.mul(ij, ij)
  const v = F.div(F.mul(ij2, ij2), den, ADJ_SQUARE)
  return n % 2 === 0 ? v : F.neg(v)
}
