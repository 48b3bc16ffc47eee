// What an evaluation worker does: one dispatcher over the engine's entry points, with every
// failure turned into a plain, structured-cloneable outcome (class identity does not survive
// postMessage). Pure: no Nitro or h3 imports, so esbuild can bundle it into the worker file and
// the server can run it in-process in `nuxt dev` when no worker file exists.
import { threadId } from 'node:worker_threads'
import { ZodError } from 'zod'
import {
  ENGINE_VERSION,
  LIMITS,
  PhysicsError,
  SingularError,
  THEORIES,
  buildPoint,
  crossShift,
  defaultShift,
  evaluate,
  falloffTable,
  floatTolerance,
  kinToWire,
  probeFalloff,
  validateProcess,
  type Field,
} from '#shared/physics/index'
import { TARGET_INFO } from '#shared/physics/targets/index'
import { checkLimit } from '#shared/physics/checks/index'
import { loopCuts } from '#shared/physics/loop/index'
import type { LimitCheckRequestInput } from '#shared/schemas/limit-checks'
import type { LoopCutRequestInput } from '#shared/schemas/loop-cuts'
import { checkOrder, effectiveOrder, inOrder, isIdentity, responseToLabels, shiftInOrder } from '#shared/physics/colour-order'
import { MAX_SPIN } from '#shared/physics/theories'
import { FORMULA_MAX_EXPONENT, FORMULA_MAX_LENGTH } from '#shared/physics/formula'
import { EvaluateRequestSchema, KinematicsSchema, zodIssuePath, type EvaluateRequestInput, type EvaluateResponse, type Kinematics } from '#shared/schemas/evaluate'
import { generatePoints } from '#shared/pointsets/generate'
import type { GenerateInput } from '#shared/pointsets/schemas'
import {
  CrossShiftRequestSchema,
  SHIFTS_MEASURE_LIMITS,
  shiftsMeasureLimit,
  ShiftsRequestSchema,
  type CrossShiftResponse,
  type ShiftRow,
  type ShiftsResponse,
} from '#shared/schemas/service'
import { checkDrawing } from '#shared/editor/drawing/evaluate'
import { checkLoopCutDrawing, type CompiledRing } from '#shared/editor/loop-cut-check'
import type { PackedGraph } from '#shared/editor/drawing/handoff'
import { checkPackedDrawing } from './drawing-cache'
import type { Process as GraphProcess } from '#shared/schemas/graph'
import type { EditorEdge, EditorNode } from '#shared/editor/types'

export type Task
  /** `json`: the response comes back as its JSON text (a string crosses postMessage far cheaper than the object, and the route sends it as is). */
  = | { kind: 'evaluate'; req: EvaluateRequestInput; order?: number[]; json?: boolean }
  /** `slim`: each value keeps only what a batch stores (BatchValue): cloning whole responses across threads cost about half as much as evaluating them. */
    | { kind: 'evaluateMany'; reqs: EvaluateRequestInput[]; slim?: boolean }
    | { kind: 'shifts'; req: unknown }
    | { kind: 'crossShift'; req: unknown }
    | { kind: 'limitCheck'; req: unknown }
    | { kind: 'loopCuts'; req: unknown }
  /** A loop-cut drawing: the process's boxes, then the drawn rings' terms (shared/editor/loop-cut-check.ts). */
    | { kind: 'loopCutDrawing'; req: unknown; rings: CompiledRing[] }
    | { kind: 'catalogue' }
    | { kind: 'generatePoints'; g: GenerateInput }
  /** A check of a diagram's drawing: the process evaluated, then the drawn terms at the same point (the graph packed by packDrawingGraph, or as objects). */
    | { kind: 'checkDrawing'; req: EvaluateRequestInput; order?: number[]; process: GraphProcess; graph: PackedGraph | { nodes: EditorNode[]; edges: EditorEdge[] } }

