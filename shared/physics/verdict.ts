// Verdicts of docs/conventions.md "Verdicts", and the deviation measure.
import type { Arithmetic, Field } from './field'

export type Verdict = 'singular point' | 'not evaluated' | 'boundary term suspected' | 'agrees' | 'disagrees'

/**
 * Float tolerance on the relative deviation: 1e-9 up to n = 8, doubling with every further leg
 * (rounding grows with the number of terms), never above 1e-7: n = 12 → 1.6e-8.
 * docs/conventions.md "Verdicts" puts 1e-9 as sound for generic points.
 */
export function floatTolerance(n: number): number {
  return Math.min(1e-7, 1e-9 * 2 ** Math.max(0, n - 8))
}

/**
 * |value − target| / |target|; for a target that is exactly zero, |value| / max |term| (0 when
 * everything is zero). In exact arithmetic the ratio is formed exactly, then turned into a double.
 */
export function deviationOf<T>(F: Field<T>, value: T, target: T, terms: readonly T[]): number {
  const diff = F.sub(value, target)
  if (F.isZero(diff)) return 0
  if (!F.isZero(target)) return F.kind === 'exact' ? F.abs(F.div(diff, target)) : F.abs(diff) / F.abs(target)
  const largest = Math.max(0, ...terms.map((t) => F.abs(t)))
  if (largest === 0) return F.abs(value) === 0 ? 0 : Infinity
  return F.abs(value) / largest
}

export interface VerdictInput {
  singular: boolean
  targetNone: boolean
  /** Valid by the table of valid shifts (docs/conventions.md "Falloff"). */
  shiftValidByTable: boolean
  /** The probed exponent, when probed. */
  probedExponent: number | null
  /** The class vanishes identically: A(z) ≡ 0, so no shift can miss a boundary term. */
  vanishing: boolean
  arithmetic: Arithmetic
  n: number
  deviation: number
  /** Exact arithmetic: value and target are equal rationals. */
  exactEqual: boolean
}

export function decideVerdict(v: VerdictInput): Verdict {
  if (v.singular) return 'singular point'
  if (v.targetNone) return 'not evaluated'
  if (!v.vanishing && (!v.shiftValidByTable || (v.probedExponent !== null && v.probedExponent >= 0))) return 'boundary term suspected'
  if (v.arithmetic === 'exact') return v.exactEqual ? 'agrees' : 'disagrees'
  return v.deviation <= floatTolerance(v.n) ? 'agrees' : 'disagrees'
}

/**
 * A float deviation above the tolerance that lies within what the arithmetic could resolve at this
 * point (≤ 100 × the estimated precision, itself above the tolerance) decides nothing: the verdict
 * `disagrees` becomes `not evaluated` (with a `precision loss` warning beside it).
 */
export function lostPrecision(verdict: Verdict, n: number, deviation: number | null, estimated: number | null): boolean {
  return verdict === 'disagrees' && estimated !== null && deviation !== null && estimated > floatTolerance(n) && deviation <= 100 * estimated
}
