// Graviton BCFW against Hodges' formula (Hodges, arXiv:1204.1930) and KLT (Kawai, Lewellen, Tye
// 1986; Bern, Dixon, Perelstein, Rozowsky, Nucl. Phys. B546 (1999) 423); Bose symmetry; the
// soft-graviton factor (Weinberg, Phys. Rev. 140 (1965) B516).
import { describe, expect, it } from 'vitest'
import { Fraction, complexField as C, rationalField as Q } from '#shared/physics/field'
import { fromDoubleDouble, randomPoint, rationalPoint, solveLastTwo, toDoubleDouble } from '#shared/physics/kinematics'
import { ddField } from '#shared/physics/double-double'
import { bcfwValue, bcfw } from '#shared/physics/bcfw'
import { processOf, isValidShift } from '#shared/physics/theories'
import { hodges } from '#shared/physics/targets/hodges'
import { klt } from '#shared/physics/targets/klt'
import { angle, square, type Kin } from '#shared/physics/spinors'
import { allHelicities, countMinus, relDiff } from './helpers'

const G = processOf('graviton')
const S2 = processOf('spin', 2)
const permute = <T>(k: Kin<T>, order: number[]): Kin<T> => ({ lambda: order.map((t) => k.lambda[t]!), lambdaTilde: order.map((t) => k.lambdaTilde[t]!) })

describe('gravity BCFW = Hodges, MHV and conjugate (arXiv:1204.1930)', () => {
  const cases: [string, number[]][] = []
  for (let n = 4; n <= 7; n++) {
    const h = Array(n).fill(2)
    h[0] = -2
    h[2] = -2
    cases.push([`MHV n=${n}`, h], [`anti-MHV n=${n}`, h.map((x) => -x)])
  }
  it.each(cases)('%s float', (_, h) => {
    const k = randomPoint(h.length, 2)
    expect(relDiff(C, bcfwValue(C, G, k, h), hodges(C, k, h))).toBeLessThan(1e-11)
  })
  it.each(cases.filter(([, h]) => h.length <= 6))('%s exact', (_, h) => {
    const k = rationalPoint(h.length, 2)
    expect(bcfwValue(Q, G, k, h).equals(hodges(Q, k, h))).toBe(true)
  })
  it('spin 2 is gravity', () => {
    const h = [-2, 2, -2, 2, 2]
    const k = rationalPoint(5, 8)
    expect(bcfwValue(Q, S2, k, h).equals(bcfwValue(Q, G, k, h))).toBe(true)
  })
})

describe('gravity BCFW = KLT (n = 4..6, every class incl. NMHV at 6)', () => {
  const cases: [string, number[]][] = []
  for (let n = 4; n <= 6; n++) for (const h of allHelicities(n, 2)) if (countMinus(h) >= 2 && n - countMinus(h) >= 2) cases.push([h.map((x) => (x > 0 ? '+' : '−')).join(''), h])
  it.each(cases.filter(([, h]) => h.length <= 5 || ['−−−+++', '−+−+−+', '+−−+−+'].includes(h.map((x) => (x > 0 ? '+' : '−')).join(''))))('%s exact', (_, h) => {
    const k = rationalPoint(h.length, 3)
    expect(bcfwValue(Q, G, k, h).equals(klt(Q, k, h))).toBe(true)
  })
  // Gravity's BCFW terms cancel strongly: in doubles this point loses ~1e-10, so float runs in
  // double-double (as evaluate() does for gravitons).
  it.each(cases.filter(([, h]) => h.length === 6))('%s float (double-double)', (_, h) => {
    const k = randomPoint(6, 3)
    expect(relDiff(C, fromDoubleDouble(bcfwValue(ddField, G, toDoubleDouble(k), h)), klt(C, k, h))).toBeLessThan(1e-12)
  })
  it('NMHV n=6 under every valid shift, float', () => {
    const h = [-2, -2, -2, 2, 2, 2]
    const k = randomPoint(6, 4)
    const ref = klt(C, k, h)
    for (let i = 0; i < 6; i++) for (let j = 0; j < 6; j++) if (i !== j && isValidShift(G, h, i, j)) expect(relDiff(C, bcfw(C, G, k, h, [i, j]).value, ref)).toBeLessThan(1e-11)
  })
})

describe('Bose symmetry of graviton amplitudes (common practice)', () => {
  it.each([
    [[-2, -2, 2, 2, 2], [4, 0, 3, 1, 2]],
    [[-2, 2, -2, 2, -2, 2], [5, 2, 1, 0, 4, 3]],
    [[-2, 2, 2, -2, 2, -2, 2], [6, 5, 4, 3, 2, 1, 0]],
  ])('%j permuted by %j', (h, perm) => {
    const n = h.length
    const k = n <= 6 ? rationalPoint(n, 5) : null
    if (k) {
      expect(bcfwValue(Q, G, permute(k, perm), perm.map((t) => h[t]!)).equals(bcfwValue(Q, G, k, h))).toBe(true)
    }
    else {
      const kc = randomPoint(n, 5)
      expect(relDiff(C, bcfwValue(C, G, permute(kc, perm), perm.map((t) => h[t]!)), bcfwValue(C, G, kc, h))).toBeLessThan(1e-11)
    }
  })
})

describe('soft graviton (Weinberg, Phys. Rev. 140 (1965) B516): M_n → S M_{n−1}', () => {
  // (ε⁺·p_a)²/(p_s·p_a) with ε⁺ from reference spinors x, y gives
  // S = Σ_a ⟨xa⟩⟨ya⟩[as] / (⟨xs⟩⟨ys⟩⟨sa⟩). Exact arithmetic: in doubles the individual BCFW terms
  // of gravity cancel strongly near the soft limit (measured: 1% lost at λ̃_s ~ 1e-5).
  it.each([
    [[-2, 2, -2, 2, 2], 1, 2],
    [[-2, -2, 2, 2, 2], 3, 4],
  ])('positive-helicity soft leg added to %j (references %i, %i)', (h5, x, y) => {
    const base = rationalPoint(5, 9)
    const eps = new Fraction(1, 10 ** 7)
    const ls: [Fraction, Fraction] = [new Fraction(2, 3), new Fraction(-5, 7)]
    const lts: [Fraction, Fraction] = [eps.mul(3), eps.mul(-4)]
    // the soft leg first, so that re-solving the last two λ̃ keeps it soft
    const k = solveLastTwo(Q, { lambda: [ls, ...base.lambda], lambdaTilde: [lts, ...base.lambdaTilde] })
    const k5 = solveLastTwo(Q, { lambda: k.lambda.slice(1), lambdaTilde: k.lambdaTilde.slice(1) })
    let S = Q.zero
    for (let a = 1; a < 6; a++) {
      if (a === x || a === y) continue
      S = Q.add(S, Q.div(Q.mul(Q.mul(angle(Q, k, x, a), angle(Q, k, y, a)), square(Q, k, a, 0)), Q.mul(Q.mul(angle(Q, k, x, 0), angle(Q, k, y, 0)), angle(Q, k, 0, a))))
    }
    const ratio = Q.div(bcfwValue(Q, G, k, [2, ...h5]), Q.mul(S, bcfwValue(Q, G, k5, h5)))
    expect(Math.abs(ratio.valueOf() - 1)).toBeLessThan(1e-4)
  })
})
