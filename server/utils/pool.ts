// The evaluation worker pool: every evaluation runs off the request thread, in a tinypool of
// worker threads started from <server output>/workers/evaluate.mjs (see
// modules/evaluation-worker.ts). Each task has a time budget; a task over budget is aborted,
// which terminates its worker, and tinypool starts a fresh one, so the pool recovers.
import { existsSync } from 'node:fs'
import { availableParallelism } from 'node:os'
import { dirname, join } from 'node:path'
import { fileURLToPath } from 'node:url'
import Tinypool from 'tinypool'
import type { EvaluateRequestInput, EvaluateResponse } from '#shared/schemas/evaluate'
import type { BatchValue, Failure, Outcome, Task } from '../workers/tasks'

export interface PoolOptions {
  /** Time budget of the task (each chunk for batches), ms; default POLEWRIGHT_EVAL_BUDGET_MS. */
  timeoutMs?: number
  /** Aborts the task (e.g. the client went away). */
  signal?: AbortSignal
}

/** A failure of the evaluation itself: the route turns it into the HTTP error. */
export class EvaluationError extends Error {
  constructor(
    public readonly status: number,
    public readonly field: string,
    message: string,
    public readonly issues?: unknown,
  ) {
    super(message)
    this.name = 'EvaluationError'
  }
}

export function evaluationBudgetMs(): number {
  const v = Number(process.env.POLEWRIGHT_EVAL_BUDGET_MS)
  return Number.isFinite(v) && v > 0 ? v : 20_000
}

function threadCount(): number {
  const v = Number(process.env.POLEWRIGHT_EVAL_THREADS)
  return Number.isInteger(v) && v > 0 ? v : Math.max(1, availableParallelism())
}

/** The worker file: next to the built server's index.mjs, or the dev build's (runtimeConfig). */
function workerFile(): string | null {
  const candidates: string[] = []
  if (process.env.POLEWRIGHT_WORKER_FILE) candidates.push(process.env.POLEWRIGHT_WORKER_FILE)
  const dev = (useRuntimeConfig() as { evaluationWorker?: string }).evaluationWorker
  if (dev) candidates.push(dev)
  if (process.argv[1]) candidates.push(join(dirname(process.argv[1]), 'workers/evaluate.mjs'))
  // This code sits in a chunk somewhere below the server dir.
  let dir = dirname(fileURLToPath(import.meta.url))
  for (let up = 0; up < 5; up++, dir = dirname(dir)) candidates.push(join(dir, 'workers/evaluate.mjs'))
  return candidates.find((f) => existsSync(f)) ?? null
}

let pool: Tinypool | null | undefined
let warned = false

function getPool(): Tinypool | null {
  if (pool !== undefined) return pool
  const filename = workerFile()
  if (!filename) {
    pool = null
    return pool
  }
  const threads = threadCount()
  // A worker that outgrows its heap is terminated (its request gets 503), never the server.
  const heapMb = Number(process.env.POLEWRIGHT_WORKER_HEAP_MB) || 1024
  pool = new Tinypool({ filename, minThreads: threads, maxThreads: threads, idleTimeout: 60_000, maxQueue: 10_000, resourceLimits: { maxOldGenerationSizeMb: heapMb } })
  return pool
}

/** Whether evaluations run in worker threads (false only in `nuxt dev` without a worker file). */
export function poolInfo() {
  const p = getPool()
  return { workers: !!p, threads: p ? p.threads.length : 0, queued: p ? p.queueSize : 0 }
}

async function runInProcess(task: Task): Promise<Outcome> {
  if (!warned) {
    console.warn('[polewright] no evaluation worker file found: evaluating on the request thread (no time budget)')
    warned = true
  }
  const { runTask } = await import('../workers/tasks')
  return runTask(task)
}

