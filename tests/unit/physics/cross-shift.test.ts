// The four-particle test by cross-shifts (Benincasa & Cachazo, arXiv:0705.4305; higher spins:
// McGady & Rodina, arXiv:1311.2938 — references from memory): every valid shift agrees for
// gluons, gravitons and spin 2; a single species of spin 1, 3 or 4 gives different residue sums
// under different shifts; for the cubic scalar adjacent shifts miss a boundary term while
// non-adjacent shifts agree with the Feynman diagrams.
import { describe, expect, it } from 'vitest'
import { complexField as C, rationalField as Q } from '#shared/physics/field'
import { randomPoint, rationalPoint } from '#shared/physics/kinematics'
import { crossShift } from '#shared/physics/cross-shift'
import { processOf, type TheoryName } from '#shared/physics/theories'
import { cubicScalarFeynman } from '#shared/physics/targets/cubic-scalar'

const consistent: [string, TheoryName, number | undefined, number[]][] = [
  ['gluon −−++', 'gluon', undefined, [-1, -1, 1, 1]],
  ['gluon −+−+', 'gluon', undefined, [-1, 1, -1, 1]],
  ['graviton −−++', 'graviton', undefined, [-2, -2, 2, 2]],
  ['graviton −+−+', 'graviton', undefined, [-2, 2, -2, 2]],
  ['spin 2 −−++', 'spin', 2, [-2, -2, 2, 2]],
  ['spin 2 +−−+', 'spin', 2, [2, -2, -2, 2]],
  ['gluon NMHV n=6', 'gluon', undefined, [-1, 1, -1, 1, -1, 1]],
  ['graviton NMHV n=6', 'graviton', undefined, [-2, 2, -2, 2, -2, 2]],
]

describe('consistent theories: all valid shifts agree exactly', () => {
  it.each(consistent)('%s', (_, theory, spin, h) => {
    const r = crossShift(Q, processOf(theory, spin), rationalPoint(h.length, 17), h)
    expect(r.agree).toBe(true)
    expect(r.spread).toBe(0)
    expect(r.rows.filter((x) => x.valid).length).toBeGreaterThan(1)
  })
  it('float: spread at rounding level', () => {
    const h = [-1, 1, -1, 1, -1, 1, 1]
    const r = crossShift(C, processOf('gluon'), randomPoint(7, 2), h)
    expect(r.spread).toBeLessThan(1e-12)
  })
})

describe('a single species of spin 1, 3, 4: different shifts give different four-point sums', () => {
  const cases: [number, number[]][] = []
  for (const s of [1, 3, 4]) for (const base of [[-1, -1, 1, 1], [-1, 1, -1, 1]]) cases.push([s, base.map((x) => x * s)])
  it.each(cases)('spin %i %j', (s, h) => {
    const r = crossShift(Q, processOf('spin', s), rationalPoint(4, 17), h)
    expect(r.agree).toBe(false)
    expect(r.spread).toBeGreaterThan(1e-3)
  })
})

describe('cubic scalar: adjacent shifts miss the boundary term, non-adjacent agree with Feynman', () => {
  it.each([4, 5, 6])('n = %i', (n) => {
    const h = Array(n).fill(0)
    const k = rationalPoint(n, 23)
    const feyn = cubicScalarFeynman(Q, k)
    const r = crossShift(Q, processOf('scalar-cubic'), k, h)
    expect(r.agree).toBe(true)
    for (const row of r.rows) {
      if (row.valid) expect(row.value!.equals(feyn)).toBe(true)
      else expect(row.value!.equals(feyn)).toBe(false)
    }
  })
})