export interface Failure {
  ok: false
  /** 400 schema, 422 physics, 500 an engine bug (the server logs it and answers 422). */
  status: 400 | 422 | 500
  field: string
  message: string
  issues?: unknown
  stack?: string
}
export type Outcome<T = unknown> = { ok: true; value: T; thread: number; ms?: number } | Failure

export function failureOf(e: unknown): Failure {
  if (e instanceof PhysicsError) return { ok: false, status: 422, field: e.field, message: e.message }
  if (e instanceof ZodError) {
    const issue = e.issues[0]
    const field = issue ? zodIssuePath(issue) || 'body' : 'body'
    return { ok: false, status: 400, field, message: `${field}: ${issue?.message ?? 'is invalid'}`, issues: JSON.parse(JSON.stringify(e.issues)) }
  }
  if (e instanceof SingularError) return { ok: false, status: 422, field: 'kinematics', message: `kinematics: singular point: ${e.what}` }
  const err = e instanceof Error ? e : new Error(String(e))
  return { ok: false, status: 500, field: 'engine', message: `${err.name}: ${err.message}`, stack: err.stack }
}

export function runTask(task: Task): Outcome {
  try {
    const value = dispatch(task)
    if (task.kind === 'evaluate' && task.json) return { ok: true, value: JSON.stringify(value), thread: threadId, ms: (value as EvaluateResponse).ms }
    return { ok: true, value, thread: threadId }
  }
  catch (e) {
    return failureOf(e)
  }
}

function dispatch(task: Task): unknown {
  switch (task.kind) {
    case 'evaluate':
      return task.order ? evaluateInOrder(task.req, task.order) : evaluate(task.req)
    case 'evaluateMany':
      // One failing point does not fail the batch: each item is its own outcome.
      return task.reqs.map((req) => {
        const o = runTask({ kind: 'evaluate', req })
        return o.ok && task.slim ? { ...o, value: slimValue(o.value as EvaluateResponse) } : o
      })
    case 'shifts':
      return shifts(task.req)
    case 'crossShift':
      return crossShiftTask(task.req)
    case 'limitCheck':
      return checkLimit(task.req as LimitCheckRequestInput)
    case 'loopCuts':
      return loopCuts(task.req as LoopCutRequestInput)
    case 'loopCutDrawing':
      return checkLoopCutDrawing(task.req as LoopCutRequestInput, task.rings)
    case 'catalogue':
      return catalogue()
    case 'generatePoints':
      return [...generatePoints(task.g)]
    case 'checkDrawing': {
      const t0 = performance.now()
      const res = task.order ? evaluateInOrder(task.req, task.order) : evaluate(task.req)
      // A packed graph is compiled once per drawing and process (drawing-cache.ts): a check run again skips it.
      const out = 'nums' in task.graph ? checkPackedDrawing(res, task.process, task.graph) : checkDrawing(res, task.process, task.graph)
      // A fresh object: set its time rather than copy it.
      out.ms = round3(performance.now() - t0)
      return out
    }
  }
}

/** What a batch stores of one evaluation (server/utils/batch.ts rowOf). */
export type BatchValue = Pick<EvaluateResponse, 'value' | 'deviation' | 'verdict' | 'warnings'> & { target: { value: EvaluateResponse['value'] | null } | null }
function slimValue(r: EvaluateResponse): BatchValue {
  return { value: r.value, deviation: r.deviation, verdict: r.verdict, warnings: r.warnings, target: r.target ? { value: r.target.value } : null }
}

const round3 = (ms: number) => Math.round(ms * 1000) / 1000

// ---------------------------------------------------------------------------------------------
// Colour order. A diagram's process may name a colour order σ (leg labels); the engine takes legs
// in the order given, so the request is rewritten into σ's order (helicities, the point, the
// shift) and the answer is mapped back to the diagram's labels. A seeded point belongs to the
// labels 1..n: leg σ_k keeps the momentum it has in the natural order.

