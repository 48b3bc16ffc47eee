// The evaluation routes' glue: cheap checks before any work (limits, shift), the time budget of
// a request, cancelling when the client goes away, and pool failures as the errors of docs/api.md.
import type { H3Event } from 'h3'
import { PhysicsError } from '#shared/physics/errors'
import { checkShift, validateProcess, type TheoryName } from '#shared/physics/theories'
import { formatPath } from '#shared/schemas/common'
import type { EvaluateRequest, EvaluateResponse } from '#shared/schemas/evaluate'
import { ProcessSchema, type Process } from '#shared/schemas/graph'
import type { DrawingResult } from '#shared/editor/drawing/evaluate'
import type { SingleCheckSummary } from '#shared/schemas/service'

/**
 * The limits and the shift, checked on the request thread before anything is queued, so an
 * over-limit request is refused at once even while the pool is busy. `prefix` re-roots field
 * paths (a check names `graph.process.helicities`, not `helicities`).
 */
export function precheckProcess(p: { theory: TheoryName, spin?: number, helicities: number[], species?: string[], shift?: number[], arithmetic?: 'float' | 'exact' }, prefix = '') {
  try {
    validateProcess(p.theory, p.helicities, p.arithmetic ?? 'float', p.spin, p.species)
    if (p.shift) checkShift(p.shift as [number, number], p.helicities.length)
  }
  catch (e) {
    if (e instanceof PhysicsError) throw physicsHttpError(e, prefix)
    throw e
  }
}

export function physicsHttpError(e: PhysicsError, prefix = '') {
  if (!prefix) return createError({ statusCode: 422, statusMessage: 'Unprocessable Entity', message: e.message, data: { field: e.field } })
  return createError({ statusCode: 422, statusMessage: 'Unprocessable Entity', message: `${prefix}${e.message}`, data: { field: `${prefix}${e.field}` } })
}

/** An EvaluationError from the pool as the h3 error docs/api.md describes; other errors pass through. */
export function evaluationHttpError(e: unknown, rootFields: (field: string) => string = f => f) {
  if (!(e instanceof EvaluationError)) return e
  const field = e.field ? rootFields(e.field) : ''
  const message = e.field && field !== e.field && e.message.startsWith(e.field) ? field + e.message.slice(e.field.length) : e.message
  const statusMessage = { 400: 'Bad Request', 422: 'Unprocessable Entity', 499: 'Client Closed Request', 503: 'Service Unavailable' }[e.status] ?? 'Error'
  return createError({ statusCode: e.status, statusMessage, message, data: { field, ...(e.issues ? { issues: e.issues } : {}) } })
}

/**
 * The request's time budget: POLEWRIGHT_EVAL_BUDGET_MS, or less when the caller asks for less
 * with `?budgetMs=` (a script that would rather fail fast; it can never raise the budget).
 */
export function requestBudget(event: H3Event): number {
  const server = evaluationBudgetMs()
  const asked = Number(getQuery(event).budgetMs)
  return Number.isFinite(asked) && asked >= 1 ? Math.min(server, Math.floor(asked)) : server
}

/** Aborts when the client closes the connection before the answer is written. */
export function clientSignal(event: H3Event): AbortSignal {
  const ac = new AbortController()
  const res = event.node.res
  res.once('close', () => {
    if (!res.writableEnded) ac.abort()
  })
  return ac.signal
}

/**
 * JSON text a worker made from a T, sent on unparsed (no second parse and stringify on the request
 * thread): the route's return type is the T that a typed fetch receives.
 */
export function jsonText<T>(text: string): T
export function jsonText(text: string): unknown {
  return text
}

/** The pool options of a route: the request's budget and its cancellation. */
export function poolOptions(event: H3Event) {
  return { timeoutMs: requestBudget(event), signal: clientSignal(event) }
}

// ---------------------------------------------------------------------------------------------
// Stored checks.

/** The diagram's process, or a 422 naming `graph.process` and what is missing. */
export function diagramProcess(graph: unknown): Process {
  const raw = (graph as { process?: unknown } | null)?.process
  if (raw === undefined || raw === null) {
    throw fieldError(422, 'graph.process', 'this diagram has no process yet; save its theory and helicities (and, if you like, spin, colour order and shift) before running a check')
  }
  const parsed = ProcessSchema.safeParse(raw)
  if (!parsed.success) {
    const issue = parsed.error.issues[0]!
    const field = `graph.process${issue.path.length ? `.${formatPath(issue.path)}` : ''}`
    const missing = issue.code === 'invalid_type' && (issue as { input?: unknown }).input === undefined
    throw fieldError(422, field, missing ? 'is missing; a check needs it' : issue.message, { issues: parsed.error.issues })
  }
  return parsed.data
}

/** Fields of a check's request that come from the diagram's process (re-rooted in errors). */
const PROCESS_FIELDS = /^(theory|spin|helicities|shift|order)\b/
export const processField = (field: string) => (PROCESS_FIELDS.test(field) ? `graph.process.${field}` : field)

type CheckRow = typeof tables.checks.$inferSelect

export function checkSummary(req: EvaluateRequest, process: Process, result: EvaluateResponse & { drawing?: DrawingResult }): SingleCheckSummary {
  const kin = req.kinematics
  return {
    theory: process.theory,
    ...(process.spin !== undefined ? { spin: process.spin } : {}),
    n: process.helicities.length,
    helicities: process.helicities,
    ...(process.order ? { order: process.order } : {}),
    shift: result.shift,
    target: result.target?.name ?? null,
    kinematics: kin.kind,
    ...('seed' in kin ? { seed: kin.seed } : {}),
    value: result.value,
    deviation: result.deviation,
    falloff: result.falloff,
    warnings: result.warnings.length,
    engineMs: result.ms,
    // A check of the drawing: how many drawn terms, whether they are the whole recursion, and why not.
    ...(result.drawing ? { drawing: { terms: result.drawing.terms.length, complete: result.drawing.comparison.complete, message: result.drawing.message } } : {}),
  }
}

/** A check as the list shows it (no request or result payload). */
export function checkListView(row: Omit<CheckRow, 'request' | 'result'>, createdByName: string | null) {
  return {
    id: row.id,
    projectId: row.projectId,
    diagramId: row.diagramId,
    diagramVersion: row.diagramVersion,
    pointSetId: row.pointSetId,
    kind: row.kind,
    status: row.status,
    verdict: row.verdict,
    arithmetic: row.arithmetic,
    seed: row.seed,
    engineVersion: row.engineVersion,
    durationMs: row.durationMs,
    done: row.done,
    total: row.total,
    summary: row.summary,
    createdBy: row.createdBy,
    createdByName,
    createdAt: row.createdAt,
  }
}

/** A check in full: what was asked and what came back. */
export function checkView(row: CheckRow, createdByName: string | null) {
  return { ...checkListView(row, createdByName), request: row.request, result: row.result }
}
