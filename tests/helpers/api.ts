// A tiny API client for tests: real HTTP against the test server, one cookie jar per client.
import { inject } from 'vitest'
import { randomUUID } from 'node:crypto'

export const baseURL = () => inject('baseURL')

export interface Res<T = any> { status: number, body: T, headers: Headers }

export class Client {
  cookie = ''
  token = ''
  /** Another server than the shared test server, and headers sent with every request (both optional). */
  constructor(readonly base?: string, readonly headers: Record<string, string> = {}) {}

  async req<T = any>(method: string, path: string, body?: unknown, init: { raw?: string, headers?: Record<string, string> } = {}): Promise<Res<T>> {
    const headers: Record<string, string> = { ...this.headers, ...init.headers }
    if (body !== undefined || init.raw !== undefined) headers['content-type'] = 'application/json'
    if (this.cookie) headers.cookie = this.cookie
    if (this.token) headers.authorization = `Bearer ${this.token}`
    const res = await fetch((this.base ?? baseURL()) + path, { method, headers, body: init.raw ?? (body === undefined ? undefined : JSON.stringify(body)), redirect: 'manual' })
    const set = res.headers.getSetCookie()
    for (const c of set) {
      const pair = c.split(';')[0]!
      const [name] = pair.split('=')
      const rest = this.cookie.split('; ').filter(p => p && !p.startsWith(`${name}=`))
      this.cookie = [...rest, pair].join('; ')
    }
    const text = await res.text()
    let parsed: unknown = text
    try {
      parsed = text ? JSON.parse(text) : null
    }
    catch { /* not JSON */ }
    return { status: res.status, body: parsed as T, headers: res.headers }
  }

  get<T = any>(path: string) { return this.req<T>('GET', path) }
  post<T = any>(path: string, body?: unknown) { return this.req<T>('POST', path, body ?? {}) }
  put<T = any>(path: string, body?: unknown) { return this.req<T>('PUT', path, body ?? {}) }
  patch<T = any>(path: string, body?: unknown) { return this.req<T>('PATCH', path, body ?? {}) }
  del<T = any>(path: string) { return this.req<T>('DELETE', path) }
}

export const uniqueEmail = (tag = 'user') => `${tag}-${randomUUID().slice(0, 8)}@example.test`

/** Registers a fresh user and returns a signed-in client. */
export async function newUser(tag = 'user', name = 'Test Person') {
  const client = new Client()
  const email = uniqueEmail(tag)
  const res = await client.post('/api/auth/register', { email, password: 'correct-horse-1', name })
  if (res.status !== 201) throw new Error(`register failed: ${res.status} ${JSON.stringify(res.body)}`)
  return Object.assign(client, { email, id: res.body.id as number })
}

export const demo = {
  owner: 'ines.varga@example.test',
  editor: 'tomas.okafor@example.test',
  viewer: 'mira.holloway@example.test',
  outsider: 'kenji.albright@example.test',
  password: 'polewright-demo',
}

export async function signIn(email: string, password = demo.password) {
  const client = new Client()
  const res = await client.post('/api/auth/login', { email, password })
  if (res.status !== 200) throw new Error(`login failed: ${res.status} ${JSON.stringify(res.body)}`)
  return client
}

/** A project owned by a fresh user, with an editor, a viewer and an outsider. */
export async function projectWithRoles() {
  const owner = await newUser('owner', 'Owner Person')
  const editor = await newUser('editor', 'Editor Person')
  const viewer = await newUser('viewer', 'Viewer Person')
  const outsider = await newUser('outsider', 'Outsider Person')
  const project = (await owner.post('/api/projects', { name: 'Roles test' })).body
  await owner.post(`/api/projects/${project.id}/members`, { email: editor.email, role: 'editor' })
  await owner.post(`/api/projects/${project.id}/members`, { email: viewer.email, role: 'viewer' })
  return { owner, editor, viewer, outsider, project, anonymous: new Client() }
}
