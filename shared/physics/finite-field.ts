// Arithmetic modulo word-size primes, and the way back to rationals: the Chinese remainder
// theorem (Garner's mixed-radix form) and rational reconstruction (Wang, Proc. SYMSAC 1981; as
// used for amplitudes by von Manteuffel & Schabinger, arXiv:1406.4513, and Peraro, JHEP 12 (2016)
// 030, arXiv:1608.01902). Residues are plain doubles holding integers in [0, p).
import { Fraction, SingularError, intPow, type Field } from './field'
import type { Kin, Spinor } from './spinors'

/**
 * Primes below 2^26, so a product of two residues stays below 2^52 and is exact in a double; the
 * remainder then comes from a floating quotient (off by at most one, corrected). Measured on this
 * machine (Node 20): 9 ns per multiply this way against 22 ns with `%`, and 38 ns per lane for
 * 31-bit primes multiplied in 16-bit halves — the 26-bit primes win even though they need ~20 %
 * more of them.
 */
export const PRIME_LIMIT = 2 ** 26

const primes: number[] = []
let nextCandidate = PRIME_LIMIT - 1
let smallPrimes: number[] | null = null

function sieve(limit: number): number[] {
  const mark = new Uint8Array(limit + 1)
  const out: number[] = []
  for (let i = 2; i <= limit; i++) {
    if (mark[i]) continue
    out.push(i)
    for (let j = i * i; j <= limit; j += i) mark[j] = 1
  }
  return out
}

/** The i-th prime below 2^26, counting down from the largest (generated on demand, cached). */
export function nthPrime(i: number): number {
  smallPrimes ??= sieve(Math.ceil(Math.sqrt(PRIME_LIMIT)))
  while (primes.length <= i) {
    const c = nextCandidate
    nextCandidate -= 2
    let prime = true
    for (const q of smallPrimes) {
      if (q * q > c) break
      if (c % q === 0) {
        prime = false
        break
      }
    }
    if (prime) primes.push(c)
  }
  return primes[i]!
}

/** a⁻¹ mod p by the extended Euclidean algorithm (a in [1, p)). */
export function invMod(a: number, p: number): number {
  let t = 0
  let nt = 1
  let r = p
  let nr = a
  while (nr !== 0) {
    const q = Math.floor(r / nr)
    const t2 = t - q * nt
    t = nt
    nt = t2
    const r2 = r - q * nr
    r = nr
    nr = r2
  }
  if (r !== 1) throw new RangeError(`${a} is not invertible modulo ${p}`)
  return t < 0 ? t + p : t
}

/** a·b mod p for residues a, b < p < 2^26. */
export function mulMod(a: number, b: number, p: number, pinv: number): number {
  const x = a * b
  const r = x - Math.floor(x * pinv) * p
  return r < 0 ? r + p : r >= p ? r - p : r
}

/** An integer (|n| < 2^53) reduced into [0, p). */
function reduceInt(n: number, p: number): number {
  const r = n % p
  return r < 0 ? r + p : r === 0 ? 0 : r
}

/** The field of integers modulo the prime p (< 2^26). `kind` is 'exact': zero tests are exact. */
export class PrimeField implements Field<number> {
  readonly kind = 'exact' as const
  readonly zero = 0
  readonly one = 1
  readonly pinv: number
  readonly big: bigint
  constructor(readonly p: number) {
    if (!(Number.isInteger(p) && p > 2 && p < PRIME_LIMIT)) throw new RangeError(`prime ${p} out of range`)
    this.pinv = 1 / p
    this.big = BigInt(p)
  }

  fromInt(n: number): number {
    if (!Number.isSafeInteger(n)) return this.fromBigInt(BigInt(n))
    return reduceInt(n, this.p)
  }

  fromBigInt(n: bigint): number {
    const r = Number(n % this.big)
    return r < 0 ? r + this.p : r
  }

  add(a: number, b: number): number {
    const s = a + b
    return s >= this.p ? s - this.p : s
  }

  sub(a: number, b: number): number {
    const s = a - b
    return s < 0 ? s + this.p : s
  }

  mul(a: number, b: number): number {
    const x = a * b
    const p = this.p
    const r = x - Math.floor(x * this.pinv) * p
    return r < 0 ? r + p : r >= p ? r - p : r
  }

  div(a: number, b: number, what = 'division by zero'): number {
    if (b === 0) throw new SingularError(what)
    return this.mul(a, invMod(b, this.p))
  }

