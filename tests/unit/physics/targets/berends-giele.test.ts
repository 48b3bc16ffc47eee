// Berends–Giele (Berends & Giele, Nucl. Phys. B306 (1988) 759) against outside references:
// Parke–Taylor (Parke & Taylor, PRL 56 (1986) 2459), reference-spinor independence (gauge
// invariance), U(1) decoupling and Kleiss–Kuijf (Kleiss & Kuijf, Nucl. Phys. B312 (1989) 616), the
// fundamental BCJ relation (Bern, Carrasco, Johansson, arXiv:0805.3993), little-group scaling and
// the leading soft-gluon factor (Weinberg, Phys. Rev. 140 (1965) B516).
import { describe, expect, it } from 'vitest'
import { Complex, Fraction, complexField as C, rationalField as Q } from '#shared/physics/field'
import type { Field } from '#shared/physics/field'
import type { Kin } from '#shared/physics/spinors'
import { angle, square, mandelstam } from '#shared/physics/spinors'
import { toFloatKin } from '#shared/physics/kinematics'
import { berendsGiele } from '#shared/physics/targets/berends-giele'
import { parkeTaylor } from '#shared/physics/targets/parke-taylor'
import { expectSubleading, permuteKin, randomComplexPoint, randomRationalPoint, relDiff, withSoftLeg } from './_points'

const TOL = 1e-9 // docs/conventions.md: a sound float tolerance at generic points

/** Every ±1 helicity assignment of n legs. */
function allHelicities(n: number): number[][] {
  const out: number[][] = []
  for (let mask = 0; mask < 1 << n; mask++) out.push(Array.from({ length: n }, (_, a) => ((mask >> a) & 1 ? -1 : 1)))
  return out
}
const minusCount = (h: number[]) => h.filter((x) => x < 0).length
const vanishing = (h: number[]) => h.length >= 4 && (minusCount(h) < 2 || h.length - minusCount(h) < 2)

/** A at the colour order `order` (0-based labels of the original legs). */
function ordered<T>(F: Field<T>, k: Kin<T>, h: number[], order: number[]): T {
  return berendsGiele(F, permuteKin(k, order), order.map((i) => h[i]!))
}

/** |Σ terms| / max |term| — the size of a relation's violation. */
function violation(terms: Complex[]): number {
  const sum = terms.reduce((a, b) => a.add(b), Complex.ZERO)
  return sum.abs() / Math.max(...terms.map((t) => t.abs()))
}

const mhvCases: Array<[number, number[]]> = []
for (let n = 4; n <= 10; n++) {
  const mhv = Array(n).fill(1)
  mhv[0] = -1
  mhv[Math.floor(n / 2)] = -1
  mhvCases.push([n, mhv])
  const adj = Array(n).fill(1)
  adj[n - 2] = -1
  adj[n - 1] = -1
  mhvCases.push([n, adj])
  mhvCases.push([n, mhv.map((x) => -x)])
  mhvCases.push([n, adj.map((x) => -x)])
}

describe('Berends–Giele = Parke–Taylor (Parke & Taylor, PRL 56 (1986) 2459)', () => {
  it.each(mhvCases)('n = %i, helicities %j (float)', (n, h) => {
    for (const seed of [1, 2]) {
      const k = randomComplexPoint(n, `bg-pt-${seed}`)
      expect(relDiff(berendsGiele(C, k, h), parkeTaylor(C, k, h))).toBeLessThan(TOL)
    }
  })
  it.each(mhvCases.filter(([n]) => n <= 8))('n = %i, helicities %j (exact, equal rationals)', (n, h) => {
    const k = randomRationalPoint(n, `bg-pt-exact-${n}`)
    const bg = berendsGiele(Q, k, h)
    expect(bg.equals(parkeTaylor(Q, k, h))).toBe(true)
    expect(bg.n).not.toBe(0n)
  })
})

