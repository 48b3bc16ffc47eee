// The limit and identity checks (shared/physics/checks): soft factors (Weinberg, Phys. Rev. 140
// (1965) B516), tree splitting amplitudes (Mangano & Parke, Phys. Rept. 200 (1991) 301; Bern,
// Dixon, Dunbar, Kosower, hep-ph/9403226), Kleiss–Kuijf, U(1) decoupling, reflection and cyclicity
// (Kleiss & Kuijf, Nucl. Phys. B312 (1989) 616) and the fundamental BCJ relation (Bern, Carrasco,
// Johansson, arXiv:0805.3993). Each ratio must tend to 1 at the expected rate, each identity hold
// to 1e-12 at generic points (exactly in exact arithmetic) and fail when a term is dropped.
import { describe, expect, it } from 'vitest'
import { checkLimit, collinearCheck, identityCheck, shuffles, softCheck, IDENTITIES, type IdentityName } from '#shared/physics/checks/index'
import { judge } from '#shared/physics/checks/soft'
import { processOf } from '#shared/physics/theories'
import { rationalField as Q } from '#shared/physics/field'
import { ddField } from '#shared/physics/double-double'
import { randomPoint, rationalPoint, toDoubleDouble } from '#shared/physics/kinematics'
import { PhysicsError } from '#shared/physics/errors'
import type { IdentityResponse, LimitPathResponse } from '#shared/schemas/limit-checks'

const gluon = processOf('gluon')
const graviton = processOf('graviton')

describe('soft limit: A_n / (S × A_{n−1}) → 1 like ε', () => {
  const cases: [string, typeof gluon, number[], number][] = [
    ['gluon + between − and +', gluon, [-1, 1, -1, 1, 1], 1],
    ['gluon − (NMHV)', gluon, [-1, 1, -1, 1, -1, 1], 2],
    ['gluon + (NMHV, first leg)', gluon, [1, -1, 1, -1, -1, 1], 0],
    ['gluon − at the last position', gluon, [-1, 1, 1, -1, 1, -1], 5],
    ['graviton + (MHV)', graviton, [-2, -2, 2, 2, 2], 3],
    ['graviton − (NMHV)', graviton, [-2, 2, -2, 2, -2, 2], 4],
    ['graviton + (NMHV)', graviton, [-2, 2, -2, 2, -2, 2], 1],
  ]
  it.each(cases)('%s', (_, p, h, s) => {
    const r = softCheck(p, h, s)
    expect(r.holds).toBe(true)
    expect(r.rows).toHaveLength(8)
    expect(r.rows[7]!.deviation).toBeLessThan(1e-6)
    if (r.rate !== null) expect(Math.abs(r.rate - 1)).toBeLessThan(0.15)
  })

  it('a soft plus gluon of an MHV amplitude is exact (Parke–Taylor factorises)', () => {
    const r = softCheck(gluon, [-1, -1, 1, 1, 1], 2)
    for (const row of r.rows) expect(row.deviation).toBeLessThan(1e-20)
  })

  it('the factor with the wrong sign is caught (ratio → −1)', () => {
    const r = softCheck(gluon, [-1, 1, -1, 1, -1, 1], 2)
    const flipped = r.rows.map((x) => ({ ...x, deviation: Math.hypot(-x.ratio[0] - 1, -x.ratio[1]) }))
    expect(judge(flipped, 1).holds).toBe(false)
  })

  it('refuses n = 4, a missing leg and an identically vanishing A_{n−1}', () => {
    expect(() => softCheck(gluon, [-1, -1, 1, 1], 0)).toThrow(PhysicsError)
    expect(() => softCheck(gluon, [-1, -1, 1, 1, 1], 5)).toThrow(/leg 6 does not exist/)
    expect(() => softCheck(gluon, [-1, -1, 1, 1, 1], 0)).toThrow(/vanishes identically/)
  })
})

describe('collinear limit: A_n / Σ_h Split × A_{n−1} → 1 like δ', () => {
  const cases: [number[], number, number][] = [
    [[-1, -1, 1, 1, 1], 2, 0.3], // + + → P+
    [[-1, -1, 1, 1, 1], 1, 0.3], // − + → P−
    [[-1, -1, 1, 1, 1], 4, 0.7], // + − (wrapping 5, 1)
    [[-1, 1, -1, 1, -1, 1], 1, 0.3], // + − both P helicities
    [[-1, 1, -1, 1, -1, 1], 0, 0.45],
    [[-1, -1, -1, 1, 1, 1], 0, 0.3], // − − → P−
    [[-1, -1, -1, 1, 1, 1], 2, 0.6],
    [[1, 1, -1, -1, 1, -1], 5, 0.3],
    [[-1, 1, 1, -1, -1, 1, 1], 3, 0.25], // − − at n = 7
  ]
  it.each(cases)('helicities %j, legs %i, %i+1, z = %f', (h, a, z) => {
    const r = collinearCheck(gluon, h, a, { z })
    expect(r.holds).toBe(true)
    expect(r.rows[7]!.deviation).toBeLessThan(1e-6)
    expect(Math.abs(r.rate! - 1)).toBeLessThan(0.15)
  })

  it('z ↔ 1 − z swapped in the splitting amplitude is caught', () => {
    // a − + pair: Split(−; a⁻, b⁺) = z²/(√(z(1−z))⟨ab⟩); at 1 − z the ratio tends to (z/(1−z))² ≠ 1
    const good = collinearCheck(gluon, [-1, -1, 1, 1, 1], 1, { z: 0.3 })
    const swapped = collinearCheck(gluon, [-1, -1, 1, 1, 1], 1, { z: 0.7 })
    expect(good.holds).toBe(true)
    expect(swapped.holds).toBe(true) // the check at z = 0.7 is itself right …
    const r = good.rows[7]!.ratio[0] * (0.3 / 0.7) ** 2
    expect(Math.abs(r - 1)).toBeGreaterThan(0.5) // … and the wrong factor would be far off
  })

  it('refuses z outside (0, 1) and a pair whose A_{n−1} vanishes for both helicities', () => {
    expect(() => collinearCheck(gluon, [-1, -1, 1, 1, 1], 1, { z: 1 })).toThrow(/strictly between/)
    expect(() => collinearCheck(gluon, [-1, -1, 1, 1, 1], 0)).toThrow(/vanishes identically/)
  })
})

