import { describe, expect, it, beforeAll } from 'vitest'
import { readdirSync, statSync } from 'node:fs'
import { join, relative, resolve } from 'node:path'
import { Client, newUser, signIn, demo } from '../helpers/api'
import { matrix, requestFor, fixtureMakers, type Ids, type RouteAccess } from './access-matrix'

const apiDir = resolve(import.meta.dirname, '../../server/api')
function listRoutes(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const p = join(dir, name)
    return statSync(p).isDirectory() ? listRoutes(p) : [relative(apiDir, p)]
  })
}

describe('route inventory', () => {
  it('every file under server/api is in the access matrix', () => {
    const known = new Set(matrix.map(r => r.file))
    const missing = listRoutes(apiDir).filter(f => !known.has(f))
    expect(missing).toEqual([])
  })
  it('the matrix names no route that does not exist', () => {
    const files = new Set(listRoutes(apiDir))
    expect(matrix.map(r => r.file).filter(f => !files.has(f))).toEqual([])
  })
})

const rank = { viewer: 1, editor: 2, owner: 3 } as const
type Role = keyof typeof rank

describe('access matrix: each role on each route', () => {
  let users: Record<Role | 'outsider', Awaited<ReturnType<typeof newUser>>>
  let admin: Client
  beforeAll(async () => {
    users = {
      owner: await newUser('m-owner'), editor: await newUser('m-editor'), viewer: await newUser('m-viewer'), outsider: await newUser('m-out'),
    }
    admin = await signIn(demo.owner)
  })

  async function fixture(): Promise<Ids> {
    const project = (await users.owner.post('/api/projects', { name: 'Matrix' })).body
    await users.owner.post(`/api/projects/${project.id}/members`, { email: users.editor.email, role: 'editor' })
    await users.owner.post(`/api/projects/${project.id}/members`, { email: users.viewer.email, role: 'viewer' })
    const diagram = (await users.owner.post(`/api/projects/${project.id}/diagrams`, { title: 'D', graph: { nodes: [], edges: [] } })).body
    const ids: Ids = { project: project.id, diagram: diagram.id, member: users.viewer.id }
    for (const make of fixtureMakers) await make(users.owner, ids)
    return ids
  }

  const projectScoped = matrix.filter(r => ['viewer', 'editor', 'owner'].includes(r.access))
  it.each(projectScoped.map(r => [r.file, r] as [string, RouteAccess]))('%s', async (_file, route) => {
    const ids = await fixture()
    const { method, path } = requestFor(route, ids)
    expect((await new Client().req(method, path, route.body)).status, 'anonymous').toBe(401)
    expect((await users.outsider.req(method, path, route.body)).status, 'outsider').toBe(404)
    const min = rank[route.access as Role]
    for (const role of ['viewer', 'editor', 'owner'] as Role[]) {
      if (rank[role] >= min) continue
      const res = await users[role].req(method, path, route.body)
      expect(res.status, `${role} on ${method} ${path}`).toBe(403)
    }
    const allowed = (['owner', 'editor', 'viewer'] as Role[]).filter(r => rank[r] >= min).reverse()[0]!
    if (!route.skipAllowed) {
      const res = await users[allowed].req(method, path, route.body)
      expect([401, 403, 404], `${allowed} on ${method} ${path}: ${JSON.stringify(res.body)}`).not.toContain(res.status)
    }
  })

  const siteScoped = matrix.filter(r => r.access === 'user' || r.access === 'admin')
  it.each(siteScoped.map(r => [r.file, r] as [string, RouteAccess]))('%s', async (_file, route) => {
    const ids = await fixture()
    const { method, path } = requestFor(route, ids)
    expect((await new Client().req(method, path, route.body)).status, 'anonymous').toBe(401)
    if (route.access === 'admin') expect((await users.owner.req(method, path, route.body)).status, 'member').toBe(403)
    if (route.skipAllowed) return
    const res = await (route.access === 'admin' ? admin : users.outsider).req(method, path, route.body)
    expect([401, 403, 404]).not.toContain(res.status)
  })
})
