// Request bodies of the evaluation service's routes beside POST /api/evaluate (whose body is
// EvaluateRequestSchema): stored checks, the shift table and the cross-shift check. Used by the
// routes, the pages and the API docs page.
import { z } from 'zod'
import { EvaluateRequestSchema, KinematicsSchema, TheoryEnum, type EvaluateRequest, type EvaluateRequestInput, type EvaluateResponse, type Verdict, type WireComplex } from './evaluate'
import { MEASURE_LIMITS, type TheoryName } from '../physics/theories'
import { GraphSchema, type Process } from './graph'

/**
 * The largest n for which every shift's falloff is measured exactly (`measure: true`; the theory
 * registry's `limits.measure`): n(n−1) shifts × probe points × an exact recursion each; above
 * these it takes longer than a request's time budget on two cores.
 */
export const SHIFTS_MEASURE_LIMITS = MEASURE_LIMITS

export function shiftsMeasureLimit(theory: TheoryName): number {
  return SHIFTS_MEASURE_LIMITS[theory]
}

export const ProcessRequestSchema = z.object({
  theory: TheoryEnum,
  spin: z.number().optional(),
  helicities: z.array(z.number()).min(1).max(64),
  /** Several species (theory qcd), one name per leg as in POST /api/evaluate; checked by the engine (422). */
  species: z.array(z.string().max(16)).max(64).optional(),
})

/** POST /api/shifts: every [i,j⟩ shift with its falloff exponent and validity. */
export const ShiftsRequestSchema = ProcessRequestSchema.extend({
  /** true: measure every exponent exactly (n ≤ SHIFTS_MEASURE_LIMITS[theory]); false: the falloff table of docs/conventions.md. */
  measure: z.boolean().default(false),
})

/** POST /api/cross-shift: the same amplitude under every [i,j⟩ shift at one point. */
export const CrossShiftRequestSchema = ProcessRequestSchema.extend({
  kinematics: KinematicsSchema.optional(),
  arithmetic: z.enum(['float', 'exact']).default('float'),
})

/** POST /api/diagrams/:id/checks: the point and options; the process comes from the diagram. */
export const CheckRunSchema = EvaluateRequestSchema.pick({ kinematics: true, target: true, arithmetic: true, probeFalloff: true, tree: true })

export type ShiftsRequest = z.output<typeof ShiftsRequestSchema>
export type CrossShiftRequest = z.output<typeof CrossShiftRequestSchema>
export type CheckRun = z.output<typeof CheckRunSchema>

/**
 * A stored check's request (column checks.request): a single check's evaluation request with the
 * diagram's colour order, or a batch's plan (kind 'batch'). Partial: readers take what is there.
 */
export type CheckRequest = Partial<Omit<EvaluateRequest, 'target'>> & {
  order?: number[]
  /** 'loop-cut': a loop-cut diagram's stored check (its settings: corners, arithmetic, kinematics). */
  kind?: 'batch' | 'loop-cut'
  corners?: string
  pointSetId?: number
  pointSetName?: string
  process?: Process
  /** A tree target, or 'n4-mhv' (the box coefficients of a loop-cut check). */
  target?: EvaluateRequestInput['target'] | 'n4-mhv'
  chunk?: number
}

/** A single check's figures beside its verdict (checkSummary on the server). */
export interface SingleCheckSummary {
  theory: TheoryName
  spin?: number
  n: number
  helicities: number[]
  order?: number[]
  shift: [number, number]
  target: string | null
  kinematics: EvaluateRequest['kinematics']['kind']
  seed?: number | string
  value: WireComplex | null
  deviation: number | null
  falloff: EvaluateResponse['falloff']
  warnings: number
  engineMs: number
  drawing?: { terms: number, complete: boolean, message?: string }
}

/** A batch's tally over its stored points (batchSummary on the server). */
export interface BatchCheckSummary {
  counts: Record<Verdict, number>
  evaluated: number
  median: number | null
  worst: { idx: number, deviation: number | null, minInvariant: number | null } | null
  smallestMinInvariant: number | null
  verdict: Verdict | null
  message?: string
}

/** A loop-cut diagram's check (loopCutCheckColumns on the server), beside the single-check fields. */
export interface LoopCutCheckSummary {
  kind: 'loop-cut'
  corners: string
  rings: number
  boxes: number
  missing: number
}

/** Column checks.summary: any kind's fields, each optional (a reader checks what it needs). */
export type CheckSummary = Partial<Omit<SingleCheckSummary & BatchCheckSummary, 'counts'> & LoopCutCheckSummary> & { counts?: Partial<Record<Verdict, number>> }

export interface ShiftRow {
  /** 1-based [i, j⟩. */
  shift: [number, number]
  /** The large-z exponent k of |A(z)| ~ |z|^k; null where neither the table nor a probe gives one. */
  exponent: number | null
  valid: boolean
  /** Where the exponent comes from. */
  source: 'table' | 'measured'
}

export interface ShiftsResponse {
  theory: string
  spin?: number
  n: number
  helicities: number[]
  /** Echoed when the request gave species per leg. */
  species?: string[]
  /** The shift POST /api/evaluate uses when none is given. */
  defaultShift: [number, number]
  rows: ShiftRow[]
  ms: number
}

export interface CrossShiftResponse {
  theory: string
  spin?: number
  n: number
  arithmetic: 'float' | 'exact'
  rows: { shift: [number, number]; valid: boolean; value: [number, number] | [string, string] | null }[]
  /** max |v_a − v_b| / max |v| over the valid shifts (0 with fewer than two). */
  spread: number
  /** Every valid shift gives the same value (exactly in exact arithmetic, within the float tolerance otherwise). */
  agree: boolean
  /** What decided `agree`: the valid shifts agreeing, or (no valid shift: a single scalar species) factorisation on every pole. */
  test: 'shifts' | 'factorisation'
  /** With test `factorisation`: each pole (legs of one side, 1-based) and whether its residue is A_L·A_R. */
  poles?: { pole: number[]; factorises: boolean }[]
  tolerance: number | null
  kinematics: { lambda: unknown[]; lambdaTilde: unknown[] }
  warnings: string[]
  ms: number
}

/**
 * POST /api/diagrams/:id/check-drawing: a check of the graph in the body (what a viewer has on the
 * canvas), never stored. Its process is the graph's, else the diagram's saved one.
 */
export const DrawingCheckSchema = EvaluateRequestSchema.pick({ kinematics: true, target: true, arithmetic: true }).extend({
  graph: GraphSchema,
})
export type DrawingCheck = z.output<typeof DrawingCheckSchema>
