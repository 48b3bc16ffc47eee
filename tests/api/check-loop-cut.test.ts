// POST /api/diagrams/:id/check-loop-cut against the built server: generated rings of a five-gluon
// MHV loop-cut diagram agree box by box with the N = 4 coefficients (Bern, Dixon, Dunbar, Kosower,
// hep-ph/9403226), a viewer may check, and every refusal names its field.
import { beforeAll, describe, expect, it } from 'vitest'
import { projectWithRoles } from '../helpers/api'
import { boxRings } from '#shared/editor/loop-cut'
import type { Graph, Process } from '#shared/schemas/graph'

type Roles = Awaited<ReturnType<typeof projectWithRoles>>
let r: Roles

const five: Process = { theory: 'gluon', helicities: [-1, -1, 1, 1, 1] }
const ringsOf = (p: Process): Graph => ({ schemaVersion: 1, kind: 'loop-cut', process: p, ...boxRings(p) } as Graph)

async function diagramWith(graph: Graph) {
  const res = await r.owner.post(`/api/projects/${r.project.id}/diagrams`, { title: 'Loop cut', graph })
  expect(res.status, JSON.stringify(res.body)).toBe(201)
  return res.body as { id: number }
}

beforeAll(async () => {
  r = await projectWithRoles()
})

describe('POST /api/diagrams/:id/check-loop-cut', () => {
  it('the five boxes of −−+++ agree, checked by a viewer from the saved graph', async () => {
    const d = await diagramWith(ringsOf(five))
    const got = await r.owner.get(`/api/diagrams/${d.id}`)
    expect(got.body.graph.kind).toBe('loop-cut')
    const res = await r.viewer.post(`/api/diagrams/${d.id}/check-loop-cut`, { kinematics: { kind: 'random', seed: 3 } })
    expect(res.status, JSON.stringify(res.body)).toBe(200)
    expect(res.body).toMatchObject({ kind: 'loop-cut', n: 5, verdict: 'agrees', missing: [], counts: { agrees: 5 } })
    expect(res.body.rings).toHaveLength(5)
    for (const ring of res.body.rings) expect(ring.summed).toBe('open')
    for (const b of res.body.boxes) {
      expect(b.targetRule).toBe('−½ st A_tree')
      expect(b.deviation).toBeLessThan(1e-9)
    }
  })

  it('a graph in the body is checked as drawn (four gluons, exact)', async () => {
    const d = await diagramWith(ringsOf(five))
    const four: Process = { theory: 'gluon', helicities: [-1, -1, 1, 1] }
    const res = await r.editor.post(`/api/diagrams/${d.id}/check-loop-cut`, { arithmetic: 'exact', graph: ringsOf(four) })
    expect(res.status, JSON.stringify(res.body)).toBe(200)
    expect(res.body.boxes[0]).toMatchObject({ targetRule: '−st A_tree', verdict: 'agrees', deviation: 0 })
    expect(res.body.boxes[0].value).toEqual(res.body.boxes[0].target)
  })

  it.each([
    ['a tree diagram', (g: Graph) => ({ ...g, kind: 'tree' }), 'graph.kind'],
    ['a scalar process', (g: Graph) => ({ ...g, process: { theory: 'scalar-cubic', helicities: [0, 0, 0, 0, 0] } }), 'graph.process.theory'],
    ['three legs', (g: Graph) => ({ ...g, process: { theory: 'gluon', helicities: [-1, -1, 1] } }), 'graph.process.helicities'],
    ['nothing drawn', (g: Graph) => ({ ...g, nodes: [], edges: [] }), 'graph.nodes'],
    ['a corner of the wrong kind', (g: Graph) => ({ ...g, nodes: g.nodes.map((n, i) => (i === 0 ? { ...n, type: 'square' } : n)) }), 'graph.nodes[0]'],
    ['a line removed', (g: Graph) => ({ ...g, edges: g.edges.filter(e => (e.data as { external?: boolean }).external) }), 'graph.nodes[0]'],
    ['equal helicities across a line', (g: Graph) => ({ ...g, edges: g.edges.map(e => ((e.data as { external?: boolean }).external ? e : { ...e, data: { helicity: 1, targetHelicity: 1 } })) }), 'graph.edges['],
  ])('%s: 422 naming the field', async (_name, change, field) => {
    const d = await diagramWith(ringsOf(five))
    const res = await r.editor.post(`/api/diagrams/${d.id}/check-loop-cut`, { graph: change(ringsOf(five)) })
    expect(res.status, JSON.stringify(res.body)).toBe(422)
    expect(res.body.data.field.startsWith(field)).toBe(true)
    expect(res.body.message.startsWith(res.body.data.field)).toBe(true)
  })

  it('the tree check of a drawing refuses a loop-cut diagram, naming graph.kind', async () => {
    const d = await diagramWith(ringsOf(five))
    const drawn = await r.viewer.post(`/api/diagrams/${d.id}/check-drawing`, { kinematics: { kind: 'random', seed: 1 }, graph: ringsOf(five) })
    expect(drawn.status).toBe(422)
    expect(drawn.body.data.field).toBe('graph.kind')
  })

  it('a schema failure is a 400 naming the field; a stranger gets 404', async () => {
    const d = await diagramWith(ringsOf(five))
    const bad = await r.editor.post(`/api/diagrams/${d.id}/check-loop-cut`, { corners: 'feynman' })
    expect(bad.status).toBe(400)
    expect(bad.body.data.field).toBe('corners')
    const none = await r.outsider.post(`/api/diagrams/${d.id}/check-loop-cut`, {})
    expect(none.status).toBe(404)
  })
})
