// Helpers shared by the target tests. Points come from the core's seeded generators
// (shared/physics/kinematics.ts), which redraw until a point is well-conditioned.
import { expect } from 'vitest'
import { Complex, complexField } from '#shared/physics/field'
import type { Kin } from '#shared/physics/spinors'
import { solveLastTwo } from '#shared/physics/kinematics'

export { randomPoint as randomComplexPoint, rationalPoint as randomRationalPoint } from '#shared/physics/kinematics'

/** The point with legs relabelled: leg a of the result is leg perm[a] of k. */
export function permuteKin<T>(k: Kin<T>, perm: readonly number[]): Kin<T> {
  return { lambda: perm.map((p) => k.lambda[p]!), lambdaTilde: perm.map((p) => k.lambdaTilde[p]!) }
}

export function relDiff(a: Complex, b: Complex): number {
  return a.sub(b).abs() / Math.max(a.abs(), b.abs(), 1e-300)
}

/**
 * The hard point with a soft leg inserted at `position`: λ̃_s → ε λ̃_s for a positive-helicity soft
 * leg, λ_s → ε λ_s for a negative one; momentum conservation is restored on the last two legs.
 */
export function withSoftLeg(hard: Kin<Complex>, position: number, eps: number, plus: boolean): Kin<Complex> {
  const ls: [Complex, Complex] = [new Complex(0.3, -0.7), new Complex(-0.4, 0.2)]
  const lts: [Complex, Complex] = [new Complex(0.6, 0.1), new Complex(0.25, -0.5)]
  const e = new Complex(eps, 0)
  const l: [Complex, Complex] = plus ? ls : [ls[0].mul(e), ls[1].mul(e)]
  const lt: [Complex, Complex] = plus ? [lts[0].mul(e), lts[1].mul(e)] : lts
  const lambda = [...hard.lambda]
  const lambdaTilde = [...hard.lambdaTilde]
  lambda.splice(position, 0, l)
  lambdaTilde.splice(position, 0, lt)
  return solveLastTwo(complexField, { lambda, lambdaTilde })
}

/**
 * A leading soft factor is right when the relative deviation is small and falls like ε (ten times
 * smaller ε, about ten times smaller deviation), or is at rounding level throughout.
 */
export function expectSubleading(dev: (eps: number) => number): void {
  const d1 = dev(1e-4)
  const d2 = dev(1e-5)
  expect(d1).toBeLessThan(1e-2)
  if (d1 > 1e-10) {
    expect(d2 / d1).toBeGreaterThan(0.05)
    expect(d2 / d1).toBeLessThan(0.2)
  }
  else expect(d2).toBeLessThan(1e-10)
}
