// storeChunk, the one write of a queue worker, on a real SQLite file with the project's
// migrations: a chunk stored twice (a retry after its worker died, from the same or another
// connection) keeps one copy of every point and counts once; a batch no longer running takes
// nothing. (Two connections of one process cannot interleave transactions — the driver is
// synchronous — so truly concurrent workers are covered by tests/api/queue.test.ts.)
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createClient, type Client } from '@libsql/client'
import { drizzle } from 'drizzle-orm/libsql'
import { migrate } from 'drizzle-orm/libsql/migrator'
import { eq } from 'drizzle-orm'
import { mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join, resolve } from 'node:path'
import * as schema from '../../../db/schema'
import { storeChunk, type ChunkJob } from '../../../server/queue/shared'

const dir = mkdtempSync(join(tmpdir(), 'polewright-chunk-'))
const url = `file:${join(dir, 't.db')}`
const clients: Client[] = []
const open = async () => {
  const c = createClient({ url, concurrency: 1 })
  await c.execute('PRAGMA journal_mode = WAL')
  await c.execute('PRAGMA busy_timeout = 5000')
  await c.execute('PRAGMA foreign_keys = ON')
  clients.push(c)
  return drizzle(c, { schema })
}
let db: Awaited<ReturnType<typeof open>>
let checkId = 0

const job = (chunk: number): ChunkJob => ({ checkId, chunk, pointSetId: 1, from: chunk * 3, to: chunk * 3 + 3, plan: { process: { theory: 'gluon', helicities: [-1, -1, 1, 1] }, target: 'auto' } as ChunkJob['plan'] })
const rows = (chunk: number, verdict = 'agrees') => [0, 1, 2].map(k => ({ checkId, idx: chunk * 3 + k, value: [k, 0], target: [k, 0], deviation: 1e-15, verdict, minInvariant: 0.1, message: null }))
const points = async () => db.select().from(schema.checkPoints).where(eq(schema.checkPoints.checkId, checkId)).orderBy(schema.checkPoints.idx)
const done = async () => (await db.select().from(schema.checks).where(eq(schema.checks.id, checkId)).get())!.done

beforeAll(async () => {
  db = await open()
  await migrate(db, { migrationsFolder: resolve(import.meta.dirname, '../../../db/migrations') })
  const u = await db.insert(schema.users).values({ email: 'a@example.test', name: 'A', passwordHash: 'x' }).returning().get()
  const p = await db.insert(schema.projects).values({ name: 'P', createdBy: u.id }).returning().get()
  checkId = (await db.insert(schema.checks).values({ projectId: p.id, kind: 'batch', status: 'running', request: {}, engineVersion: 't', arithmetic: 'float', total: 9, createdBy: u.id }).returning().get()).id
})
afterAll(() => {
  for (const c of clients) c.close()
  rmSync(dir, { recursive: true, force: true })
})

describe('storeChunk', () => {
  it('stores a chunk once; a retry stores nothing and does not count again', async () => {
    expect(await storeChunk(db, job(0), rows(0), 'w1', 5)).toEqual({ stored: 3, evalMs: 5 })
    expect(await storeChunk(db, job(0), rows(0, 'disagrees'), 'w2', 5)).toEqual({ skipped: 'duplicate' })
    expect((await points()).map(r => [r.idx, r.verdict])).toEqual([[0, 'agrees'], [1, 'agrees'], [2, 'agrees']])
    expect(await done()).toBe(3)
    const c = await db.select().from(schema.batchChunks).where(eq(schema.batchChunks.checkId, checkId))
    expect(c).toMatchObject([{ chunk: 0, points: 3, counts: { agrees: 3 }, worker: 'w1' }])
  })

  it('another worker (its own connection) retrying a stored chunk stores nothing', async () => {
    const other = await open()
    expect(await storeChunk(other, job(1), rows(1), 'w2', 1)).toEqual({ stored: 3, evalMs: 1 })
    expect(await storeChunk(db, job(1), rows(1), 'w1', 1)).toEqual({ skipped: 'duplicate' })
    expect((await points()).length).toBe(6)
    expect(await done()).toBe(6)
  })

  it('a batch that is no longer running takes no chunk (nothing half-written)', async () => {
    await db.update(schema.checks).set({ status: 'cancelled' }).where(eq(schema.checks.id, checkId))
    expect(await storeChunk(db, job(2), rows(2), 'w1', 1)).toEqual({ skipped: 'stopped' })
    expect((await points()).length).toBe(6)
    expect(await done()).toBe(6)
    expect((await db.select().from(schema.batchChunks).where(eq(schema.batchChunks.checkId, checkId))).length).toBe(2)
  })
})
