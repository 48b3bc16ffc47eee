// Legs hanging off one vertex or Block keep the cyclic order of its slots, so their lines do not
// cross on the way in (counted over laid-out expansions of 5- to 8-gluon processes).
import { describe, expect, it } from 'vitest'
import { expandedGraph } from '#shared/editor/demo'
import { handleLayout, nodeSize } from '#shared/editor/geometry'
import type { EditorEdge, EditorNode } from '#shared/editor/types'
import type { Process } from '#shared/schemas/graph'

/** Pairs of legs on one hub and one side whose rows are in the opposite order of their slots. */
function legCrossings(nodes: EditorNode[], edges: EditorEdge[]): number {
  const byId = new Map(nodes.map(n => [n.id, n]))
  const groups = new Map<string, { legY: number, slotY: number }[]>()
  for (const e of edges) {
    const legFirst = byId.get(e.source)?.type === 'leg'
    const leg = byId.get(legFirst ? e.source : e.target)!
    const hub = byId.get(legFirst ? e.target : e.source)!
    if (leg.type !== 'leg' || hub.type === 'leg') continue
    const h = handleLayout(hub).find(x => x.id === (legFirst ? e.targetHandle : e.sourceHandle))!
    const k = `${hub.id}:${h.side}`
    groups.set(k, [...(groups.get(k) ?? []), { legY: leg.position.y, slotY: h.y }])
  }
  let n = 0
  for (const g of groups.values()) for (let a = 0; a < g.length; a++) for (let b = a + 1; b < g.length; b++) if ((g[a]!.legY - g[b]!.legY) * (g[a]!.slotY - g[b]!.slotY) < 0) n++
  return n
}

describe('layout: legs in the cyclic order of their slots', () => {
  it.each<[string, Process, boolean]>([
    ['5 MHV, full', { theory: 'gluon', helicities: [-1, -1, 1, 1, 1], shift: [1, 2] }, true],
    ['6 alternating, top level', { theory: 'gluon', helicities: [-1, 1, -1, 1, -1, 1], shift: [1, 2] }, false],
    ['6 alternating, full', { theory: 'gluon', helicities: [-1, 1, -1, 1, -1, 1], shift: [1, 2] }, true],
    ['8 NMHV, top level', { theory: 'gluon', helicities: [-1, -1, -1, 1, 1, 1, 1, 1], shift: [1, 2] }, false],
  ])('%s: no two legs of one vertex or Block cross', (_, p, full) => {
    const g = expandedGraph(p, full)
    expect(legCrossings(g.nodes as EditorNode[], g.edges as EditorEdge[])).toBe(0)
  })

  it.each<[string, Process, boolean]>([
    ['6 alternating, full', { theory: 'gluon', helicities: [-1, 1, -1, 1, -1, 1], shift: [1, 2] }, true],
    ['8 NMHV, top level', { theory: 'gluon', helicities: [-1, -1, -1, 1, 1, 1, 1, 1], shift: [1, 2] }, false],
    ['7 NMHV, full', { theory: 'gluon', helicities: [-1, -1, 1, -1, 1, 1, 1], shift: [1, 2] }, true],
  ])('%s: each term\'s left side lies wholly left of its right side', (_, p, full) => {
    const ns = expandedGraph(p, full).nodes as EditorNode[]
    const of = (n: EditorNode) => n.data as { comp?: string, path?: string }
    const comps = new Set(ns.map(n => of(n).comp).filter(Boolean))
    expect(comps.size).toBeGreaterThan(1)
    for (const c of comps) {
      const side = (s: string) => ns.filter(n => n.type !== 'leg' && of(n).comp === c && (of(n).path ?? '')[0] === s)
      const L = side('L')
      const R = side('R')
      expect(Math.max(...L.map(n => n.position.x + nodeSize(n).width))).toBeLessThan(Math.min(...R.map(n => n.position.x)))
    }
  })
})
