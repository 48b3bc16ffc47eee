// One number interface for the whole engine: complex doubles (complex.js) and exact
// rationals on BigInt (fraction.js). Every algorithm is written once against Field<T>.
import Complex from 'complex.js'
import Fraction from 'fraction.js'

export type Arithmetic = 'float' | 'exact'

/** A complex number on the wire: [re, im] of numbers (float) or of "p/q" strings (exact). */
export type WireNumber = [number, number] | [string, string]

/** Thrown when the evaluation divides by an exact (or, in floats, numerically) vanishing quantity. */
export class SingularError extends Error {
  constructor(public readonly what: string) {
    super(what)
    this.name = 'SingularError'
  }
}

/** a^k for integer k by repeated squaring, shared by the floating fields. */
export function intPow<T>(a: T, k: number, one: T, mul: (x: T, y: T) => T, inv: (x: T) => T, isZero: (x: T) => boolean): T {
  if (!Number.isInteger(k)) throw new RangeError(`non-integer power ${k}`)
  if (k < 0 && isZero(a)) throw new SingularError('zero to a negative power')
  let base = k < 0 ? inv(a) : a
  let e = Math.abs(k)
  let acc = one
  while (e > 0) {
    if (e & 1) acc = mul(acc, base)
    e >>= 1
    if (e > 0) base = mul(base, base)
  }
  return acc
}

export interface Field<T> {
  readonly kind: Arithmetic
  readonly zero: T
  readonly one: T
  fromInt(n: number): T
  add(a: T, b: T): T
  sub(a: T, b: T): T
  mul(a: T, b: T): T
  /** Throws SingularError(what) when b is zero. */
  div(a: T, b: T, what?: string): T
  neg(a: T): T
  /** Integer powers only (negative allowed). */
  pow(a: T, k: number): T
  /** Exactly zero (float: both parts === 0). */
  isZero(a: T): boolean
  /** |a| as a double. */
  abs(a: T): number
  equals(a: T, b: T): boolean
  toWire(a: T): WireNumber
  /** √a in the field, or null where it is not in it (exact: not a rational square); absent: not offered. */
  sqrt?(a: T): T | null
  /**
   * Float fields: a quantity the evaluation divides by counts as zero when |x| is below this
   * fraction of the size of the terms it was formed from (a rounding-level remainder of an exact
   * zero, e.g. two BCFW poles that coincide at a point of small integers). Exact fields: absent.
   */
  readonly zeroTolerance?: number
}

/** Doubles: 1e-10 of the scale (about 10^6 roundings of headroom). */
export const DOUBLE_ZERO_TOLERANCE = 1e-10

/**
 * Whether x, formed from terms of size `scale`, is zero for the purpose of dividing by it:
 * exactly zero in exact arithmetic, below `F.zeroTolerance · scale` in a float field.
 */
export function negligible<T>(F: Field<T>, x: T, scale: number): boolean {
  if (F.isZero(x)) return true
  return F.zeroTolerance !== undefined && F.abs(x) <= F.zeroTolerance * scale
}

/** |a| + |b| of a spinor (the scale of a bracket is the product of two of these). */
export function spinorSize<T>(F: Field<T>, a: readonly [T, T]): number {
  return F.abs(a[0]) + F.abs(a[1])
}

// complex.js parses its arguments on every operation and in its constructor; the engine's hot
// loops build results directly on its prototype (same Complex objects, a fraction of the cost).
const complexProto = Complex.prototype
function mkComplex(re: number, im: number): Complex {
  const z = Object.create(complexProto) as Complex
  z.re = re
  z.im = im
  return z
}

function cmul(a: Complex, b: Complex): Complex {
  return mkComplex(a.re * b.re - a.im * b.im, a.re * b.im + a.im * b.re)
}

/** a / b by Smith's algorithm (no overflow for large |b|). */
function cdiv(a: Complex, b: Complex): Complex {
  if (Math.abs(b.re) >= Math.abs(b.im)) {
    const r = b.im / b.re
    const d = b.re + b.im * r
    return mkComplex((a.re + a.im * r) / d, (a.im - a.re * r) / d)
  }
  const r = b.re / b.im
  const d = b.re * r + b.im
  return mkComplex((a.re * r + a.im) / d, (a.im * r - a.re) / d)
}

const C0 = mkComplex(0, 0)
const C1 = mkComplex(1, 0)

export const complexField: Field<Complex> = {
  kind: 'float',
  zero: C0,
  one: C1,
  fromInt: (n) => mkComplex(n, 0),
  add: (a, b) => mkComplex(a.re + b.re, a.im + b.im),
  sub: (a, b) => mkComplex(a.re - b.re, a.im - b.im),
  mul: cmul,
  div: (a, b, what = 'division by zero') => {
    if (b.re === 0 && b.im === 0) throw new SingularError(what)
    return cdiv(a, b)
  },
  neg: (a) => mkComplex(-a.re, -a.im),
  pow: (a, k) => intPow(a, k, C1, cmul, x => cdiv(C1, x), x => x.re === 0 && x.im === 0),
  isZero: (a) => a.re === 0 && a.im === 0,
  abs: (a) => Math.sqrt(a.re * a.re + a.im * a.im),
  equals: (a, b) => a.re === b.re && a.im === b.im,
  toWire: (a) => [a.re, a.im],
  sqrt: (a) => a.sqrt(),
  zeroTolerance: DOUBLE_ZERO_TOLERANCE,
}

const F0 = new Fraction(0)
const F1 = new Fraction(1)

function fractionString(a: Fraction): string {
  // fraction.js prints "p/q" in lowest terms and integers without "/1".
  return a.toFraction(false)
}

export const rationalField: Field<Fraction> = {
  kind: 'exact',
  zero: F0,
  one: F1,
  fromInt: (n) => new Fraction(n),
  add: (a, b) => a.add(b),
  sub: (a, b) => a.sub(b),
  mul: (a, b) => a.mul(b),
  div: (a, b, what = 'division by zero') => {
    if (b.n === 0n) throw new SingularError(what)
    return a.div(b)
  },
  neg: (a) => a.neg(),
  pow: (a, k) => {
    if (!Number.isInteger(k)) throw new RangeError(`non-integer power ${k}`)
    if (k < 0 && a.n === 0n) throw new SingularError('zero to a negative power')
    return a.pow(k)
  },
  isZero: (a) => a.n === 0n,
  abs: (a) => Math.abs(a.valueOf()),
  equals: (a, b) => a.equals(b),
  toWire: (a) => [fractionString(a), '0'],
  sqrt: (a) => {
    if (a.s < 0n) return null
    const p = isqrt(a.n)
    const q = isqrt(a.d)
    return p * p === a.n && q * q === a.d ? new Fraction(p, q) : null
  },
}

function isqrt(n: bigint): bigint {
  if (n < 2n) return n
  let x = BigInt(Math.floor(Math.sqrt(Number(n))))
  // Newton from the double estimate, then settle exactly.
  for (;;) {
    const y = (x + n / x) >> 1n
    if (y >= x) break
    x = y
  }
  while (x * x > n) x--
  while ((x + 1n) * (x + 1n) <= n) x++
  return x
}

/** Parses an exact input: an integer or "p/q" string, reduced or not. */
export function parseRational(s: string): Fraction {
  if (!/^\s*[+-]?\d+(\s*\/\s*[+-]?\d+)?\s*$/.test(s)) throw new SyntaxError(`"${s}" is not an integer or p/q`)
  const f = new Fraction(s.replace(/\s+/g, ''))
  return f
}

export { Complex, Fraction }
