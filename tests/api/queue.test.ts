// Batch checks on the job queue, end to end with a real redis-server (tests/helpers/queue-stack.ts):
// the same answers as the embedded pool, kill -9 of a worker (its chunks go to the other, every
// point once), cancel across workers, and Redis stopped mid-batch (failed, whole chunks only).
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createClient, type Client } from '@libsql/client'
import { sleep, startQueueStack } from '../helpers/queue-stack'

const CHUNK = 100
let s: Awaited<ReturnType<typeof startQueueStack>>
let db: Client
const ids = (n: number) => Array.from({ length: n }, (_, k) => k)
const stored = async (id: number) => (await db.execute({ sql: 'select idx, value, target, deviation, verdict, message from check_points where check_id = ? order by idx', args: [id] })).rows
const chunks = async (id: number) => (await db.execute({ sql: 'select chunk, points, worker from batch_chunks where check_id = ? order by chunk', args: [id] })).rows

beforeAll(async () => {
  s = await startQueueStack({ chunk: CHUNK })
  db = createClient({ url: s.databaseUrl })
  s.startWorker()
  s.startWorker()
  await s.workersConnected(2)
}, 120_000)

afterAll(async () => {
  if (process.env.POLEWRIGHT_TEST_LOGS) console.log(s?.logs())
  db?.close()
  await s?.stop()
})

