import { describe, expect, it } from 'vitest'
import { projectWithRoles, newUser } from '../helpers/api'

const empty = { nodes: [], edges: [] }

describe('projects and roles (the generated API page, "Projects and members")', () => {
  it('create → 201 and the caller is owner; list is an array; get one', async () => {
    const u = await newUser('proj')
    const created = await u.post('/api/projects', { name: 'Soft limits', description: 'checks near soft gluons' })
    expect(created.status).toBe(201)
    expect(created.body).toMatchObject({ name: 'Soft limits', role: 'owner' })
    const list = await u.get('/api/projects')
    expect(Array.isArray(list.body)).toBe(true)
    expect(list.body.map((p: { id: number }) => p.id)).toContain(created.body.id)
    expect((await u.get(`/api/projects/${created.body.id}`)).body.id).toBe(created.body.id)
  })

  it('members: 201 for an existing user, 202 for an unknown address; owner only', async () => {
    const { owner, editor, project } = await projectWithRoles()
    const other = await newUser('member')
    expect((await owner.post(`/api/projects/${project.id}/members`, { email: other.email, role: 'viewer' })).status).toBe(201)
    expect((await owner.post(`/api/projects/${project.id}/members`, { email: 'nobody-yet@example.test', role: 'editor' })).status).toBe(202)
    expect((await editor.post(`/api/projects/${project.id}/members`, { email: 'x@example.test', role: 'viewer' })).status).toBe(403)
    const bad = await owner.post(`/api/projects/${project.id}/members`, { email: other.email, role: 'boss' })
    expect(bad.status).toBe(400)
    expect(bad.body.data.field).toBe('role')
  })

  it('non-members get 404, a role too low 403', async () => {
    const { owner, viewer, outsider, project } = await projectWithRoles()
    const d = (await owner.post(`/api/projects/${project.id}/diagrams`, { title: 'D', graph: empty })).body
    expect((await outsider.get(`/api/projects/${project.id}`)).status).toBe(404)
    expect((await outsider.get(`/api/diagrams/${d.id}`)).status).toBe(404)
    expect((await viewer.get(`/api/diagrams/${d.id}`)).status).toBe(200)
    expect((await viewer.put(`/api/diagrams/${d.id}`, { title: 'mine', version: 1 })).status).toBe(403)
    expect((await viewer.post(`/api/projects/${project.id}/diagrams`, { title: 'E', graph: empty })).status).toBe(403)
    expect((await outsider.get('/api/projects/999999')).status).toBe(404)
  })

  it('diagrams: create with an empty graph, save with version, stale version → 409 and nothing overwritten', async () => {
    const { owner, editor, project } = await projectWithRoles()
    const created = await editor.post(`/api/projects/${project.id}/diagrams`, { title: 'Five gluons', graph: empty })
    expect(created.status).toBe(201)
    expect(created.body).toMatchObject({ projectId: project.id, title: 'Five gluons', version: 1, graph: empty })
    const id = created.body.id
    const graph = { schemaVersion: 1, process: { theory: 'gluon', helicities: [-1, -1, 1, 1, 1], shift: [1, 2] }, nodes: [], edges: [] }
    const saved = await owner.put(`/api/diagrams/${id}`, { graph, version: 1 })
    expect(saved.status).toBe(200)
    expect(saved.body.version).toBe(2)
    const stale = await editor.put(`/api/diagrams/${id}`, { title: 'Overwrite?', graph: empty, version: 1 })
    expect(stale.status).toBe(409)
    expect(stale.body.data).toMatchObject({ field: 'version', current: 2 })
    const now = (await editor.get(`/api/diagrams/${id}`)).body
    expect(now).toMatchObject({ title: 'Five gluons', version: 2, graph })
    const revisions = (await editor.get(`/api/diagrams/${id}/revisions`)).body
    expect(revisions.map((r: { version: number }) => r.version)).toEqual([2, 1])
  })

  it('fifty saves racing against one version: one 200 and forty-nine 409s, never a 500', async () => {
    const { owner, project } = await projectWithRoles()
    const d = (await owner.post(`/api/projects/${project.id}/diagrams`, { title: 'Race', graph: empty })).body
    const results = await Promise.all(Array.from({ length: 50 }, (_, i) => owner.put(`/api/diagrams/${d.id}`, { title: `writer ${i}`, version: 1 })))
    const counts = results.reduce<Record<number, number>>((acc, r) => ({ ...acc, [r.status]: (acc[r.status] ?? 0) + 1 }), {})
    expect(counts).toEqual({ 200: 1, 409: 49 })
    const winner = results.find(r => r.status === 200)!.body.title
    expect((await owner.get(`/api/diagrams/${d.id}`)).body).toMatchObject({ version: 2, title: winner })
  })

  it.each([
    ['graph.nodes', { title: 'x', graph: { edges: [] } }],
    ['graph.process.helicities[1]', { title: 'x', graph: { nodes: [], edges: [], process: { theory: 'gluon', helicities: [1, 'NaN', 1] } } }],
    ['graph.process.theory', { title: 'x', graph: { nodes: [], edges: [], process: { theory: 'photon', helicities: [1, 1, 1] } } }],
    ['title', { graph: { nodes: [], edges: [] } }],
  ])('an invalid diagram body → 400 naming %s', async (field, body) => {
    const { owner, project } = await projectWithRoles()
    const res = await owner.post(`/api/projects/${project.id}/diagrams`, body)
    expect(res.status).toBe(400)
    expect(res.body.data.field).toBe(field)
  })

  it('the last owner cannot be demoted', async () => {
    const { owner, project } = await projectWithRoles()
    const res = await owner.patch(`/api/projects/${project.id}/members/${owner.id}`, { role: 'viewer' })
    expect(res.status).toBe(422)
  })
})
