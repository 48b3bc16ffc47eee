// The subleading soft graviton theorem (Cachazo & Strominger, arXiv:1404.4091): with S⁽⁰⁾ + S⁽¹⁾ the
// ratio A_n / ((S⁽⁰⁾ + S⁽¹⁾) A_{n−1}) tends to 1 like ε² along p_s → ε p_s, against ε¹ with the
// leading (Weinberg) factor alone; and the relation Σ_a u_a λ_a = S⁽⁰⁾ λ_s that fixes the sign of S⁽¹⁾
// in our conventions (docs/engine.md "Subleading soft graviton"), on the support of momentum conservation.
import { describe, expect, it } from 'vitest'
import { checkLimit, softCheck, softFactor, subleadingCoefficients } from '#shared/physics/checks/index'
import { ddField as D, type DD } from '#shared/physics/double-double'
import { randomPoint, toDoubleDouble } from '#shared/physics/kinematics'
import { processOf } from '#shared/physics/theories'
import { PhysicsError } from '#shared/physics/errors'
import type { LimitPathResponse } from '#shared/schemas/limit-checks'

const graviton = processOf('graviton')

describe('subleading soft graviton: |ratio − 1| ~ ε² (leading only: ~ ε)', () => {
  const cases: [string, number[], number][] = [
    ['n = 5, soft − (hard MHV)', [-2, -2, -2, 2, 2], 0],
    ['n = 6, soft − (NMHV)', [-2, 2, -2, 2, -2, 2], 4],
    ['n = 6, soft + (NMHV)', [-2, 2, -2, 2, -2, 2], 1],
    ['n = 6, soft + (MHV)', [-2, -2, 2, 2, 2, 2], 2],
  ]
  it.each(cases)('%s', (_, h, s) => {
    const lead = softCheck(graviton, h, s)
    const sub = softCheck(graviton, h, s, { order: 'subleading' })
    expect(lead.expectedRate).toBe(1)
    expect(sub.expectedRate).toBe(2)
    expect(Math.abs(lead.rate! - 1)).toBeLessThan(0.15)
    expect(Math.abs(sub.rate! - 2)).toBeLessThan(0.15)
    expect(sub.holds).toBe(true)
    // At ε = 10⁻⁴ the subleading ratio is closer to 1 by a factor ~ε (measured 2·10⁻³ … 10⁻⁵ here).
    const t = sub.rows.findIndex((r) => r.x === 1e-4)
    expect(sub.rows[t]!.deviation / lead.rows[t]!.deviation).toBeLessThan(1e-2)
    // Judged at rate 2, the leading-only path fails.
    expect(lead.rate!).toBeLessThan(2 - 0.25)
  })

  it('n = 5 with a soft plus graviton of MHV: S⁽⁰⁾ + S⁽¹⁾ is exact to rounding', () => {
    const r = softCheck(graviton, [-2, -2, 2, 2, 2], 3, { order: 'subleading' })
    expect(r.holds).toBe(true)
    expect(r.rows[0]!.deviation).toBeLessThan(1e-22)
  })

  it('Σ_a u_a λ_a = S⁽⁰⁾ λ_s at a conserving point (both helicities)', () => {
    const k = toDoubleDouble(randomPoint(6, 'subleading-relation'))
    const s = 2
    for (const plus of [true, false]) {
      const u = subleadingCoefficients(k, s, plus)
      const lam = plus ? k.lambda : k.lambdaTilde
      const S0 = softFactor(graviton, k, s, plus)
      for (const c of [0, 1] as const) {
        let sum: DD = D.zero
        u.forEach((ua, a) => (sum = D.add(sum, D.mul(ua, lam[a]![c]))))
        const want = D.mul(S0, lam[s]![c])
        expect(D.abs(D.sub(sum, want)) / D.abs(want)).toBeLessThan(1e-25)
        // The opposite sign breaks it.
        expect(D.abs(D.add(sum, want)) / D.abs(want)).toBeGreaterThan(1)
      }
    }
  })

  it('the route body: order subleading for gravitons, refused for gluons', () => {
    const r = checkLimit({ check: 'soft', theory: 'graviton', helicities: [-2, 2, -2, 2, -2, 2], soft: 5, order: 'subleading' }) as LimitPathResponse
    expect(r).toMatchObject({ order: 'subleading', expectedRate: 2, holds: true })
    expect(r.source).toMatch(/1404\.4091/)
    expect(r.factor).toMatch(/λ_s·∂\/∂λ_a/)
    expect(() => checkLimit({ check: 'soft', theory: 'gluon', helicities: [-1, 1, -1, 1, 1], soft: 2, order: 'subleading' })).toThrow(PhysicsError)
    expect(() => checkLimit({ check: 'soft', theory: 'gluon', helicities: [-1, 1, -1, 1, 1], soft: 2, order: 'subleading' })).toThrow(/^order: /)
  })
})