describe('float precision: double-double recursion on the conserving surface', () => {
  // The Feynman-diagram sum cancels where the amplitude is accidentally small; the float path
  // therefore runs in double-double and re-solves the last two λ̃. Checked against exact
  // Parke–Taylor at a rational point rounded to doubles (n = 12 is above the exact limit of BCFW,
  // Parke–Taylor alone is cheap in exact arithmetic).
  const toDouble = (f: Fraction): number => {
    let a = f.n, b = f.d
    const bits = Math.max(a.toString(2).length, b.toString(2).length)
    const sh = BigInt(Math.max(0, bits - 1000))
    a >>= sh
    b >>= sh
    return Number(f.s) * (Number(a) / Number(b))
  }
  it.each([8, 10, 12])('n = %i: MHV and anti-MHV at 10 rational points agree with exact Parke–Taylor to 1e-13', (n) => {
    for (let seed = 0; seed < 10; seed++) {
      const kq = randomRationalPoint(n, `bg-dd-${seed}`)
      const kf = toFloatKin(kq)
      const h = Array.from({ length: n }, (_, a) => (a === 0 || a === 1 + (seed % (n - 1)) ? -1 : 1))
      for (const hh of [h, h.map((x) => -x)]) {
        const exact = toDouble(parkeTaylor(Q, kq, hh))
        const bg = berendsGiele(C, kf, hh)
        expect(Math.abs(bg.re - exact) / Math.abs(exact)).toBeLessThan(1e-13)
        expect(Math.abs(bg.im)).toBeLessThan(1e-13 * Math.abs(exact))
      }
    }
  })
  it("precision 'double' runs in complexField itself (same value within float tolerance at a benign point)", () => {
    const k = randomComplexPoint(7, 'bg-double')
    const h = [-1, 1, -1, 1, -1, 1, 1]
    expect(relDiff(berendsGiele(C, k, h, { precision: 'double' }), berendsGiele(C, k, h))).toBeLessThan(TOL)
  })
})

describe('Berends–Giele does not depend on the reference spinors (gauge invariance)', () => {
  it.each([4, 5, 6, 7])('every helicity configuration at n = %i (float)', (n) => {
    const k = randomComplexPoint(n, `bg-ref-${n}`)
    // Scale of the non-vanishing amplitudes at this point, for the identically vanishing classes.
    const scale = Math.max(...allHelicities(n).filter((h) => !vanishing(h)).map((h) => berendsGiele(C, k, h).abs()))
    for (const h of allHelicities(n)) {
      const base = berendsGiele(C, k, h)
      for (const reference of [1, 2, 3]) {
        const other = berendsGiele(C, k, h, { reference })
        if (vanishing(h)) expect(other.abs() / scale).toBeLessThan(1e-12)
        else expect(relDiff(base, other)).toBeLessThan(TOL)
      }
      if (vanishing(h)) expect(base.abs() / scale).toBeLessThan(1e-12)
    }
  })
  it.each([4, 5, 6])('every helicity configuration at n = %i (exact: equal rationals, vanishing classes exactly 0)', (n) => {
    const k = randomRationalPoint(n, `bg-ref-exact-${n}`)
    for (const h of allHelicities(n)) {
      const base = berendsGiele(Q, k, h)
      for (const reference of [1, 2]) expect(berendsGiele(Q, k, h, { reference }).equals(base)).toBe(true)
      if (vanishing(h)) expect(base.n).toBe(0n)
      else expect(base.n).not.toBe(0n)
    }
  })
})

const nmhvCases: Array<[number[]]> = [
  [[-1, -1, -1, 1, 1, 1]],
  [[-1, 1, -1, 1, -1, 1]],
  [[1, -1, -1, 1, -1, 1]],
  [[-1, -1, 1, -1, 1, 1, 1]],
  [[-1, 1, -1, 1, -1, 1, 1]],
  [[-1, -1, 1, 1, -1, -1, 1, 1]],
  [[-1, 1, -1, 1, -1, 1, -1, 1]],
]

