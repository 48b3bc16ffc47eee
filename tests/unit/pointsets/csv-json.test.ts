// Our CSV and JSON layouts: round trips, refusal of unreadable files with line and column, and
// the per-point reasons for points that break momentum conservation or masslessness.
import { describe, expect, it } from 'vitest'
import { parseCsv, parseJson, toCsv, toJsonFile, validatePoints, generatePoints, PointFileError, type PointData } from '#shared/pointsets'

function refusal(f: () => unknown): PointFileError {
  try {
    f()
  }
  catch (e) {
    if (e instanceof PointFileError) return e
    throw e
  }
  throw new Error('accepted')
}

const physical = [...generatePoints({ kind: 'physical', n: 5, count: 4, seed: 3, energy: 7 })]
const random = [...generatePoints({ kind: 'random', n: 6, count: 3, seed: 9 })]
const indexed = (ps: PointData[]) => ps.map((data, idx) => ({ idx, data }))
const strip = ({ minInvariant: _m, ...rest }: PointData) => rest

describe('CSV layout: point, leg, E, px, py, pz', () => {
  it('round-trips a generated set exactly', () => {
    const text = toCsv(indexed(physical))
    expect(text.split('\n')[0]).toBe('point,leg,E,px,py,pz')
    const back = parseCsv(text)
    expect(back.rejected).toEqual([])
    expect(back.points).toEqual(physical.map(strip))
    const { valid, rejected } = validatePoints(back.points, 5)
    expect(rejected).toEqual([])
    valid.forEach((p, i) => expect(p.minInvariant).toBeCloseTo(physical[i]!.minInvariant!, 12))
  })

  it('reads columns in any order, comments, CRLF and a code column', () => {
    const text = '# four gluons\r\npz,py,px,E,leg,point,code\r\n-1,0,0,1,1,a,21\r\n1,0,0,1,2,a,21\r\n0,1,0,-1,3,a,21\r\n0,-1,0,-1,4,a,21\r\n'
    const r = parseCsv(text)
    expect(r.points).toEqual([{ label: 'a', momenta: [[1, 0, 0, -1], [1, 0, 0, 1], [-1, 0, 1, 0], [-1, 0, -1, 0]], codes: [21, 21, 21, 21] }])
    expect(validatePoints(r.points).rejected).toEqual([])
  })

  it.each([
    ['no header', '1,1,1,0,0,1\n', 1, 1, /the header row is missing; unknown column "1"/],
    ['a missing column', 'point,leg,E,px,py\n', 1, null, /lacks the column pz/],
    ['a word for a number', 'point,leg,E,px,py,pz\n1,1,1,0,0,1\n1,2,1,0,zero,-1\n', 3, 9, /py must be a finite number, got "zero"/],
    ['a short row', 'point,leg,E,px,py,pz\n1,1,1,0,0\n', 2, null, /expected 6 fields/],
    ['a non-integer leg', 'point,leg,E,px,py,pz\n1,1.5,1,0,0,1\n', 2, 3, /leg must be a label/],
    ['an open quote', 'point,leg,E,px,py,pz\n1,1,"1,0,0,1\n', 2, 5, /quoted field unterminated/],
  ])('refuses %s with line and column', (_w, text, line, column, reason) => {
    const e = refusal(() => parseCsv(text))
    expect([e.line, e.column]).toEqual([line, column])
    expect(e.message).toMatch(reason)
  })

  it('reports duplicated and missing legs per point', () => {
    const r = parseCsv('point,leg,E,px,py,pz\nA,1,1,0,0,1\nA,1,1,0,0,1\nB,1,1,0,0,1\nB,3,1,0,0,-1\n')
    expect(r.rejected).toEqual([
      { point: 'A', reason: 'leg 1 is given twice (lines 2 and 3)', size: null },
      { point: 'B', reason: 'leg 2 is missing (legs given: 1, 3)', size: null },
    ])
  })

  it('refuses a non-conserving point and a massive leg with the size of the violation', () => {
    const text = 'point,leg,E,px,py,pz\n'
      + 'p1,1,-1,0,0,-1\np1,2,-1,0,0,1\np1,3,1,1,0,0\np1,4,1,-1,0,0.01\n'
      + 'p2,1,-1,0,0,-1\np2,2,-1,0,0,1\np2,3,1,0.6,0,0\np2,4,1,-0.6,0,0\n'
    const { valid, rejected } = validatePoints(parseCsv(text).points, 4)
    expect(valid).toEqual([])
    expect(rejected[0]!.point).toBe('p1')
    expect(rejected[0]!.reason).toMatch(/^leg 4 is not massless: p² = -1.0e-4$/)
    expect(rejected[0]!.size).toBeCloseTo(1e-4, 12)
    expect(rejected[1]!.reason).toMatch(/^leg 3 is not massless: p² = 0.64$/)
    const conserving = 'point,leg,E,px,py,pz\nq,1,-1,0,0,-1\nq,2,-1,0,0,1\nq,3,1,1,0,0\nq,4,1.001,-1.001,0,0\n'
    const r = validatePoints(parseCsv(conserving).points, 4).rejected[0]!
    expect(r.reason).toMatch(/^momentum is not conserved: \|Σp\| = 0.00141 relative to the largest energy$/)
    expect(r.size).toBeCloseTo(Math.SQRT2 * 0.001 / 1.001, 9)
  })
})

