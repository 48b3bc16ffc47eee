// Display helpers: one minus sign (U+2212) in shown numbers, ASCII in exports, a tolerance with
// its own digits, and counts with their nouns in the right number.
import { describe, expect, it } from 'vitest'
import { countOf, fmtComplex, fmtDeviation, fmtReal, minusSign, showDeviation, showReal, showSci, showTolerance } from '#shared/editor/format'
import { floatTolerance } from '#shared/physics/verdict'
import { termsCsv } from '#shared/editor/exports'

const MINUS = '\u2212'

describe('minus signs', () => {
  it('shown numbers use U+2212 for signs and exponents, never a hyphen', () => {
    expect(showReal(-1.5e-7, 3)).toBe(`${MINUS}1.50e${MINUS}07`)
    expect(showSci(-2.5e-12)).toBe(`${MINUS}2.50e${MINUS}12`)
    expect(showDeviation(3.2e-16)).toBe(`3.20e${MINUS}16`)
    expect(showReal('-3/4')).toBe(`${MINUS}3/4`)
    const c = fmtComplex([-1, -0.5])
    for (const part of [c.re, c.im, c.phase]) {
      expect(part).not.toContain('-')
      expect(part).toContain(MINUS)
    }
    expect(minusSign('1e-9')).toBe(`1e${MINUS}9`)
  })

  it('missing and zero values stay as they are', () => {
    expect(showSci(null)).toBe('—')
    expect(showSci(0)).toBe('0')
    expect(showDeviation(null)).toBe('—')
  })

  it('exports keep ASCII (CSV and LaTeX readers expect a hyphen-minus)', () => {
    expect(fmtReal(-1.5e-7, 3)).toBe('-1.50e-07')
    expect(fmtDeviation(3.2e-16)).toBe('3.20e-16')
    const csv = termsCsv({ n: 4, theory: 'gluon', shift: [1, 2], arithmetic: 'float', value: [-1, 0], terms: [], target: null, deviation: 1e-12, verdict: 'agrees', falloff: null, warnings: [], kinematics: { lambda: [], lambdaTilde: [] }, engine: { version: 'x' }, ms: 1 })
    expect(csv).not.toContain(MINUS)
  })
})

describe('tolerances keep their digits', () => {
  it.each([
    [8, `1e${MINUS}9`],
    [9, `2e${MINUS}9`],
    [12, `1.6e${MINUS}8`],
    [20, `1e${MINUS}7`],
  ])('n = %i → %s', (n, shown) => {
    expect(showTolerance(floatTolerance(n))).toBe(shown)
  })
})

describe('counts', () => {
  it.each([
    [1, '1 channel term'],
    [2, '2 channel terms'],
    [0, '0 channel terms'],
  ])('%i', (n, text) => {
    expect(countOf(n, 'channel term')).toBe(text)
  })
  it('takes an irregular plural', () => {
    expect(countOf(1, 'vertex', 'vertices')).toBe('1 vertex')
    expect(countOf(3, 'vertex', 'vertices')).toBe('3 vertices')
  })
})
