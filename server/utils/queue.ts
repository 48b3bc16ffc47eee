// The job queue (BullMQ on REDIS_URL): when it is configured, a batch check's chunks go to the
// queue's workers (server/queue/worker.ts, other processes or machines) instead of this server's
// pool. This side enqueues the chunks, follows the stored progress, cancels, and notices a queue
// that stopped answering. Without REDIS_URL nothing here is started.
import { Queue, QueueEvents } from 'bullmq'
import IORedis from 'ioredis'
import { and, count, eq, gt } from 'drizzle-orm'
import { CHUNK_ATTEMPTS, QUEUE_NAME, jobId, redisLabel, redisOptions, type ChunkJob } from '../queue/shared'
import type { Verdict } from '#shared/pointsets'

/** Points per queued chunk (POLEWRIGHT_QUEUE_CHUNK, default the embedded chunk size). */
export function queueChunkSize() {
  const v = Number(process.env.POLEWRIGHT_QUEUE_CHUNK)
  return Number.isInteger(v) && v > 0 ? v : BATCH_CHUNK
}

export const queueEnabled = () => !!process.env.REDIS_URL

let q: { queue: Queue, events: QueueEvents, client: IORedis } | undefined
/** Chunks that used up their attempts, per batch: shown in the batch's progress until retried. */
const failedChunks = new Map<number, Map<string, string>>()

export function useQueue() {
  if (q) return q
  const url = process.env.REDIS_URL!
  const client = new IORedis(url, redisOptions(false))
  // A Redis that went away is reported by the batches and the health route; keep the log short.
  let logged = 0
  client.on('error', (e) => {
    if (Date.now() - logged > 10_000) console.error(`[queue] ${redisLabel(url)}: ${e.message}`)
    logged = Date.now()
  })
  const queue = new Queue<ChunkJob>(QUEUE_NAME, { connection: client })
  queue.on('error', () => {})
  const events = new QueueEvents(QUEUE_NAME, { connection: new IORedis(url, redisOptions(true)) })
  events.on('error', () => {})
  events.on('failed', ({ jobId: id, failedReason }) => {
    const checkId = Number(/^c(\d+)-/.exec(id)?.[1])
    if (!checkId) return
    void queue.getJob(id).then((job) => {
      if (job && job.attemptsMade < CHUNK_ATTEMPTS) return
      const m = failedChunks.get(checkId) ?? new Map()
      m.set(id, failedReason)
      failedChunks.set(checkId, m)
    }, () => {})
  })
  events.on('waiting', ({ jobId: id }) => {
    const checkId = Number(/^c(\d+)-/.exec(id)?.[1])
    failedChunks.get(checkId)?.delete(id)
  })
  q = { queue, events, client }
  return q
}

function withTimeout<T>(p: Promise<T>, ms: number, what: string): Promise<T> {
  return Promise.race([p, new Promise<T>((_, reject) => setTimeout(() => reject(new Error(`${what} did not answer within ${ms} ms`)), ms))])
}

/** Whether Redis answers (for the health route and the batch runner). */
export async function queuePing(ms = 1500): Promise<string | null> {
  try {
    await withTimeout(useQueue().client.ping(), ms, 'Redis')
    return null
  }
  catch (e) {
    return (e as Error).message
  }
}

interface Live {
  controller: AbortController
  counts: Record<Verdict, number>
}

/**
 * Runs a batch on the queue and returns how it ended. The batch row is already 'running'; workers
 * add to checks.done in each chunk's transaction. A cancel or a lost queue flips the status first
 * (one UPDATE … WHERE status = 'running'), so no worker's chunk lands after it.
 */
