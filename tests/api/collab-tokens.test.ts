import { describe, expect, it } from 'vitest'
import { createHash } from 'node:crypto'
import { Client, newUser, projectWithRoles } from '../helpers/api'
import { testDb } from './collab-support'

const sha256 = (s: string) => createHash('sha256').update(s).digest('hex')

function bearer(token: string) {
  const c = new Client()
  c.token = token
  return c
}

async function mint(c: Client, scope: 'read' | 'read-write', name = `script ${scope}`) {
  const res = await c.post('/api/tokens', { name, scope })
  expect(res.status).toBe(201)
  return res.body as { id: number, name: string, scope: string, token: string, lastUsedAt: string | null }
}

describe('API tokens', () => {
  it('shown once, stored hashed, listed with name, scope and last use', async () => {
    const u = await newUser('tok')
    const t = await mint(u, 'read')
    expect(t.token).toMatch(/^pw_[A-Za-z0-9_-]{40,}$/)
    expect(t.lastUsedAt).toBeNull()
    const rows = await testDb().execute({ sql: 'SELECT token_hash FROM api_tokens WHERE id = ?', args: [t.id] })
    expect(rows.rows[0]!.token_hash).toBe(sha256(t.token))

    const list = (await u.get('/api/tokens')).body
    expect(list).toHaveLength(1)
    expect(list[0]).toMatchObject({ id: t.id, name: 'script read', scope: 'read', lastUsedAt: null })
    expect(JSON.stringify(list)).not.toContain(t.token)

    expect((await bearer(t.token).get('/api/auth/me')).body.email).toBe(u.email)
    const after = (await u.get('/api/tokens')).body[0]
    expect(after.lastUsedAt).not.toBeNull()
  })

  it('every route gives a token the same access as its owner\'s session', async () => {
    const { owner, editor, viewer, outsider, project } = await projectWithRoles()
    const diagram = (await owner.post(`/api/projects/${project.id}/diagrams`, { title: 'Tok', graph: { nodes: [], edges: [] } })).body
    const t = {
      owner: bearer((await mint(owner, 'read-write')).token),
      editor: bearer((await mint(editor, 'read-write')).token),
      viewer: bearer((await mint(viewer, 'read-write')).token),
      outsider: bearer((await mint(outsider, 'read-write')).token),
    }
    expect((await t.viewer.get(`/api/diagrams/${diagram.id}`)).status).toBe(200)
    expect((await t.outsider.get(`/api/diagrams/${diagram.id}`)).status).toBe(404)
    expect((await t.viewer.put(`/api/diagrams/${diagram.id}`, { title: 'x', version: 1 })).status).toBe(403)
    expect((await t.editor.put(`/api/diagrams/${diagram.id}`, { title: 'Renamed by a script', version: 1 })).status).toBe(200)
    expect((await t.viewer.post(`/api/diagrams/${diagram.id}/comments`, { body: 'from a script' })).status).toBe(201)
    expect((await t.editor.post(`/api/projects/${project.id}/members`, { email: 'x@example.test', role: 'viewer' })).status).toBe(403)
    expect((await t.owner.get(`/api/projects/${project.id}/invitations`)).status).toBe(200)
    const projects = await t.outsider.get('/api/projects')
    expect(projects.status).toBe(200)
    expect(projects.body).toEqual([])
  })

  it('a read token reads but cannot write anything', async () => {
    const { owner, viewer, project } = await projectWithRoles()
    const diagram = (await owner.post(`/api/projects/${project.id}/diagrams`, { title: 'RO', graph: { nodes: [], edges: [] } })).body
    const ro = bearer((await mint(owner, 'read')).token)
    const roViewer = bearer((await mint(viewer, 'read')).token)
    expect((await ro.get(`/api/projects/${project.id}`)).status).toBe(200)
    expect((await ro.get(`/api/diagrams/${diagram.id}/comments`)).status).toBe(200)
    const writes = [
      await ro.post('/api/projects', { name: 'No' }),
      await ro.patch(`/api/projects/${project.id}`, { name: 'No' }),
      await ro.post(`/api/projects/${project.id}/diagrams`, { title: 'No', graph: { nodes: [], edges: [] } }),
      await ro.put(`/api/diagrams/${diagram.id}`, { title: 'No', version: 1 }),
      await ro.post(`/api/diagrams/${diagram.id}/comments`, { body: 'No' }),
      await roViewer.post(`/api/diagrams/${diagram.id}/comments`, { body: 'No' }),
      await ro.post(`/api/projects/${project.id}/members`, { email: 'x@example.test', role: 'viewer' }),
    ]
    for (const w of writes) {
      expect(w.status).toBe(403)
      expect(w.body.message).toMatch(/read-only/)
    }
    expect((await owner.get(`/api/diagrams/${diagram.id}`)).body.title).toBe('RO')
  })

  it('a token cannot list, mint or revoke tokens', async () => {
    const u = await newUser('nomint')
    const t = await mint(u, 'read-write')
    const b = bearer(t.token)
    expect((await b.get('/api/tokens')).status).toBe(403)
    const minted = await b.post('/api/tokens', { name: 'child', scope: 'read-write' })
    expect(minted.status).toBe(403)
    expect(minted.body.message).toMatch(/^authorization: /)
    expect((await b.del(`/api/tokens/${t.id}`)).status).toBe(403)
    expect((await u.get('/api/tokens')).body).toHaveLength(1)
  })

  it('revoked → 401 at the next request; someone else\'s token → 404', async () => {
    const u = await newUser('revoke')
    const other = await newUser('revoke-other')
    const t = await mint(u, 'read-write')
    const b = bearer(t.token)
    expect((await b.get('/api/projects')).status).toBe(200)
    expect((await other.del(`/api/tokens/${t.id}`)).status).toBe(404)
    expect((await b.get('/api/projects')).status).toBe(200)
    expect((await u.del(`/api/tokens/${t.id}`)).status).toBe(204)
    const after = await b.get('/api/projects')
    expect(after.status).toBe(401)
    expect(after.body.message).toMatch(/^authorization: /)
    expect((await u.get('/api/tokens')).body).toEqual([])
    expect((await bearer('pw_not-a-token').get('/api/projects')).status).toBe(401)
  })

  it.each([
    ['no name', { scope: 'read' }, 'name'],
    ['an unknown scope', { name: 'x', scope: 'admin' }, 'scope'],
    ['no scope', { name: 'x' }, 'scope'],
  ])('create with %s → 400 naming the field', async (_label, body, field) => {
    const u = await newUser('badtok')
    const res = await u.post('/api/tokens', body)
    expect(res.status).toBe(400)
    expect(res.body.data.field).toBe(field)
  })

  it('a token calls /api/evaluate, read scope included', async () => {
    const u = await newUser('evaltok')
    const res = await bearer((await mint(u, 'read')).token).post('/api/evaluate', {
      theory: 'gluon', helicities: [-1, -1, 1, 1], kinematics: { kind: 'random', seed: 3 },
    })
    expect(res.status).toBe(200)
    expect(res.body.verdict).toBe('agrees')
  })
})
