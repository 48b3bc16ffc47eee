import { describe, expect, it } from 'vitest'
import { components, layoutGraph, layoutPositions } from '#shared/editor/layout'
import { handleLayout, nodeSize } from '#shared/editor/geometry'
import { expandedGraph } from '#shared/editor/demo'
import type { Process } from '#shared/schemas/graph'
import type { EditorEdge, EditorNode } from '#shared/editor/types'

const leg = (id: string, label: number, helicity: number): EditorNode => ({ id, type: 'leg', position: { x: 0, y: 0 }, data: { label, helicity } })
const vtx = (id: string, type: 'angle' | 'square'): EditorNode => ({ id, type, position: { x: 0, y: 0 }, data: {} })
const edge = (id: string, source: string, target: string, sh = 'p', th = 'h0'): EditorEdge => ({ id, source, target, sourceHandle: sh, targetHandle: th, type: 'line' })

/** A four-point term: two vertices glued by a line, four legs. */
function fourPoint(prefix: string) {
  const nodes = [vtx(`${prefix}a`, 'angle'), vtx(`${prefix}b`, 'square'), leg(`${prefix}1`, 1, -1), leg(`${prefix}4`, 4, 1), leg(`${prefix}2`, 2, -1), leg(`${prefix}3`, 3, 1)]
  const edges = [
    edge(`${prefix}e1`, `${prefix}1`, `${prefix}a`, 'p', 'h0'), edge(`${prefix}e4`, `${prefix}4`, `${prefix}a`, 'p', 'h1'),
    edge(`${prefix}e2`, `${prefix}2`, `${prefix}b`, 'p', 'h0'), edge(`${prefix}e3`, `${prefix}3`, `${prefix}b`, 'p', 'h1'),
    { ...edge(`${prefix}L`, `${prefix}a`, `${prefix}b`, 'h2', 'h2'), data: { helicity: 1 } },
  ]
  return { nodes, edges }
}

const overlaps = (a: EditorNode, b: EditorNode) => {
  const sa = nodeSize(a)
  const sb = nodeSize(b)
  return a.position.x < b.position.x + sb.width && b.position.x < a.position.x + sa.width && a.position.y < b.position.y + sb.height && b.position.y < a.position.y + sa.height
}

