// Shared pieces of the limit and identity checks: amplitudes of a process at any point (BCFW under
// the default valid shift), relabelled points, re-solving momentum conservation on two chosen legs,
// and the least-squares rate of a deviation along a path.
import type { Field } from '../field'
import { solveLastTwo } from '../kinematics'
import type { Kin, Spinor } from '../spinors'
import { bcfw } from '../bcfw'
import { defaultShift, vanishes, type Process } from '../theories'
import { fit } from '../falloff'

/** The amplitude of the process at a point by BCFW under the default (valid) shift. */
export function amplitude<T>(F: Field<T>, p: Process, k: Kin<T>, h: number[]): T {
  if (h.length === 3) throw new RangeError('three-point amplitudes need degenerate kinematics')
  if (vanishes(p, h)) return F.zero
  return bcfw(F, p, k, h, defaultShift(p, h)).value
}

/** The point with legs relabelled: leg a of the result is leg perm[a] of k. */
export function permuteKin<T>(k: Kin<T>, perm: readonly number[]): Kin<T> {
  return { lambda: perm.map((q) => k.lambda[q]!), lambdaTilde: perm.map((q) => k.lambdaTilde[q]!) }
}

/** Exact momentum conservation by re-solving the square spinors of legs a and b (0-based). */
export function solveOn<T>(F: Field<T>, k: Kin<T>, a: number, b: number): Kin<T> {
  const n = k.lambda.length
  const order = [...Array.from({ length: n }, (_, t) => t).filter((t) => t !== a && t !== b), a, b]
  const solved = solveLastTwo(F, permuteKin(k, order))
  const back = new Array<number>(n)
  order.forEach((q, t) => (back[q] = t))
  return permuteKin(solved, back)
}

export function scaleSpinor<T>(F: Field<T>, c: T, s: Spinor<T>): Spinor<T> {
  return [F.mul(c, s[0]), F.mul(c, s[1])]
}

/** Rate r of |dev| ~ x^r along a path (least squares in log-log), over the points above rounding. */
export function rateOf(xs: number[], devs: number[], floor: number): number | null {
  const use = xs.map((x, t) => [x, devs[t]!] as const).filter(([, d]) => d > floor && Number.isFinite(d))
  if (use.length < 2) return null
  return fit(use.map(([x]) => Math.log(x)), use.map(([, d]) => Math.log(d))).slope
}

/** The path ε = 10⁻¹ … 10⁻⁸ of the soft and collinear checks. */
export const DEFAULT_PATH = [1e-1, 1e-2, 1e-3, 1e-4, 1e-5, 1e-6, 1e-7, 1e-8]