describe('U(1) decoupling (Kleiss & Kuijf, Nucl. Phys. B312 (1989) 616)', () => {
  // A(1,2,…,n) + A(2,1,3,…,n) + A(2,3,1,…,n) + … + A(2,…,n−1,1,n) = 0
  it.each([[[-1, -1, 1, 1, 1]] as [number[]], ...nmhvCases])('helicities %j', (h) => {
    const n = h.length
    const k = randomComplexPoint(n, `u1-${n}`)
    const rest = Array.from({ length: n - 1 }, (_, a) => a + 1)
    const terms = Array.from({ length: n - 1 }, (_, pos) => {
      const order = [...rest]
      order.splice(pos, 0, 0)
      return ordered(C, k, h, order)
    })
    expect(violation(terms)).toBeLessThan(TOL)
  })
})

/** All interleavings of a and b keeping the order within each. */
function shuffles(a: number[], b: number[]): number[][] {
  if (a.length === 0) return [b]
  if (b.length === 0) return [a]
  return [...shuffles(a.slice(1), b).map((s) => [a[0]!, ...s]), ...shuffles(a, b.slice(1)).map((s) => [b[0]!, ...s])]
}

describe('Kleiss–Kuijf relations (Kleiss & Kuijf, Nucl. Phys. B312 (1989) 616)', () => {
  // A(1, α, n, β) = (−1)^|β| Σ_{σ ∈ α ⧢ βᵀ} A(1, σ, n)
  const cases: Array<[number[], number[], number[]]> = [
    [[-1, -1, -1, 1, 1, 1], [1, 2], [3, 4]],
    [[-1, 1, -1, 1, -1, 1], [1], [2, 3, 4]],
    [[-1, 1, -1, 1, -1, 1], [2, 4], [1, 3]],
    [[-1, -1, 1, -1, 1, 1, 1], [1, 2], [3, 4, 5]],
    [[-1, 1, -1, 1, -1, 1, 1], [4], [1, 2, 5, 3]],
  ]
  it.each(cases)('helicities %j, α = %j, β = %j (0-based)', (h, alpha, beta) => {
    const n = h.length
    expect([...alpha, ...beta].sort()).toEqual(Array.from({ length: n - 2 }, (_, a) => a + 1))
    const last = n - 1
    const k = randomComplexPoint(n, `kk-${n}`)
    const lhs = ordered(C, k, h, [0, ...alpha, last, ...beta])
    const sign = beta.length % 2 === 0 ? 1 : -1
    const rhs = shuffles(alpha, [...beta].reverse())
      .map((s) => ordered(C, k, h, [0, ...s, last]))
      .reduce((a, b) => a.add(b), Complex.ZERO)
      .mul(sign)
    expect(relDiff(lhs, rhs)).toBeLessThan(TOL)
  })
})

describe('fundamental BCJ relation (Bern, Carrasco, Johansson, arXiv:0805.3993)', () => {
  // Σ_{i=3}^{n} (Σ_{j=3}^{i} s_{2j}) A(1, 3, …, i, 2, i+1, …, n) = 0 (1-based labels)
  it.each([[[-1, -1, 1, 1]] as [number[]], [[-1, 1, -1, 1, 1]] as [number[]], ...nmhvCases])('helicities %j', (h) => {
    const n = h.length
    const k = randomComplexPoint(n, `bcj-${n}`)
    const terms: Complex[] = []
    for (let i = 3; i <= n; i++) {
      let coef = Complex.ZERO
      for (let j = 3; j <= i; j++) coef = coef.add(mandelstam(C, k, [1, j - 1]))
      const order = [0]
      for (let l = 3; l <= n; l++) {
        order.push(l - 1)
        if (l === i) order.push(1)
      }
      terms.push(coef.mul(ordered(C, k, h, order)))
    }
    expect(violation(terms)).toBeLessThan(TOL)
  })
})