describe('JSON layout', () => {
  it('round-trips momenta and spinors', () => {
    for (const [pts, n] of [[physical, 5], [random, 6]] as const) {
      const text = JSON.stringify(toJsonFile('set', n, indexed([...pts])))
      const back = parseJson(text)
      expect(back.n).toBe(n)
      expect(back.points).toEqual(pts.map(strip))
      const v = validatePoints(back.points, n)
      expect(v.rejected).toEqual([])
      v.valid.forEach((p, i) => expect(p.minInvariant).toBeCloseTo(pts[i]!.minInvariant!, 12))
    }
  })

  it('refuses a syntax error with line and column', () => {
    const e = refusal(() => parseJson('{\n  "points": [\n    { "momenta": [[1, 0, 0, 1] [1, 0, 0, -1]] }\n  ]\n}'))
    expect([e.line, e.column]).toEqual([3, 32])
    expect(e.message).toMatch(/^file: line 3, column 32: not valid JSON/)
  })

  it('gives line and column of a schema error too', () => {
    const text = '{\n  "points": [\n    { "momenta": [[1, 0, 0, 1], [1, 0, 0, -1], [1, 0, 1, "x"]] }\n  ]\n}'
    const e = refusal(() => parseJson(text))
    expect(e.message).toMatch(/^file: line 3, column 58: points\[0\]\.momenta\[2\]\[3\]: must be a finite number/)
    expect(text.split('\n')[2]!.slice(57, 60)).toBe('"x"')
    const unknown = refusal(() => parseJson('{ "points": [], "pionts": 1 }'))
    expect([unknown.line, unknown.column]).toEqual([1, 1])
  })

  it.each([
    [{ points: [{ momenta: [[1, 0, 0, 1], [1, 0, 0, -1], [1, 0]] }] }, /^file: points\[0\]\.momenta\[2\]: must be \[E, px, py, pz\]/],
    [{ points: [{ momenta: [[1, 0, 0, 1], [1, 0, 0, -1], [1, 0, 1, 'x']] }] }, /^file: points\[0\]\.momenta\[2\]\[3\]: must be a finite number/],
    [{ points: [{ lambda: random[0]!.lambda }] }, /^file: points\[0\]\.lambdaTilde: is missing/],
    [{ points: [{}] }, /^file: points\[0\]: needs momenta, or lambda and lambdaTilde/],
    [{ point: [] }, /^file: (points|point)/],
  ])('refuses a wrong shape naming the path (%#)', (body, reason) => {
    expect(refusal(() => parseJson(JSON.stringify(body))).message.replace(/^file: line \d+, column \d+: /, 'file: ')).toMatch(reason)
  })
})
