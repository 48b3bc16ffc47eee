// Batch checks: a diagram's process evaluated over a point set in the worker pool, chunk by chunk.
// Each chunk's per-point results are written to tables.checkPoints as soon as it is done, so
// memory stays bounded by a few chunks (BATCH_AHEAD evaluating ahead); progress goes to subscribers
// (the SSE route) and to checks.done. The summary is computed by SQL over the stored rows.
import { and, asc, count, desc, eq, gte, inArray, isNotNull, sql } from 'drizzle-orm'
import { EventEmitter, setMaxListeners } from 'node:events'
import { ENGINE_VERSION } from '#shared/physics/index'
import type { EvaluateRequestInput } from '#shared/schemas/evaluate'
import type { BatchValue } from '../workers/tasks'
import type { Process } from '#shared/schemas/graph'
import type { BatchCheckSummary } from '#shared/schemas/service'
import { VERDICTS, type BatchProgressView, type PointData, type Verdict } from '#shared/pointsets'
import { checkOrder, effectiveOrder, inOrder, shiftInOrder } from '#shared/physics/colour-order'
import { isColourOrdered, pdgOf } from '#shared/physics/theories'
import { speciesCodeMismatch } from '#shared/pointsets/species'

type CheckRow = typeof tables.checks.$inferSelect

/** Points per chunk read, evaluated and written together. */
export const BATCH_CHUNK = 250
/** Chunks evaluating at once per batch while the oldest is written. */
const BATCH_AHEAD = 3
/** Batches running at once (the pool is shared; more wait as "queued"). */
const MAX_RUNNING = 2
const TERMINAL = new Set(['done', 'failed', 'cancelled'])

export type BatchProgress = BatchProgressView

interface Live {
  controller: AbortController
  pointSetId: number
  startedAt: number | null
  counts: Record<Verdict, number>
  last: BatchProgress | null
  /** Starts the run (kept while queued, so a cancelled queued batch finishes at once). */
  go?: () => void
}

const live = new Map<number, Live>()
const queue: (() => void)[] = []
let running = 0
const bus = new EventEmitter()
bus.setMaxListeners(0)

const zeroCounts = (): Record<Verdict, number> => Object.fromEntries(VERDICTS.map(v => [v, 0])) as Record<Verdict, number>

/** The engine request for one stored point (colour order applied: the worker's evaluateMany takes legs as given). */
export interface BatchPlan {
  process: Process
  target: EvaluateRequestInput['target']
  shift?: [number, number]
}

export function requestFor(plan: BatchPlan, data: PointData): EvaluateRequestInput {
  const { process: p } = plan
  const order = effectiveOrder(p.theory, p.order)
  const pick = <T>(xs: T[]): T[] => (order ? inOrder(xs, order) : xs)
  const shift = plan.shift ?? p.shift
  return {
    theory: p.theory,
    ...(p.spin !== undefined ? { spin: p.spin } : {}),
    helicities: pick(p.helicities),
    ...(p.species ? { species: pick(p.species) } : {}),
    kinematics: data.momenta
      ? { kind: 'momenta', momenta: pick(data.momenta) }
      : { kind: 'spinors', lambda: pick(data.lambda!), lambdaTilde: pick(data.lambdaTilde!) },
    ...(shift ? { shift: order ? shiftInOrder(shift, order) : shift } : {}),
    target: plan.target,
    arithmetic: 'float',
  }
}

/** Why a point's particles do not fit the process, or null. */
export function codeMismatch(theory: Process['theory'], codes: number[] | undefined, species?: string[]): string | null {
  if (codes && species) return speciesCodeMismatch(species, codes)
  const want = pdgOf(theory)
  if (!codes || want === null) return null
  const k = codes.findIndex(c => c !== want)
  return k < 0 ? null : `leg ${k + 1} has particle code ${codes[k]}; a ${theory} process needs code ${want} on every leg`
}