  neg(a: number): number {
    return a === 0 ? 0 : this.p - a
  }

  pow(a: number, k: number): number {
    return intPow(a, k, 1, (x, y) => this.mul(x, y), (x) => invMod(x, this.p), (x) => x === 0)
  }

  isZero(a: number): boolean {
    return a === 0
  }

  /** Not a size: the residue itself, so that pivot searches pick a non-zero entry. */
  abs(a: number): number {
    return a
  }

  equals(a: number, b: number): boolean {
    return a === b
  }

  toWire(a: number): [string, string] {
    return [String(a), '0']
  }

  /** The image of a rational, or null when its denominator vanishes modulo p (an unlucky prime). */
  fromRational(f: Fraction): number | null {
    const d = f.d < 9007199254740991n ? reduceInt(Number(f.d), this.p) : this.fromBigInt(f.d)
    if (d === 0) return null
    const n = f.n < 9007199254740991n ? reduceInt(Number(f.n), this.p) : this.fromBigInt(f.n)
    const v = this.mul(n, invMod(d, this.p))
    return f.s < 0n ? this.neg(v) : v
  }
}

const fields: PrimeField[] = []

/** The field of the i-th prime (cached). */
export function primeFieldAt(i: number): PrimeField {
  return (fields[i] ??= new PrimeField(nthPrime(i)))
}

/** A point reduced modulo p, or null when a denominator vanishes there. */
export function kinModulo(F: PrimeField, k: Kin<Fraction>): Kin<number> | null {
  const map = (s: Spinor<Fraction>): Spinor<number> | null => {
    const a = F.fromRational(s[0])
    const b = F.fromRational(s[1])
    return a === null || b === null ? null : [a, b]
  }
  const lambda: Spinor<number>[] = []
  const lambdaTilde: Spinor<number>[] = []
  for (let t = 0; t < k.lambda.length; t++) {
    const l = map(k.lambda[t]!)
    const lt = map(k.lambdaTilde[t]!)
    if (!l || !lt) return null
    lambda.push(l)
    lambdaTilde.push(lt)
  }
  return { lambda, lambdaTilde }
}

// Garner's constants p_j⁻¹ mod p_i (j < i, indices into the prime list), cached.
const garner: number[][] = []
function garnerInv(j: number, i: number): number {
  const row = (garner[i] ??= [])
  return (row[j] ??= invMod(nthPrime(j) % nthPrime(i), nthPrime(i)))
}

/**
 * The residue modulo M = Π p of the residues r_t modulo the primes of indices idx[t] (Garner:
 * mixed-radix digits in doubles, then one Horner pass in BigInt).
 */
export function chineseRemainder(residues: readonly number[], idx: readonly number[]): { x: bigint; M: bigint } {
  const m = residues.length
  const v: number[] = new Array(m)
  for (let i = 0; i < m; i++) {
    const F = primeFieldAt(idx[i]!)
    let t = residues[i]!
    for (let j = 0; j < i; j++) {
      const vj = v[j]! % F.p
      t = F.mul(F.sub(t, vj), garnerInv(idx[j]!, idx[i]!))
    }
    v[i] = t
  }
  let x = BigInt(v[m - 1]!)
  let M = primeFieldAt(idx[m - 1]!).big
  for (let i = m - 2; i >= 0; i--) {
    const big = primeFieldAt(idx[i]!).big
    x = x * big + BigInt(v[i]!)
    M *= big
  }
  return { x, M }
}

const fractionProto = Fraction.prototype

type Euclid = [bigint, bigint, bigint, bigint]

/** One step of the extended Euclidean algorithm. */
function euclidStep([r0, r1, s0, s1]: Euclid): Euclid {
  const q = r0 / r1
  return [r1, r0 - q * r1, s1, s0 - q * s1]
}

/** The number of bits of x > 0. */
function bitLength(x: bigint): number {
  const h = x.toString(16)
  return (h.length - 1) * 4 + (32 - Math.clz32(parseInt(h[0]!, 16)))
}

/** ⌊a/b⌋ for integers below 2^53 in magnitude, b > 0, exact (the float quotient may round up). */
function floorDiv(a: number, b: number): number {
  let q = Math.floor(a / b)
  if (q * b > a) q--
  else if (a - q * b >= b) q++
  return q
}

