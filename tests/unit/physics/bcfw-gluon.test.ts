// BCFW for colour-ordered gluons against outside references: Parke–Taylor (Parke & Taylor, PRL 56
// (1986) 2459), Berends–Giele (Berends & Giele, Nucl. Phys. B306 (1988) 759), little-group
// scaling, U(1) decoupling and Kleiss–Kuijf (Kleiss & Kuijf, Nucl. Phys. B312 (1989) 616), the
// fundamental BCJ relation (Bern, Carrasco, Johansson, arXiv:0805.3993), the soft-gluon factor
// (Weinberg, Phys. Rev. 140 (1965) B516; colour-ordered form common practice).
import { describe, expect, it } from 'vitest'
import { Complex, complexField as C, rationalField as Q, type Field } from '#shared/physics/field'
import { randomPoint, rationalPoint, physicalPoint, solveLastTwo } from '#shared/physics/kinematics'
import { bcfw, bcfwValue } from '#shared/physics/bcfw'
import { defaultShift, isValidShift, processOf } from '#shared/physics/theories'
import { parkeTaylor } from '#shared/physics/targets/parke-taylor'
import { berendsGiele } from '#shared/physics/targets/berends-giele'
import { angle, mandelstam, square, type Kin } from '#shared/physics/spinors'
import { allHelicities, countMinus, relDiff } from './helpers'

const g = processOf('gluon')
const A = <T>(F: Field<T>, k: Kin<T>, h: number[]) => bcfwValue(F, g, k, h)
const permute = <T>(k: Kin<T>, order: number[]): Kin<T> => ({ lambda: order.map((t) => k.lambda[t]!), lambdaTilde: order.map((t) => k.lambdaTilde[t]!) })

function mhvCases(): [string, number[]][] {
  const out: [string, number[]][] = []
  for (let n = 4; n <= 10; n++) {
    const mhv = Array(n).fill(1)
    mhv[0] = -1
    mhv[Math.floor(n / 2)] = -1
    out.push([`MHV n=${n}`, mhv])
    const adj = Array(n).fill(1)
    adj[n - 2] = -1
    adj[n - 1] = -1
    out.push([`MHV adjacent n=${n}`, adj])
    out.push([`anti-MHV n=${n}`, mhv.map((x) => -x)])
  }
  return out
}

describe('Parke–Taylor = BCFW (Parke & Taylor, PRL 56 (1986) 2459)', () => {
  it.each(mhvCases())('%s, float at a random point to 1e-12', (_, h) => {
    const k = randomPoint(h.length, 11)
    expect(relDiff(C, A(C, k, h), parkeTaylor(C, k, h))).toBeLessThan(1e-12)
  })
  it.each(mhvCases().filter(([, h]) => h.length <= 8))('%s, exact: equal rationals', (_, h) => {
    const k = rationalPoint(h.length, 5)
    expect(A(Q, k, h).equals(parkeTaylor(Q, k, h))).toBe(true)
  })
  it.each(mhvCases().filter(([, h]) => h.length <= 7))('%s, with the tree fully expanded (no closed forms)', (_, h) => {
    const k = rationalPoint(h.length, 6)
    const r = bcfw(Q, g, k, h, defaultShift(g, h), { tree: true })
    expect(r.value.equals(parkeTaylor(Q, k, h))).toBe(true)
  })
})