/** Checks the plan against the point set before anything is stored (422 naming the field). */
export function checkPlan(plan: BatchPlan, set: typeof tables.pointSets.$inferSelect) {
  const n = plan.process.helicities.length
  if (set.n !== n) throw fieldError(422, 'pointSetId', `the point set "${set.name}" has ${set.n} legs per point; the process has ${n}`)
  if (plan.process.order && isColourOrdered(plan.process.theory)) {
    try {
      checkOrder(plan.process.order, n)
    }
    catch (e) {
      throw fieldError(422, `graph.process.${(e as { field: string }).field}`, (e as Error).message.replace(/^[^:]*: /, ''))
    }
  }
  const sets = ((set.meta ?? {}) as { codeSets?: { codes: number[] }[] }).codeSets
  if (sets && sets.length && sets.every(s => codeMismatch(plan.process.theory, s.codes, plan.process.species))) {
    throw fieldError(422, 'pointSetId', `no point of "${set.name}" fits a ${plan.process.theory} process: ${codeMismatch(plan.process.theory, sets[0]!.codes, plan.process.species)}`)
  }
}

/** Overall verdict of a batch: the first verdict that occurs in this order. */
const OVERALL: Verdict[] = ['disagrees', 'boundary term suspected', 'agrees', 'singular point', 'not evaluated']

export async function batchSummary(checkId: number): Promise<BatchCheckSummary> {
  const db = useDB()
  const cp = tables.checkPoints
  const counts = zeroCounts()
  const rows = await db.select({ verdict: cp.verdict, c: count() }).from(cp).where(eq(cp.checkId, checkId)).groupBy(cp.verdict)
  for (const r of rows) counts[r.verdict as Verdict] = (counts[r.verdict as Verdict] ?? 0) + r.c
  const withDev = and(eq(cp.checkId, checkId), isNotNull(cp.deviation))
  const m = (await db.select({ c: count() }).from(cp).where(withDev).get())?.c ?? 0
  let median: number | null = null
  if (m) {
    const mid = await db.select({ d: cp.deviation }).from(cp).where(withDev).orderBy(asc(cp.deviation)).limit(m % 2 ? 1 : 2).offset(Math.floor((m - 1) / 2))
    median = mid.reduce((a, r) => a + r.d!, 0) / mid.length
  }
  const worstRow = m ? await db.select({ idx: cp.idx, d: cp.deviation, minInvariant: cp.minInvariant }).from(cp).where(withDev).orderBy(desc(cp.deviation)).limit(1).get() : undefined
  const minInv = await db.select({ lo: sql<number | null>`min(${cp.minInvariant})` }).from(cp).where(eq(cp.checkId, checkId)).get()
  return {
    counts,
    evaluated: m,
    median,
    worst: worstRow ? { idx: worstRow.idx, deviation: worstRow.d, minInvariant: worstRow.minInvariant } : null,
    smallestMinInvariant: minInv?.lo ?? null,
    verdict: OVERALL.find(v => counts[v] > 0) ?? null,
  }
}

function progressOf(row: CheckRow, l?: Live): BatchProgress {
  const elapsedMs = l?.startedAt ? performance.now() - l.startedAt : row.durationMs
  const rate = elapsedMs && row.done ? row.done / (elapsedMs / 1000) : null
  const counts = l?.counts ?? row.summary?.counts ?? zeroCounts()
  return {
    id: row.id,
    status: row.status,
    done: row.done,
    total: row.total,
    rate: rate === null ? null : Math.round(rate * 10) / 10,
    etaSeconds: rate && !TERMINAL.has(row.status) ? Math.round(((row.total - row.done) / rate) * 10) / 10 : TERMINAL.has(row.status) ? 0 : null,
    elapsedMs: elapsedMs === null || elapsedMs === undefined ? null : Math.round(elapsedMs),
    counts,
    ...(row.summary?.message ? { message: row.summary.message } : {}),
  }
}

/** When this server process started: a batch created since then has its runner here. */
const PROCESS_STARTED = Date.now()

