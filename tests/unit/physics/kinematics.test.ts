// Kinematics: spinors of real momenta (docs/conventions.md), seeded points, RAMBO (Kleiss, Stirling,
// Ellis, Comput. Phys. Commun. 40 (1986) 359), and validation of given momenta.
import { describe, expect, it } from 'vitest'
import { complexField as C, rationalField as Q } from '#shared/physics/field'
import { det, momentumSum, outer } from '#shared/physics/spinors'
import {
  conditionRatio,
  momentumOfBispinor,
  physicalMomenta,
  physicalPoint,
  pointFromMomenta,
  randomPoint,
  rationalPoint,
  spinorsOfMomentum,
  type Momentum,
} from '#shared/physics/kinematics'
import { PhysicsError } from '#shared/physics/errors'

const all = (n: number) => Array.from({ length: n }, (_, i) => i)
const mass2 = (p: number[]) => p[0]! ** 2 - p[1]! ** 2 - p[2]! ** 2 - p[3]! ** 2

describe('spinors of a real massless momentum', () => {
  it.each([
    ['generic', [5, 3, 0, 4]],
    ['complex phase', [3, 1, 2, 2]],
    ['along −z (second branch)', [2, 0, 0, -2]],
    ['near −z', [1, 1e-6, 0, -Math.sqrt(1 - 1e-12)]],
    ['crossed incoming (p0 < 0)', [-3, 1, -2, 2]],
    ['crossed along +z', [-2, 0, 0, -2]],
  ] as [string, Momentum][])('%s: λ λ̃ᵀ reproduces the bispinor of p', (_, p) => {
    const s = spinorsOfMomentum(p)
    const P = outer(C, s.lambda, s.lambdaTilde)
    const back = momentumOfBispinor(P)
    back.forEach((x, m) => {
      expect(x.re).toBeCloseTo(p[m]!, 12)
      expect(Math.abs(x.im)).toBeLessThan(1e-12)
    })
  })

  it('p0 < 0: λ(p) = λ(−p), λ̃(p) = −λ̃(−p) (docs/conventions.md)', () => {
    const a = spinorsOfMomentum([-3, 1, -2, 2])
    const b = spinorsOfMomentum([3, -1, 2, -2])
    expect(a.lambda[0].equals(b.lambda[0]) && a.lambda[1].equals(b.lambda[1])).toBe(true)
    expect(a.lambdaTilde[0].equals(b.lambdaTilde[0].neg()) && a.lambdaTilde[1].equals(b.lambdaTilde[1].neg())).toBe(true)
  })

  it('the −z branch is λ = ((p1 − i p2)/√p−, √p−)', () => {
    const s = spinorsOfMomentum([2, 0, 0, -2])
    expect(s.lambda[0].abs()).toBe(0)
    expect(s.lambda[1].re).toBeCloseTo(2, 14)
    expect(s.lambdaTilde[1].re).toBeCloseTo(2, 14)
  })
})

describe('seeded points', () => {
  it.each([4, 5, 6, 8, 10, 12])('random complex point, n = %i: exact conservation, well-conditioned, reproducible', (n) => {
    const k = randomPoint(n, 42)
    const P = momentumSum(C, k, all(n))
    for (const row of P) for (const x of row) expect(x.abs()).toBeLessThan(1e-14)
    expect(conditionRatio(C, k)).toBeGreaterThanOrEqual(1e-3)
    const again = randomPoint(n, 42)
    expect(again.lambda[1]![0].equals(k.lambda[1]![0])).toBe(true)
    expect(randomPoint(n, 43).lambda[1]![0].equals(k.lambda[1]![0])).toBe(false)
  })

  it.each([4, 5, 6, 7, 9])('rational point, n = %i: Σp = 0 exactly, real, well-conditioned', (n) => {
    const k = rationalPoint(n, 'a')
    const P = momentumSum(Q, k, all(n))
    for (const row of P) for (const x of row) expect(Q.isZero(x)).toBe(true)
    expect(conditionRatio(Q, k)).toBeGreaterThanOrEqual(1e-3)
  })
})

describe('RAMBO physical points', () => {
  it.each([4, 5, 6, 8, 12])('n = %i: massless, conserving, √s = energy, legs 1, 2 incoming along ±z', (n) => {
    const E = 91.2
    const ps = physicalMomenta(n, 7, E)
    for (const p of ps) expect(Math.abs(mass2(p))).toBeLessThan(1e-9 * E * E)
    for (let m = 0; m < 4; m++) expect(Math.abs(ps.reduce((a, p) => a + p[m]!, 0))).toBeLessThan(1e-11 * E)
    expect(ps[0]).toEqual([-E / 2, 0, 0, -E / 2])
    expect(ps[1]).toEqual([-E / 2, 0, 0, E / 2])
    const out = ps.slice(2).reduce((a, p) => a + p[0], 0)
    expect(out).toBeCloseTo(E, 10)
    for (const p of ps.slice(2)) expect(p[0]).toBeGreaterThan(0)
  })

  it('the spinor point is real-momentum, conserving and well-conditioned', () => {
    const k = physicalPoint(6, 3, 2)
    const P = momentumSum(C, k, all(6))
    for (const row of P) for (const x of row) expect(x.abs()).toBeLessThan(1e-14)
    expect(conditionRatio(C, k)).toBeGreaterThanOrEqual(1e-3)
    // s_12 = (√s)² for the two incoming legs
    expect(det(C, momentumSum(C, k, [0, 1])).re).toBeCloseTo(4, 12)
  })
})

describe('given momenta', () => {
  const good = physicalMomenta(5, 1, 10)
  it('are accepted, made exactly conserving, and a warning says so', () => {
    const r = pointFromMomenta(good)
    expect(r.warnings[0]).toMatch(/^kinematics: exact momentum conservation restored/)
    const P = momentumSum(C, r.kin, all(5))
    for (const row of P) for (const x of row) expect(x.abs()).toBeLessThan(1e-14)
  })
  it.each([
    ['a massive leg', () => good.map((p, i) => (i === 1 ? [p[0] + 0.5, p[1], p[2], p[3]] : p)), /^kinematics: leg 2 is not massless: p² = /],
    ['non-conservation', () => good.map((p, i) => (i === 3 ? ([p[0] * 1.01, p[1] * 1.01, p[2] * 1.01, p[3] * 1.01] as Momentum) : p)), /^kinematics: momentum is not conserved: \|Σp\| = .* relative to the largest energy$/],
  ] as [string, () => Momentum[], RegExp][])('%s is refused with a 422 naming the size', (_, make, msg) => {
    try {
      pointFromMomenta(make())
      expect.unreachable()
    }
    catch (e) {
      expect(e).toBeInstanceOf(PhysicsError)
      expect((e as PhysicsError).status).toBe(422)
      expect((e as PhysicsError).field).toBe('kinematics')
      expect((e as Error).message).toMatch(msg)
    }
  })
  it('a violation inside 1e-8 is repaired', () => {
    const bent = good.map((p, i) => (i === 4 ? ([p[0] + 1e-9, p[1], p[2], p[3]] as Momentum) : p))
    expect(() => pointFromMomenta(bent)).not.toThrow()
  })
})
