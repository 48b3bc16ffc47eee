// Three-point blocks (docs/conventions.md "Amplitudes and normalisations"): little-group scaling of the formula, σ,
// gravitons as squares of gluons, structural kinds, Bose (anti)symmetry (Benincasa & Cachazo,
// arXiv:0705.4305), half-integer helicities in the formula itself.
import { describe, expect, it } from 'vitest'
import { Fraction, rationalField as Q } from '#shared/physics/field'
import type { Kin, Spinor } from '#shared/physics/spinors'
import { boseSymmetry, threePoint, threePointFormula, threePointSurvives } from '#shared/physics/three-point'
import { processOf } from '#shared/physics/theories'

const f = (a: number, b = 1) => new Fraction(a, b)
// generic spinors (three-point kinematics is not needed for the algebraic checks)
const k: Kin<Fraction> = {
  lambda: [[f(1), f(2)], [f(3, 2), f(-1)], [f(2, 3), f(5)]] as Spinor<Fraction>[],
  lambdaTilde: [[f(2), f(-3)], [f(1, 4), f(1)], [f(-2), f(7, 3)]] as Spinor<Fraction>[],
}
const scaled = (leg: number, t: Fraction): Kin<Fraction> => {
  const out: Kin<Fraction> = { lambda: k.lambda.slice(), lambdaTilde: k.lambdaTilde.slice() }
  out.lambda[leg] = [k.lambda[leg]![0].mul(t), k.lambda[leg]![1].mul(t)]
  out.lambdaTilde[leg] = [k.lambdaTilde[leg]![0].div(t), k.lambdaTilde[leg]![1].div(t)]
  return out
}

describe('little-group scaling t^(−2h) of the formula, both kinds, any helicities', () => {
  it.each([
    [[-1, -1, 1], 'angle'],
    [[1, 1, -1], 'square'],
    [[-2, -2, 2], 'angle'],
    [[-2, 2, 2], 'square'],
    [[-0.5, -0.5, -1], 'angle'],
    [[0.5, -0.5, 1], 'square'],
    [[-1.5, 1.5, -1], 'angle'],
    [[3, -3, 3], 'square'],
  ] as [number[], 'angle' | 'square'][])('%j %s', (h, kind) => {
    const base = threePointFormula(Q, k, h, kind, -1)
    for (let leg = 0; leg < 3; leg++) {
      const t = f(3, 2)
      expect(threePointFormula(Q, scaled(leg, t), h, kind, -1).equals(base.mul(t.pow(-2 * h[leg]!)))).toBe(true)
    }
  })
  it('non-integer exponents are refused', () => {
    expect(() => threePointFormula(Q, k, [0.5, 0.5, 0.5], 'square', 1)).toThrow(/not an integer/)
  })
})

describe('theories', () => {
  const g = processOf('gluon')
  it('gluon square vertex carries σ = −1', () => {
    const v = threePoint(Q, g, k, [1, 1, -1], 'square')
    const sq = (a: number, b: number) => k.lambdaTilde[a]![1].mul(k.lambdaTilde[b]![0]).sub(k.lambdaTilde[a]![0].mul(k.lambdaTilde[b]![1]))
    expect(v.equals(sq(0, 1).pow(3).div(sq(1, 2).mul(sq(2, 0))).neg())).toBe(true)
  })
  it('graviton = (gluon)², spin s = (gluon)^s', () => {
    const gl = threePoint(Q, g, k, [-1, -1, 1], 'angle')
    expect(threePoint(Q, processOf('graviton'), k, [-2, -2, 2], 'angle').equals(gl.pow(2))).toBe(true)
    expect(threePoint(Q, processOf('spin', 3), k, [-3, -3, 3], 'angle').equals(gl.pow(3))).toBe(true)
    const gs = threePoint(Q, g, k, [1, -1, 1], 'square')
    expect(threePoint(Q, processOf('spin', 3), k, [3, -3, 3], 'square').equals(gs.pow(3))).toBe(true)
    expect(threePoint(Q, processOf('spin', 4), k, [4, -4, 4], 'square').equals(gs.pow(4))).toBe(true)
  })
  it.each([
    ['gluon', [-1, -1, 1], 'square'],
    ['gluon', [1, 1, -1], 'angle'],
    ['gluon', [-1, -1, -1], 'angle'],
    ['gluon', [1, 1, 1], 'square'],
    ['graviton', [2, 2, 2], 'square'],
  ] as const)('%s %j on the %s side vanishes structurally', (theory, h, kind) => {
    expect(threePointSurvives(processOf(theory), h, kind)).toBe(false)
    expect(Q.isZero(threePoint(Q, processOf(theory), k, [...h], kind))).toBe(true)
  })
  it('cubic scalar: 1 on both kinds, with a coupling', () => {
    const p = processOf('scalar-cubic')
    expect(threePoint(Q, p, k, [0, 0, 0], 'angle').equals(f(1))).toBe(true)
    expect(threePoint(Q, p, k, [0, 0, 0], 'square', f(3)).equals(f(3))).toBe(true)
  })
  it('Bose symmetry: odd spin antisymmetric under exchange of two legs, even symmetric', () => {
    for (const s of [1, 2, 3, 4]) {
      const p = processOf('spin', s)
      const h = [-s, -s, s]
      const v = threePoint(Q, p, k, h, 'angle')
      const swapped: Kin<Fraction> = { lambda: [k.lambda[1]!, k.lambda[0]!, k.lambda[2]!], lambdaTilde: [k.lambdaTilde[1]!, k.lambdaTilde[0]!, k.lambdaTilde[2]!] }
      const w = threePoint(Q, p, swapped, h, 'angle')
      expect(w.equals(s % 2 ? v.neg() : v)).toBe(true)
      expect(boseSymmetry(p)).toBe(s % 2 ? 'antisymmetric' : 'symmetric')
    }
    expect(boseSymmetry(processOf('gluon'))).toBe('colour-ordered')
  })
})
