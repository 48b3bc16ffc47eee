// A loop-cut diagram's stored check (POST /api/diagrams/:id/checks) against the built server: the
// saved rings of five gluons −−+++ agree box by box with the N = 4 coefficients (Bern, Dixon,
// Dunbar, Kosower, hep-ph/9403226) and the row keeps verdict, box table, author and time; it shows
// in the diagram's checks, in the project's check list and as the diagram's latest check; a
// viewer's check of the drawing stays unstored; refusals name their field and store nothing.
import { beforeAll, describe, expect, it } from 'vitest'
import { projectWithRoles } from '../helpers/api'
import { boxRings } from '#shared/editor/loop-cut'
import type { Graph, Process } from '#shared/schemas/graph'

type Roles = Awaited<ReturnType<typeof projectWithRoles>>
let r: Roles

const five: Process = { theory: 'gluon', helicities: [-1, -1, 1, 1, 1] }
const ringsOf = (p: Process): Graph => ({ schemaVersion: 1, kind: 'loop-cut', process: p, ...boxRings(p) } as Graph)

async function diagramWith(graph: Graph, title = 'Loop cut, stored') {
  const res = await r.owner.post(`/api/projects/${r.project.id}/diagrams`, { title, graph })
  expect(res.status, JSON.stringify(res.body)).toBe(201)
  return res.body as { id: number, version: number }
}
const checksOf = async (id: number) => (await r.owner.get(`/api/diagrams/${id}/checks`)).body as { id: number }[]

beforeAll(async () => {
  r = await projectWithRoles()
})

describe('POST /api/diagrams/:id/checks on a loop-cut diagram', () => {
  it('stores the check of the saved rings: verdict, box table, author, time; listed and latest', async () => {
    const d = await diagramWith(ringsOf(five))
    const before = Date.now()
    const res = await r.editor.post(`/api/diagrams/${d.id}/checks`, { kinematics: { kind: 'random', seed: 3 } })
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    const c = res.body
    expect(c).toMatchObject({
      diagramId: d.id, diagramVersion: d.version, kind: 'single', status: 'done', verdict: 'agrees', arithmetic: 'float', seed: 3,
      createdByName: 'Editor Person', engineVersion: expect.any(String),
      request: { kind: 'loop-cut', helicities: five.helicities, kinematics: { kind: 'random', seed: 3 } },
      summary: { kind: 'loop-cut', n: 5, helicities: five.helicities, rings: 5, boxes: 5, missing: 0, counts: { agrees: 5 } },
      result: { kind: 'loop-cut', n: 5, verdict: 'agrees', missing: [] },
    })
    expect(new Date(c.createdAt).getTime()).toBeGreaterThanOrEqual(before - 2000)
    expect(c.durationMs).toBeGreaterThan(0)
    for (const b of c.result.boxes) {
      expect(b.targetRule).toBe('−½ st A_tree')
      expect(b.deviation).toBeLessThan(1e-9)
    }
    expect(c.summary.deviation).toBe(c.result.deviation)
    // the diagram's checks, the check itself, the project's checks and its diagram list
    expect((await checksOf(d.id)).map(x => x.id)).toEqual([c.id])
    const one = await r.viewer.get(`/api/checks/${c.id}`)
    expect(one.status).toBe(200)
    expect(one.body.result).toEqual(c.result)
    const projectChecks = (await r.viewer.get(`/api/projects/${r.project.id}/checks`)).body as { id: number, loopCut: boolean, shift: unknown, target: string, verdict: string, createdByName: string }[]
    expect(projectChecks.find(x => x.id === c.id)).toMatchObject({ loopCut: true, shift: null, target: 'N = 4 box coefficients', verdict: 'agrees', createdByName: 'Editor Person' })
    const list = (await r.viewer.get(`/api/projects/${r.project.id}/diagrams`)).body as { id: number, kind: string, latestCheck: { id: number, verdict: string } | null }[]
    expect(list.find(x => x.id === d.id)).toMatchObject({ kind: 'loop-cut', latestCheck: { id: c.id, verdict: 'agrees' } })
  })

  it('exact arithmetic: every box equals its target, stored as exact', async () => {
    const four: Process = { theory: 'gluon', helicities: [-1, -1, 1, 1] }
    const d = await diagramWith(ringsOf(four))
    const res = await r.owner.post(`/api/diagrams/${d.id}/checks`, { arithmetic: 'exact', kinematics: { kind: 'rational', seed: 2 } })
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    expect(res.body).toMatchObject({ arithmetic: 'exact', verdict: 'agrees', seed: 2, createdByName: 'Owner Person' })
    expect(res.body.result.boxes[0]).toMatchObject({ targetRule: '−st A_tree', deviation: 0 })
    expect(res.body.result.boxes[0].value).toEqual(res.body.result.boxes[0].target)
  })

  it('a viewer may not store one (403) but checks the drawing unstored', async () => {
    const d = await diagramWith(ringsOf(five))
    const refused = await r.viewer.post(`/api/diagrams/${d.id}/checks`, { kinematics: { kind: 'random', seed: 3 } })
    expect(refused.status).toBe(403)
    const drawn = await r.viewer.post(`/api/diagrams/${d.id}/check-loop-cut`, { kinematics: { kind: 'random', seed: 3 } })
    expect(drawn.status).toBe(200)
    expect(drawn.body.verdict).toBe('agrees')
    expect(await checksOf(d.id)).toEqual([])
  })

  it.each([
    ['a corner of the wrong kind', (g: Graph) => ({ ...g, nodes: g.nodes.map((n, i) => (i === 0 ? { ...n, type: 'square' } : n)) }), 422, 'graph.nodes[0]'],
    ['nothing drawn', (g: Graph) => ({ ...g, nodes: [], edges: [] }), 422, 'graph.nodes'],
    ['a scalar process', (g: Graph) => ({ ...g, process: { theory: 'scalar-cubic', helicities: [0, 0, 0, 0, 0] } }), 422, 'graph.process.theory'],
  ])('saved with %s: %i naming the field, nothing stored', async (_name, change, status, field) => {
    const d = await diagramWith(change(ringsOf(five)) as Graph)
    const res = await r.editor.post(`/api/diagrams/${d.id}/checks`, { kinematics: { kind: 'random', seed: 1 } })
    expect(res.status, JSON.stringify(res.body)).toBe(status)
    expect(res.body.data.field.startsWith(field)).toBe(true)
    expect(res.body.message.startsWith(res.body.data.field)).toBe(true)
    expect(await checksOf(d.id)).toEqual([])
  })

  it('a schema failure is a 400 naming the field', async () => {
    const d = await diagramWith(ringsOf(five))
    const bad = await r.editor.post(`/api/diagrams/${d.id}/checks`, { corners: 'feynman' })
    expect(bad.status).toBe(400)
    expect(bad.body.data.field).toBe('corners')
    expect(await checksOf(d.id)).toEqual([])
  })
})
