// The Limits tab's logic: which checks apply to a process, the request bodies in colour order, and
// the verdict spelled out with the engine's thresholds, on real answers of the engine (soft factor:
// Weinberg, Phys. Rev. 140 (1965) B516; subleading: Cachazo & Strominger, arXiv:1404.4091;
// identities: Kleiss & Kuijf, Nucl. Phys. B312 (1989) 616).
import { describe, expect, it } from 'vitest'
import { collinearBody, identityBody, identityVerdict, limitPlan, pathVerdict, softBody } from '#shared/editor/limits'
import { checkLimit } from '#shared/physics/checks/index'
import type { IdentityResponse, LimitPathResponse } from '#shared/schemas/limit-checks'

describe('limitPlan', () => {
  it('gluons: soft, collinear and identities; gravitons: soft with the subleading factor', () => {
    const g = limitPlan({ theory: 'gluon', helicities: [-1, 1, -1, 1, 1] })!
    expect(g).toMatchObject({ n: 5, soft: true, subleading: false, collinear: true, identities: true, why: null })
    const G = limitPlan({ theory: 'graviton', helicities: [-2, -2, 2, 2, 2] })!
    expect(G).toMatchObject({ soft: true, subleading: true, collinear: false, identities: false, why: null })
  })
  it('four gluons have identities only; four gravitons and scalars nothing, with the reason', () => {
    expect(limitPlan({ theory: 'gluon', helicities: [-1, -1, 1, 1] })).toMatchObject({ soft: false, identities: true, why: null })
    expect(limitPlan({ theory: 'graviton', helicities: [-2, -2, 2, 2] })!.why).toMatch(/n ≥ 5/)
    expect(limitPlan({ theory: 'scalar', helicities: [0, 0, 0, 0] } as never)!.why).toMatch(/gluons and gravitons, not scalar/)
    expect(limitPlan(undefined)).toBeNull()
  })
  it('a colour order reorders the helicities and maps positions to labels', () => {
    const p = limitPlan({ theory: 'gluon', helicities: [-1, 1, -1, 1, 1], order: [1, 3, 2, 4, 5] })!
    expect(p.helicities).toEqual([-1, -1, 1, 1, 1])
    expect(p.label(2)).toBe(3)
    expect(softBody(p, 2, 'leading')).toMatchObject({ check: 'soft', helicities: [-1, -1, 1, 1, 1], soft: 2 })
    expect(collinearBody(p, 5, 0.4)).toMatchObject({ check: 'collinear', leg: 5, z: 0.4 })
    expect(identityBody(p, 'bcj', 'exact')).toMatchObject({ check: 'identity', identity: 'bcj', arithmetic: 'exact' })
  })
})

describe('verdict arithmetic', () => {
  it('a path: fitted rate against expected − 0.25 and the last deviation against 10⁻²', () => {
    const r = checkLimit({ check: 'soft', theory: 'graviton', helicities: [-2, 2, -2, 2, -2, 2], soft: 5, order: 'subleading' }) as LimitPathResponse
    expect(pathVerdict(r)).toMatch(/^fitted rate 2\.0\d\d \(expected 2; must be > 1\.75\); last \|ratio − 1\| = \d\.\de-\d+ at ε = 1\.0e-8 \(must be < 1\.0e-2\) → holds$/)
    const failed = { ...r, rate: 1.02, holds: false }
    expect(pathVerdict(failed)).toMatch(/fitted rate 1\.020 .* → fails$/)
  })
  it('an identity: residual against the tolerance, or exactly zero', () => {
    const f = checkLimit({ check: 'identity', theory: 'gluon', helicities: [-1, 1, -1, 1, 1], identity: 'kleiss-kuijf' }) as IdentityResponse
    expect(identityVerdict(f)).toMatch(/^residual \|Σ\| \/ max \|term\| = \d\.\de-\d+ \(must be ≤ tolerance 1\.0e-12\) → holds$/)
    const x = checkLimit({ check: 'identity', theory: 'gluon', helicities: [-1, 1, -1, 1, 1], identity: 'bcj', arithmetic: 'exact' }) as IdentityResponse
    expect(identityVerdict(x)).toBe('Σ = 0 + 0i in exact rationals (must be exactly 0) → holds')
  })
})
