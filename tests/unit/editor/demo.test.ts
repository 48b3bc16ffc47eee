import { describe, expect, it } from 'vitest'
import { expandedGraph } from '#shared/editor/demo'
import { GraphSchema, type Process } from '#shared/schemas/graph'
import { validateGraph } from '#shared/editor/validate'
import type { EditorNode } from '#shared/editor/types'

describe('demo diagrams: expanded and laid out', () => {
  // Nodes: each drawn term carries its own n legs plus its vertices and Blocks: fully expanded,
  // n − 2 three-point vertices (a cubic tree); one level, the two sides of the channel.
  it.each<[string, Process, boolean, number]>([
    ['five gluons MHV', { theory: 'gluon', helicities: [-1, -1, 1, 1, 1], shift: [1, 2] }, true, 1 * (5 + 3)],
    ['six gluons alternating', { theory: 'gluon', helicities: [-1, 1, -1, 1, -1, 1], shift: [1, 2] }, false, 3 * (6 + 2)],
    ['four gravitons', { theory: 'graviton', helicities: [-2, -2, 2, 2], shift: [1, 2] }, true, 2 * (4 + 2)],
    ['bad shift', { theory: 'gluon', helicities: [-1, -1, 1, 1], shift: [3, 1] }, true, 1 * (4 + 2)],
    ['a quark line', { theory: 'qcd', helicities: [-0.5, 0.5, -1, 1], species: ['qbar1', 'q1', 'g', 'g'], shift: [3, 1] }, true, 2 * (4 + 2)],
  ])('%s: a valid graph with no problem on any node', (_, p, full, nodes) => {
    const g = expandedGraph(p, full)
    expect(GraphSchema.safeParse(g).success).toBe(true)
    expect(g.nodes).toHaveLength(nodes)
    expect(g.process?.shift).toEqual(p.shift)
    const v = validateGraph(g.nodes as EditorNode[], g.edges, g.process)
    expect(v.errorCount).toBe(0)
    if (full) expect(g.nodes.some(n => n.type === 'block')).toBe(false)
  })
})
