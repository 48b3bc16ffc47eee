import { describe, expect, it } from 'vitest'
import { diffRevisions, showValue, type RevisionLike } from '#shared/revision-diff'

const leg = (id: string, x = 0) => ({ id, type: 'leg', position: { x, y: 0 }, data: { label: Number(id.slice(1)) } })
const block = (id: string, term: number) => ({ id, type: 'block', position: { x: 0, y: 0 }, data: { term, helicities: [1, -1, 1] } })
const base: RevisionLike = {
  title: 'Five gluons',
  graph: {
    process: { theory: 'gluon', helicities: [-1, -1, 1, 1, 1], shift: [1, 2] },
    settings: { arithmetic: 'float', target: 'auto' },
    nodes: [leg('l1'), leg('l2'), block('b0', 0), block('b1', 1)],
    edges: [{ id: 'e1' }, { id: 'e2' }],
  },
}

describe('revision diff', () => {
  it('finds nothing between a revision and itself', () => {
    const d = diffRevisions(base, base)
    expect(d).toMatchObject({ title: null, process: [], settings: [], termsAdded: [], termsRemoved: [], nodesAdded: {}, nodesRemoved: {}, nodesMoved: 0, linesAdded: 0, linesRemoved: 0, layoutOnly: true })
  })
  it('names process fields and settings that changed, with both values', () => {
    const newer: RevisionLike = { title: 'Five gluons, NMHV', graph: { ...base.graph, process: { theory: 'gluon', helicities: [-1, -1, -1, 1, 1], shift: [2, 3] }, settings: { arithmetic: 'exact', target: 'auto', seed: 4 } } }
    const d = diffRevisions(base, newer)
    expect(d.title).toEqual({ field: 'title', from: 'Five gluons', to: 'Five gluons, NMHV' })
    expect(d.process).toEqual([
      { field: 'helicities', from: [-1, -1, 1, 1, 1], to: [-1, -1, -1, 1, 1] },
      { field: 'shift', from: [1, 2], to: [2, 3] },
    ])
    expect(d.settings).toEqual([{ field: 'arithmetic', from: 'float', to: 'exact' }, { field: 'seed', from: undefined, to: 4 }])
    expect(d.layoutOnly).toBe(false)
  })
  it('counts terms, nodes and lines added and removed', () => {
    const newer: RevisionLike = { title: base.title, graph: { ...base.graph, nodes: [leg('l1'), leg('l2'), block('b1', 1), block('b2', 2), block('b3', 3)], edges: [{ id: 'e2' }, { id: 'e3' }, { id: 'e4' }] } }
    const d = diffRevisions(base, newer)
    expect(d.termsAdded).toEqual([2, 3])
    expect(d.termsRemoved).toEqual([0])
    expect(d.nodesAdded).toEqual({ block: 2 })
    expect(d.nodesRemoved).toEqual({ block: 1 })
    expect([d.linesAdded, d.linesRemoved]).toEqual([2, 1])
  })
  it('calls a pure move "layout only"', () => {
    const newer: RevisionLike = { title: base.title, graph: { ...base.graph, nodes: [leg('l1', 50), leg('l2'), block('b0', 0), block('b1', 1)] } }
    const d = diffRevisions(base, newer)
    expect(d.nodesMoved).toBe(1)
    expect(d.layoutOnly).toBe(true)
  })
  it('treats a missing process as empty', () => {
    const d = diffRevisions({ title: 'x', graph: { nodes: [], edges: [] } }, { title: 'x', graph: { process: { theory: 'graviton', helicities: [-1, -1, 1, 1] }, nodes: [], edges: [] } })
    expect(d.process.map(c => c.field)).toEqual(['theory', 'helicities'])
  })
  it('writes values briefly', () => {
    expect(showValue('helicities', [-1, 1, 0])).toBe('−+0')
    expect(showValue('shift', [1, 2])).toBe('[1,2⟩')
    expect(showValue('order', [2, 1, 3])).toBe('2 1 3')
    expect(showValue('seed', undefined)).toBe('—')
  })
})
