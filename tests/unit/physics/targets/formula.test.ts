// The user-formula target: typed as Parke–Taylor (Parke & Taylor, PRL 56 (1986) 2459) or as the
// three-point and KLT forms of docs/conventions.md it must reproduce those values exactly; brackets are
// compared with the spinor primitives; errors point at the user's character.
import { describe, expect, it } from 'vitest'
import { Fraction, complexField as C, rationalField as Q, SingularError } from '#shared/physics/field'
import { angle, square, mandelstam, sandwich } from '#shared/physics/spinors'
import { compileFormula } from '#shared/physics/formula'
import { evaluate } from '#shared/physics/index'
import { PhysicsError } from '#shared/physics/errors'
import { parkeTaylor } from '#shared/physics/targets/parke-taylor'
import { klt } from '#shared/physics/targets/klt'
import { randomComplexPoint, randomRationalPoint, relDiff } from './_points'

function ptFormula(n: number, i: number, j: number): string {
  const den = Array.from({ length: n }, (_, a) => `<${a + 1} ${((a + 1) % n) + 1}>`).join('')
  return `<${i} ${j}>^4/(${den})`
}

describe('formula = Parke–Taylor when typed as Parke–Taylor (Parke & Taylor, PRL 56 (1986) 2459)', () => {
  it.each([
    [4, 1, 2],
    [5, 1, 3],
    [6, 2, 5],
    [8, 3, 8],
  ])('n = %i, negative legs %i and %i (exact and float)', (n, i, j) => {
    const f = compileFormula(ptFormula(n, i, j), n)
    const h = Array.from({ length: n }, (_, a) => (a + 1 === i || a + 1 === j ? -1 : 1))
    const kq = randomRationalPoint(n, `formula-${n}`)
    expect(f.evaluate(Q, kq).equals(parkeTaylor(Q, kq, h))).toBe(true)
    const k = randomComplexPoint(n, `formula-${n}`)
    expect(relDiff(f.evaluate(C, k), parkeTaylor(C, k, h))).toBeLessThan(1e-12)
  })
  it('the parity conjugate, with the (−1)ⁿ of docs/conventions.md, at n = 5', () => {
    const f = compileFormula('-[2 4]^4/([1 2][2 3][3 4][4 5][5 1])', 5)
    const kq = randomRationalPoint(5, 'formula-anti')
    expect(f.evaluate(Q, kq).equals(parkeTaylor(Q, kq, [-1, 1, -1, 1, -1]))).toBe(true)
  })
  it('KLT four-graviton form M_4 = −s12 A(1234) A(1243), typed with Parke–Taylor (docs/conventions.md)', () => {
    const f = compileFormula('-s(1,2) * <1 2>^4/(<1 2><2 3><3 4><4 1>) * <1 2>^4/(<1 2><2 4><4 3><3 1>)', 4)
    const kq = randomRationalPoint(4, 'formula-klt')
    expect(f.evaluate(Q, kq).equals(klt(Q, kq, [-2, -2, 2, 2]))).toBe(true)
  })
})

