// Heavy inputs, cross-site writes, exports, 5xx from client input and response headers, checked
// against the built server. Each test names the OWASP ASVS 4.0 requirement it holds the app to.
import { beforeAll, describe, expect, it } from 'vitest'
import { Client, baseURL, projectWithRoles } from '../helpers/api'

let ctx: Awaited<ReturnType<typeof projectWithRoles>>
let pid: number
let did: number

async function upload(client: Client, projectId: number, filename: string, text: string) {
  const form = new FormData()
  form.append('file', new Blob([text]), filename)
  const res = await fetch(`${baseURL()}/api/projects/${projectId}/point-sets`, { method: 'POST', headers: { cookie: client.cookie }, body: form })
  return { status: res.status, body: await res.json() as any }
}

beforeAll(async () => {
  ctx = await projectWithRoles()
  pid = ctx.project.id
  did = (await ctx.owner.post(`/api/projects/${pid}/diagrams`, { title: 'Security', graph: { schemaVersion: 1, nodes: [], edges: [] } })).body.id
})

describe('heavy formulas (item: literal and intermediate sizes)', () => {
  it.each(['1e999999999', '1e-999999999', '1e100000000', '((<1 2>^64)^64)^64'])('V5.1.4 / V11.1.4 %s is refused on target.formula within moments', async (formula) => {
    const t0 = Date.now()
    const res = await ctx.owner.post('/api/evaluate', { theory: 'gluon', helicities: [-1, -1, 1, 1], kinematics: { kind: 'rational', seed: 1 }, arithmetic: 'exact', target: { formula } })
    expect(res.status).toBe(422)
    expect(res.body.data.field).toBe('target.formula')
    expect(res.body.message).toMatch(/^target\.formula: /)
    expect(Date.now() - t0).toBeLessThan(5000)
  })
})

describe('point-set generation off the request thread', () => {
  it('V11.1.4 / V13.1.x a large generate does not hold up other requests', async () => {
    const order: string[] = []
    const gen = ctx.editor.post(`/api/projects/${pid}/point-sets/generate`, { kind: 'random', n: 16, count: 5000, seed: 7 }).then((r) => {
      order.push('generate')
      return r
    })
    // Generation got fast: ask while the 5000 points are still being drawn in the pool.
    await new Promise(r => setTimeout(r, 50))
    const me = await ctx.viewer.get('/api/auth/me')
    order.push('me')
    expect(me.status).toBe(200)
    const r = await gen
    expect(r.status).toBe(201)
    expect(r.body.count).toBe(5000)
    expect(order).toEqual(['me', 'generate'])
  })
  it('V5.1.3 physical points at n = 16 answer 422 naming a field of the request', async () => {
    const r = await ctx.editor.post(`/api/projects/${pid}/point-sets/generate`, { kind: 'physical', n: 16, count: 3, seed: 1 })
    expect(r.status).toBe(422)
    expect(r.body.statusMessage).not.toBe('Server Error')
    expect(r.body.data.field).toBe('n')
    expect(r.body.message).toMatch(/^n: /)
  })
})

describe('cross-site writes', () => {
  const url = () => `${baseURL()}/api/projects`
  it('V4.2.2 / V13.2.5 a urlencoded form post is refused with 415', async () => {
    const res = await fetch(url(), { method: 'POST', headers: { 'cookie': ctx.owner.cookie, 'content-type': 'application/x-www-form-urlencoded' }, body: 'name=evil' })
    expect(res.status).toBe(415)
    expect((await res.json()).data.field).toBe('content-type')
    const plain = await fetch(`${baseURL()}/api/projects/${pid}/members`, { method: 'POST', headers: { 'cookie': ctx.owner.cookie, 'content-type': 'text/plain' }, body: JSON.stringify({ email: ctx.outsider.email, role: 'owner' }) })
    expect(plain.status).toBe(415)
  })
  it('V4.2.2 a cookie write with Origin null or a foreign Origin is refused', async () => {
    for (const origin of ['null', 'http://evil.example.test']) {
      const res = await ctx.owner.req('POST', '/api/projects', { name: 'x' }, { headers: { origin } })
      expect(res.status).toBe(403)
    }
    const same = await ctx.owner.req('POST', '/api/projects', { name: 'same origin' }, { headers: { origin: baseURL() } })
    expect(same.status).toBe(201)
  })
  it('V13.2.x a script with a bearer token, JSON and no Origin is accepted', async () => {
    const token = (await ctx.owner.post('/api/tokens', { name: 'script', scope: 'read-write' })).body.token
    const script = new Client()
    script.token = token
    const res = await script.post('/api/projects', { name: 'from a script' })
    expect(res.status).toBe(201)
  })
})

