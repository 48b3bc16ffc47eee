// Typed brackets: ⟨12⟩ (U+27E8/U+27E9) and its lookalikes read as <12>, so a formula typed with them
// equals its ASCII form at a point; Parke–Taylor (Parke & Taylor, PRL 56 (1986) 2459) typed with ⟨⟩
// agrees with the closed form. The syntax reference's examples all compile to the LaTeX it shows.
import { describe, expect, it } from 'vitest'
import { complexField as C, rationalField as Q } from '#shared/physics/field'
import { compileFormula } from '#shared/physics/formula'
import { FORMULA_ALIASES, FORMULA_EXAMPLE_LEGS, FORMULA_SYNTAX, normaliseFormula } from '#shared/physics/formula-syntax'
import { parkeTaylor } from '#shared/physics/targets/parke-taylor'
import { PhysicsError } from '#shared/physics/errors'
import { randomComplexPoint, randomRationalPoint, relDiff } from './targets/_points'

describe('typed brackets equal the ASCII forms at a point', () => {
  const kq = randomRationalPoint(6, 'typed-brackets')
  it.each([
    ['⟨12⟩', '<12>'],
    ['⟨1 2⟩', '<1 2>'],
    ['〈1 2〉', '<1 2>'],
    ['〈3,5〉', '<3,5>'],
    ['[12]', '[1 2]'],
    ['⟨1|2+3|4]', '<1|2+3|4]'],
    ['[4|2+3|1⟩', '<1|2+3|4]'],
    ['⟨12⟩[21] − s(1,2)', '<12>[21] - s(1,2)'],
    ['⟨12⟩·[34]×2', '<12>*[34]*2'],
    ['⟨12⟩^4/(⟨12⟩⟨23⟩⟨34⟩⟨45⟩⟨56⟩⟨61⟩)', '<1 2>^4/(<1 2><2 3><3 4><4 5><5 6><6 1>)'],
  ])('%s = %s (exact)', (typed, ascii) => {
    expect(compileFormula(typed, 6).evaluate(Q, kq).equals(compileFormula(ascii, 6).evaluate(Q, kq))).toBe(true)
  })
  it('the LaTeX of a typed formula is that of its ASCII form', () => {
    expect(compileFormula('⟨12⟩^4/⟨23⟩', 4).latex).toBe(compileFormula('<1 2>^4/<2 3>', 4).latex)
  })
  it('normalising keeps the length, so error positions point at the user\'s character', () => {
    for (const a of FORMULA_ALIASES) for (const t of a.typed) expect(normaliseFormula(`1${t}2`)).toBe(`1${a.ascii}2`)
    expect(() => compileFormula('⟨1 7⟩', 5)).toThrow(new PhysicsError('target.formula', 'leg 7 does not exist (legs are 1..5) at position 4'))
    expect(() => compileFormula('⟨1 2]', 5)).toThrow(/expected ">" \(an angle bracket reads <i j>\), found "]" at position 5/)
  })
})

describe('Parke–Taylor typed with ⟨⟩ agrees with the closed form (Parke & Taylor, PRL 56 (1986) 2459)', () => {
  it.each([
    [5, 1, 2],
    [6, 2, 5],
    [7, 3, 7],
  ])('n = %i, negative legs %i and %i', (n, i, j) => {
    const den = Array.from({ length: n }, (_, a) => `⟨${a + 1}${((a + 1) % n) + 1}⟩`).join('')
    const f = compileFormula(`⟨${i}${j}⟩^4/(${den})`, n)
    const h = Array.from({ length: n }, (_, a) => (a + 1 === i || a + 1 === j ? -1 : 1))
    const kq = randomRationalPoint(n, `typed-pt-${n}`)
    expect(f.evaluate(Q, kq).equals(parkeTaylor(Q, kq, h))).toBe(true)
    const k = randomComplexPoint(n, `typed-pt-${n}`)
    expect(relDiff(f.evaluate(C, k), parkeTaylor(C, k, h))).toBeLessThan(1e-12)
  })
})

describe('the syntax reference is the compiler\'s', () => {
  it.each(FORMULA_SYNTAX.map(r => [r.form, r] as const))('%s: its example compiles to the LaTeX shown', (_form, row) => {
    expect(compileFormula(row.example, FORMULA_EXAMPLE_LEGS).latex).toBe(row.tex)
  })
})