function permuteKinematics(kin: Kinematics, order: number[], n: number, arithmetic: 'float' | 'exact'): { kin: Kinematics; seeded: boolean } {
  const pick = <T>(xs: readonly T[]): T[] => inOrder(xs, order)
  switch (kin.kind) {
    case 'spinors':
    case 'exact-spinors':
      if (kin.lambda.length !== n || kin.lambdaTilde.length !== n) return { kin, seeded: false } // the engine names the length error
      return { kin: { ...kin, lambda: pick<unknown>(kin.lambda), lambdaTilde: pick<unknown>(kin.lambdaTilde) } as Kinematics, seeded: false }
    case 'momenta':
      if (kin.momenta.length !== n) return { kin, seeded: false }
      return { kin: { kind: 'momenta', momenta: pick(kin.momenta) }, seeded: false }
    case 'rational': {
      // Built exactly (in any arithmetic), so the float evaluation sees the same rational point.
      const pt = buildPoint(kin, n, 'exact')
      const w = kinToWire(pt.F as Field<unknown>, pt.kin as never)
      return { kin: { kind: 'exact-spinors', lambda: pick(w.lambda), lambdaTilde: pick(w.lambdaTilde) } as Kinematics, seeded: true }
    }
    default: {
      const pt = buildPoint(kin, n, arithmetic)
      const w = kinToWire(pt.F as Field<unknown>, pt.kin as never)
      return { kin: { kind: 'spinors', lambda: pick(w.lambda), lambdaTilde: pick(w.lambdaTilde) } as Kinematics, seeded: true }
    }
  }
}

/** Evaluates a request whose labels 1..n are taken in the colour order `order`. */
export function evaluateInOrder(input: EvaluateRequestInput, order: number[]): EvaluateResponse {
  const req = EvaluateRequestSchema.parse(input)
  const n = req.helicities.length
  if (!effectiveOrder(req.theory, order)) {
    const res = evaluate(req)
    if (!isIdentity(order)) res.warnings.unshift(`order: ignored, ${req.theory === 'spin' ? `spin ${req.spin}` : req.theory} amplitudes carry no colour order`)
    return res
  }
  checkOrder(order, n)
  const { kin, seeded } = permuteKinematics(req.kinematics, order, n, req.arithmetic)
  const res = evaluate({
    ...req,
    helicities: inOrder(req.helicities, order),
    ...(req.species ? { species: inOrder(req.species, order) } : {}),
    kinematics: kin,
    shift: req.shift ? shiftInOrder(req.shift as [number, number], order) : undefined,
  })
  // Re-solving the last two square spinors of a seeded point only absorbs rounding: not news.
  const warnings = res.warnings.filter((w) => !(seeded && w.startsWith('kinematics: exact momentum conservation restored')))
  warnings.unshift(`order: evaluated in the colour order (${order.join(', ')}); legs in the warnings below are numbered by their position in that order`)
  return { ...responseToLabels(res, order), warnings }
}

// ---------------------------------------------------------------------------------------------
// The shift table and the cross-shift check.

function shifts(input: unknown): ShiftsResponse {
  const t0 = performance.now()
  const req = ShiftsRequestSchema.parse(input)
  const { process: p } = validateProcess(req.theory, req.helicities, 'float', req.spin, req.species)
  const n = req.helicities.length
  const table = falloffTable(req.theory, req.helicities, req.spin, req.species)
  const needsProbe = req.measure || table.some((r) => r.exponent === null)
  const limit = shiftsMeasureLimit(req.theory)
  if (needsProbe && n > limit)
    throw new PhysicsError('helicities', `${n} legs exceed the limit of ${limit} for measuring the falloff of every shift exactly (${req.theory})`)
  const rows: ShiftRow[] = table.map((r) => {
    if (!req.measure && r.exponent !== null) return { shift: r.shift, exponent: r.exponent, valid: r.valid, source: 'table' }
    const f = probeFalloff(p, req.helicities, r.shift[0] - 1, r.shift[1] - 1)
    return { shift: r.shift, exponent: f.exponent, valid: f.valid, source: f.measured ? 'measured' : 'table' }
  })
  const d = defaultShift(p, req.helicities)
  return {
    theory: req.theory,
    ...(req.theory === 'spin' ? { spin: req.spin } : {}),
    n,
    helicities: req.helicities,
    ...(req.species ? { species: req.species } : {}),
    defaultShift: [d[0] + 1, d[1] + 1],
    rows,
    ms: round3(performance.now() - t0),
  }
}