describe('layout', () => {
  it('returns top-left corners: every node placed, none overlapping, the origin respected', () => {
    const { nodes, edges } = fourPoint('x')
    const out = layoutGraph(nodes, edges, { origin: { x: 10, y: 20 } })
    expect(out).toHaveLength(nodes.length)
    for (const n of out) {
      expect(n.position.x).toBeGreaterThanOrEqual(10)
      expect(n.position.y).toBeGreaterThanOrEqual(20)
    }
    expect(Math.min(...out.map(n => n.position.x))).toBe(10)
    expect(Math.min(...out.map(n => n.position.y))).toBe(20)
    for (let a = 0; a < out.length; a++) for (let b = a + 1; b < out.length; b++) expect(overlaps(out[a]!, out[b]!)).toBe(false)
  })

  it('is pure: the input nodes keep their positions', () => {
    const { nodes, edges } = fourPoint('x')
    layoutGraph(nodes, edges)
    expect(nodes.every(n => n.position.x === 0 && n.position.y === 0)).toBe(true)
  })

  it('places a line\'s two vertices in different ranks, left to right', () => {
    const { nodes, edges } = fourPoint('x')
    const pos = layoutPositions(nodes, edges)
    expect(pos.get('xb')!.x).toBeGreaterThan(pos.get('xa')!.x)
  })

  it('keeps components apart and wraps rows at maxRowWidth', () => {
    const parts = ['p', 'q', 'r', 's'].map(fourPoint)
    const nodes = parts.flatMap(p => p.nodes)
    const edges = parts.flatMap(p => p.edges)
    expect(components(nodes, edges)).toHaveLength(4)
    const out = layoutGraph(nodes, edges, { maxRowWidth: 500 })
    for (let a = 0; a < out.length; a++) for (let b = a + 1; b < out.length; b++) expect(overlaps(out[a]!, out[b]!)).toBe(false)
    const rows = new Set(parts.map(p => out.find(n => n.id === p.nodes[0]!.id)!.position.y > 150 ? 'low' : 'high'))
    expect(rows.size).toBe(2)
  })

  it.each([0, 1, 7])('handles %i isolated nodes', (k) => {
    const nodes = Array.from({ length: k }, (_, t) => vtx(`n${t}`, 'angle'))
    const out = layoutGraph(nodes, [])
    expect(out).toHaveLength(k)
    for (let a = 0; a < out.length; a++) for (let b = a + 1; b < out.length; b++) expect(overlaps(out[a]!, out[b]!)).toBe(false)
  })

  // A leg laid in the rank the top-level Line runs through used to sit on it and hide its helicity
  // badge: no leg may touch the straight segment between the Line's two handles.
  it.each<[string, Process]>([
    ['quark line under [3,1>', { theory: 'qcd', helicities: [-0.5, 0.5, -1, 1], species: ['qbar1', 'q1', 'g', 'g'], shift: [3, 1] }],
    ['four gluons under [1,2>', { theory: 'gluon', helicities: [-1, -1, 1, 1], shift: [1, 2] }],
    ['six gluons alternating', { theory: 'gluon', helicities: [-1, 1, -1, 1, -1, 1], shift: [1, 2] }],
    ['four gravitons', { theory: 'graviton', helicities: [-2, -2, 2, 2], shift: [1, 2] }],
  ])('keeps the legs off each term\'s top-level Line: %s', (_, process) => {
    const g = expandedGraph(process, true)
    const nodes = g.nodes as EditorNode[]
    const byId = new Map(nodes.map(n => [n.id, n]))
    const side = (id: string) => { const n = byId.get(id)!; return n.type === 'leg' ? '' : String((n.data as { path?: string }).path ?? '')[0] }
    const at = (id: string, handle: string | null | undefined) => {
      const n = byId.get(id)!
      const h = handleLayout(n).find(x => x.id === handle)!
      return { x: n.position.x + h.x, y: n.position.y + h.y }
    }
    // the top-level Line crosses no leg's edge leaving the same vertex
    const ends = (e: EditorEdge) => [at(e.source, e.sourceHandle), at(e.target, e.targetHandle)] as const
    const cross = (p: readonly { x: number, y: number }[], q: readonly { x: number, y: number }[]) => {
      const o = (a: { x: number, y: number }, b: { x: number, y: number }, c: { x: number, y: number }) => Math.sign((b.x - a.x) * (c.y - a.y) - (b.y - a.y) * (c.x - a.x))
      return o(p[0]!, p[1]!, q[0]!) * o(p[0]!, p[1]!, q[1]!) < 0 && o(q[0]!, q[1]!, p[0]!) * o(q[0]!, q[1]!, p[1]!) < 0
    }
    const lines = (g.edges as EditorEdge[]).filter(e => new Set([side(e.source), side(e.target)]).size === 2 && side(e.source) && side(e.target))
    expect(lines.length).toBeGreaterThan(0)
    for (const a of lines) {
      for (const b of g.edges as EditorEdge[]) {
        const shared = [a.source, a.target].some(x => x === b.source || x === b.target)
        const legEdge = byId.get(b.source)?.type === 'leg' || byId.get(b.target)?.type === 'leg'
        if (legEdge && shared) expect(cross(ends(a), ends(b)), `${a.id} crosses ${b.id}`).toBe(false)
      }
    }
    for (const e of lines) {
      const a = at(e.source, e.sourceHandle)
      const b = at(e.target, e.targetHandle)
      for (const n of nodes.filter(x => x.type === 'leg')) {
        const z = nodeSize(n)
        for (let t = 0.05; t < 0.96; t += 0.05) {
          const x = a.x + t * (b.x - a.x)
          const y = a.y + t * (b.y - a.y)
          const inside = x > n.position.x && x < n.position.x + z.width && y > n.position.y && y < n.position.y + z.height
          expect(inside, `leg ${n.id} on line ${e.id}`).toBe(false)
        }
      }
    }
  })
})
