// The large-z behaviour of A(z) along an [i,j⟩ shift. Double precision cannot measure it
// (docs/conventions.md "Falloff"), so it is measured exactly at a seeded rational point of the
// same process, with A(z) at the shifted (still on-shell, momentum-conserving) point computed by
// BCFW under another shift that is valid there.
import { Fraction, rationalField as Q, SingularError, type Field } from './field'
import { byPrimes } from './modular'
import type { Kin, Spinor } from './spinors'
import { rationalPoint } from './kinematics'
import { bcfw, cheapestShift } from './bcfw'
import { classifyGluon, parkeTaylorAntiMhv, parkeTaylorMhv } from './targets/parke-taylor'
import { berendsGiele } from './targets/berends-giele'
import { cubicScalarAllChannels, cubicScalarFeynman } from './targets/cubic-scalar'
import { PhysicsError } from './errors'
import { quarkLine, quarkLineBerendsGiele } from './targets/quark-line'
import { quarkLines, quarkLinesBerendsGiele } from './targets/quark-lines'
import { GLUON_PDG } from './quarks'
import { defaultShift, isValidShift, processOf, tableExponent, vanishes, type Process, type TheoryName } from './theories'

/** The probe points z = 10^6, 10^7, 10^8 (exact, so size costs only digits): O(1/z) corrections stay far below 0.5. */
export const PROBE_Z = [10n ** 6n, 10n ** 7n, 10n ** 8n]

export interface FalloffResult {
  exponent: number
  valid: boolean
  /** Largest distance of a two-point slope from the fitted slope. */
  spread: number
  /** The unrounded log-log slope. */
  slope: number
  /** False when the amplitude vanishes identically and the exponent is the table's. */
  measured: boolean
}

/** ln|x| of an exact rational without overflowing a double. */
export function lnAbs(x: Fraction): number {
  const ln = (b: bigint) => {
    const s = b.toString()
    const head = Number(s.slice(0, 17))
    return Math.log(head) + (s.length - Math.min(17, s.length)) * Math.LN10
  }
  return ln(x.n) - ln(x.d)
}

/** The [i,j⟩-shifted point (0-based): λ̃_i → λ̃_i + z λ̃_j, λ_j → λ_j − z λ_i. */
export function shiftedKin(k: Kin<Fraction>, i: number, j: number, z: Fraction): Kin<Fraction> {
  const lt = k.lambdaTilde.slice()
  const l = k.lambda.slice()
  lt[i] = [lt[i]![0].add(z.mul(lt[j]![0])), lt[i]![1].add(z.mul(lt[j]![1]))] as Spinor<Fraction>
  l[j] = [l[j]![0].sub(z.mul(l[i]![0])), l[j]![1].sub(z.mul(l[i]![1]))] as Spinor<Fraction>
  return { lambda: l, lambdaTilde: lt }
}

/**
 * A valid shift other than [i,j⟩: the default rule's if it differs, else the first valid pair;
 * null when the theory has none (a single scalar species), so A(z) never comes from a shift that
 * misses a boundary term.
 */
export function validAlternativeShift(p: Process, h: readonly number[], i: number, j: number): [number, number] | null {
  const d = defaultShift(p, h)
  if (!(d[0] === i && d[1] === j) && isValidShift(p, h, d[0], d[1])) return d
  const n = h.length
  for (let a = 0; a < n; a++) for (let b = 0; b < n; b++) {
    if (a === b || (a === i && b === j)) continue
    if (isValidShift(p, h, a, b)) return [a, b]
  }
  return null
}

/** validAlternativeShift, or the default shift where no valid one exists (for the editor's own probe). */
export function alternativeShift(p: Process, h: readonly number[], i: number, j: number): [number, number] {
  return validAlternativeShift(p, h, i, j) ?? defaultShift(p, h)
}

/**
 * A(z) at the shifted point (docs/conventions.md allows any exact method there): for gluons
 * Parke–Taylor, BCFW under another valid shift or Berends–Giele, whichever is cheapest; the
 * planar diagram sum for the cubic scalar, the sum of all cubic diagrams for a single scalar
 * species; else BCFW under another valid shift.
 */
function amplitudeIn<T>(F: Field<T>, p: Process, k: Kin<T>, h: number[], alt: [number, number] | null): T {
  // quark lines: their Berends–Giele current, independent of any shift
  if (p.pdg && quarkLine(p.pdg)) return quarkLineBerendsGiele(F, k, h, p.pdg)
  if (p.pdg && quarkLines(p.pdg)?.length) return quarkLinesBerendsGiele(F, k, h, p.pdg)
  if (p.theory === 'gluon' || (p.theory === 'qcd' && p.pdg?.every((c) => c === GLUON_PDG) !== false)) {
    const c = classifyGluon(h)
    if (c.kind === 'mhv') return parkeTaylorMhv(F, k, c.i, c.j)
    if (c.kind === 'anti-mhv') return parkeTaylorAntiMhv(F, k, c.i, c.j)
    // BCFW while its closed-form count is small (measured faster up to ~300), else Berends–Giele
    return cheapestShift(h).cost <= 300 && alt ? bcfw(F, p, k, h, alt).value : berendsGiele(F, k, h)
  }
  if (p.theory === 'scalar-cubic') return cubicScalarFeynman(F, k)
  if (p.s === 0) return cubicScalarAllChannels(F, k)
  if (!alt) throw new PhysicsError('shift', 'no valid shift is known for this process, so the falloff cannot be measured')
  return bcfw(F, p, k, h, alt).value
}