describe('little-group scaling: λ_i → tλ_i, λ̃_i → λ̃_i/t gives t^(−2h_i) (common practice)', () => {
  it.each(nmhvCases)('helicities %j (exact)', (h) => {
    const n = h.length
    const k = randomRationalPoint(n, `lg-${n}`)
    const t = new Fraction(3, 2)
    const base = berendsGiele(Q, k, h)
    for (let i = 0; i < n; i++) {
      const scaled: Kin<Fraction> = {
        lambda: k.lambda.map((l, a) => (a === i ? [l[0].mul(t), l[1].mul(t)] : l)),
        lambdaTilde: k.lambdaTilde.map((l, a) => (a === i ? [l[0].div(t), l[1].div(t)] : l)),
      }
      expect(berendsGiele(Q, scaled, h).equals(base.mul(t.pow(-2 * h[i]!)))).toBe(true)
    }
  })
})

describe('leading soft-gluon factor (Weinberg, Phys. Rev. 140 (1965) B516)', () => {
  // In our conventions, from Parke–Taylor: A_n(…a, s⁺, b…) → ⟨ab⟩/(⟨as⟩⟨sb⟩) A_{n−1}(…a, b…) as
  // λ̃_s → ε λ̃_s; and, from the conjugate formula's (−1)ⁿ, A_n(…a, s⁻, b…) → −[ab]/([as][sb]) A_{n−1}
  // as λ_s → ε λ_s. The soft leg sits at position 1 (0-based), between legs 0 and 2.
  const cases: Array<[number[], 1 | -1]> = [
    [[-1, -1, 1, 1, 1], 1],
    [[-1, -1, -1, 1, 1, 1], 1],
    [[-1, 1, -1, 1, 1, -1], 1],
    [[-1, -1, -1, 1, 1, 1], -1],
    [[1, -1, 1, -1, 1, -1, 1], -1],
    [[1, -1, 1, -1, 1, -1, 1], 1],
  ]
  it.each(cases)('hard helicities %j, soft helicity %i', (hardH, hs) => {
    const hard = randomComplexPoint(hardH.length, `soft-${hardH.length}`)
    const h = [hardH[0]!, hs, ...hardH.slice(1)]
    const aHard = berendsGiele(C, hard, hardH)
    const dev = (eps: number) => {
      const k = withSoftLeg(hard, 1, eps, hs === 1)
      const S = hs === 1
        ? angle(C, k, 0, 2).div(angle(C, k, 0, 1).mul(angle(C, k, 1, 2)))
        : square(C, k, 0, 2).div(square(C, k, 0, 1).mul(square(C, k, 1, 2))).neg()
      return relDiff(berendsGiele(C, k, h), S.mul(aHard))
    }
    expectSubleading(dev)
  })
})

describe('input checks', () => {
  it.each([
    [[-1, 2, 1, 1], 'helicities[1]: a gluon has helicity ±1'],
    [[-1, 1], 'target: Berends–Giele needs at least three legs'],
  ])('helicities %j → %s', (h, msg) => {
    const k = randomComplexPoint(4, 'bad')
    expect(() => berendsGiele(C, h.length === 4 ? k : { lambda: k.lambda.slice(0, 2), lambdaTilde: k.lambdaTilde.slice(0, 2) }, h)).toThrow(msg)
  })
  it('Parke–Taylor refuses NMHV helicities with a target error', () => {
    const k = randomComplexPoint(6, 'bad')
    expect(() => parkeTaylor(C, k, [-1, -1, -1, 1, 1, 1])).toThrow(/^target: Parke–Taylor applies only/)
  })
  it('Parke–Taylor gives exactly zero for the vanishing classes', () => {
    const k = randomRationalPoint(5, 'zero')
    expect(parkeTaylor(Q, k, [1, 1, 1, 1, 1]).n).toBe(0n)
    expect(parkeTaylor(Q, k, [-1, 1, 1, 1, 1]).n).toBe(0n)
  })
})
