// Numbers as the term table shows them: re/im in scientific notation, |·| and phase (in units of
// π). Exact values arrive as "p/q" strings and are shown exactly, with float |·| and phase beside.
// fmt… helpers give ASCII (the CSV and LaTeX exports use them); what a page shows goes through
// the show… helpers, which print the minus sign U+2212 (typographic minus, common practice).
import type { WireComplex } from '../schemas/evaluate'

/** A "p/q" or integer string as a double (digits beyond 17 are scaled, so no overflow). */
export function rationalToNumber(s: string): number {
  const [p, q = '1'] = s.split('/').map(x => x.trim())
  const big = (x: string) => {
    const neg = x.startsWith('-')
    const d = x.replace(/^[+-]/, '')
    return { neg, head: Number(d.slice(0, 17)), exp: Math.max(0, d.length - 17) }
  }
  const a = big(p!)
  const b = big(q)
  const v = (a.head / b.head) * 10 ** (a.exp - b.exp)
  return (a.neg !== b.neg ? -1 : 1) * v
}

export function toFloat(c: WireComplex): [number, number] {
  return [typeof c[0] === 'string' ? rationalToNumber(c[0]) : c[0], typeof c[1] === 'string' ? rationalToNumber(c[1]) : c[1]]
}

export function absOf(c: WireComplex): number {
  const [re, im] = toFloat(c)
  return Math.hypot(re, im)
}

/** Phase in units of π, in (−1, 1]. */
export function phaseOf(c: WireComplex): number {
  const [re, im] = toFloat(c)
  if (re === 0 && im === 0) return 0
  return Math.atan2(im, re) / Math.PI
}

/** A real part as the table prints it: exact strings as they are, floats to 10 significant digits. */
export function fmtReal(x: number | string, digits = 10): string {
  if (typeof x === 'string') return x
  if (x === 0) return '0'
  if (!Number.isFinite(x)) return String(x)
  return x.toExponential(digits - 1).replace('e+', 'e+').replace(/e([+-])(\d)$/, 'e$10$2')
}

/** The minus sign U+2212 for every ASCII hyphen-minus in a number's text (signs and exponents). */
export function minusSign(text: string): string {
  return text.replace(/-/g, '\u2212')
}

/** A complex value for display: re, im, |·| and phase, with U+2212 minus signs. */
export function fmtComplex(c: WireComplex | null | undefined, digits = 10): { re: string, im: string, abs: string, phase: string } {
  if (!c) return { re: '—', im: '—', abs: '—', phase: '—' }
  return { re: showReal(c[0], digits), im: showReal(c[1], digits), abs: showReal(absOf(c), 6), phase: minusSign(`${phaseOf(c).toFixed(4)}π`) }
}

export function showReal(x: number | string, digits = 10): string {
  return minusSign(fmtReal(x, digits))
}

/** Scientific notation with `fractionDigits` after the point, or '—' for a missing value. */
export function showSci(x: number | null | undefined, fractionDigits = 2): string {
  if (x === null || x === undefined) return '—'
  if (x === 0) return '0'
  return minusSign(x.toExponential(fractionDigits))
}

/**
 * A tolerance with the digits it has (1e−9, 1.6e−8): two significant digits at most, trailing
 * zeros dropped, so 1.6e-8 is not rounded to 2e-8.
 */
export function showTolerance(x: number): string {
  const [mantissa, exponent] = x.toExponential(1).split('e') as [string, string]
  return minusSign(`${mantissa.replace(/\.0$/, '')}e${exponent.replace('+', '')}`)
}

/** A deviation for display (two digits after the point, U+2212). */
export function showDeviation(d: number | null | undefined): string {
  return minusSign(fmtDeviation(d))
}

/** "1 channel term", "3 channel terms": a count with its noun in the right number. */
export function countOf(n: number, singular: string, plural = `${singular}s`): string {
  return `${n} ${n === 1 ? singular : plural}`
}

export function fmtDeviation(d: number | null | undefined): string {
  if (d === null || d === undefined) return '—'
  if (d === 0) return '0'
  return d.toExponential(2)
}
