// Hodges' formula (Hodges, arXiv:1204.1930) and KLT (Kawai, Lewellen, Tye 1986; Bern, Dixon,
// Perelstein, Rozowsky, Nucl. Phys. B546 (1999) 423) against each other and against outside
// identities: independence of the removed rows/columns and reference legs, Bose symmetry,
// little-group scaling and the leading soft-graviton factor (Weinberg, Phys. Rev. 140 (1965) B516).
import { describe, expect, it } from 'vitest'
import { Complex, Fraction, complexField as C, rationalField as Q } from '#shared/physics/field'
import type { Kin } from '#shared/physics/spinors'
import { angle, square } from '#shared/physics/spinors'
import { hodges, determinant } from '#shared/physics/targets/hodges'
import type { HodgesOptions } from '#shared/physics/targets/hodges'
import { klt } from '#shared/physics/targets/klt'
import { expectSubleading, permuteKin, randomComplexPoint, randomRationalPoint, relDiff, withSoftLeg } from './_points'

const TOL = 1e-9

function mhv(n: number, a: number, b: number, sign = 1): number[] {
  const h = Array<number>(n).fill(2 * sign)
  h[a] = -2 * sign
  h[b] = -2 * sign
  return h
}

describe('determinant by elimination (checked against the Leibniz expansion)', () => {
  it.each([
    [[[2, 1], [1, 3]], 5],
    [[[0, 1, 2], [1, 0, 3], [4, -3, 8]], -2],
    [[[1, 2, 3], [2, 4, 6], [1, 0, 1]], 0],
    [[[0, 0, 1], [0, 1, 0], [1, 0, 0]], -1],
  ])('det %j = %i', (m, d) => {
    expect(determinant(Q, m.map((r) => r.map((x) => new Fraction(x)))).equals(new Fraction(d))).toBe(true)
  })
})

describe("Hodges' formula does not depend on the removed rows, columns and reference legs (Hodges, arXiv:1204.1930)", () => {
  const choices: Array<[number, HodgesOptions]> = [
    [5, { rows: [0, 2, 4] }],
    [5, { rows: [1, 2, 3], cols: [0, 3, 4] }],
    [5, { x: 3, y: 4 }],
    [6, { rows: [3, 4, 5], x: 0, y: 0 }],
    [6, { rows: [0, 1, 2], cols: [1, 3, 5], x: 2, y: 5 }],
    [6, { rows: [5, 1, 3], cols: [4, 0, 2] }],
    [7, { rows: [2, 4, 6], cols: [0, 1, 5], x: 3, y: 4 }],
  ]
  it.each(choices)('n = %i, %j (exact)', (n, opts) => {
    const k = randomRationalPoint(n, `hodges-rows-${n}`)
    const h = mhv(n, 1, n - 2)
    const base = hodges(Q, k, h)
    expect(base.n).not.toBe(0n)
    expect(hodges(Q, k, h, opts).equals(base)).toBe(true)
    const hb = h.map((x) => -x)
    expect(hodges(Q, k, hb, opts).equals(hodges(Q, k, hb))).toBe(true)
  })
})

describe('Hodges = KLT for MHV and its conjugate (two independent published forms)', () => {
  const cases: Array<[number[]]> = []
  for (const n of [4, 5, 6]) {
    for (const [a, b] of [[0, 1], [0, 2], [1, n - 1]] as const) {
      cases.push([mhv(n, a, b)])
      cases.push([mhv(n, a, b, -1)])
    }
  }
  it.each(cases)('helicities %j (float and exact)', (h) => {
    const n = h.length
    const k = randomComplexPoint(n, `hodges-klt-${n}`)
    expect(relDiff(hodges(C, k, h), klt(C, k, h))).toBeLessThan(TOL)
    const kq = randomRationalPoint(n, `hodges-klt-${n}`)
    expect(hodges(Q, kq, h).equals(klt(Q, kq, h))).toBe(true)
  })
  it('three points: both are the square of the gluon three-point amplitude', () => {
    const k = randomComplexPoint(3, 'three')
    const h = [-2, -2, 2]
    const a3 = angle(C, k, 0, 1).pow(3).div(angle(C, k, 1, 2).mul(angle(C, k, 2, 0)))
    expect(relDiff(hodges(C, k, h), a3.mul(a3))).toBeLessThan(TOL)
    expect(relDiff(klt(C, k, h), a3.mul(a3))).toBeLessThan(TOL)
  })
})

// Deterministic permutations of n legs.
function perms(n: number): number[][] {
  const out: number[][] = []
  const rev = Array.from({ length: n }, (_, a) => n - 1 - a)
  const rot = Array.from({ length: n }, (_, a) => (a + 2) % n)
  const swap = Array.from({ length: n }, (_, a) => (a === 0 ? 1 : a === 1 ? 0 : a))
  const mix = Array.from({ length: n }, (_, a) => (a * 3 + 1) % n)
  out.push(rev, rot, swap)
  if (new Set(mix).size === n) out.push(mix)
  return out
}

describe('Bose symmetry: relabelling legs (with their helicities) leaves the amplitude unchanged', () => {
  const configs: Array<[string, number[]]> = [
    ['hodges', mhv(5, 0, 3)],
    ['hodges', mhv(6, 2, 4, -1)],
    ['hodges', mhv(7, 1, 5)],
    ['klt', mhv(5, 1, 2)],
    ['klt', [-2, -2, -2, 2, 2, 2]],
    ['klt', [-2, 2, -2, 2, -2, 2]],
    ['klt', [2, -2, 2, 2, -2, -2]],
  ]
  it.each(configs)('%s, helicities %j (exact)', (target, h) => {
    const n = h.length
    const f = target === 'hodges' ? hodges : klt
    const k = randomRationalPoint(n, `bose-${n}`)
    const base = f(Q, k, h)
    expect(base.n).not.toBe(0n)
    for (const p of perms(n)) expect(f(Q, permuteKin(k, p), p.map((i) => h[i]!)).equals(base)).toBe(true)
  })
})

