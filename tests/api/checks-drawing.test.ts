// A stored check of a diagram with drawn terms evaluates the drawing: the complete six-gluon
// expansion agrees with Berends–Giele, the same drawing with one channel term removed disagrees and
// names the channel, and the stored check keeps the comparison.
import { beforeAll, describe, expect, it } from 'vitest'
import { projectWithRoles } from '../helpers/api'
import { expandedGraph } from '#shared/editor/demo'
import { validateGraph } from '#shared/editor/validate'
import type { EditorEdge, EditorNode } from '#shared/editor/types'
import { DrawingResultSchema } from '#shared/schemas/drawing'
import type { Graph } from '#shared/schemas/graph'

type Roles = Awaited<ReturnType<typeof projectWithRoles>>
let r: Roles

async function diagramWith(graph: Graph) {
  const res = await r.owner.post(`/api/projects/${r.project.id}/diagrams`, { title: 'Drawn check', graph })
  expect(res.status, JSON.stringify(res.body)).toBe(201)
  return res.body as { id: number, version: number }
}

beforeAll(async () => {
  r = await projectWithRoles()
})

describe('checks of a drawing', () => {
  const full = expandedGraph({ theory: 'gluon', helicities: [-1, 1, -1, 1, -1, 1], shift: [1, 2] }, true)
  const terms = validateGraph(full.nodes as EditorNode[], full.edges as EditorEdge[], full.process).drawing.terms

  it('the complete drawing agrees, with every drawn term and the recursion beside it', async () => {
    const d = await diagramWith(full)
    const res = await r.editor.post(`/api/diagrams/${d.id}/checks`, { kinematics: { kind: 'random', seed: 4 } })
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    expect(res.body.verdict).toBe('agrees')
    const drawing = res.body.result.drawing
    expect(DrawingResultSchema.safeParse(drawing).success).toBe(true)
    expect(drawing.comparison).toMatchObject({ complete: true, missing: [], duplicated: [], foreign: [], wrongHelicity: [], messages: [] })
    expect(drawing.terms).toHaveLength(terms.length)
    expect(res.body.result.value).toEqual(drawing.sum)
    expect(drawing.recursion.verdict).toBe('agrees')
    expect(res.body.result.target.name).toBe('berends-giele')
    expect(res.body.summary.drawing).toMatchObject({ terms: terms.length, complete: true })
    const again = await r.viewer.get(`/api/checks/${res.body.id}`)
    expect(again.body.result.drawing.comparison.complete).toBe(true)
  })

  it('one channel term removed: disagrees, naming the missing channel', async () => {
    const gone = terms[0]!
    const ids = new Set(gone.nodeIds)
    const graph: Graph = { ...full, nodes: full.nodes.filter(n => !ids.has(n.id)), edges: full.edges.filter(e => !ids.has(e.source) && !ids.has(e.target)) }
    const d = await diagramWith(graph)
    const res = await r.editor.post(`/api/diagrams/${d.id}/checks`, { kinematics: { kind: 'random', seed: 4 } })
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    expect(res.body.verdict).toBe('disagrees')
    const want = `channel {${gone.channel!.left.join(',')}} with internal helicity ${gone.channel!.helicity > 0 ? '+' : '−'}`
    const drawing = res.body.result.drawing
    expect(drawing.comparison.complete).toBe(false)
    // Exactly that channel, missing (not half-drawn): no drawn term is concerned.
    expect(drawing.comparison.missing).toEqual([{ left: gone.channel!.left, helicity: gone.channel!.helicity, terms: [], message: `${want} is not drawn` }])
    expect(drawing.comparison.incomplete).toEqual([])
    expect(drawing.message).toContain(want)
    expect(res.body.summary.drawing.message).toContain(want)
    // The process's own recursion still agrees: the drawing is what is wrong.
    expect(drawing.recursion.verdict).toBe('agrees')
  })

  it('a diagram without drawn terms keeps the process check', async () => {
    const d = await diagramWith({ schemaVersion: 1, process: full.process, nodes: [], edges: [] })
    const res = await r.editor.post(`/api/diagrams/${d.id}/checks`, { kinematics: { kind: 'random', seed: 4 } })
    expect(res.status).toBe(201)
    expect(res.body.verdict).toBe('agrees')
    expect(res.body.result.drawing).toBeUndefined()
  })

  it('checked again and again through the pool (compiled drawings kept per thread), then edited: each answer is the drawing\'s own', async () => {
    const d = await diagramWith(full)
    const post = (graph: Graph, seed: number) => r.viewer.post(`/api/diagrams/${d.id}/check-drawing`, { kinematics: { kind: 'random', seed }, graph })
    const sums: unknown[] = []
    // Enough runs that every pool thread sees the canvas at least twice, at new points.
    for (let k = 0; k < 6; k++) {
      const res = await post(full, 10 + (k % 3))
      expect(res.status, JSON.stringify(res.body)).toBe(200)
      expect(res.body.verdict).toBe('agrees')
      expect(res.body.drawing.comparison.complete).toBe(true)
      sums.push(res.body.drawing.sum)
    }
    // The same point gives the same sum, a new point another.
    expect(sums[3]).toEqual(sums[0])
    expect(sums[1]).not.toEqual(sums[0])
    // One term removed after those runs: the drawing is compiled afresh and says what is missing.
    const gone = new Set(terms[0]!.nodeIds)
    const edited: Graph = { ...full, nodes: full.nodes.filter(n => !gone.has(n.id)), edges: full.edges.filter(e => !gone.has(e.source) && !gone.has(e.target)) }
    for (let k = 0; k < 2; k++) {
      const res = await post(edited, 10)
      expect(res.status).toBe(200)
      expect(res.body.verdict).toBe('disagrees')
      expect(res.body.drawing.comparison.missing).toHaveLength(1)
    }
    expect((await post(full, 10)).body.drawing.sum).toEqual(sums[0])
  })
})
