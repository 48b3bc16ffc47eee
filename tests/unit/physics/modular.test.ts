// The exact backend over finite fields: arithmetic modulo primes checked against BigInt, the
// Chinese remainder theorem against direct reduction, Wang's rational reconstruction (Wang, Proc.
// SYMSAC 1981; von Manteuffel & Schabinger, arXiv:1406.4513) against known fractions, and the whole
// evaluation against the big-rational reference at the engine suite's exact points.
import { describe, expect, it } from 'vitest'
import { Fraction, rationalField as Q } from '#shared/physics/field'
import {
  LaneField,
  PRIME_LIMIT,
  PrimeField,
  chineseRemainder,
  invMod,
  nthPrime,
  primeFieldAt,
  rationalReconstruct,
  reconstructFrom,
} from '#shared/physics/finite-field'
import { bcfwByPrimes, byPrimes } from '#shared/physics/modular'
import { shiftedKin } from '#shared/physics/falloff'
import { evaluate } from '#shared/physics/index'
import { rationalPoint, solveLastTwo } from '#shared/physics/kinematics'
import { bcfw } from '#shared/physics/bcfw'
import { defaultShift, processOf } from '#shared/physics/theories'
import type { Kin, Spinor } from '#shared/physics/spinors'
import type { EvaluateRequestInput } from '#shared/schemas/evaluate'
import { allHelicities } from './helpers'

const residuesOf = (f: Fraction, count: number, first = 0) => Array.from({ length: count }, (_, t) => primeFieldAt(first + t).fromRational(f)!)
const indices = (count: number, first = 0) => Array.from({ length: count }, (_, t) => first + t)

describe('arithmetic modulo primes below 2^26', () => {
  it('the primes are prime, below 2^26 and descending', () => {
    for (let i = 0; i < 40; i++) {
      const p = nthPrime(i)
      expect(p).toBeLessThan(PRIME_LIMIT)
      if (i > 0) expect(p).toBeLessThan(nthPrime(i - 1))
      let divisor = 0
      for (let d = 2; d * d <= p && !divisor; d++) if (p % d === 0) divisor = d
      expect(divisor).toBe(0)
    }
    expect(nthPrime(0)).toBe(67108859) // the largest prime below 2^26 (trial division above)
  })
  it('products, sums, inverses and powers agree with BigInt', () => {
    const F = primeFieldAt(3)
    const P = BigInt(F.p)
    let x = 12345
    for (let t = 0; t < 500; t++) {
      x = (x * 1103515245 + 12345) % 2147483648
      const a = x % F.p
      const b = (x * 7 + 11) % F.p
      expect(F.mul(a, b)).toBe(Number((BigInt(a) * BigInt(b)) % P))
      expect(F.add(a, b)).toBe(Number((BigInt(a) + BigInt(b)) % P))
      expect(F.sub(a, b)).toBe(Number((((BigInt(a) - BigInt(b)) % P) + P) % P))
      if (b !== 0) expect(F.mul(b, invMod(b, F.p))).toBe(1)
    }
    expect(F.pow(2, 30)).toBe(Number((1n << 30n) % P))
    expect(F.mul(F.pow(3, -5), F.pow(3, 5))).toBe(1)
    expect(F.fromInt(-1)).toBe(F.p - 1)
    expect(F.fromRational(new Fraction(-3, 4))).toBe(F.div(F.fromInt(-3), F.fromInt(4)))
    expect(F.fromRational(new Fraction(1, F.p))).toBeNull()
    expect(() => new PrimeField(PRIME_LIMIT + 1)).toThrow(RangeError)
  })
  it('lanes: one residue per prime; a zero lane under division turns NaN, all-zero throws', () => {
    const L = new LaneField([0, 1, 2])
    const a = L.fromRational(new Fraction(5, 7))
    expect(a).toEqual([0, 1, 2].map((i) => primeFieldAt(i).fromRational(new Fraction(5, 7))))
    const b = [0, 1, 1]
    const q = L.div(L.one, b)
    expect(Number.isNaN(q[0])).toBe(true)
    expect(q.slice(1)).toEqual([1, 1])
    expect(L.isZero([0, NaN, 0])).toBe(true)
    expect(L.isZero([0, 3, 0])).toBe(false)
    expect(() => L.div(L.one, L.zero)).toThrow(/division by zero/)
  })
})