/**
 * Wang's rational reconstruction: the fraction n/d with |n|, d ≤ B and n ≡ u·d (mod M), where
 * B = 2^⌊(bits(M) − 2)/2⌋ (so 2B² < M and the answer is unique), or null when none exists (M is
 * too small for the answer). `primes` are the factors of M: d must be a unit modulo each, which
 * also makes n/d reduced (a common factor of the Euclidean pair divides M).
 */
export function rationalReconstruct(u: bigint, M: bigint, primes: readonly PrimeField[]): Fraction | null {
  u %= M
  if (u < 0n) u += M
  if (u === 0n) return new Fraction(0)
  const mBits = bitLength(M)
  const bound = 1n << BigInt((mBits - 2) >> 1)
  // [r0, r1, s0, s1]: two consecutive remainders and their cofactors of u (s·u ≡ r mod M)
  let st: Euclid = [M, u, 0n, 1n]
  // Lehmer (Knuth, TAOCP 2, 4.5.2, Algorithm L): runs of quotients from the leading 52 bits, applied
  // to the big numbers as one 2×2 matrix. Kept well above the bound (a run shrinks r by less than
  // 2^60), then single steps find the exact stopping remainder.
  const far = bound << 64n
  let bits = mBits
  while (st[1] > far) {
    const shift = BigInt(Math.max(0, bits - 52))
    let x = Number(st[0] >> shift)
    let y = Number(st[1] >> shift)
    let A = 1
    let B = 0
    let C = 0
    let D = 1
    for (;;) {
      if (y + C <= 0 || y + D <= 0) break
      const q = floorDiv(x + A, y + C)
      if (q !== floorDiv(x + B, y + D)) break
      let T = A - q * C
      A = C
      C = T
      T = B - q * D
      B = D
      D = T
      T = x - q * y
      x = y
      y = T
    }
    if (B === 0) st = euclidStep(st)
    else {
      const a = BigInt(A), b = BigInt(B), c = BigInt(C), d = BigInt(D)
      st = [a * st[0] + b * st[1], c * st[0] + d * st[1], a * st[2] + b * st[3], c * st[2] + d * st[3]]
    }
    bits = bitLength(st[0])
  }
  while (st[1] > bound) st = euclidStep(st)
  let n = st[1]
  let d = st[3]
  if (d < 0n) {
    n = -n
    d = -d
  }
  if (d === 0n || d > bound) return null
  for (const F of primes) if (F.fromBigInt(d) === 0) return null
  // Already in lowest terms (above): built directly, as fraction.js would after its own gcd.
  const f = Object.create(fractionProto) as Fraction
  Object.assign(f, { s: n < 0n ? -1n : 1n, n: n < 0n ? -n : n, d })
  return f
}

/** n/d reduced modulo the prime of index i equals the residue r (d a unit there). */
function agrees(n: bigint, d: bigint, r: number, i: number): boolean {
  const F = primeFieldAt(i)
  const dm = F.fromBigInt(d)
  return dm !== 0 && F.mul(r, dm) === F.fromBigInt(n)
}

/**
 * The rational with residues r (prime indices idx), reconstructed from the first `use` of them and
 * checked against every remaining one, or null when that fails.
 */
export function reconstructFrom(residues: readonly number[], idx: readonly number[], use: number): Fraction | null {
  if (use < 1 || use > residues.length) return null
  const { x, M } = chineseRemainder(residues.slice(0, use), idx.slice(0, use))
  const f = rationalReconstruct(x, M, idx.slice(0, use).map(primeFieldAt))
  if (!f) return null
  const n = f.s < 0n ? -f.n : f.n
  for (let t = use; t < residues.length; t++) if (!agrees(n, f.d, residues[t]!, idx[t]!)) return null
  return f
}

/** One residue per prime ("lane"); NaN marks a lane whose prime turned out unlucky. */
export type Lanes = number[]

/**
 * Z/p for several primes at once, lane by lane: one pass of the engine serves every prime, so its
 * bookkeeping (channels, helicity checks, arrays) is paid once instead of once per prime. A
 * division by a residue that is zero in some lanes (a pole or bracket vanishing modulo those
 * primes only) makes those lanes NaN, and they are dropped at the end: the prime is skipped. Only
 * a value zero in every live lane counts as zero (isZero, and SingularError on division).
 */