/**
 * A batch left queued or running by a previous server process is marked failed on first sight.
 * Only rows created before this process started qualify (created_at has whole seconds), so a
 * row read just before its runner here finished is never mistaken for one.
 */
async function settleOrphan(row: CheckRow): Promise<CheckRow> {
  if (row.kind !== 'batch' || TERMINAL.has(row.status) || live.has(row.id)) return row
  if (new Date(row.createdAt).getTime() >= PROCESS_STARTED - 1000) {
    return (await useDB().select().from(tables.checks).where(eq(tables.checks.id, row.id)).get()) ?? row
  }
  const summary = { ...(await batchSummary(row.id)), message: `interrupted: the server restarted while the batch ran; ${row.done} of ${row.total} points were stored` }
  const updated = await useDB().update(tables.checks).set({ status: 'failed', summary, verdict: summary.verdict })
    .where(and(eq(tables.checks.id, row.id), inArray(tables.checks.status, ['queued', 'running']))).returning().get()
  return updated ?? (await useDB().select().from(tables.checks).where(eq(tables.checks.id, row.id)).get()) ?? row
}

/** At start-up: every batch a previous process left queued or running is marked interrupted. */
export async function settleOrphanBatches(): Promise<number> {
  const rows = await useDB().select().from(tables.checks)
    .where(and(eq(tables.checks.kind, 'batch'), inArray(tables.checks.status, ['queued', 'running'])))
  for (const row of rows) await settleOrphan(row)
  return rows.length
}

export async function batchView(row: CheckRow) {
  const r = await settleOrphan(row)
  const l = live.get(r.id)
  return {
    id: r.id,
    projectId: r.projectId,
    diagramId: r.diagramId,
    diagramVersion: r.diagramVersion,
    pointSetId: r.pointSetId,
    kind: r.kind,
    status: r.status,
    done: r.done,
    total: r.total,
    verdict: r.verdict,
    summary: r.summary,
    request: r.request,
    engineVersion: r.engineVersion,
    arithmetic: r.arithmetic,
    durationMs: r.durationMs,
    createdBy: r.createdBy,
    createdAt: r.createdAt,
    progress: progressOf(r, l),
  }
}

export async function batchProgress(checkId: number): Promise<BatchProgress | null> {
  const row = await useDB().select().from(tables.checks).where(eq(tables.checks.id, checkId)).get()
  if (!row) return null
  const r = await settleOrphan(row)
  return progressOf(r, live.get(checkId))
}

export function isTerminal(status: string) {
  return TERMINAL.has(status)
}

/** Subscribes to a batch's progress; returns the unsubscribe function. */
export function onBatchProgress(checkId: number, fn: (p: BatchProgress) => void) {
  const key = `p${checkId}`
  bus.on(key, fn)
  return () => bus.off(key, fn)
}

function emit(p: BatchProgress) {
  bus.emit(`p${p.id}`, p)
}

/** Creates the batch check row and starts (or queues) its run. */
export async function startBatch(input: {
  projectId: number
  diagram: typeof tables.diagrams.$inferSelect
  pointSet: typeof tables.pointSets.$inferSelect
  plan: BatchPlan
  userId: number
}) {
  const { plan, pointSet } = input
  const row = await useDB().insert(tables.checks).values({
    projectId: input.projectId,
    diagramId: input.diagram.id,
    diagramVersion: input.diagram.version,
    pointSetId: pointSet.id,
    kind: 'batch',
    status: 'queued',
    request: {
      kind: 'batch',
      pointSetId: pointSet.id,
      pointSetName: pointSet.name,
      process: plan.process,
      target: plan.target,
      ...(plan.shift ? { shift: plan.shift } : {}),
      arithmetic: 'float',
      chunk: BATCH_CHUNK,
    },
    engineVersion: ENGINE_VERSION,
    arithmetic: 'float',
    seed: pointSet.seed,
    done: 0,
    total: pointSet.count,
    createdBy: input.userId,
  }).returning().get()
  const l: Live = { controller: new AbortController(), pointSetId: pointSet.id, startedAt: null, counts: zeroCounts(), last: null }
  // Every pool task of a chunk listens to this one signal.
  setMaxListeners(0, l.controller.signal)
  live.set(row.id, l)
  const go = () => {
    running++
    runBatch(row.id, pointSet.id, pointSet.count, plan, l)
      .catch(e => console.error('[polewright] batch runner failed', e))
      .finally(() => {
        running--
        live.delete(row.id)
        queue.shift()?.()
      })
  }
  l.go = go
  if (running < MAX_RUNNING) go()
  else queue.push(go)
  return row
}