describe('Chinese remainder theorem and rational reconstruction', () => {
  it('CRT gives the residue modulo the product', () => {
    const x = 123456789012345678901234567890123456789n
    const idx = indices(6, 5)
    const r = idx.map((i) => Number(x % BigInt(nthPrime(i))))
    const { x: y, M } = chineseRemainder(r, idx)
    expect(M).toBe(idx.reduce((m, i) => m * BigInt(nthPrime(i)), 1n))
    expect(y).toBe(x % M)
  })
  it.each([
    ['22/7', new Fraction(22, 7)],
    ['-355/113', new Fraction(-355, 113)],
    ['1', new Fraction(1)],
    ['-1/3', new Fraction(-1, 3)],
    ['2^100/3^50', new Fraction(2n ** 100n, 3n ** 50n)],
    ['-(10^40+1)/(7^45)', new Fraction(-(10n ** 40n + 1n), 7n ** 45n)],
  ])('%s comes back from enough primes and is confirmed by two more', (_, f) => {
    const bits = f.n.toString(2).length + f.d.toString(2).length
    const use = Math.ceil((bits + 2) / 25) + 1
    const back = reconstructFrom(residuesOf(f, use + 2), indices(use + 2), use)
    expect(back).not.toBeNull()
    expect(back!.equals(f)).toBe(true)
    expect(back!.d).toBe(f.d) // lowest terms
  })
  it('zero is zero', () => {
    expect(rationalReconstruct(0n, 1000003n, [])!.equals(new Fraction(0))).toBe(true)
  })
  it('too few primes: no reconstruction, or one that the extra primes refuse', () => {
    const f = new Fraction(2n ** 100n + 7n, 3n ** 60n)
    expect(reconstructFrom(residuesOf(f, 5), indices(5), 3)).toBeNull()
  })
  it('Wang by hand: 3/7 modulo 101·103 (u = 3·7⁻¹)', () => {
    const M = 101n * 103n
    const u = (3n * BigInt(invMod(7 % 10403, 10403))) % M
    const f = rationalReconstruct(u, M, [])
    expect(f!.equals(new Fraction(3, 7))).toBe(true)
  })
})

// Exact points the engine's suite uses (bcfw-gluon, gravity, evaluate, cubic-scalar tests) and more.
function gluonCases(): [string, number[], number][] {
  const out: [string, number[], number][] = []
  for (let n = 4; n <= 6; n++) for (const h of allHelicities(n)) out.push([h.map((x) => (x > 0 ? '+' : '−')).join(''), h, 4])
  for (let n = 7; n <= 9; n++) {
    for (let k = 0; 2 * k <= n - 4; k++) {
      const spread = Array<number>(n).fill(1)
      for (let t = 0; t < k + 2; t++) spread[Math.floor((t * n) / (k + 2))] = -1
      const adjacent = Array.from({ length: n }, (_, t) => (t < k + 2 ? -1 : 1))
      for (const [h, seed] of [[spread, 5], [adjacent, 1], [spread.map((x) => -x), 2]] as [number[], number][]) out.push([h.map((x) => (x > 0 ? '+' : '−')).join(''), h, seed])
    }
  }
  return out
}

function same(req: EvaluateRequestInput) {
  const a = evaluate({ ...req, exact: { backend: 'rational' } })
  const b = evaluate({ ...req, exact: { backend: 'modular' } })
  expect({ ...b, ms: 0 }).toEqual({ ...a, ms: 0 })
  return a
}

describe('modular = big rationals, every field of the response', () => {
  it.each(gluonCases())('gluons %s (seed %#)', (_, h, seed) => {
    same({ theory: 'gluon', helicities: h, kinematics: { kind: 'rational', seed }, arithmetic: 'exact' })
  })
  it.each([
    [[-2, -2, 2, 2], 3], [[-2, 2, -2, 2, 2], 2], [[-2, -2, 2, 2, 2], 3], [[-2, -2, -2, 2, 2], 3],
    [[-2, 2, -2, 2, 2, 2], 2], [[2, -2, 2, -2, -2, -2], 2], [[-2, -2, -2, 2, 2, 2], 3], [[-2, 2, -2, 2, -2, 2], 3], [[2, -2, -2, 2, -2, 2], 3],
  ] as [number[], number][])('gravitons %j (seed %i)', (h, seed) => {
    const r = same({ theory: 'graviton', helicities: h, kinematics: { kind: 'rational', seed }, arithmetic: 'exact' })
    expect(r.verdict).toBe('agrees')
  })
  it.each([4, 5, 6, 7, 8])('cubic scalars, n = %i', (n) => {
    const r = same({ theory: 'scalar-cubic', helicities: Array(n).fill(0), kinematics: { kind: 'rational', seed: 1 }, arithmetic: 'exact' })
    expect(r.verdict).toBe('agrees')
  })
  it('spin 3, a formula target, a vanishing class, a non-default shift', () => {
    same({ theory: 'spin', spin: 3, helicities: [-3, -3, 3, 3], kinematics: { kind: 'rational', seed: 1 }, arithmetic: 'exact' })
    same({ theory: 'gluon', helicities: [-1, -1, 1, 1], kinematics: { kind: 'rational', seed: 1 }, arithmetic: 'exact', target: { formula: '<1 2>^4/(<1 2><2 3><3 4><4 1>)' } })
    same({ theory: 'gluon', helicities: [-1, 1, 1, 1, 1], kinematics: { kind: 'rational', seed: 1 }, arithmetic: 'exact' })
    same({ theory: 'gluon', helicities: [-1, 1, -1, 1, -1, 1], kinematics: { kind: 'rational', seed: 2 }, arithmetic: 'exact', shift: [1, 3] })
  })
})

