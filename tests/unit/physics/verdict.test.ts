// docs/conventions.md "Verdicts", the float tolerance and the deviation.
import { describe, expect, it } from 'vitest'
import { decideVerdict, deviationOf, floatTolerance, type VerdictInput } from '#shared/physics/verdict'
import { complexField as C, rationalField as Q, Fraction, Complex } from '#shared/physics/field'

const ok: VerdictInput = { singular: false, targetNone: false, shiftValidByTable: true, probedExponent: null, vanishing: false, arithmetic: 'float', n: 6, deviation: 1e-14, exactEqual: false }

describe('verdict order', () => {
  it.each([
    ['singular beats everything', { ...ok, singular: true, targetNone: true, shiftValidByTable: false }, 'singular point'],
    ['target none', { ...ok, targetNone: true, shiftValidByTable: false }, 'not evaluated'],
    ['invalid by the table', { ...ok, shiftValidByTable: false }, 'boundary term suspected'],
    ['probed exponent ≥ 0', { ...ok, probedExponent: 0 }, 'boundary term suspected'],
    ['probed exponent < 0', { ...ok, probedExponent: -1 }, 'agrees'],
    ['vanishing class with an invalid shift', { ...ok, shiftValidByTable: false, vanishing: true, deviation: 0 }, 'agrees'],
    ['float within tolerance', { ...ok, deviation: 9e-10 }, 'agrees'],
    ['float beyond tolerance', { ...ok, deviation: 2e-9 }, 'disagrees'],
    ['n = 12 within its larger tolerance', { ...ok, n: 12, deviation: 1e-8 }, 'agrees'],
    ['exact, equal', { ...ok, arithmetic: 'exact', exactEqual: true, deviation: 0 }, 'agrees'],
    ['exact, tiny difference', { ...ok, arithmetic: 'exact', exactEqual: false, deviation: 1e-30 }, 'disagrees'],
  ] as [string, VerdictInput, string][])('%s', (_, v, want) => expect(decideVerdict(v)).toBe(want))
})

describe('tolerance and deviation', () => {
  it('1e-9 up to n = 8, grows with n, never above 1e-7', () => {
    expect(floatTolerance(4)).toBe(1e-9)
    expect(floatTolerance(8)).toBe(1e-9)
    expect(floatTolerance(12)).toBeCloseTo(1.6e-8, 20)
    for (let n = 4; n <= 40; n++) expect(floatTolerance(n)).toBeLessThanOrEqual(1e-7)
  })
  it('relative deviation; exact zero target: |value| / max |term|', () => {
    expect(deviationOf(C, new Complex(1.5, 0), new Complex(1, 0), [])).toBeCloseTo(0.5, 15)
    expect(deviationOf(Q, new Fraction(0), new Fraction(0), [new Fraction(2), new Fraction(-2)])).toBe(0)
    expect(deviationOf(Q, new Fraction(1, 10), new Fraction(0), [new Fraction(2), new Fraction(-19, 10)])).toBeCloseTo(0.05, 15)
    expect(deviationOf(Q, new Fraction(3, 2), new Fraction(1), [])).toBe(0.5)
  })
})