describe('CSV exports', () => {
  it('V5.3.x (CSV injection) labels that look like spreadsheet formulas are neutralised', async () => {
    const csv = ['point,leg,E,px,py,pz',
      ...['=HYPERLINK("http://evil.example.test")', '+1+2', '@SUM(A1)'].flatMap(label => [
        `"${label.replace(/"/g, '""')}",1,-1,0,0,-1`, `"${label.replace(/"/g, '""')}",2,-1,0,0,1`, `"${label.replace(/"/g, '""')}",3,1,1,0,0`, `"${label.replace(/"/g, '""')}",4,1,-1,0,0`]),
    ].join('\n')
    const up = await upload(ctx.editor, pid, 'formulae.csv', csv)
    expect(up.status).toBe(201)
    const res = await fetch(`${baseURL()}/api/point-sets/${up.body.pointSet.id}/export?format=csv`, { headers: { cookie: ctx.editor.cookie } })
    const text = await res.text()
    expect(res.status, text.slice(0, 500)).toBe(200)
    expect(text).toContain(`'=HYPERLINK`)
    expect(text).toContain(`'+1+2`)
    expect(text).toContain(`'@SUM(A1)`)
    expect(text.split('\n').some(line => /^"?[=+@]/.test(line))).toBe(false)
  })
})

describe('no 5xx from client input', () => {
  it('V5.1.4 a graph nested 4,100 levels deep is a 400 naming the field', async () => {
    let deep: unknown = 1
    for (let i = 0; i < 4100; i++) deep = { a: deep }
    const doc = (await ctx.owner.get(`/api/diagrams/${did}`)).body
    const res = await ctx.owner.put(`/api/diagrams/${did}`, { version: doc.version, graph: { schemaVersion: 1, nodes: [{ id: 'n1', type: 'leg', position: { x: 0, y: 0 }, data: { deep } }], edges: [] } })
    expect(res.status).toBe(400)
    expect(res.body.data.field).toBe('graph.nodes[0].data.deep')
    const page = await fetch(`${baseURL()}/projects/${pid}/diagrams/${did}`, { headers: { cookie: ctx.owner.cookie } })
    expect(page.status).toBe(200)
  })
  it('V5.1.4 a CSV point with 200,000 legs is a clear 400', async () => {
    const rows = ['point,leg,E,px,py,pz']
    for (let l = 1; l <= 200_000; l++) rows.push(`p,${l},1,0,0,1`)
    const r = await upload(ctx.editor, pid, 'legs.csv', rows.join('\n'))
    expect(r.status).toBe(400)
    expect(r.body.message).toMatch(/65 is beyond the limit of 64 legs/)
  })
  it('V5.1.3 ?limit=1.5 (and 0x10, 1e1) on the list routes is a 400 naming limit', async () => {
    for (const path of [`/api/projects/${pid}/activity`, `/api/diagrams/${did}/checks`]) {
      for (const limit of ['1.5', '0x10', '1e1', '-1']) {
        const r = await ctx.owner.get(`${path}?limit=${limit}`)
        expect(r.status, `${path}?limit=${limit}`).toBe(400)
        expect(r.body.data.field).toBe('limit')
      }
      expect((await ctx.owner.get(`${path}?limit=2`)).status).toBe(200)
    }
  })
})

describe('headers and ids', () => {
  it('V14.4.x / V8.2.1 authenticated answers and pages are not cached; CSP sets default-src and connect-src', async () => {
    const api = await fetch(`${baseURL()}/api/auth/me`, { headers: { cookie: ctx.owner.cookie } })
    expect(api.headers.get('cache-control')).toBe('no-store')
    const page = await fetch(`${baseURL()}/projects/${pid}`, { headers: { cookie: ctx.owner.cookie } })
    expect(page.status).toBe(200)
    expect(page.headers.get('cache-control')).toBe('no-store')
    const csp = page.headers.get('content-security-policy') ?? ''
    expect(csp).toMatch(/default-src 'self'/)
    expect(csp).toMatch(/connect-src 'self'/)
  })
  it('V14.4.3 every page gets its own CSP nonce on its scripts; API answers keep the security headers, request after request', async () => {
    const nonces: string[] = []
    for (let k = 0; k < 3; k++) {
      const page = await fetch(`${baseURL()}/projects/${pid}`, { headers: { cookie: ctx.owner.cookie } })
      const nonce = /'nonce-([^']+)'/.exec(page.headers.get('content-security-policy') ?? '')?.[1]
      expect(nonce).toBeTruthy()
      expect(await page.text()).toContain(`<script nonce="${nonce}"`)
      nonces.push(nonce!)
    }
    expect(new Set(nonces).size).toBe(3)
    // The /api rules are resolved once per path (server/plugins/security-rules.ts): the same headers every time.
    const heads = []
    for (let k = 0; k < 3; k++) {
      const res = await ctx.owner.req('POST', '/api/evaluate', { theory: 'gluon', helicities: [-1, -1, 1, 1], kinematics: { kind: 'random', seed: 1 } })
      expect(res.status).toBe(200)
      heads.push(['x-content-type-options', 'x-frame-options', 'referrer-policy', 'cache-control'].map(h => res.headers.get(h)))
    }
    expect(heads[0]).toEqual(['nosniff', 'SAMEORIGIN', 'no-referrer', 'no-store'])
    expect(heads[1]).toEqual(heads[0])
    expect(heads[2]).toEqual(heads[0])
    // The request-size limit still holds on /api (413 beyond 4 MB).
    const big = await fetch(`${baseURL()}/api/evaluate`, { method: 'POST', headers: { 'cookie': ctx.owner.cookie, 'content-type': 'application/json' }, body: JSON.stringify({ pad: 'x'.repeat(4_100_000) }) })
    expect(big.status).toBe(413)
  })
  it('V9.1.x / V14.4.5 HSTS is sent when served over HTTPS, not over plain HTTP', async () => {
    const https = await fetch(`${baseURL()}/api/auth/me`, { headers: { 'x-forwarded-proto': 'https' } })
    expect(https.headers.get('strict-transport-security')).toMatch(/max-age=\d+/)
    const http = await fetch(`${baseURL()}/api/auth/me`)
    expect(http.headers.get('strict-transport-security')).toBeNull()
  })
  it('V3.2.x a 401 sets no session cookie', async () => {
    const res = await fetch(`${baseURL()}/api/projects`)
    expect(res.status).toBe(401)
    expect(res.headers.getSetCookie().filter(c => !/max-age=0/i.test(c))).toEqual([])
  })
  it('V14.3.x the 403/404 pages carry their own reason phrase', async () => {
    const missing = await fetch(`${baseURL()}/projects/999999`, { headers: { cookie: ctx.owner.cookie } })
    expect(missing.status).toBe(404)
    expect(missing.statusText).not.toBe('Server Error')
    const forbidden = await fetch(`${baseURL()}/admin/users`, { headers: { cookie: ctx.owner.cookie } })
    expect(forbidden.status).toBe(403)
    expect(forbidden.statusText).not.toBe('Server Error')
  })
  it('V5.1.3 numeric ids are plain decimals: 0x1 and 1e0 are not id 1', async () => {
    for (const id of [`0x${pid.toString(16)}`, `${pid}e0`, `${pid}.0`, `+${pid}`]) {
      expect((await ctx.owner.get(`/api/projects/${id}`)).status, id).toBe(404)
    }
    expect((await ctx.owner.get(`/api/projects/${pid}`)).status).toBe(200)
  })
})
