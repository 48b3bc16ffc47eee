// A queue stack for the queue test and bench: redis-server on a free loopback port, the built
// server twice on one temporary SQLite file (one with REDIS_URL, one embedded) and worker
// processes (node <output>/server/worker.mjs). Everything it starts, stop() ends.
import { spawn, type ChildProcess } from 'node:child_process'
import { existsSync, mkdtempSync, rmSync } from 'node:fs'
import { createServer } from 'node:net'
import { tmpdir } from 'node:os'
import { join, resolve } from 'node:path'

const root = resolve(import.meta.dirname, '../..')

export function freePort(): Promise<number> {
  return new Promise((res, rej) => {
    const s = createServer()
    s.once('error', rej)
    s.listen(0, '127.0.0.1', () => {
      const p = (s.address() as { port: number }).port
      s.close(() => res(p))
    })
  })
}

export const sleep = (ms: number) => new Promise(r => setTimeout(r, ms))

export async function startQueueStack(opts: { chunk: number, lockMs?: number, root?: string }) {
  const base = opts.root ?? root
  const output = join(base, process.env.POLEWRIGHT_TEST_OUTPUT || '.output')
  if (!existsSync(join(output, 'server/worker.mjs'))) throw new Error(`No worker in ${output}/server: run "npx nuxt build"`)
  const children: ChildProcess[] = []
  let logs = ''
  const start = (cmd: string, args: string[], env: Record<string, string | undefined>) => {
    const c = spawn(cmd, args, { env: { ...process.env, ...env }, cwd: base, stdio: 'pipe' })
    c.stdout?.on('data', (d) => { logs += d })
    c.stderr?.on('data', (d) => { logs += d })
    children.push(c)
    return c
  }
  const until = async <T>(what: string, fn: () => Promise<T | undefined | null | false>, ms = 60_000): Promise<T> => {
    const end = Date.now() + ms
    for (;;) {
      try {
        const v = await fn()
        if (v) return v
      }
      catch { /* not yet */ }
      if (Date.now() > end) throw new Error(`${what} did not happen in ${ms} ms\n${logs.slice(-4000)}`)
      await sleep(100)
    }
  }
  const dir = mkdtempSync(join(tmpdir(), 'polewright-queue-'))
  const redisPort = await freePort()
  const redis = start('/usr/bin/redis-server', ['--port', String(redisPort), '--bind', '127.0.0.1', '--save', '', '--appendonly', 'no'], {})
  const lock = opts.lockMs ?? 2000
  const databaseUrl = `file:${join(dir, 'test.db')}`
  const env: Record<string, string> = {
    DATABASE_URL: databaseUrl,
    NUXT_SESSION_PASSWORD: 'test-session-password-0123456789-abcdefghijklmnop',
    POLEWRIGHT_MIGRATIONS_DIR: join(base, 'db/migrations'),
    POLEWRIGHT_QUEUE_CHUNK: String(opts.chunk),
    // Short locks, so a killed worker's chunk is handed on within a few seconds.
    POLEWRIGHT_QUEUE_LOCK_MS: String(lock),
    POLEWRIGHT_QUEUE_STALL_MS: String(lock / 2),
    SMTP_PORT: String(await freePort()),
    MAIL_OUTBOX_DIR: join(dir, 'outbox'),
  }
  const redisUrl = `redis://127.0.0.1:${redisPort}`
  let cookie = ''
  const api = async (url: string, method: string, path: string, body?: unknown) => {
    const res = await fetch(url + path, { method, headers: { cookie, ...(body ? { 'content-type': 'application/json' } : {}) }, body: body ? JSON.stringify(body) : undefined })
    const text = await res.text()
    return { status: res.status, body: text ? JSON.parse(text) : null }
  }
  const serve = async (extra: Record<string, string>) => {
    const port = await freePort()
    const url = `http://127.0.0.1:${port}`
    start(process.execPath, [join(output, 'server/index.mjs')], { ...env, ...extra, PORT: String(port), HOST: '127.0.0.1', APP_URL: url, NODE_ENV: 'production' })
    await until(`server on ${port}`, async () => (await fetch(`${url}/api/health`)).status > 0)
    return url
  }
  const queued = await serve({ REDIS_URL: redisUrl, POLEWRIGHT_SEED: '1' })
  // The embedded server on the same file, after the first has migrated and seeded it.
  const embedded = await serve({})
  const login = await fetch(`${queued}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: 'ines.varga@example.test', password: 'polewright-demo' }) })
  if (login.status !== 200) throw new Error(`login: ${login.status}`)
  cookie = login.headers.getSetCookie().map(c => c.split(';')[0]).join('; ')
  const project = (await api(queued, 'POST', '/api/projects', { name: 'Queue run' })).body.id as number

  const workers: ChildProcess[] = []
  const stack = {
    queued,
    embedded,
    redisPort,
    redis,
    workers,
    databaseUrl,
    api,
    until,
    logs: () => logs,
    cookie: () => cookie,
    startWorker(threads = 1) {
      const w = start(process.execPath, [join(output, 'server/worker.mjs'), '--threads', String(threads)], { ...env, REDIS_URL: redisUrl })
      workers.push(w)
      return w
    },
    async workersConnected(n: number) {
      await until(`${n} workers`, async () => (await api(queued, 'GET', '/api/admin/queue')).body.workers?.length === n)
    },
    async diagram(title: string, helicities: number[]) {
      const graph = { schemaVersion: 1, nodes: [], edges: [], process: { theory: 'gluon', helicities } }
      return (await api(queued, 'POST', `/api/projects/${project}/diagrams`, { title, graph })).body.id as number
    },
    async pointSet(n: number, count: number, seed: number) {
      const r = await api(queued, 'POST', `/api/projects/${project}/point-sets/generate`, { kind: 'physical', n, count, seed })
      if (r.status !== 201) throw new Error(`point set: ${r.status} ${JSON.stringify(r.body)}`)
      return r.body.id as number
    },
    async waitEnd(url: string, id: number, ms = 90_000) {
      return until(`batch ${id} to end`, async () => {
        const b = (await api(url, 'GET', `/api/batch-checks/${id}`)).body
        return ['done', 'failed', 'cancelled'].includes(b.status) ? b : null
      }, ms)
    },
    async stop() {
      for (const c of children) if (c.exitCode === null) c.kill('SIGKILL')
      await sleep(200)
      rmSync(dir, { recursive: true, force: true })
    },
  }
  return stack
}