describe('Berends–Giele = BCFW (Berends & Giele, Nucl. Phys. B306 (1988) 759)', () => {
  const cases: [string, number[]][] = []
  for (let n = 4; n <= 7; n++) for (const h of allHelicities(n)) cases.push([h.map((x) => (x > 0 ? '+' : '−')).join(''), h])
  it.each(cases)('%s float, default shift, to 1e-11', (_, h) => {
    const k = randomPoint(h.length, 21)
    const bg = berendsGiele(C, k, h)
    const v = A(C, k, h)
    if (countMinus(h) < 2 || h.length - countMinus(h) < 2) expect(v.abs()).toBe(0)
    else expect(relDiff(C, v, bg)).toBeLessThan(1e-11)
  })
  it.each(cases.filter(([, h]) => h.length <= 6))('%s exact: equal rationals', (_, h) => {
    const k = rationalPoint(h.length, 4)
    expect(A(Q, k, h).equals(berendsGiele(Q, k, h))).toBe(true)
  })
  const sample8 = allHelicities(8).filter((_, t) => t % 17 === 3)
  it.each(sample8.map((h) => [h.map((x) => (x > 0 ? '+' : '−')).join(''), h] as [string, number[]]))('n=8 sample %s', (_, h) => {
    const k = randomPoint(8, 8)
    const bg = berendsGiele(C, k, h)
    const v = A(C, k, h)
    if (bg.abs() === 0 || countMinus(h) < 2 || countMinus(h) > 6) expect(v.abs()).toBe(0)
    else expect(relDiff(C, v, bg)).toBeLessThan(1e-11)
  })
  it.each([
    ['NMHV n=9', [-1, 1, -1, 1, -1, 1, 1, 1, 1]],
    ['NMHV n=10', [-1, -1, -1, 1, 1, 1, 1, 1, 1, 1]],
    ['N²MHV n=10', [-1, 1, -1, 1, -1, 1, -1, 1, 1, 1]],
    ['N²MHV n=12', [-1, 1, 1, -1, 1, 1, -1, 1, 1, -1, 1, 1]],
    ['N³MHV n=12', [-1, 1, -1, 1, -1, 1, -1, 1, -1, 1, 1, 1]],
  ])('%s agrees to 1e-12 at a generic point', (_, h) => {
    const k = randomPoint(h.length, 1)
    expect(relDiff(C, A(C, k, h), berendsGiele(C, k, h))).toBeLessThan(1e-12)
  })
  it('every valid shift gives the same amplitude (n = 6, NMHV, exact)', () => {
    const h = [-1, 1, -1, 1, -1, 1]
    const k = rationalPoint(6, 9)
    const bg = berendsGiele(Q, k, h)
    for (let i = 0; i < 6; i++) for (let j = 0; j < 6; j++) {
      if (i === j || !isValidShift(g, h, i, j)) continue
      expect(bcfw(Q, g, k, h, [i, j]).value.equals(bg)).toBe(true)
    }
  })
  it('physical (RAMBO) point, NMHV n = 7', () => {
    const h = [-1, -1, 1, -1, 1, 1, 1]
    const k = physicalPoint(7, 2, 5)
    expect(relDiff(C, A(C, k, h), berendsGiele(C, k, h))).toBeLessThan(1e-11)
  })
})

describe('little-group scaling: λ_i → tλ_i, λ̃_i → λ̃_i/t multiplies A by t^(−2h_i) (common practice)', () => {
  it.each([
    [[-1, -1, 1, 1, 1], 0],
    [[-1, 1, -1, 1, -1, 1], 3],
    [[1, -1, 1, -1, 1, -1, 1], 1],
  ])('%j, leg %i', (h, leg) => {
    const k = rationalPoint(h.length, 3)
    const t = Q.fromInt(3)
    const k2: Kin<typeof t> = { lambda: k.lambda.slice(), lambdaTilde: k.lambdaTilde.slice() }
    k2.lambda[leg] = [Q.mul(t, k.lambda[leg]![0]), Q.mul(t, k.lambda[leg]![1])]
    k2.lambdaTilde[leg] = [Q.div(k.lambdaTilde[leg]![0], t), Q.div(k.lambdaTilde[leg]![1], t)]
    expect(A(Q, k2, h).equals(Q.mul(A(Q, k, h), Q.pow(t, -2 * h[leg]!)))).toBe(true)
  })
})