describe('identities among colour-ordered amplitudes', () => {
  const hs = [[-1, -1, 1, 1, 1], [-1, 1, -1, 1, -1, 1], [-1, -1, 1, -1, 1, 1, 1], [1, -1, -1, 1, -1, 1, -1, 1]]
  const cases: [IdentityName, number[]][] = []
  for (const id of IDENTITIES) for (const h of hs) cases.push([id, h])

  it.each(cases)('%s, helicities %j: holds to 1e-12 (double-double) and exactly; caught when a term is dropped', (id, h) => {
    const n = h.length
    const k = toDoubleDouble(randomPoint(n, `identity:${n}`))
    const r = identityCheck(ddField, gluon, k, h, id)
    expect(r.holds).toBe(true)
    expect(r.residual).toBeLessThan(1e-12)
    for (let t = 0; t < r.terms.length; t++) {
      const d = identityCheck(ddField, gluon, k, h, id, { drop: t })
      expect(d.holds, `term ${t} dropped`).toBe(false)
      expect(d.residual).toBeGreaterThan(1e-6)
    }
    if (n <= 7) expect(identityCheck(Q, gluon, rationalPoint(n, `identity:${n}`), h, id).holds).toBe(true)
  })

  it('Kleiss–Kuijf with a chosen α; its term count is 1 + C(|α|+|β|, |α|)', () => {
    const h = [-1, 1, -1, 1, -1, 1, 1]
    const k = toDoubleDouble(randomPoint(7, 9))
    for (const alpha of [[1], [2, 4], [1, 2, 3], [4, 1]]) {
      const r = identityCheck(ddField, gluon, k, h, 'kleiss-kuijf', { alpha })
      expect(r.holds).toBe(true)
      const binom = (m: number, j: number): number => (j === 0 || j === m ? 1 : binom(m - 1, j - 1) + binom(m - 1, j))
      expect(r.terms).toHaveLength(1 + binom(5, alpha.length))
    }
    expect(() => identityCheck(ddField, gluon, k, h, 'kleiss-kuijf', { alpha: [0] })).toThrow(/α must be/)
  })

  it('shuffles keep each order and count C(a+b, a)', () => {
    const s = shuffles([1, 2], [3, 4, 5])
    expect(s).toHaveLength(10)
    for (const x of s) {
      expect(x.filter((y) => y < 3)).toEqual([1, 2])
      expect(x.filter((y) => y >= 3)).toEqual([3, 4, 5])
    }
  })
})

describe('checkLimit: the engine entry of POST /api/limit-checks', () => {
  it('soft, collinear and identity requests answer with labels 1-based', () => {
    const s = checkLimit({ check: 'soft', theory: 'graviton', helicities: [-2, -2, 2, 2, 2], soft: 4 }) as LimitPathResponse
    expect(s).toMatchObject({ check: 'soft', n: 5, legs: [4], holds: true, expectedRate: 1 })
    expect(s.source).toMatch(/Weinberg/)
    const c = checkLimit({ check: 'collinear', theory: 'gluon', helicities: [-1, -1, 1, -1, 1, 1], leg: 6 }) as LimitPathResponse
    expect(c).toMatchObject({ check: 'collinear', legs: [6, 1], holds: true })
    const e = checkLimit({ check: 'identity', theory: 'gluon', helicities: [-1, 1, -1, 1, -1, 1], identity: 'kleiss-kuijf', alpha: [2, 3], arithmetic: 'exact' }) as IdentityResponse
    expect(e).toMatchObject({ holds: true, residual: 0, tolerance: null, sum: ['0', '0'] })
    expect(e.terms[0]!.order).toEqual([1, 2, 3, 6, 4, 5])
    const b = checkLimit({ check: 'identity', theory: 'gluon', helicities: [-1, 1, -1, 1, 1], identity: 'bcj' }) as IdentityResponse
    expect(b.holds).toBe(true)
    expect(b.tolerance).toBe(1e-12)
  })

  it('errors name the field', () => {
    const field = (f: () => unknown) => {
      try {
        f()
      }
      catch (e) {
        return (e as PhysicsError).field
      }
      return null
    }
    expect(field(() => checkLimit({ check: 'soft', theory: 'gluon', helicities: [-1, -1, 1, 1, 1], soft: 9 }))).toBe('soft')
    expect(field(() => checkLimit({ check: 'collinear', theory: 'gluon', helicities: [-1, -1, 1, 1, 1], leg: 0 }))).toBe('leg')
    expect(field(() => checkLimit({ check: 'identity', theory: 'gluon', helicities: [-1, 1, -1, 1, 1], identity: 'kleiss-kuijf', alpha: [5] }))).toBe('alpha')
    expect(field(() => checkLimit({ check: 'identity', theory: 'gluon', helicities: [-1, 1, -1, 1, 1], identity: 'kleiss-kuijf', alpha: [9] }))).toBe('alpha[0]')
    expect(field(() => checkLimit({ check: 'soft', theory: 'gluon', helicities: [-1, -2, 1, 1, 1], soft: 1 }))).toBe('helicities[1]')
  })
})
