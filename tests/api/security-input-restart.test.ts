// A batch cut short by a crash shows as interrupted in the diagram's checks list as soon as the
// server is back, without anyone opening the batch page. Runs its own server (killed with SIGKILL
// mid-batch, then started again on the same database file).
import { afterAll, describe, expect, it } from 'vitest'
import { spawn, type ChildProcess } from 'node:child_process'
import { mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join, resolve } from 'node:path'
import { testServerEnv } from '../setup/server'

const root = resolve(import.meta.dirname, '../..')
const dir = mkdtempSync(join(tmpdir(), 'polewright-restart-'))
const port = 4100 + Math.floor(Math.random() * 200)
const base = `http://127.0.0.1:${port}`
const env = { ...testServerEnv(dir, port, port + 1000), POLEWRIGHT_INSECURE_COOKIE: '1', APP_URL: base }
let server: ChildProcess | null = null

async function start() {
  const child = spawn(process.execPath, [join(root, process.env.POLEWRIGHT_TEST_OUTPUT || '.output', 'server/index.mjs')], { env, cwd: root, stdio: 'ignore' })
  for (let i = 0; i < 300; i++) {
    try {
      if ((await fetch(`${base}/api/auth/me`)).status > 0) return child
    }
    catch { /* not up yet */ }
    await new Promise(r => setTimeout(r, 100))
  }
  throw new Error('server did not start')
}

let cookie = ''
async function call(method: string, path: string, body?: unknown) {
  const res = await fetch(base + path, { method, headers: { 'content-type': 'application/json', cookie }, body: body === undefined ? undefined : JSON.stringify(body) })
  const set = res.headers.getSetCookie()[0]
  if (set) cookie = set.split(';')[0]!
  return { status: res.status, body: await res.json() as any }
}

afterAll(() => {
  server?.kill('SIGKILL')
  rmSync(dir, { recursive: true, force: true })
})

describe('interrupted batches', () => {
  it('V11.1.x / V7.4.x after a crash the checks list shows the batch interrupted, not running', async () => {
    server = await start()
    expect((await call('POST', '/api/auth/register', { email: 'restart@example.test', password: 'correct-horse-1', name: 'Restart Person' })).status).toBe(201)
    const project = (await call('POST', '/api/projects', { name: 'Restart' })).body
    const graph = { schemaVersion: 1, nodes: [], edges: [], process: { theory: 'gluon', helicities: [-1, -1, 1, 1, 1, 1, 1, 1] } }
    const diagram = (await call('POST', `/api/projects/${project.id}/diagrams`, { title: 'Eight gluons', graph })).body
    const set = (await call('POST', `/api/projects/${project.id}/point-sets/generate`, { kind: 'random', n: 8, count: 3000, seed: 3 })).body
    const batch = await call('POST', `/api/diagrams/${diagram.id}/batch-checks`, { pointSetId: set.id, target: 'parke-taylor' })
    expect(batch.status).toBe(202)
    server.kill('SIGKILL')
    await new Promise(r => setTimeout(r, 300))
    server = await start()
    const list = (await call('GET', `/api/diagrams/${diagram.id}/checks`)).body as { id: number, status: string, summary: { message?: string } }[]
    const row = list.find(c => c.id === batch.body.id)!
    expect(row.status).toBe('failed')
    expect(row.summary.message).toMatch(/^interrupted/)
  }, 120_000)
})
