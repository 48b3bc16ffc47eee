// Property tests (fast-check): BCFW = Berends–Giele (Berends & Giele, Nucl. Phys. B306 (1988) 759)
// and little-group scaling t^(−2h) (common practice) at random seeds, helicities and shifts.
import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import { complexField as C, rationalField as Q, Fraction } from '#shared/physics/field'
import { randomPoint, rationalPoint } from '#shared/physics/kinematics'
import { bcfw } from '#shared/physics/bcfw'
import { isValidShift, processOf } from '#shared/physics/theories'
import { berendsGiele } from '#shared/physics/targets/berends-giele'
import type { Kin } from '#shared/physics/spinors'
import { relDiff } from './helpers'

const g = processOf('gluon')
const process = fc
  .integer({ min: 4, max: 8 })
  .chain((n) => fc.tuple(fc.constant(n), fc.array(fc.constantFrom(-1, 1), { minLength: n, maxLength: n }), fc.integer({ min: 0, max: n - 1 }), fc.integer({ min: 1, max: n - 1 }), fc.integer({ min: 0, max: 1e6 })))

describe('properties', () => {
  it('BCFW under any valid shift = Berends–Giele (float, 1e-10)', () => {
    fc.assert(
      fc.property(process, ([n, h, i, d, seed]) => {
        const j = (i + d) % n
        fc.pre(isValidShift(g, h, i, j))
        const k = randomPoint(n, seed)
        const v = bcfw(C, g, k, h, [i, j]).value
        const bg = berendsGiele(C, k, h)
        const minus = h.filter((x) => x < 0).length
        if (minus < 2 || n - minus < 2) return v.abs() === 0
        return relDiff(C, v, bg) < 1e-10
      }),
      { numRuns: 150 },
    )
  })
  it('little-group scaling in exact arithmetic', () => {
    fc.assert(
      fc.property(process, fc.integer({ min: 1, max: 9 }), fc.integer({ min: 1, max: 9 }), ([n, h, leg, , seed], a, b) => {
        const minus = h.filter((x) => x < 0).length
        fc.pre(minus >= 2 && n - minus >= 2 && n <= 7)
        const k = rationalPoint(n, seed)
        const t = new Fraction(a, b)
        const k2: Kin<Fraction> = { lambda: k.lambda.slice(), lambdaTilde: k.lambdaTilde.slice() }
        k2.lambda[leg] = [k.lambda[leg]![0].mul(t), k.lambda[leg]![1].mul(t)]
        k2.lambdaTilde[leg] = [k.lambdaTilde[leg]![0].div(t), k.lambdaTilde[leg]![1].div(t)]
        const shift: [number, number] = h[0]! < 0 ? [0, 1] : [1, 0]
        fc.pre(isValidShift(g, h, shift[0], shift[1]))
        const v = bcfw(Q, g, k, h, shift).value
        const w = bcfw(Q, g, k2, h, shift).value
        expect(w.equals(v.mul(t.pow(-2 * h[leg]!)))).toBe(true)
      }),
      { numRuns: 60 },
    )
  })
})
