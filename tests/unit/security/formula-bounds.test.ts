// Heavy formulas are refused at parse time, before any exact arithmetic runs (OWASP ASVS 4.0 V5.1.4:
// structured data is checked against ranges; V13.1.x / V11.1.4: no single request occupies a worker).
import { describe, expect, it } from 'vitest'
import { compileFormula } from '#shared/physics/formula'
import { PhysicsError } from '#shared/physics/errors'
import { rationalField as Q } from '#shared/physics/field'
import { randomRationalPoint } from '../physics/targets/_points'

function refusal(src: string): PhysicsError {
  const t0 = performance.now()
  let err: unknown
  try {
    compileFormula(src, 4)
  }
  catch (e) {
    err = e
  }
  expect(performance.now() - t0).toBeLessThan(1000)
  expect(err).toBeInstanceOf(PhysicsError)
  expect((err as PhysicsError).field).toBe('target.formula')
  return err as PhysicsError
}

describe('V5.1.4 formula literals and intermediate sizes are bounded', () => {
  it.each(['1e999999999', '1e-999999999', '1e100000000', '<1 2>*1E+101'])('refuses the literal %s', (src) => {
    expect(refusal(src).message).toMatch(/^target\.formula: the number's exponent is out of range/)
  })
  it('refuses a literal with hundreds of digits', () => {
    expect(refusal('1'.repeat(150)).message).toMatch(/more than 100 digits/)
  })
  it('refuses nested powers that would build huge exact numbers', () => {
    expect(refusal('((<1 2>^64)^64)^64').message).toMatch(/too large for exact arithmetic/)
    expect(refusal('((3^64)^64)^64').message).toMatch(/too large for exact arithmetic/)
  })
  it('still accepts ordinary formulas with exponents and small literals', () => {
    const k = randomRationalPoint(4, 'bounds')
    const f = compileFormula('1e-20*<1 2>^64/<3 4>^64 + 2.5e3*(<1 2>/<3 4>)^4', 4)
    expect(() => f.evaluate(Q, k)).not.toThrow()
  })
})