/** A conserving rational point on which ⟨12⟩ = p exactly (p = the first prime): a pole modulo p only. */
function unluckyPoint(n: number, p: number): Kin<Fraction> {
  const k = rationalPoint(n, 7)
  const l2 = k.lambda[1]!
  const l1: Spinor<Fraction> = [l2[0].add(new Fraction(p).div(l2[1])), l2[1]]
  const lambda = k.lambda.slice()
  lambda[0] = l1
  return solveLastTwo(Q, { lambda, lambdaTilde: k.lambdaTilde })
}

describe('unlucky primes', () => {
  const p = nthPrime(0)
  const g = processOf('gluon')
  const h = [-1, 1, -1, 1, 1, -1, 1]
  it('a bracket vanishing modulo the first prime only: that prime is skipped, the answer unchanged', () => {
    const k = unluckyPoint(7, p)
    const ang12 = k.lambda[0]![0].mul(k.lambda[1]![1]).sub(k.lambda[0]![1].mul(k.lambda[1]![0]))
    expect(ang12.equals(new Fraction(p))).toBe(true)
    const shift = defaultShift(g, h)
    const reference = bcfw(Q, g, k, h, shift)
    const r = byPrimes(k, (F, km) => {
      const b = bcfw(F, g, km, h, shift)
      return { shape: String(b.terms.length), values: [b.value, ...b.terms.map((t) => t.value)], info: null }
    })
    expect(r).not.toBeNull()
    expect(r!.unlucky).toBeGreaterThanOrEqual(1)
    expect(r!.values[0]!.equals(reference.value)).toBe(true)
    reference.terms.forEach((t, s) => expect(r!.values[1 + s]!.equals(t.value)).toBe(true))
  })
  it('a denominator divisible by the first prime: that lane is dropped', () => {
    const k = rationalPoint(6, 3)
    const lt = k.lambdaTilde.slice()
    lt[0] = [k.lambdaTilde[0]![0].add(new Fraction(1, p)), k.lambdaTilde[0]![1]]
    const kk = solveLastTwo(Q, { lambda: k.lambda, lambdaTilde: lt })
    const hh = [-1, -1, 1, -1, 1, 1]
    const shift = defaultShift(g, hh)
    const r = byPrimes(kk, (F, km) => ({ shape: '', values: [bcfw(F, g, km, hh, shift).value], info: null }))
    expect(r!.unlucky).toBeGreaterThanOrEqual(1)
    expect(r!.values[0]!.equals(bcfw(Q, g, kk, hh, shift).value)).toBe(true)
  })
  it('through evaluate(): the same response as big rationals', () => {
    const k = unluckyPoint(7, p)
    const w = (s: Spinor<Fraction>) => s.map((x) => x.toFraction()) as [string, string]
    same({ theory: 'gluon', helicities: h, kinematics: { kind: 'exact-spinors', lambda: k.lambda.map(w), lambdaTilde: k.lambdaTilde.map(w) }, arithmetic: 'exact' })
  })
  it('an exact zero of the rational computation (a physical pole) falls back to the reference and its message', () => {
    const k = rationalPoint(5, 1)
    // legs 1 and 2 collinear: s12 = 0 exactly
    const lambda = k.lambda.slice()
    lambda[1] = [k.lambda[0]![0].mul(2), k.lambda[0]![1].mul(2)]
    const kk = solveLastTwo(Q, { lambda, lambdaTilde: k.lambdaTilde })
    const w = (s: Spinor<Fraction>) => s.map((x) => x.toFraction()) as [string, string]
    const r = same({ theory: 'gluon', helicities: [-1, -1, 1, 1, 1], kinematics: { kind: 'exact-spinors', lambda: kk.lambda.map(w), lambdaTilde: kk.lambdaTilde.map(w) }, arithmetic: 'exact' })
    expect(r.verdict).toBe('singular point')
  })
})

describe('large numbers: the falloff probe\'s shifted points (z = 10^8)', () => {
  it.each([
    ['gluon', [-1, 1, -1, 1, -1, 1, 1, 1]],
    ['graviton', [-2, 2, -2, 2, -2, 2]],
  ] as const)('%s: BCFW by primes equals BCFW in big rationals', (theory, h) => {
    const p = processOf(theory)
    const k = shiftedKin(rationalPoint(h.length, 'falloff', { numerator: 9, denominator: 4 }), 0, 1, new Fraction(10n ** 8n))
    const shift = defaultShift(p, [...h])
    const r = bcfwByPrimes(p, k, [...h], shift, { terms: true })!
    const ref = bcfw(Q, p, k, [...h], shift)
    expect(r.value.equals(ref.value)).toBe(true)
    expect(r.terms.map((t) => t.value.toFraction())).toEqual(ref.terms.map((t) => t.value.toFraction()))
  })
})
