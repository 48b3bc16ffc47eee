// Helpers shared by the target tests. Points come from the core's seeded generators
// (shared/physics/kinematics.ts), which redraw until a point is well-conditioned.
import type { Complex } from '../../../../shared/physics/field'
import type { Kin } from '../../../../shared/physics/spinors'

export { randomPoint as randomComplexPoint, rationalPoint as randomRationalPoint } from '../../../../shared/physics/kinematics'

/** The point with legs relabelled: leg a of the result is leg perm[a] of k. */
export function permuteKin<T>(k: Kin<T>, perm: readonly number[]): Kin<T> {
  return { lambda: perm.map((p) => k.lambda[p]!), lambdaTilde: perm.map((p) => k.lambdaTilde[p]!) }
}

export function relDiff(a: Complex, b: Complex): number {
  return a.sub(b).abs() / Math.max(a.abs(), b.abs(), 1e-300)
}