export class LaneField implements Field<Lanes> {
  readonly kind = 'exact' as const
  readonly zero: Lanes
  readonly one: Lanes
  readonly primes: number[]
  private readonly pinv: number[]
  readonly width: number
  constructor(readonly indices: readonly number[]) {
    this.primes = indices.map(nthPrime)
    this.pinv = this.primes.map((p) => 1 / p)
    this.width = indices.length
    this.zero = new Array<number>(this.width).fill(0)
    this.one = new Array<number>(this.width).fill(1)
  }

  fromInt(n: number): Lanes {
    const out: Lanes = new Array(this.width)
    if (!Number.isSafeInteger(n)) {
      const b = BigInt(n)
      for (let t = 0; t < this.width; t++) out[t] = primeFieldAt(this.indices[t]!).fromBigInt(b)
      return out
    }
    for (let t = 0; t < this.width; t++) out[t] = reduceInt(n, this.primes[t]!)
    return out
  }

  add(a: Lanes, b: Lanes): Lanes {
    const P = this.primes
    const out: Lanes = new Array(this.width)
    for (let t = 0; t < out.length; t++) {
      const s = a[t]! + b[t]!
      out[t] = s >= P[t]! ? s - P[t]! : s
    }
    return out
  }

  sub(a: Lanes, b: Lanes): Lanes {
    const P = this.primes
    const out: Lanes = new Array(this.width)
    for (let t = 0; t < out.length; t++) {
      const s = a[t]! - b[t]!
      out[t] = s < 0 ? s + P[t]! : s
    }
    return out
  }

  mul(a: Lanes, b: Lanes): Lanes {
    const P = this.primes
    const I = this.pinv
    const out: Lanes = new Array(this.width)
    for (let t = 0; t < out.length; t++) {
      const x = a[t]! * b[t]!
      const p = P[t]!
      const r = x - Math.floor(x * I[t]!) * p
      out[t] = r < 0 ? r + p : r >= p ? r - p : r
    }
    return out
  }

  /** Lane-wise inverse; zero lanes become NaN (unlucky). */
  inv(a: Lanes): Lanes {
    const out: Lanes = new Array(this.width)
    for (let t = 0; t < out.length; t++) {
      const x = a[t]!
      out[t] = x === 0 || x !== x ? NaN : invMod(x, this.primes[t]!)
    }
    return out
  }

  // The last divisor and its inverse: formulas often divide several numbers by one value.
  private lastDivisor: Lanes | null = null
  private lastInverse: Lanes | null = null

  div(a: Lanes, b: Lanes, what = 'division by zero'): Lanes {
    if (b !== this.lastDivisor) {
      if (this.isZero(b)) throw new SingularError(what)
      this.lastInverse = this.inv(b)
      this.lastDivisor = b
    }
    return this.mul(a, this.lastInverse!)
  }

  neg(a: Lanes): Lanes {
    const P = this.primes
    const out: Lanes = new Array(this.width)
    for (let t = 0; t < out.length; t++) {
      const x = a[t]!
      out[t] = x === 0 ? 0 : P[t]! - x
    }
    return out
  }

  pow(a: Lanes, k: number): Lanes {
    return intPow(a, k, this.one, (x, y) => this.mul(x, y), (x) => this.inv(x), (x) => this.isZero(x))
  }

  /** Zero in every live lane (a lane that is non-zero proves the rational is non-zero). */
  isZero(a: Lanes): boolean {
    for (let t = 0; t < a.length; t++) {
      const x = a[t]!
      if (x !== 0 && x === x) return false
    }
    return true
  }

  /** Not a size: the number of lanes where a is a unit, so pivot searches pick the most usable entry. */
  abs(a: Lanes): number {
    let c = 0
    for (let t = 0; t < a.length; t++) if (a[t]! > 0) c++
    return c
  }

  equals(a: Lanes, b: Lanes): boolean {
    for (let t = 0; t < a.length; t++) if (a[t] !== b[t] && a[t] === a[t] && b[t] === b[t]) return false
    return true
  }

  toWire(a: Lanes): [string, string] {
    return [a.join(','), '0']
  }

  /** The image of a rational in every lane; a lane whose prime divides the denominator is NaN. */
  fromRational(f: Fraction): Lanes {
    const out: Lanes = new Array(this.width)
    for (let t = 0; t < this.width; t++) out[t] = primeFieldAt(this.indices[t]!).fromRational(f) ?? NaN
    return out
  }
}
