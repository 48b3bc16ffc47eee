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
}

export const complexField: Field<Complex> = {
  kind: 'float',
  zero: Complex.ZERO,
  one: Complex.ONE,
  fromInt: (n) => new Complex(n, 0),
  add: (a, b) => a.add(b),
  sub: (a, b) => a.sub(b),
  mul: (a, b) => a.mul(b),
  div: (a, b, what = 'division by zero') => {
    if (b.re === 0 && b.im === 0) throw new SingularError(what)
    return a.div(b)
  },
  neg: (a) => a.neg(),
  pow: (a, k) => {
    if (!Number.isInteger(k)) throw new RangeError(`non-integer power ${k}`)
    let base = k < 0 ? Complex.ONE.div(a) : a
    let e = Math.abs(k)
    let acc = Complex.ONE
    while (e > 0) {
      if (e & 1) acc = acc.mul(base)
      base = base.mul(base)
      e >>= 1
    }
    return acc
  },
  isZero: (a) => a.re === 0 && a.im === 0,
  abs: (a) => a.abs(),
  equals: (a, b) => a.re === b.re && a.im === b.im,
  toWire: (a) => [a.re, a.im],
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
}

/** Parses an exact input: an integer or "p/q" string, reduced or not. */
export function parseRational(s: string): Fraction {
  if (!/^\s*[+-]?\d+(\s*\/\s*[+-]?\d+)?\s*$/.test(s)) throw new SyntaxError(`"${s}" is not an integer or p/q`)
  const f = new Fraction(s.replace(/\s+/g, ''))
  return f
}

export { Complex, Fraction }