function crossShiftTask(input: unknown): CrossShiftResponse {
  const t0 = performance.now()
  const req = CrossShiftRequestSchema.parse(input)
  const { process: p, warnings } = validateProcess(req.theory, req.helicities, req.arithmetic, req.spin, req.species)
  const n = req.helicities.length
  const kin: Kinematics = req.kinematics ?? (req.arithmetic === 'exact' ? { kind: 'rational', seed: 1 } : { kind: 'random', seed: 1 })
  const pt = buildPoint(kin, n, req.arithmetic)
  warnings.push(...pt.warnings)
  const F = pt.F as Field<unknown>
  const tolerance = req.arithmetic === 'float' ? floatTolerance(n) : null
  const r = crossShift(F, p, pt.kin as never, req.helicities, tolerance ?? undefined)
  const singular = r.rows.filter((row) => row.value === null).map((row) => `[${row.shift[0]}, ${row.shift[1]}⟩`)
  if (singular.length) warnings.push(`singular point for the shifts ${singular.join(', ')}: a pole or bracket vanishes at this point`)
  if (r.test === 'factorisation')
    warnings.push('every shift of a single scalar species has a boundary term, so consistency was decided by the residues of the sum of all cubic diagrams on every pole')
  return {
    theory: req.theory,
    ...(req.theory === 'spin' ? { spin: req.spin } : {}),
    n,
    arithmetic: req.arithmetic,
    rows: r.rows.map((row) => ({ shift: row.shift, valid: row.valid, value: row.value === null ? null : (F.toWire(row.value) as [number, number]) })),
    spread: r.spread,
    agree: r.agree,
    test: r.test,
    ...(r.poles ? { poles: r.poles } : {}),
    tolerance,
    kinematics: kinToWire(F, pt.kin as never),
    warnings,
    ms: round3(performance.now() - t0),
  }
}

// ---------------------------------------------------------------------------------------------
// The catalogue: everything a page or script needs to know about what the engine offers.

const KINEMATICS_INFO: Record<Kinematics['kind'], { description: string; arithmetic: ('float' | 'exact')[]; fields: string[] }> = {
  'spinors': { description: 'Per leg a 2-spinor of complex numbers [re, im] for λ and for λ̃; conservation checked to 1e-8, then restored exactly.', arithmetic: ['float'], fields: ['lambda', 'lambdaTilde'] },
  'exact-spinors': { description: 'Per leg a real 2-spinor of exact rationals ("p/q" strings) for λ and for λ̃ (split signature); conservation must hold exactly.', arithmetic: ['float', 'exact'], fields: ['lambda', 'lambdaTilde'] },
  'momenta': { description: 'Per leg a real momentum [E, px, py, pz], all outgoing; massless and conserving to 1e-8 of the largest energy.', arithmetic: ['float'], fields: ['momenta'] },
  'random': { description: 'A seeded complex point, drawn until well-conditioned (min |s_S| ≥ 1e-3 of max |s_ij|).', arithmetic: ['float'], fields: ['seed'] },
  'rational': { description: 'A seeded exact rational point (real, split signature), drawn until well-conditioned.', arithmetic: ['float', 'exact'], fields: ['seed'] },
  'physical': { description: 'A seeded physical point by RAMBO: legs 1 and 2 incoming along ±z with total energy √s = energy (default 1), crossed to all-outgoing.', arithmetic: ['float'], fields: ['seed', 'energy'] },
}