describe('little-group scaling: λ_i → tλ_i, λ̃_i → λ̃_i/t gives t^(−2h_i) (common practice)', () => {
  const configs: Array<[string, number[]]> = [
    ['hodges', mhv(5, 0, 3)],
    ['hodges', mhv(6, 1, 2, -1)],
    ['klt', mhv(4, 0, 1)],
    ['klt', [-2, -2, -2, 2, 2, 2]],
    ['klt', [-2, 2, -2, 2, -2, 2]],
  ]
  it.each(configs)('%s, helicities %j (exact)', (target, h) => {
    const n = h.length
    const f = target === 'hodges' ? hodges : klt
    const k = randomRationalPoint(n, `lg-grav-${n}`)
    const t = new Fraction(-2, 3)
    const base = f(Q, k, h)
    for (let i = 0; i < n; i++) {
      const scaled: Kin<Fraction> = {
        lambda: k.lambda.map((l, a) => (a === i ? [l[0].mul(t), l[1].mul(t)] : l)),
        lambdaTilde: k.lambdaTilde.map((l, a) => (a === i ? [l[0].div(t), l[1].div(t)] : l)),
      }
      expect(f(Q, scaled, h).equals(base.mul(t.pow(-2 * h[i]!)))).toBe(true)
    }
  })
})

describe('leading soft-graviton factor (Weinberg, Phys. Rev. 140 (1965) B516)', () => {
  // Soft leg s = 0 with λ̃_s → ε λ̃_s (helicity +2): M_n → S⁺ M_{n−1},
  //   S⁺ = Σ_{a≠s} [as]⟨ax⟩⟨ay⟩ / (⟨sa⟩⟨sx⟩⟨sy⟩)   (any reference legs x, y);
  // its parity conjugate for helicity −2 with λ_s → ε λ_s, S⁻ = Σ ⟨as⟩[ax][ay] / ([sa][sx][sy]).
  // This is Weinberg's Σ_a (ε·p_a)²/(p_s·p_a) with our polarization vectors; its overall sign in our
  // conventions follows from KLT's M_4 = −s12 A(1234) A(1243) and the soft-gluon factor of Parke–Taylor.
  function softFactor(k: Kin<Complex>, plus: boolean): Complex {
    const n = k.lambda.length
    const x = 1, y = 2
    let S = Complex.ZERO
    for (let a = 1; a < n; a++) {
      if (a === x || a === y) continue // those terms vanish (⟨xx⟩ = 0)
      S = S.add(plus
        ? square(C, k, a, 0).mul(angle(C, k, a, x)).mul(angle(C, k, a, y)).div(angle(C, k, 0, a).mul(angle(C, k, 0, x)).mul(angle(C, k, 0, y)))
        : angle(C, k, a, 0).mul(square(C, k, a, x)).mul(square(C, k, a, y)).div(square(C, k, 0, a).mul(square(C, k, 0, x)).mul(square(C, k, 0, y))))
    }
    return S
  }
  const cases: Array<[string, number[], 2 | -2]> = [
    ['hodges', mhv(4, 0, 2), 2],
    ['hodges', mhv(5, 1, 3), 2],
    ['hodges', mhv(5, 0, 4, -1), -2],
    ['hodges', mhv(6, 2, 3), 2],
    ['klt', mhv(5, 1, 2, -1), 2], // NMHV at six points: KLT only
    ['klt', mhv(5, 0, 3), -2],
  ]
  it.each(cases)('%s, hard helicities %j, soft helicity %i', (target, hardH, hs) => {
    const f = target === 'hodges' ? hodges : klt
    const hard = randomComplexPoint(hardH.length, `soft-grav-${hardH.length}`)
    const h = [hs, ...hardH]
    const mHard = f(C, hard, hardH)
    const dev = (eps: number) => {
      const k = withSoftLeg(hard, 0, eps, hs === 2)
      return relDiff(f(C, k, h), softFactor(k, hs === 2).mul(mHard))
    }
    expectSubleading(dev)
  })
})

describe('input checks', () => {
  it.each([
    [[-2, -2, -2, 2, 2, 2], /^target: Hodges' formula applies only to MHV/],
    [[-2, -2, 1, 2], /^helicities\[2\]: a graviton has helicity ±2/],
  ])('hodges %j', (h, msg) => {
    const k = randomComplexPoint(h.length, 'bad')
    expect(() => hodges(C, k, h)).toThrow(msg)
  })
  it('KLT refuses eight gravitons', () => {
    const k = randomComplexPoint(8, 'bad')
    expect(() => klt(C, k, mhv(8, 0, 1))).toThrow(/^target: the KLT target covers 3 to 7 gravitons/)
  })
  it('vanishing classes: Hodges gives exactly 0, KLT computes 0', () => {
    const k = randomRationalPoint(5, 'zero')
    expect(hodges(Q, k, [2, 2, 2, 2, -2]).n).toBe(0n)
    expect(klt(Q, k, [2, 2, 2, 2, -2]).n).toBe(0n)
    expect(klt(Q, k, [2, 2, 2, 2, 2]).n).toBe(0n)
  })
})
