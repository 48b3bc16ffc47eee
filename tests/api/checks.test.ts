// Stored checks: a diagram's process evaluated at a point and kept with its provenance; editors
// and owners run them, viewers read them, non-members get 404.
import { beforeAll, describe, expect, it } from 'vitest'
import { projectWithRoles } from '../helpers/api'

type Roles = Awaited<ReturnType<typeof projectWithRoles>>
let r: Roles

async function diagramWith(process: unknown) {
  const graph = { schemaVersion: 1, ...(process ? { process } : {}), nodes: [], edges: [] }
  const res = await r.owner.post(`/api/projects/${r.project.id}/diagrams`, { title: 'Check test', graph })
  expect(res.status, JSON.stringify(res.body)).toBe(201)
  return res.body as { id: number, version: number }
}

beforeAll(async () => {
  r = await projectWithRoles()
})

describe('stored checks', () => {
  it('a diagram without a process: 422 naming graph.process', async () => {
    const d = await diagramWith(null)
    const res = await r.editor.post(`/api/diagrams/${d.id}/checks`, { kinematics: { kind: 'random', seed: 1 } })
    expect(res.status).toBe(422)
    expect(res.body.data.field).toBe('graph.process')
    expect(res.body.message).toMatch(/^graph\.process: this diagram has no process yet/)
  })

  it('an editor runs a check; it is stored with provenance, audited, listed newest first', async () => {
    const d = await diagramWith({ theory: 'gluon', helicities: [-1, -1, 1, 1, 1] })
    const first = await r.editor.post(`/api/diagrams/${d.id}/checks`, { kinematics: { kind: 'random', seed: 3 } })
    expect(first.status, JSON.stringify(first.body)).toBe(201)
    expect(first.body).toMatchObject({
      diagramId: d.id, diagramVersion: d.version, projectId: r.project.id, kind: 'single', status: 'done',
      verdict: 'agrees', arithmetic: 'float', seed: 3, createdBy: r.editor.id, createdByName: 'Editor Person',
    })
    expect(first.body.engineVersion).toMatch(/^\d+\.\d+\.\d+/)
    expect(first.body.durationMs).toBeGreaterThan(0)
    expect(first.body.request).toMatchObject({ theory: 'gluon', helicities: [-1, -1, 1, 1, 1], kinematics: { kind: 'random', seed: 3 } })
    expect(first.body.result).toMatchObject({ n: 5, verdict: 'agrees', target: { name: 'parke-taylor' } })
    expect(first.body.summary).toMatchObject({ theory: 'gluon', n: 5, target: 'parke-taylor', kinematics: 'random', seed: 3 })

    // The same point through the stateless route gives the same value.
    const direct = await r.viewer.post('/api/evaluate', { theory: 'gluon', helicities: [-1, -1, 1, 1, 1], kinematics: { kind: 'random', seed: 3 } })
    expect(first.body.result.value).toEqual(direct.body.value)

    const second = await r.owner.post(`/api/diagrams/${d.id}/checks`, { kinematics: { kind: 'rational', seed: 'two' }, arithmetic: 'exact' })
    expect(second.status).toBe(201)
    expect(second.body.seed).toBeNull() // a string seed lives in the request only
    expect(second.body.arithmetic).toBe('exact')

    const list = await r.viewer.get(`/api/diagrams/${d.id}/checks`)
    expect(list.status).toBe(200)
    expect(list.body.map((c: { id: number }) => c.id)).toEqual([second.body.id, first.body.id])
    expect(list.body[0]).not.toHaveProperty('result')
    expect(list.body[0]).not.toHaveProperty('request')
    expect(list.body[1].summary.target).toBe('parke-taylor')

    const one = await r.viewer.get(`/api/checks/${first.body.id}`)
    expect(one.status).toBe(200)
    expect(one.body.result.value).toEqual(first.body.result.value)

    const activity = await r.owner.get(`/api/projects/${r.project.id}/activity`)
    expect(activity.body.some((e: { action: string, subjectId: number }) => e.action === 'check.run' && e.subjectId === first.body.id)).toBe(true)
  })

  it('roles: viewers read but cannot run, outsiders get 404, anonymous 401', async () => {
    const d = await diagramWith({ theory: 'gluon', helicities: [-1, -1, 1, 1] })
    const run = await r.owner.post(`/api/diagrams/${d.id}/checks`, { kinematics: { kind: 'random', seed: 1 } })
    expect(run.status).toBe(201)
    expect((await r.viewer.post(`/api/diagrams/${d.id}/checks`, { kinematics: { kind: 'random', seed: 1 } })).status).toBe(403)
    expect((await r.outsider.post(`/api/diagrams/${d.id}/checks`, { kinematics: { kind: 'random', seed: 1 } })).status).toBe(404)
    expect((await r.outsider.get(`/api/diagrams/${d.id}/checks`)).status).toBe(404)
    expect((await r.outsider.get(`/api/checks/${run.body.id}`)).status).toBe(404)
    expect((await r.anonymous.get(`/api/checks/${run.body.id}`)).status).toBe(401)
    expect((await r.viewer.get('/api/checks/999999')).status).toBe(404)
  })

  it('errors in the process name graph.process.*, errors in the body keep their own path', async () => {
    const d = await diagramWith({ theory: 'gluon', helicities: [2, -1, 1, 1] })
    const bad = await r.editor.post(`/api/diagrams/${d.id}/checks`, { kinematics: { kind: 'random', seed: 1 } })
    expect(bad.status).toBe(422)
    expect(bad.body.data.field).toBe('graph.process.helicities[0]')
    expect(bad.body.message).toMatch(/^graph\.process\.helicities\[0\]: a gluon has helicity ±1/)

    const ok = await diagramWith({ theory: 'gluon', helicities: [-1, -1, 1, 1] })
    const noKin = await r.editor.post(`/api/diagrams/${ok.id}/checks`, {})
    expect(noKin.status).toBe(400)
    expect(noKin.body.data.field).toBe('kinematics')
    const exactFloat = await r.editor.post(`/api/diagrams/${ok.id}/checks`, { kinematics: { kind: 'random', seed: 1 }, arithmetic: 'exact' })
    expect(exactFloat.status).toBe(422)
    expect(exactFloat.body.data.field).toBe('arithmetic')
    const big = await diagramWith({ theory: 'graviton', helicities: [-2, -2, 2, 2, 2, 2, 2, 2] })
    const over = await r.editor.post(`/api/diagrams/${big.id}/checks`, { kinematics: { kind: 'random', seed: 1 } })
    expect(over.status).toBe(422)
    expect(over.body.data.field).toBe('graph.process.helicities')
  })

  it('the diagram\'s shift is used; a colour order relabels the legs', async () => {
    const helicities = [-1, 1, -1, 1, 1]
    const order = [1, 3, 2, 4, 5]
    const d = await diagramWith({ theory: 'gluon', helicities, order, shift: [3, 2] })
    const check = await r.editor.post(`/api/diagrams/${d.id}/checks`, { kinematics: { kind: 'random', seed: 9 }, tree: true })
    expect(check.status, JSON.stringify(check.body)).toBe(201)
    const res = check.body.result
    expect(res.shift).toEqual([3, 2])
    expect(res.verdict).toBe('agrees')
    expect(res.warnings[0]).toMatch(/^order: evaluated in the colour order \(1, 3, 2, 4, 5\)/)

    // Independent: A(1, 3, 2, 4, 5) evaluated directly, legs given in that order.
    const natural = (await r.editor.post('/api/evaluate', { theory: 'gluon', helicities, kinematics: { kind: 'random', seed: 9 } })).body
    expect(res.kinematics).toEqual(natural.kinematics) // the point, in the diagram's labels
    const pick = (xs: unknown[]) => order.map(l => xs[l - 1])
    const direct = (await r.editor.post('/api/evaluate', {
      theory: 'gluon', helicities: pick(helicities), shift: [2, 3],
      kinematics: { kind: 'spinors', lambda: pick(natural.kinematics.lambda), lambdaTilde: pick(natural.kinematics.lambdaTilde) },
    })).body
    const rel = Math.hypot(res.value[0] - direct.value[0], res.value[1] - direct.value[1]) / Math.hypot(...direct.value as [number, number])
    expect(rel).toBeLessThan(1e-12)
    // Terms name the diagram's labels: the shifted leg 3 is on the left of every channel.
    for (const t of res.terms) {
      expect(t.left).toContain(3)
      expect(t.left).not.toContain(2)
      expect(t.children).not.toBeNull()
    }
    // The ordered amplitude differs from the natural one (a different colour ordering).
    expect(Math.abs(res.value[0] - natural.value[0])).toBeGreaterThan(1e-6)
  })

  it('a colour order that is not a permutation: 422 on graph.process.order', async () => {
    const d = await diagramWith({ theory: 'gluon', helicities: [-1, -1, 1, 1], order: [1, 1, 2, 3] })
    const res = await r.editor.post(`/api/diagrams/${d.id}/checks`, { kinematics: { kind: 'random', seed: 1 } })
    expect(res.status).toBe(422)
    expect(res.body.data.field).toBe('graph.process.order[1]')
  })
})