describe('batch checks on the job queue', () => {
  it('reports itself healthy and shows both workers to site administrators', async () => {
    expect((await s.api(s.queued, 'GET', '/api/health')).body).toEqual({ status: 'ok', database: 'ok', queue: 'ok' })
    expect((await s.api(s.embedded, 'GET', '/api/health')).body).toEqual({ status: 'ok', database: 'ok', queue: 'off' })
    const q = (await s.api(s.queued, 'GET', '/api/admin/queue')).body
    expect(q).toMatchObject({ enabled: true, ok: true, failed: [] })
    expect(q.workers).toHaveLength(2)
    expect((await s.api(s.embedded, 'GET', '/api/admin/queue')).body).toEqual({ enabled: false })
    const r = await s.api(s.queued, 'POST', '/api/admin/queue/retry', { jobId: 'c999-0' })
    expect(r.status).toBe(404)
    expect(r.body.message).toMatch(/^jobId: no chunk c999-0/)
  })

  it('2,000 points over two workers agree point for point with the embedded run', async () => {
    const set = await s.pointSet(6, 2000, 11)
    const d = await s.diagram('Six gluons NMHV', [-1, -1, -1, 1, 1, 1])
    const a = await s.api(s.queued, 'POST', `/api/diagrams/${d}/batch-checks`, { pointSetId: set })
    expect(a.status, JSON.stringify(a.body)).toBe(202)
    // The progress stream counts the points of every worker.
    const sse = await fetch(`${s.queued}/api/batch-checks/${a.body.id}/events`, { headers: { cookie: s.cookie() } })
    const ev = (await sse.text()).split('\n\n').filter(Boolean).map(b => ({ event: /^event: (.*)$/m.exec(b)?.[1], data: JSON.parse(/^data: (.*)$/m.exec(b)![1]!) }))
    expect(ev.at(-1)).toMatchObject({ event: 'end', data: { status: 'done', done: 2000, total: 2000 } })
    expect(ev.some(e => e.event === 'progress' && e.data.rate > 0)).toBe(true)
    const b = await s.api(s.embedded, 'POST', `/api/diagrams/${d}/batch-checks`, { pointSetId: set })
    expect(b.status).toBe(202)
    const eb = await s.waitEnd(s.embedded, b.body.id)
    const ea = await s.waitEnd(s.queued, a.body.id)
    expect([ea.status, eb.status]).toEqual(['done', 'done'])
    const ra = await stored(a.body.id)
    const rb = await stored(b.body.id)
    expect(ra).toHaveLength(2000)
    expect(ra.map(r => ({ ...r }))).toEqual(rb.map(r => ({ ...r })))
    expect(ea.summary.counts).toEqual(eb.summary.counts)
    const cs = await chunks(a.body.id)
    expect(cs.map(c => c.chunk)).toEqual(ids(2000 / CHUNK))
    expect(new Set(cs.map(c => c.worker)).size).toBe(2)
  })

  it('kill -9 of a worker mid-batch: the other takes over its chunks, every point stored once', async () => {
    const set = await s.pointSet(8, 2000, 12)
    const d = await s.diagram('Eight gluons N2MHV', [-1, -1, -1, -1, 1, 1, 1, 1])
    const a = await s.api(s.queued, 'POST', `/api/diagrams/${d}/batch-checks`, { pointSetId: set })
    expect(a.status).toBe(202)
    await s.until('first chunks', async () => (await chunks(a.body.id)).length >= 2)
    s.workers[0]!.kill('SIGKILL')
    const end = await s.waitEnd(s.queued, a.body.id)
    expect(end.status, JSON.stringify(end.summary)).toBe('done')
    expect(end.done).toBe(2000)
    expect((await stored(a.body.id)).map(r => r.idx)).toEqual(ids(2000))
    const cs = await chunks(a.body.id)
    expect(cs.map(c => c.chunk)).toEqual(ids(2000 / CHUNK))
    expect(cs.reduce((t, c) => t + Number(c.points), 0)).toBe(2000)
    s.workers.shift()
    s.startWorker()
    await s.workersConnected(2)
  })

  it('cancel stops the chunks of both workers; the stored points are whole chunks', async () => {
    const set = await s.pointSet(8, 3000, 13)
    const d = await s.diagram('Eight gluons, cancelled', [-1, -1, -1, -1, 1, 1, 1, 1])
    const a = await s.api(s.queued, 'POST', `/api/diagrams/${d}/batch-checks`, { pointSetId: set })
    await s.until('first chunk', async () => (await chunks(a.body.id)).length >= 1)
    const c = await s.api(s.queued, 'POST', `/api/batch-checks/${a.body.id}/cancel`)
    expect(c.status, JSON.stringify(c.body)).toBe(200)
    expect(c.body.status).toBe('cancelled')
    expect(c.body.summary.message).toMatch(/^cancelled after \d+ of 3000 points/)
    await sleep(2500)
    const rows = await stored(a.body.id)
    expect((await s.api(s.queued, 'GET', `/api/batch-checks/${a.body.id}`)).body.done).toBe(c.body.done)
    expect(rows).toHaveLength(c.body.done)
    expect(rows.length % CHUNK).toBe(0)
    expect(rows.length).toBeLessThan(3000)
    const q = (await s.api(s.queued, 'GET', '/api/admin/queue')).body
    expect(q.counts.active + q.counts.waiting).toBe(0)
  })

  it('Redis stopped mid-batch: the batch fails with the reason, nothing half-written', async () => {
    const set = await s.pointSet(8, 3000, 14)
    const d = await s.diagram('Eight gluons, queue lost', [-1, -1, -1, -1, 1, 1, 1, 1])
    const a = await s.api(s.queued, 'POST', `/api/diagrams/${d}/batch-checks`, { pointSetId: set })
    await s.until('first chunk', async () => (await chunks(a.body.id)).length >= 1)
    s.redis.kill('SIGKILL')
    const end = await s.waitEnd(s.queued, a.body.id, 30_000)
    expect(end.status).toBe('failed')
    expect(end.summary.message).toMatch(new RegExp(`^the batch stopped: the job queue at redis://127\\.0\\.0\\.1:${s.redisPort} stopped answering .*; \\d+ of 3000 points were stored, in whole chunks of ${CHUNK}$`))
    await sleep(2000)
    const rows = await stored(a.body.id)
    expect(rows).toHaveLength(end.done)
    expect(rows.length % CHUNK).toBe(0)
    expect((await chunks(a.body.id)).length * CHUNK).toBe(rows.length)
    expect((await s.api(s.queued, 'GET', '/api/health')).status).toBe(503)
  })
})