describe('colour-ordered identities', () => {
  const h = [-1, 1, -1, 1, 1, -1]
  const n = h.length
  it('cyclic symmetry', () => {
    const k = rationalPoint(n, 12)
    const rot = [1, 2, 3, 4, 5, 0]
    expect(A(Q, permute(k, rot), rot.map((t) => h[t]!)).equals(A(Q, k, h))).toBe(true)
  })
  it('U(1) decoupling: Σ over positions of leg 1 among the others vanishes (Kleiss & Kuijf)', () => {
    const k = rationalPoint(n, 13)
    let sum = Q.zero
    for (let pos = 0; pos < n - 1; pos++) {
      const order = [1, 2, 3, 4, 5]
      order.splice(pos, 0, 0)
      sum = Q.add(sum, A(Q, permute(k, order), order.map((t) => h[t]!)))
    }
    expect(Q.isZero(sum)).toBe(true)
  })
  it('Kleiss–Kuijf: A(1,{α},n,{β}) = (−1)^|β| Σ_{σ∈α⧢βᵀ} A(1,σ,n) (Nucl. Phys. B312 (1989) 616)', () => {
    const k = rationalPoint(n, 14)
    // legs 0-based: 1 → 0, n → 5; α = (1, 2), β = (3, 4)
    const lhsOrder = [0, 1, 2, 5, 3, 4]
    const lhs = A(Q, permute(k, lhsOrder), lhsOrder.map((t) => h[t]!))
    const alpha = [1, 2]
    const betaT = [4, 3]
    const shuffles: number[][] = []
    const rec = (a: number[], b: number[], acc: number[]) => {
      if (!a.length && !b.length) return shuffles.push(acc)
      if (a.length) rec(a.slice(1), b, [...acc, a[0]!])
      if (b.length) rec(a, b.slice(1), [...acc, b[0]!])
    }
    rec(alpha, betaT, [])
    let rhs = Q.zero
    for (const s of shuffles) {
      const order = [0, ...s, 5]
      rhs = Q.add(rhs, A(Q, permute(k, order), order.map((t) => h[t]!)))
    }
    expect(lhs.equals(rhs)).toBe(true)
  })
  it('fundamental BCJ: Σ_{i=3}^{n} (Σ_{j=3}^{i} s_{2j}) A(1,3,…,i,2,i+1,…,n) = 0 (arXiv:0805.3993)', () => {
    const k = rationalPoint(n, 15)
    let sum = Q.zero
    const rest = [2, 3, 4, 5]
    for (let i = 0; i < rest.length; i++) {
      let coeff = Q.zero
      for (let j = 0; j <= i; j++) coeff = Q.add(coeff, mandelstam(Q, k, [1, rest[j]!]))
      const order = [0, ...rest.slice(0, i + 1), 1, ...rest.slice(i + 1)]
      sum = Q.add(sum, Q.mul(coeff, A(Q, permute(k, order), order.map((t) => h[t]!))))
    }
    expect(Q.isZero(sum)).toBe(true)
  })
})

describe('soft gluon (Weinberg, Phys. Rev. 140 (1965) B516; eikonal factor ⟨ab⟩/(⟨as⟩⟨sb⟩), common practice)', () => {
  it('A_n(…a, s⁺, b…) → ⟨ab⟩/(⟨as⟩⟨sb⟩) A_{n−1}(…a, b…) as λ̃_s → 0', () => {
    // Build an (n−1)-point point, add a soft leg s between legs 2 and 3 with λ̃_s = ε·(random) and
    // re-solve the last two λ̃ so that momentum stays conserved.
    const h5 = [-1, 1, -1, 1, 1]
    const base = randomPoint(5, 31)
    const eps = 1e-6
    const ls: [Complex, Complex] = [new Complex(0.3, -0.7), new Complex(0.9, 0.2)]
    const lts: [Complex, Complex] = [new Complex(-0.4 * eps, 0.1 * eps), new Complex(0.6 * eps, 0.5 * eps)]
    const kin6: Kin<Complex> = {
      lambda: [base.lambda[0]!, base.lambda[1]!, ls, base.lambda[2]!, base.lambda[3]!, base.lambda[4]!],
      lambdaTilde: [base.lambdaTilde[0]!, base.lambdaTilde[1]!, lts, base.lambdaTilde[2]!, base.lambdaTilde[3]!, base.lambdaTilde[4]!],
    }
    {
      const k6 = solveLastTwo(C, kin6)
      const k5: Kin<Complex> = { lambda: [0, 1, 3, 4, 5].map((t) => k6.lambda[t]!), lambdaTilde: [0, 1, 3, 4, 5].map((t) => k6.lambdaTilde[t]!) }
      const h6 = [-1, 1, 1, -1, 1, 1]
      const soft = C.div(angle(C, k6, 1, 3), C.mul(angle(C, k6, 1, 2), angle(C, k6, 2, 3)))
      const ratio = C.div(A(C, k6, h6), C.mul(soft, A(C, k5, h5)))
      expect(Math.abs(ratio.re - 1)).toBeLessThan(1e-4)
      expect(Math.abs(ratio.im)).toBeLessThan(1e-4)
      expect(square(C, k6, 2, 0).abs()).toBeLessThan(1e-5)
    }
  })
})