const FORMULA_SYNTAX = [
  { form: '<1 2>', meaning: 'angle bracket ⟨12⟩ (also <12> and <1,2> for n ≤ 9)' },
  { form: '[1 2]', meaning: 'square bracket [12]' },
  { form: 's(1,2,3)', meaning: 'Mandelstam invariant (p₁ + p₂ + p₃)² (also s(123) for n ≤ 9)' },
  { form: '<1|2+3|4]', meaning: 'sandwich ⟨1|(p₂ + p₃)|4] (also written [4|2+3|1>)' },
  { form: '+ - * / ^', meaning: 'arithmetic; ^ takes integer exponents' },
  { form: '( )', meaning: 'grouping' },
  { form: '2, 1/3, 0.5', meaning: 'numbers (decimals are exact rationals in exact mode)' },
]

export const VERDICTS = [
  { name: 'singular point', rule: 'a pole of the shift or a bracket the evaluation divides by vanishes at this point' },
  { name: 'not evaluated', rule: 'the target is "none"' },
  { name: 'boundary term suspected', rule: 'the shift is invalid by the table of valid shifts, or a probed falloff exponent is ≥ 0' },
  { name: 'agrees', rule: 'deviation within the float tolerance, exact equality in exact arithmetic' },
  { name: 'disagrees', rule: 'otherwise' },
]

function catalogue() {
  const theories = Object.values(THEORIES).map((t) => {
    const s = t.species[0]!.spin
    return {
      name: t.name,
      label: t.label,
      colourOrdered: t.colourOrdered,
      species: t.species,
      helicities: s === null ? null : s === 0 ? [0] : [-s, s],
      helicityRule: t.helicityRule,
      needsSpin: t.needsSpin,
      ...(t.needsSpin ? { maxSpin: MAX_SPIN } : {}),
      minLegs: t.minLegs,
      limits: { float: t.limits.float, exact: t.limits.exact },
      targets: [...TARGET_INFO.filter((x) => x.theories.includes(t.name)).map((x) => x.name), 'formula', 'none'],
      ...(t.name === 'spin' ? { targetsNote: 'hodges and klt apply to spin 2 only; for any other s, auto means none' } : {}),
    }
  })
  return {
    engine: { version: ENGINE_VERSION },
    theories,
    targets: [
      { name: 'auto', label: 'automatic', theories: Object.keys(THEORIES), description: 'The best independent target for the theory and helicities (none for spin s ≠ 2).', source: '' },
      ...TARGET_INFO,
      { name: 'formula', label: 'your formula', theories: Object.keys(THEORIES), description: 'An expression in bracket notation, sent as { "formula": "…" }.', source: '' },
      { name: 'none', label: 'none', theories: Object.keys(THEORIES), description: 'No comparison; the verdict is "not evaluated".', source: '' },
    ],
    limits: LIMITS,
    kinematics: KinematicsSchema.options.map((o) => ({ kind: o.shape.kind.value, ...KINEMATICS_INFO[o.shape.kind.value] })),
    arithmetics: [
      { name: 'float' as const, description: 'complex doubles; agreement within a relative tolerance', tolerance: Object.fromEntries(Array.from({ length: 9 }, (_, k) => [k + 4, floatTolerance(k + 4)])) },
      { name: 'exact' as const, description: 'exact rationals; agreement means equality', tolerance: null },
    ],
    verdicts: VERDICTS,
    formula: { syntax: FORMULA_SYNTAX, maxLength: FORMULA_MAX_LENGTH, maxExponent: FORMULA_MAX_EXPONENT, example: '<1 2>^4/(<1 2><2 3><3 4><4 5><5 1>)' },
    shifts: {
      notation: '[i,j⟩: λ̃_i → λ̃_i + z λ̃_j, λ_j → λ_j − z λ_i',
      defaultRule: 'gluons, gravitons and spin s: [i, i+1⟩ with i the first negative-helicity leg ([1,2⟩ with none); cubic scalar: [1,3⟩',
      measureLimits: SHIFTS_MEASURE_LIMITS,
    },
  }
}

export type Catalogue = ReturnType<typeof catalogue>