/** Runs one task within its budget. Resolves with the worker's outcome; rejects on budget / abort. */
async function runOutcome(task: Task, opts: PoolOptions = {}): Promise<Outcome & { thread?: number }> {
  const p = getPool()
  if (!p) return runInProcess(task)
  const budget = opts.timeoutMs ?? evaluationBudgetMs()
  const ac = new AbortController()
  let timedOut = false
  const timer = setTimeout(() => {
    timedOut = true
    ac.abort()
  }, budget)
  const onAbort = () => ac.abort()
  opts.signal?.addEventListener('abort', onAbort, { once: true })
  try {
    return (await p.run(task, { signal: ac.signal })) as Outcome
  }
  catch (e) {
    if (timedOut) throw new EvaluationError(503, '', `the evaluation exceeded its time budget of ${budget} ms`, undefined)
    if (opts.signal?.aborted) throw new EvaluationError(499, '', 'the evaluation was cancelled')
    if (e instanceof Error && /queue is at limit/i.test(e.message)) throw new EvaluationError(503, '', 'the evaluation queue is full; try again shortly')
    console.error('[polewright] evaluation worker failed', e)
    throw new EvaluationError(503, '', 'the evaluation worker stopped unexpectedly; try again')
  }
  finally {
    clearTimeout(timer)
    opts.signal?.removeEventListener('abort', onAbort)
  }
}

function unwrap<T>(o: Outcome): T {
  if (o.ok) return o.value as T
  throw failureError(o)
}

/** An engine bug is logged with its stack and reported as a clear 422, never a 5xx. */
export function failureError(f: Failure): EvaluationError {
  if (f.status === 500) {
    const ref = Math.random().toString(36).slice(2, 10)
    console.error(`[polewright] engine error ${ref}: ${f.message}\n${f.stack ?? ''}`)
    return new EvaluationError(422, 'engine', `engine: the evaluation failed inside the engine (${f.message}); this is a bug, logged as ${ref}`)
  }
  return new EvaluationError(f.status, f.field, f.message, f.issues)
}

/** Runs any worker task and returns its value (the routes for shifts, cross-shift, catalogue). */
export async function runInPool<T>(task: Task, opts: PoolOptions = {}): Promise<{ value: T; thread: number; ms?: number }> {
  const o = await runOutcome(task, opts)
  return { value: unwrap<T>(o), thread: o.ok ? o.thread : 0, ms: o.ok ? o.ms : undefined }
}

/** One evaluation (docs/api.md "Evaluation request"), off the request thread. `order`: a colour order of the labels. */
export async function evaluateInPool(req: EvaluateRequestInput, opts: PoolOptions & { order?: number[] } = {}): Promise<EvaluateResponse> {
  const { order, ...rest } = opts
  return (await runInPool<EvaluateResponse>({ kind: 'evaluate', req, ...(order ? { order } : {}) }, rest)).value
}

export type BatchItem = { ok: true; value: BatchValue } | { ok: false; status: number; field: string; message: string }

/**
 * Many evaluations (batch checks), in chunks spread over the workers; one item's failure is its
 * own entry. A chunk over its budget (timeoutMs per chunk) gives 503 entries for its items.
 */
export async function evaluateManyInPool(
  reqs: EvaluateRequestInput[],
  opts: PoolOptions & { chunkSize?: number; onProgress?: (done: number, total: number) => void } = {},
): Promise<BatchItem[]> {
  const size = Math.max(1, opts.chunkSize ?? 16)
  const out = new Array<BatchItem>(reqs.length)
  let done = 0
  const chunks: number[] = []
  for (let s = 0; s < reqs.length; s += size) chunks.push(s)
  await Promise.all(chunks.map(async (start) => {
    const part = reqs.slice(start, start + size)
    let items: BatchItem[]
    try {
      const o = await runOutcome({ kind: 'evaluateMany', reqs: part, slim: true }, opts)
      if (!o.ok) throw failureError(o)
      items = (o.value as Outcome[]).map((x) => (x.ok ? { ok: true as const, value: x.value as BatchValue } : toItem(failureError(x))))
    }
    catch (e) {
      const err = e instanceof EvaluationError ? e : new EvaluationError(503, '', String(e))
      items = part.map(() => toItem(err))
    }
    items.forEach((it, k) => (out[start + k] = it))
    done += part.length
    opts.onProgress?.(done, reqs.length)
  }))
  return out
}

function toItem(e: EvaluationError): BatchItem {
  return { ok: false, status: e.status, field: e.field, message: e.message }
}
