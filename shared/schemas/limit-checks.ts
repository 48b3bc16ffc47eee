// POST /api/limit-checks: the soft, collinear and identity checks of a process (the engine's
// checkLimit). Labels are 1-based as everywhere in the API.
import { z } from 'zod'

const seed = z.union([z.number().int(), z.string().min(1).max(200)])
const helicities = z.array(z.number()).min(1).max(64)
const path = z.array(z.number().positive().max(0.5)).min(2).max(16).optional()

export const LimitCheckRequestSchema = z.discriminatedUnion('check', [
  z.object({
    check: z.literal('soft'),
    theory: z.enum(['gluon', 'graviton']),
    helicities,
    /** The leg made soft (1-based). */
    soft: z.number().int(),
    /** 'subleading' adds the Cachazo–Strominger factor S⁽¹⁾ (gravitons only; ratio − 1 ~ ε²). */
    order: z.enum(['leading', 'subleading']).default('leading'),
    seed: seed.optional(),
    /** ε values (default 10⁻¹ … 10⁻⁸). */
    path,
  }),
  z.object({
    check: z.literal('collinear'),
    theory: z.literal('gluon'),
    helicities,
    /** The first of the two adjacent legs made collinear (1-based; the second is the next one, cyclically). */
    leg: z.number().int(),
    z: z.number().gt(0).lt(1).default(0.3),
    seed: seed.optional(),
    path,
  }),
  z.object({
    check: z.literal('identity'),
    theory: z.literal('gluon'),
    helicities,
    identity: z.enum(['cyclicity', 'reflection', 'u1-decoupling', 'kleiss-kuijf', 'bcj']),
    /** Kleiss–Kuijf: the legs of α (1-based, from 2..n−1); default the first half. */
    alpha: z.array(z.number().int()).max(64).optional(),
    arithmetic: z.enum(['float', 'exact']).default('float'),
    seed: seed.optional(),
  }),
])

export type LimitCheckRequest = z.output<typeof LimitCheckRequestSchema>
export type LimitCheckRequestInput = z.input<typeof LimitCheckRequestSchema>

export interface LimitPathResponse {
  check: 'soft' | 'collinear'
  theory: string
  n: number
  helicities: number[]
  /** Soft: [s]; collinear: [a, b]. */
  legs: number[]
  /** Soft: the order of the soft factor. */
  order?: 'leading' | 'subleading'
  /** The ratio A_n / (factor × A_{n−1}) along the path, with |ratio − 1|. */
  rows: { x: number; ratio: [number, number]; deviation: number }[]
  rate: number | null
  expectedRate: number
  holds: boolean
  factor: string
  source: string
  ms: number
}

export interface IdentityResponse {
  check: 'identity'
  theory: string
  n: number
  helicities: number[]
  identity: string
  arithmetic: 'float' | 'exact'
  relation: string
  terms: { order: number[]; coefficient: [number, number] | [string, string]; value: [number, number] | [string, string] }[]
  sum: [number, number] | [string, string]
  residual: number
  tolerance: number | null
  holds: boolean
  source: string
  ms: number
}

export type LimitCheckResponse = LimitPathResponse | IdentityResponse
