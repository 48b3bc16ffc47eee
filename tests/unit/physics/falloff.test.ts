// Large-z falloff along every [i,j⟩ shift, measured exactly at seeded rational points, against the
// exponent falloff table of docs/conventions.md (validity: Britto, Cachazo, Feng, Witten, PRL 94 (2005)
// 181602; the exponents themselves are common practice).
import { describe, expect, it } from 'vitest'
import { probeFalloff, falloffTable } from '#shared/physics/falloff'
import { processOf, tableExponent, type TheoryName } from '#shared/physics/theories'

const cases: [TheoryName, number[]][] = [
  ['gluon', [-1, -1, 1, 1]],
  ['gluon', [-1, 1, -1, 1]],
  ['gluon', [-1, -1, 1, 1, 1]],
  ['gluon', [1, -1, 1, -1, -1]],
  ['gluon', [-1, 1, -1, 1, -1, 1]],
  ['gluon', [-1, -1, 1, 1, 1, 1]],
  ['graviton', [-2, -2, 2, 2]],
  ['graviton', [-2, 2, -2, 2, 2]],
  ['scalar-cubic', [0, 0, 0, 0]],
  ['scalar-cubic', [0, 0, 0, 0, 0]],
  ['scalar-cubic', [0, 0, 0, 0, 0, 0]],
]

const rows: [string, TheoryName, number[], number, number][] = []
for (const [theory, h] of cases) {
  const n = h.length
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) if (i !== j) rows.push([`${theory} ${h.join(',')} [${i + 1},${j + 1}⟩`, theory, h, i, j])
}

describe('measured exponent = docs/conventions.md falloff table', () => {
  it.each(rows)('%s', (_, theory, h, i, j) => {
    const p = processOf(theory)
    const r = probeFalloff(p, h, i, j)
    expect(r.measured).toBe(true)
    expect(r.spread).toBeLessThan(0.01)
    expect(r.exponent).toBe(tableExponent(p, h, i, j))
    expect(r.valid).toBe(r.exponent < 0)
  })
})

describe('falloffTable lists every shift', () => {
  it('gluon n = 5: 20 shifts, [+,−⟩ invalid, the rest valid', () => {
    const h = [-1, -1, 1, 1, 1]
    const t = falloffTable('gluon', h)
    expect(t).toHaveLength(20)
    for (const r of t) {
      const bad = h[r.shift[0] - 1]! > 0 && h[r.shift[1] - 1]! < 0
      expect(r.valid).toBe(!bad)
      expect(r.exponent! < 0).toBe(!bad)
    }
    expect(t.find((r) => r.shift[0] === 3 && r.shift[1] === 2)!.exponent).toBe(3)
    expect(t.find((r) => r.shift[0] === 4 && r.shift[1] === 1)!.exponent).toBe(2)
  })
  it('cubic scalar: adjacent shifts invalid (exponent 0)', () => {
    const t = falloffTable('scalar-cubic', [0, 0, 0, 0, 0])
    expect(t.filter((r) => !r.valid).map((r) => r.shift.join(','))).toEqual(['1,2', '1,5', '2,1', '2,3', '3,2', '3,4', '4,3', '4,5', '5,1', '5,4'])
  })
  it('spin 3: validity by the graviton rule, no tabulated exponent', () => {
    const t = falloffTable('spin', [-3, -3, 3, 3], 3)
    expect(t.every((r) => r.exponent === null)).toBe(true)
    expect(t.filter((r) => !r.valid)).toHaveLength(4)
  })
  it('a vanishing class reports the table exponent, unmeasured', () => {
    const r = probeFalloff(processOf('gluon'), [1, 1, 1, 1, 1], 0, 1)
    expect(r.measured).toBe(false)
  })
})
