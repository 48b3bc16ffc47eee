// What the server and the queue workers share: the queue's name and timings, a chunk job's data,
// and the one transaction that stores a chunk. Pure: no Nitro auto-imports, so the worker bundle
// (server/queue/worker.ts) can use it outside the server.
import { and, eq, sql } from 'drizzle-orm'
import type { LibSQLDatabase } from 'drizzle-orm/libsql'
import type { RedisOptions } from 'ioredis'
import * as schema from '../../db/schema'
import type { BatchPlan } from '../utils/batch'

export const QUEUE_NAME = 'polewright-batch'

/** One chunk of a batch: points [from, to) of a point set, evaluated under one plan. */
export interface ChunkJob {
  checkId: number
  chunk: number
  pointSetId: number
  from: number
  to: number
  plan: BatchPlan
}

/** What a worker answers for a chunk (the job's return value). */
export type ChunkResult = { stored: number, evalMs: number } | { skipped: 'stopped' | 'duplicate' }

export const jobId = (checkId: number, chunk: number) => `c${checkId}-${chunk}`

function ms(name: string, fallback: number) {
  const v = Number(process.env[name])
  return Number.isFinite(v) && v > 0 ? v : fallback
}

/**
 * Lock and stall timings: a worker that dies (kill -9) holds its chunk's lock for at most
 * lockDuration; the next stall check (every stalledInterval) hands the chunk to another worker.
 */
export function queueTimings() {
  const lockDuration = ms('POLEWRIGHT_QUEUE_LOCK_MS', 15_000)
  return { lockDuration, stalledInterval: ms('POLEWRIGHT_QUEUE_STALL_MS', Math.max(1000, lockDuration / 2)), maxStalledCount: 3 }
}

/** Attempts per chunk before it shows as failed on the queue page. */
export const CHUNK_ATTEMPTS = 3

/** ioredis options from REDIS_URL; workers need maxRetriesPerRequest null (blocking commands). */
export function redisOptions(forWorker: boolean): RedisOptions {
  return {
    ...(forWorker ? { maxRetriesPerRequest: null } : { maxRetriesPerRequest: 1 }),
    connectTimeout: 3000,
    retryStrategy: (times: number) => Math.min(times * 200, 2000),
  }
}

/** The Redis address without a password, for messages. */
export function redisLabel(url: string) {
  try {
    const u = new URL(url)
    return `${u.protocol}//${u.host}`
  }
  catch {
    return 'the configured Redis'
  }
}

type DB = LibSQLDatabase<typeof schema>
type PointRow = typeof schema.checkPoints.$inferInsert

const STOP = Symbol('stop')

/**
 * Stores a chunk's points in one transaction, exactly once: the chunk row (unique check + chunk)
 * is written first, so a chunk retried after its worker died finds it and stores nothing; the
 * points are upserted on their key (check, idx); the batch's done count rises only while the
 * batch is still running, so a cancelled or failed batch takes no more rows.
 */
export async function storeChunk(db: DB, job: ChunkJob, rows: PointRow[], worker: string, evalMs: number): Promise<ChunkResult> {
  const counts: Record<string, number> = {}
  for (const r of rows) counts[r.verdict] = (counts[r.verdict] ?? 0) + 1
  let result: ChunkResult = { stored: rows.length, evalMs }
  try {
    await db.transaction(async (tx) => {
      const chunk = await tx.insert(schema.batchChunks)
        .values({ checkId: job.checkId, chunk: job.chunk, points: rows.length, counts, worker, evalMs })
        .onConflictDoNothing().returning({ id: schema.batchChunks.id })
      if (!chunk.length) {
        result = { skipped: 'duplicate' }
        throw STOP
      }
      const live = await tx.update(schema.checks).set({ done: sql`${schema.checks.done} + ${rows.length}` })
        .where(and(eq(schema.checks.id, job.checkId), eq(schema.checks.status, 'running'))).returning({ id: schema.checks.id })
      if (!live.length) {
        result = { skipped: 'stopped' }
        throw STOP
      }
      const cp = schema.checkPoints
      for (let k = 0; k < rows.length; k += 200) {
        await tx.insert(cp).values(rows.slice(k, k + 200)).onConflictDoUpdate({
          target: [cp.checkId, cp.idx],
          set: { value: sql`excluded.value`, target: sql`excluded.target`, deviation: sql`excluded.deviation`, verdict: sql`excluded.verdict`, minInvariant: sql`excluded.min_invariant`, message: sql`excluded.message` },
        })
      }
    })
  }
  catch (e) {
    if (e !== STOP) throw e
  }
  return result
}