/** Asks a running or queued batch to stop; the points already stored stay. */
export function cancelBatch(checkId: number): boolean {
  const l = live.get(checkId)
  if (!l) return false
  l.controller.abort()
  const waiting = l.go ? queue.indexOf(l.go) : -1
  if (waiting >= 0) {
    queue.splice(waiting, 1)
    l.go!()
  }
  return true
}

export function cancelBatchesOfPointSet(pointSetId: number) {
  return cancelAndWait(([, l]) => l.pointSetId === pointSetId)
}

/** Stops the given batch checks and waits (at most 5 s) until each has written its last chunk. */
export function cancelBatchesById(ids: number[]) {
  const wanted = new Set(ids)
  return cancelAndWait(([id]) => wanted.has(id))
}

async function cancelAndWait(pick: (entry: [number, Live]) => boolean) {
  const waits: Promise<void>[] = []
  for (const [id, l] of live) {
    if (!pick([id, l])) continue
    cancelBatch(id)
    waits.push(new Promise((resolve) => {
      const off = onBatchProgress(id, (p) => {
        if (TERMINAL.has(p.status)) {
          off()
          resolve()
        }
      })
      if (!live.has(id)) resolve()
    }))
  }
  await Promise.race([Promise.all(waits), new Promise(r => setTimeout(r, 5000))])
}

type CheckPointRow = typeof tables.checkPoints.$inferInsert

export function rowOf(checkId: number, idx: number, data: PointData, item: { ok: true, value: BatchValue } | { ok: false, message: string }): CheckPointRow {
  const base = { checkId, idx, minInvariant: data.minInvariant ?? null }
  if (!item.ok) return { ...base, value: null, target: null, deviation: null, verdict: 'not evaluated', message: item.message }
  const r = item.value
  // Restoring conservation at a valid point only absorbs rounding: not worth a message per point.
  const notes = r.warnings.filter(w => !w.startsWith('kinematics: exact momentum conservation restored'))
  return {
    ...base,
    value: r.value,
    target: r.target?.value ?? null,
    deviation: r.deviation,
    verdict: r.verdict,
    message: notes.length ? notes.join('; ') : null,
  }
}