/**
 * The same, exactly: modulo primes with rational reconstruction (modular.ts) unless the closed
 * form is cheaper in rationals; big rationals when the primes meet an exact zero (a retry follows).
 */
function amplitudeAt(p: Process, k: Kin<Fraction>, h: number[], alt: [number, number] | null): Fraction {
  const c = p.theory === 'gluon' || (p.theory === 'qcd' && !p.pdg?.some((x) => x !== GLUON_PDG)) ? classifyGluon(h).kind : null
  if (c === 'mhv' || c === 'anti-mhv') return amplitudeIn(Q, p, k, h, alt)
  const r = byPrimes(k, (F, km) => ({ shape: '', values: [amplitudeIn(F, p, km, h, alt)], info: null }), { key: `falloff:${p.theory}:${p.s}:${h.join(',')}:${p.pdg?.join(',') ?? ''}:${alt?.join(',') ?? '-'}` })
  return r ? r.values[0]! : amplitudeIn(Q, p, k, h, alt)
}

/** Least-squares slope of y against x (ln|A| against ln z), and the spread of the two-point slopes. */
export function fit(xs: number[], ys: number[]): { slope: number; spread: number } {
  const m = xs.length
  const mx = xs.reduce((a, b) => a + b, 0) / m
  const my = ys.reduce((a, b) => a + b, 0) / m
  let sxy = 0
  let sxx = 0
  for (let t = 0; t < m; t++) {
    sxy += (xs[t]! - mx) * (ys[t]! - my)
    sxx += (xs[t]! - mx) ** 2
  }
  const slope = sxy / sxx
  let spread = 0
  for (let t = 1; t < m; t++) spread = Math.max(spread, Math.abs((ys[t]! - ys[t - 1]!) / (xs[t]! - xs[t - 1]!) - slope))
  return { slope, spread }
}

/**
 * Measures the exponent k of |A(z)| ~ |z|^k under the [i,j⟩ shift (0-based) exactly, at a seeded
 * rational point of the process (the exponent is generic in the kinematics).
 */
export function probeFalloff(p: Process, h: number[], i: number, j: number, seed: number | string = 'falloff'): FalloffResult {
  const n = h.length
  if (vanishes(p, h)) {
    const e = tableExponent(p, h, i, j) ?? -2
    return { exponent: e, valid: e < 0, spread: 0, slope: e, measured: false }
  }
  const alt = validAlternativeShift(p, h, i, j)
  for (let attempt = 0; attempt < 20; attempt++) {
    // small numbers keep the exact probe fast; a rare spurious zero only costs a retry
    const k = rationalPoint(n, `${String(seed)}:${p.theory}:${p.s}:${n}:${attempt}`, { numerator: 9, denominator: 4 })
    try {
      const xs: number[] = []
      const ys: number[] = []
      for (const z of PROBE_Z) {
        const v = amplitudeAt(p, shiftedKin(k, i, j, new Fraction(z)), h, alt)
        if (Q.isZero(v)) throw new SingularError('A(z) = 0 at a probe point')
        xs.push(Math.log(Number(z)))
        ys.push(lnAbs(v))
      }
      const { slope, spread } = fit(xs, ys)
      const exponent = Math.round(slope) || 0 // no −0
      return { exponent, valid: exponent < 0, spread, slope, measured: true }
    }
    catch (e) {
      if (!(e instanceof SingularError)) throw e
    }
  }
  throw new SingularError('no regular rational point found for the falloff probe')
}

export interface FalloffRow {
  /** 1-based. */
  shift: [number, number]
  /** docs/conventions.md falloff table (null where it has none: spin s ≠ 2). */
  exponent: number | null
  valid: boolean
}

/** Exponent and validity of every [i,j⟩ shift by the falloff table (docs/conventions.md), for the editor. */
export function falloffTable(theory: TheoryName, helicities: number[], spin?: number, species?: readonly string[]): FalloffRow[] {
  // with species (qcd) the process carries the legs' codes, which the table rules read
  const p = species ? processOf(theory, spin, helicities, species) : processOf(theory, spin)
  const n = helicities.length
  const rows: FalloffRow[] = []
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
    if (i === j) continue
    rows.push({ shift: [i + 1, j + 1], exponent: tableExponent(p, helicities, i, j), valid: isValidShift(p, helicities, i, j) })
  }
  return rows
}
