// Numbers as the term table shows them: re/im in scientific notation, |·| and phase (in units of
// π). Exact values arrive as "p/q" strings and are shown exactly, with float |·| and phase beside.
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

export function fmtComplex(c: WireComplex | null | undefined, digits = 10): { re: string, im: string, abs: string, phase: string } {
  if (!c) return { re: '—', im: '—', abs: '—', phase: '—' }
  return { re: fmtReal(c[0], digits), im: fmtReal(c[1], digits), abs: fmtReal(absOf(c), 6), phase: `${phaseOf(c).toFixed(4)}π` }
}

export function fmtDeviation(d: number | null | undefined): string {
  if (d === null || d === undefined) return '—'
  if (d === 0) return '0'
  return d.toExponential(2)
}