async function runBatch(checkId: number, pointSetId: number, total: number, plan: BatchPlan, l: Live) {
  const db = useDB()
  const signal = l.controller.signal
  let status: 'done' | 'failed' | 'cancelled' = 'done'
  let message: string | undefined
  let done = 0
  if (signal.aborted) status = 'cancelled'
  else {
    l.startedAt = performance.now()
    await db.update(tables.checks).set({ status: 'running' }).where(eq(tables.checks.id, checkId))
    const publish = async (note?: string) => {
      const row = await db.select().from(tables.checks).where(eq(tables.checks.id, checkId)).get()
      if (row) emit(l.last = { ...progressOf(row, l), ...(note ? { message: note } : {}) })
    }
    await publish()

    // Loads and evaluates one chunk; points whose particles do not fit are not sent to the pool.
    const evalChunk = async (from: number) => {
      const pts = await pointsInRange(pointSetId, from, from + BATCH_CHUNK)
      const mismatch = pts.map(p => codeMismatch(plan.process.theory, p.data.codes, plan.process.species))
      const todo = pts.filter((_, k) => !mismatch[k])
      const items = todo.length ? await evaluateManyInPool(todo.map(p => requestFor(plan, p.data)), { signal }) : []
      let t = 0
      return pts.map((p, k) => rowOf(checkId, p.idx, p.data, mismatch[k] ? { ok: false, message: mismatch[k]! } : items[t++]!))
    }
    // With REDIS_URL the chunks go to the queue's worker processes (server/utils/queue.ts).
    if (queueEnabled()) {
      ({ status, done, message } = await runOnQueue(checkId, pointSetId, total, plan, l, publish)
        .catch(e => ({ status: 'failed' as const, done, message: `the batch stopped: ${(e as Error).message}` })))
    }
    else try {
      // Chunks evaluate ahead while earlier ones are written, in order: with BATCH_AHEAD chunks in
      // the pool the workers never wait for the request thread's reads and writes (memory stays
      // bounded by that many chunks).
      const ahead: Promise<CheckPointRow[]>[] = []
      let queued = 0
      const topUp = () => {
        while (ahead.length < BATCH_AHEAD && queued < total) {
          const p = evalChunk(queued)
          p.catch(() => {})
          ahead.push(p)
          queued += BATCH_CHUNK
        }
      }
      topUp()
      while (ahead.length) {
        const rows = await ahead.shift()!
        if (signal.aborted) {
          status = 'cancelled'
          break
        }
        // A short chunk means the set ended early (points deleted meanwhile): nothing more to read.
        if (rows.length === BATCH_CHUNK) topUp()
        else queued = total
        if (rows.length) await db.insert(tables.checkPoints).values(rows)
        done += rows.length
        for (const r of rows) l.counts[r.verdict as Verdict]++
        await db.update(tables.checks).set({ done }).where(eq(tables.checks.id, checkId))
        await publish()
      }
    }
    catch (e) {
      if (signal.aborted) status = 'cancelled'
      else {
        status = 'failed'
        message = `the batch stopped: ${(e as Error).message}`
        console.error('[polewright] batch check failed', e)
      }
    }
  }
  const summary = { ...(await batchSummary(checkId)), ...(message ? { message } : {}), ...(status === 'cancelled' ? { message: `cancelled after ${done} of ${total} points` } : {}) }
  const durationMs = l.startedAt ? Math.round((performance.now() - l.startedAt) * 1000) / 1000 : 0
  const row = await db.update(tables.checks).set({ status, done, summary, verdict: summary.verdict, durationMs })
    .where(eq(tables.checks.id, checkId)).returning().get()
  live.delete(checkId)
  // A row deleted meanwhile (its diagram or project went away) still ends the streams.
  if (row) emit(progressOf(row))
  else emit({ ...(l.last ?? { id: checkId, done, total, rate: null, etaSeconds: null, elapsedMs: null, counts: l.counts }), status: 'failed', message: 'the check was deleted while it ran' })
}

/** The point labels (names in the uploaded file) of some points of a set. */
export async function pointLabels(pointSetId: number | null, idxs: number[]) {
  const out = new Map<number, string>()
  if (pointSetId === null || !idxs.length) return out
  const rows = await useDB().select({ idx: tables.points.idx, data: tables.points.data }).from(tables.points)
    .where(and(eq(tables.points.pointSetId, pointSetId), inArray(tables.points.idx, idxs)))
  for (const r of rows) {
    const label = r.data.label
    if (label !== undefined) out.set(r.idx, label)
  }
  return out
}

/** A batch's stored points in pages of 1000 (keyset by idx), with their labels: for the exports. */
export async function* checkPointPages(checkId: number, pointSetId: number | null) {
  const cp = tables.checkPoints
  let from = 0
  for (;;) {
    const rows = await useDB().select().from(cp).where(and(eq(cp.checkId, checkId), gte(cp.idx, from))).orderBy(asc(cp.idx)).limit(1000)
    if (!rows.length) return
    const labels = await pointLabels(pointSetId, rows.map(r => r.idx))
    yield rows.map(({ checkId: _c, ...r }) => ({ ...r, label: labels.get(r.idx) ?? String(r.idx + 1) }))
    from = rows[rows.length - 1]!.idx + 1
  }
}
