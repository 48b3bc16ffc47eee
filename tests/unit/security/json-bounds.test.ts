// Free-form JSON fields are measured without recursion (OWASP ASVS 4.0 V5.1.4: structured data is
// bounded); a graph stored before the bound still opens, cut where it is too deep.
import { describe, expect, it } from 'vitest'
import { GraphSchema } from '#shared/schemas/graph'
import { jsonDepth, pruneDeep } from '#shared/schemas/json-bounds'
import { describeIssues, IdParam, limitQuery } from '#shared/schemas/common'

function nest(levels: number): unknown {
  let v: unknown = 1
  for (let i = 0; i < levels; i++) v = i % 2 ? [v] : { a: v }
  return v
}

describe('V5.1.4 JSON depth bounds', () => {
  it('measures 100,000 levels without overflowing the stack', () => {
    expect(jsonDepth(nest(100_000), 30).depth).toBe(31)
    expect(jsonDepth({ a: [1, { b: 2 }] }).depth).toBe(3)
  })
  it('a deep node data field is refused naming its path', () => {
    const r = GraphSchema.safeParse({ nodes: [{ id: 'a', type: 'leg', position: { x: 0, y: 0 }, data: { label: 'x', deep: nest(4100) } }], edges: [] })
    expect(r.success).toBe(false)
    expect(describeIssues(r.error!).field).toBe('nodes[0].data.deep')
  })
  it('an ordinary graph passes', () => {
    expect(GraphSchema.safeParse({ nodes: [{ id: 'a', type: 'leg', position: { x: 0, y: 0 }, data: { label: '1', helicity: 1, extra: { a: [1, 2] } } }], edges: [] }).success).toBe(true)
  })
  it('pruneDeep cuts a stored deep value and reports where', () => {
    const { value, cut } = pruneDeep({ nodes: [{ data: nest(5000) }], edges: [] }, 10)
    expect(cut).toHaveLength(1)
    expect(cut[0]).toMatch(/^nodes\[0\]\.data/)
    expect(() => JSON.stringify(value)).not.toThrow()
    expect(jsonDepth(value, 100).depth).toBeLessThanOrEqual(10)
    expect(pruneDeep({ a: [1, { b: 'c' }] }).value).toEqual({ a: [1, { b: 'c' }] })
  })
})

describe('V5.1.3 whole numbers are plain decimals', () => {
  it.each(['1.5', '0x10', '1e1', '-1', '', ' 2', 'NaN'])('limit %j is refused', (limit) => {
    expect(limitQuery(200, 50).safeParse({ limit }).success).toBe(false)
  })
  it('accepts digits and defaults when absent', () => {
    expect(limitQuery(200, 50).parse({ limit: '20' })).toEqual({ limit: 20 })
    expect(limitQuery(200, 50).parse({})).toEqual({ limit: 50 })
  })
  it.each(['0x1', '1e0', '1.0', '+1', '01', '0'])('id %j is not id 1', (id) => {
    expect(IdParam.safeParse({ id }).success).toBe(false)
  })
})
