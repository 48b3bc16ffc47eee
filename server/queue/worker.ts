// A queue worker process (`npm run worker`, or `node .output/server/worker.mjs` in a build): pulls
// batch chunks from the BullMQ queue on REDIS_URL, evaluates their points with the engine's
// `evaluate` in a pool of threads (POLEWRIGHT_WORKER_THREADS, default 1; `--threads N`), and
// stores each chunk in one transaction (storeChunk). The database is DATABASE_URL (a libsql://
// server with DATABASE_AUTH_TOKEN when the workers run on other machines).
import { Worker, type Job } from 'bullmq'
import IORedis from 'ioredis'
import { and, asc, eq, gte, lt } from 'drizzle-orm'
import { existsSync } from 'node:fs'
import { hostname } from 'node:os'
import { dirname, join } from 'node:path'
import { fileURLToPath } from 'node:url'
import Tinypool from 'tinypool'
import { configureConnection, tables, useClient, useDB } from '../utils/db'
import { codeMismatch, requestFor, rowOf } from '../utils/batch'
import type { BatchValue, Outcome } from '../workers/tasks'
import { QUEUE_NAME, queueTimings, redisLabel, redisOptions, storeChunk, type ChunkJob, type ChunkResult } from './shared'

const arg = (name: string) => {
  const k = process.argv.indexOf(`--${name}`)
  return k > 0 ? process.argv[k + 1] : undefined
}
const threads = Math.max(1, Number(arg('threads') ?? process.env.POLEWRIGHT_WORKER_THREADS) || 1)
const url = process.env.REDIS_URL
if (!url) {
  console.error('[worker] REDIS_URL is not set: a worker needs the job queue (e.g. REDIS_URL=redis://127.0.0.1:6379)')
  process.exit(2)
}
const name = `${hostname()}:${process.pid}`
const here = dirname(fileURLToPath(import.meta.url))
const evaluator = [process.env.POLEWRIGHT_WORKER_FILE, join(here, 'workers/evaluate.mjs')].find(f => f && existsSync(f))
if (!evaluator) {
  console.error(`[worker] no evaluation worker file beside ${here} (workers/evaluate.mjs): build first`)
  process.exit(2)
}
const pool = new Tinypool({ filename: evaluator, minThreads: threads, maxThreads: threads, idleTimeout: 60_000 })
const SLICE = 25

await configureConnection(useClient())
const db = useDB()
// The client has one connection, and a transaction holds it: every database use of this process
// (status polls, point reads, the chunk transaction) takes its turn.
let turn: Promise<unknown> = Promise.resolve()
function serial<T>(fn: () => Promise<T>): Promise<T> {
  const next = turn.then(fn, fn)
  turn = next.catch(() => {})
  return next
}

/** Whether the batch still runs (polled during a chunk, so a cancel stops it within a second). */
async function running(checkId: number) {
  const row = await serial(() => db.select({ status: tables.checks.status }).from(tables.checks).where(eq(tables.checks.id, checkId)).get())
  return row?.status === 'running'
}

async function evaluateSlices(reqs: ReturnType<typeof requestFor>[], signal: AbortSignal) {
  const parts: Promise<Outcome[]>[] = []
  for (let s = 0; s < reqs.length; s += SLICE) {
    parts.push(pool.run({ kind: 'evaluateMany', reqs: reqs.slice(s, s + SLICE), slim: true }, { signal }).then((o: Outcome) => {
      if (!o.ok) throw new Error(o.message)
      return o.value as Outcome[]
    }))
  }
  return (await Promise.all(parts)).flat()
}

async function processChunk(job: Job<ChunkJob>): Promise<ChunkResult> {
  const c = job.data
  if (!(await running(c.checkId))) return { skipped: 'stopped' }
  const pts = (await serial(() => db.select().from(tables.points)
    .where(and(eq(tables.points.pointSetId, c.pointSetId), gte(tables.points.idx, c.from), lt(tables.points.idx, c.to)))
    .orderBy(asc(tables.points.idx)))).map(r => ({ idx: r.idx, data: r.data }))
  if (pts.length !== c.to - c.from) throw new Error(`points ${c.from}–${c.to - 1} of point set ${c.pointSetId}: found ${pts.length} of ${c.to - c.from}`)
  const mismatch = pts.map(p => codeMismatch(c.plan.process.theory, p.data.codes, c.plan.process.species))
  const todo = pts.filter((_, k) => !mismatch[k])
  const ac = new AbortController()
  const watch = setInterval(() => {
    running(c.checkId).then(ok => ok || ac.abort(), () => {})
  }, 500)
  const t0 = performance.now()
  let items: Outcome[]
  try {
    items = todo.length ? await evaluateSlices(todo.map(p => requestFor(c.plan, p.data)), ac.signal) : []
  }
  catch (e) {
    if (ac.signal.aborted) return { skipped: 'stopped' }
    throw e
  }
  finally {
    clearInterval(watch)
  }
  const evalMs = performance.now() - t0
  let t = 0
  const rows = pts.map((p, k) => {
    if (mismatch[k]) return rowOf(c.checkId, p.idx, p.data, { ok: false, message: mismatch[k]! })
    const o = items[t++]!
    return rowOf(c.checkId, p.idx, p.data, o.ok ? { ok: true, value: o.value as BatchValue } : { ok: false, message: o.message })
  })
  return serial(() => storeChunk(db, c, rows, name, evalMs))
}

const { lockDuration, stalledInterval, maxStalledCount } = queueTimings()
const worker = new Worker<ChunkJob, ChunkResult>(QUEUE_NAME, processChunk, {
  connection: new IORedis(url, redisOptions(true)),
  concurrency: threads,
  name,
  lockDuration,
  stalledInterval,
  maxStalledCount,
})
worker.on('error', e => console.error(`[worker] ${redisLabel(url)}: ${e.message}`))
worker.on('failed', (job, e) => console.error(`[worker] chunk ${job?.id} failed: ${e.message}`))
await worker.waitUntilReady()
console.log(`[worker] ${name} ready: ${threads} thread(s), queue ${QUEUE_NAME} on ${redisLabel(url)}`)

const stop = async () => {
  await worker.close()
  await pool.destroy()
  process.exit(0)
}
process.once('SIGTERM', stop)
process.once('SIGINT', stop)
