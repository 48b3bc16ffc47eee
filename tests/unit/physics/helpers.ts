// Shared helpers of the engine tests.
import type { Field } from '#shared/physics/field'

/** Every ±s helicity list of length n. */
export function allHelicities(n: number, s = 1): number[][] {
  const out: number[][] = []
  for (let m = 0; m < 1 << n; m++) out.push(Array.from({ length: n }, (_, t) => (m & (1 << t) ? s : -s)))
  return out
}

export function countMinus(h: readonly number[]): number {
  return h.filter((x) => x < 0).length
}

/** |a − b| / |b| (|a| when b is zero). */
export function relDiff<T>(F: Field<T>, a: T, b: T): number {
  const d = F.abs(F.sub(a, b))
  const s = F.abs(b)
  return s === 0 ? d : d / s
}