export async function runOnQueue(checkId: number, pointSetId: number, total: number, plan: BatchPlan, l: Live, publish: (message?: string) => Promise<void>) {
  const db = useDB()
  const { queue } = useQueue()
  const size = queueChunkSize()
  const chunks = Math.ceil(total / size)
  const ids = Array.from({ length: chunks }, (_, k) => jobId(checkId, k))
  const stop = async (status: 'cancelled' | 'failed') => {
    await db.update(tables.checks).set({ status }).where(and(eq(tables.checks.id, checkId), eq(tables.checks.status, 'running')))
    const row = await db.select({ done: tables.checks.done }).from(tables.checks).where(eq(tables.checks.id, checkId)).get()
    return row?.done ?? 0
  }
  const unreachable = (done: number, why: string) =>
    `the batch stopped: the job queue at ${redisLabel(process.env.REDIS_URL!)} stopped answering (${why}); ${done} of ${total} points were stored, in whole chunks of ${size}`
  const addAll = queue.addBulk(ids.map((id, k) => ({
    name: 'chunk',
    data: { checkId, chunk: k, pointSetId, from: k * size, to: Math.min(total, (k + 1) * size), plan },
    opts: { jobId: id, attempts: CHUNK_ATTEMPTS, backoff: { type: 'fixed', delay: 1000 }, removeOnComplete: { age: 3600, count: 10_000 }, removeOnFail: { age: 7 * 86400 } },
  })))
  try {
    await withTimeout(addAll, 5000, 'Redis')
  }
  catch (e) {
    const done = await stop('failed')
    return { status: 'failed' as const, done, message: unreachable(done, (e as Error).message) }
  }
  let lastChunk = 0
  let misses = 0
  for (;;) {
    await new Promise(r => setTimeout(r, 250))
    // Verdict counts from the chunks stored since the last look (each chunk row is written once).
    const fresh = await db.select({ id: tables.batchChunks.id, counts: tables.batchChunks.counts }).from(tables.batchChunks)
      .where(and(eq(tables.batchChunks.checkId, checkId), gt(tables.batchChunks.id, lastChunk)))
    for (const c of fresh) {
      for (const [v, n] of Object.entries(c.counts)) l.counts[v as Verdict] = (l.counts[v as Verdict] ?? 0) + n
      lastChunk = Math.max(lastChunk, c.id)
    }
    const stored = (await db.select({ c: count() }).from(tables.batchChunks).where(eq(tables.batchChunks.checkId, checkId)).get())?.c ?? 0
    if (stored >= chunks) return { status: 'done' as const, done: total }
    const row = await db.select({ status: tables.checks.status }).from(tables.checks).where(eq(tables.checks.id, checkId)).get()
    if (l.controller.signal.aborted || row?.status !== 'running') {
      const done = await stop('cancelled')
      await Promise.all(ids.map(id => queue.remove(id).catch(() => 0)))
      return { status: 'cancelled' as const, done }
    }
    const why = await queuePing()
    misses = why ? misses + 1 : 0
    if (why && misses >= 3) {
      const done = await stop('failed')
      return { status: 'failed' as const, done, message: unreachable(done, why) }
    }
    const failed = failedChunks.get(checkId)
    await publish(failed?.size
      ? `${failed.size} chunk(s) failed after ${CHUNK_ATTEMPTS} attempts (${[...failed.values()][0]}); a site administrator can retry them on the queue page`
      : undefined)
  }
}

/** The queue page: workers, depth, throughput over the last minute, failed chunks. */
export async function queueOverview() {
  const { queue } = useQueue()
  const down = await queuePing()
  if (down) return { redis: redisLabel(process.env.REDIS_URL!), ok: false, error: down, workers: [], counts: null, throughput: null, failed: [] }
  const [workers, counts, failed] = await Promise.all([queue.getWorkers(), queue.getJobCounts('waiting', 'active', 'delayed', 'failed', 'completed'), queue.getFailed(0, 49)])
  const since = new Date(Date.now() - 60_000)
  const recent = await useDB().select({ worker: tables.batchChunks.worker, points: tables.batchChunks.points, evalMs: tables.batchChunks.evalMs })
    .from(tables.batchChunks).where(gt(tables.batchChunks.createdAt, since))
  const perWorker = new Map<string, { chunks: number, points: number, evalMs: number }>()
  for (const r of recent) {
    const w = perWorker.get(r.worker) ?? { chunks: 0, points: 0, evalMs: 0 }
    w.chunks++
    w.points += r.points
    w.evalMs += r.evalMs
    perWorker.set(r.worker, w)
  }
  return {
    redis: redisLabel(process.env.REDIS_URL!),
    ok: true,
    error: null,
    workers: workers.map(w => ({ name: String(w.name ?? '').replace(/^.*:w:/, ''), addr: w.addr ?? null, age: Number(w.age ?? 0) })),
    counts,
    throughput: {
      windowSeconds: 60,
      points: recent.reduce((a, r) => a + r.points, 0),
      pointsPerSecond: Math.round(recent.reduce((a, r) => a + r.points, 0) / 60 * 10) / 10,
      perWorker: [...perWorker].map(([worker, v]) => ({ worker, ...v, evalMs: Math.round(v.evalMs) })),
    },
    failed: failed.map((j) => {
      const d: ChunkJob = j.data
      return { id: j.id!, checkId: d.checkId, chunk: d.chunk, points: d.to - d.from, attempts: j.attemptsMade, error: j.failedReason, failedAt: j.finishedOn ?? null }
    }),
  }
}

/** Puts a failed chunk back on the queue (its batch must still be running). */
export async function retryChunk(id: string) {
  const job = await useQueue().queue.getJob(id)
  if (!job) throw fieldError(404, 'jobId', `no chunk ${id} on the queue`)
  if (!(await job.isFailed())) throw fieldError(409, 'jobId', `chunk ${id} has not failed`)
  const check = await useDB().select({ status: tables.checks.status }).from(tables.checks).where(eq(tables.checks.id, job.data.checkId)).get()
  if (check?.status !== 'running') throw fieldError(409, 'jobId', `the batch of chunk ${id} is ${check?.status ?? 'deleted'}; start it again instead`)
  await job.retry('failed')
  failedChunks.get(job.data.checkId)?.delete(id)
  return { id, status: 'waiting' }
}