describe('brackets and numbers', () => {
  const kq = randomRationalPoint(6, 'formula-brackets')
  const one = new Fraction(1)
  it.each<[string, () => Fraction]>([
    ['<1 2>', () => angle(Q, kq, 0, 1)],
    ['<12>', () => angle(Q, kq, 0, 1)],
    ['< 3 , 5 >', () => angle(Q, kq, 2, 4)],
    ['[1 2]', () => square(Q, kq, 0, 1)],
    ['[64]', () => square(Q, kq, 5, 3)],
    ['s(1,2,3)', () => mandelstam(Q, kq, [0, 1, 2])],
    ['s(245)', () => mandelstam(Q, kq, [1, 3, 4])],
    ['<1|2+3|4]', () => sandwich(Q, kq, 0, [1, 2], 3)],
    ['[4|2+3|1>', () => sandwich(Q, kq, 0, [1, 2], 3)],
    ['<2|5|6]', () => angle(Q, kq, 1, 4).mul(square(Q, kq, 4, 5))],
    ['0.1', () => new Fraction(1, 10)],
    ['.25 * 4', () => one],
    ['1.5e-1', () => new Fraction(3, 20)],
    ['2^-3', () => new Fraction(1, 8)],
    ['-2^2', () => new Fraction(-4)],
    ['1/2/4', () => new Fraction(1, 8)],
    ['2(3 + 4)', () => new Fraction(14)],
    ['<1 2>[2 1]', () => mandelstam(Q, kq, [0, 1])],
    ['(<1 2> + [1 2])^2 - <1 2>^2 - [1 2]^2', () => angle(Q, kq, 0, 1).mul(square(Q, kq, 0, 1)).mul(2)],
  ])('%s', (src, expected) => {
    expect(compileFormula(src, 6).evaluate(Q, kq).equals(expected())).toBe(true)
  })
  it('0.1 stays exact in exact mode: 0.1 + 0.2 = 3/10', () => {
    expect(compileFormula('0.1 + 0.2', 4).evaluate(Q, randomRationalPoint(4, 'x')).equals(new Fraction(3, 10))).toBe(true)
  })
  it('legs above 9 need separators and are read as whole numbers', () => {
    const k = randomRationalPoint(12, 'formula-12')
    expect(compileFormula('<10 12> s(1,11)', 12).evaluate(Q, k).equals(angle(Q, k, 9, 11).mul(mandelstam(Q, k, [0, 10])))).toBe(true)
  })
})

describe('errors name target.formula and the 1-based position in the user\'s string', () => {
  it.each([
    ['<1 2>^4/(<1 2><2 3><3 4>', 5, 'target.formula: a closing parenthesis is missing at position 25'],
    ['<1 2>^4/(<1 2><2 3>) + ', 5, 'target.formula: unexpected end of input at position 24'],
    ['<1 7>', 5, 'target.formula: leg 7 does not exist (legs are 1..5) at position 4'],
    ['[7 1]', 5, 'target.formula: leg 7 does not exist (legs are 1..5) at position 2'],
    ['s(1,2,9)', 5, 'target.formula: leg 9 does not exist (legs are 1..5) at position 7'],
    ['<1|2+6|3]', 5, 'target.formula: leg 6 does not exist (legs are 1..5) at position 6'],
    ['<1 2', 5, 'target.formula: unexpected end of input at position 5'],
    ['1 + * 2', 5, 'target.formula: a value is expected at position 5'],
    ['(1))', 5, 'target.formula: unexpected ")" at position 4'],
    ['<1 2>^(1/2)', 5, 'target.formula: an exponent must be an integer at position 6'],
    ['[1 2] + <1 2>^<1 2>', 5, 'target.formula: an exponent must be an integer at position 14'],
    ['<1 2>^100', 5, 'target.formula: the exponent 100 is too large (at most 64 in size) at position 6'],
    ['x + 1', 5, 'target.formula: unknown name "x" (use <i j>, [i j], s(i,j,…), <i|P|j] or A(…)) at position 1'],
    ['1 # 2', 5, 'target.formula: unexpected character "#" at position 3'],
    ['<1 2 3>', 5, 'target.formula: expected ">" (an angle bracket reads <i j>), found "3" at position 6'],
    ['[1 2>', 5, 'target.formula: expected "]" (a square bracket reads [i j]), found ">" at position 5'],
    ['s(1,2,1)', 5, 'target.formula: leg 1 appears twice in s(…) at position 7'],
    ['<1|2+3+2|4]', 5, 'target.formula: leg 2 appears twice in the momentum of a sandwich at position 8'],
    ['s(3)', 5, 'target.formula: s(…) needs at least two legs at position 1'],
    ['   ', 5, 'target.formula: the formula is empty'],
  ])('%j (n = %i)', (src, n, message) => {
    let err: unknown
    try {
      compileFormula(src, n)
    }
    catch (e) {
      err = e
    }
    expect(err).toBeInstanceOf(PhysicsError)
    expect((err as PhysicsError).message).toBe(message)
    expect((err as PhysicsError).field).toBe('target.formula')
    expect((err as PhysicsError).status).toBe(422)
  })
  it('division by a vanishing bracket is a singular point, naming the position', () => {
    const k = randomRationalPoint(4, 'sing')
    const f = compileFormula('1/(<1 2> - <1 2>)', 4)
    expect(() => f.evaluate(Q, k)).toThrow(SingularError)
    expect(() => f.evaluate(Q, k)).toThrow('the formula divides by zero at position 2')
  })
})

describe('LaTeX for KaTeX', () => {
  it.each([
    ['<1 2>', '\\langle 1\\,2\\rangle'],
    ['[3 4]', '[3\\,4]'],
    ['s(1,2,3)', 's_{123}'],
    ['s(10,11)', 's_{10,11}'],
    ['<1|2+3|4]', '\\langle 1|2+3|4]'],
    ['[4|2+3|1>', '\\langle 1|2+3|4]'],
  ])('%s → %s', (src, tex) => {
    expect(compileFormula(src, 12).latex).toBe(tex)
  })
  it('fractions, powers and products', () => {
    const tex = compileFormula('<1 2>^4/(<1 2><2 3><3 4><4 1>)', 4).latex
    expect(tex.startsWith('\\frac{')).toBe(true)
    expect(tex).toContain('{\\langle 1\\,2\\rangle}^{4}')
    expect(tex).toContain('\\langle 4\\,1\\rangle')
    expect(tex).not.toMatch(/ang\(|sand\(|mand\(/)
    expect(compileFormula('-s(1,2) [1 2]', 4).latex).toBe('-s_{12}~[1\\,2]')
  })
})

describe('formulas that refer to amplitudes of the same process: A(σ)', () => {
  // identities of colour-ordered amplitudes typed as targets: reflection A(1…n) = (−1)ⁿ A(n…1) and
  // U(1) decoupling (Kleiss & Kuijf, Nucl. Phys. B312 (1989) 616)
  const h = [-1, 1, -1, 1, 1]
  it.each([
    ['A(1,2,3,4,5)'],
    ['A(12345)'],
    ['-A(5,4,3,2,1)'],
    ['-(A(2,1,3,4,5) + A(2,3,1,4,5) + A(2,3,4,1,5))'],
  ])('%s agrees (float and exact)', (formula) => {
    const f = evaluate({ theory: 'gluon', helicities: h, kinematics: { kind: 'random', seed: 2 }, target: { formula } })
    expect(f.verdict).toBe('agrees')
    const e = evaluate({ theory: 'gluon', helicities: h, kinematics: { kind: 'rational', seed: 2 }, arithmetic: 'exact', target: { formula } })
    expect(e.verdict).toBe('agrees')
    expect(e.target!.latex).toMatch(/A\(\d(,\d){4}\)/)
  })
  it('a relation with a term dropped disagrees', () => {
    const r = evaluate({ theory: 'gluon', helicities: h, kinematics: { kind: 'rational', seed: 2 }, arithmetic: 'exact', target: { formula: '-(A(2,1,3,4,5) + A(2,3,1,4,5))' } })
    expect(r.verdict).toBe('disagrees')
  })
  it('gravitons: A(σ) is the same symmetric amplitude', () => {
    const r = evaluate({ theory: 'graviton', helicities: [-2, 2, -2, 2, 2], kinematics: { kind: 'rational', seed: 3 }, arithmetic: 'exact', target: { formula: 'A(3,1,2,5,4)' } })
    expect(r.verdict).toBe('agrees')
  })
  it.each([
    ['A(1,2,3,4)', /A\(…\) lists every leg once: 5 legs, found 4 at position 1$/],
    ['A(1,2,3,4,4)', /leg 4 appears twice in A\(…\) at position 11$/],
    ['A(1,2,3,4,6)', /leg 6 does not exist \(legs are 1..5\) at position 11$/],
    ['B(1,2)', /unknown name "B"/],
  ])('%s is refused on target.formula', (formula, msg) => {
    expect(() => evaluate({ theory: 'gluon', helicities: h, kinematics: { kind: 'random', seed: 2 }, target: { formula } })).toThrow(msg)
  })
  it('without a process the formula says what A(…) needs', () => {
    const c = compileFormula('A(1,2,3,4)', 4)
    expect(c.usesAmplitudes).toBe(true)
    expect(() => c.evaluate(C, randomComplexPoint(4, 1))).toThrow(/A\(…\) needs the process/)
  })
})
