// POST /api/loop-cuts: the box coefficients of a one-loop colour-ordered gluon amplitude by
// quadruple cuts (the engine's loopCuts). Labels are 1-based as everywhere in the API.
import { z } from 'zod'
import { KinematicsSchema } from './evaluate'

/** Legs of a loop-cut request: at least 4 (one box), at most 8 (70 boxes). */
export const LOOP_CUT_MAX_LEGS = 8

export const LoopCutRequestSchema = z.object({
  theory: z.literal('gluon').default('gluon'),
  /** Gluon helicities ±1 in colour order; 4..8 legs (bounds checked with 422 and the limit). */
  helicities: z.array(z.number()).min(1).max(64),
  arithmetic: z.enum(['float', 'exact']).default('float'),
  /** Default: a seeded complex point (float) or a seeded rational point (exact), seed 1. */
  kinematics: KinematicsSchema.optional(),
  /** How corners with four or more legs are evaluated: Parke–Taylor where it applies (else BCFW), BCFW, or Berends–Giele. */
  corners: z.enum(['closed', 'bcfw', 'berends-giele']).default('closed'),
  /** 'n4-mhv': compare with the N = 4 MHV box coefficients and (states n4) the infrared conditions; 'none': no comparison. */
  target: z.enum(['n4-mhv', 'none']).default('n4-mhv'),
  /** What crosses the cut lines: 'n4' the N = 4 multiplet (gluons, four gluinos, six scalars), 'gluons' gluons only. */
  states: z.enum(['n4', 'gluons']).default('n4'),
})

export type LoopCutRequest = z.output<typeof LoopCutRequestSchema>
export type LoopCutRequestInput = z.input<typeof LoopCutRequestSchema>

type Wire = [number, number] | [string, string]

export interface LoopCutBox {
  /** Per corner its external legs (1-based), in colour order. */
  corners: number[][]
  kind: 'zero-mass' | 'one-mass' | 'two-mass-easy' | 'two-mass-hard' | 'three-mass' | 'four-mass'
  solutions: {
    /** Per corner the surviving three-point vertex ('angle' or 'square'), null for a massive corner. */
    threePoint: ('angle' | 'square' | null)[]
    /** max_k |ℓ_k²| / |ℓ_k|²: exactly 0 in exact arithmetic. */
    onShell: number
    /** ℓ_1 as its bispinor entries [L00, L01, L10, L11] (docs/conventions.md "Momenta and spinors"). */
    loopMomentum: Wire[]
    /** 'gluons': only gluons can cross the cut in N = 4 (SU(4) counting); 'multiplet': fermions and scalars too. */
    states: 'gluons' | 'multiplet'
  }[]
  /** What was summed on the cut lines, in words ('N = 4 multiplet: …' or 'gluons only: … because …'). */
  states: string
  /**
   * The non-zero products of corner amplitudes: solution (1 or 2), h_1..h_4 of the lines (±1
   * gluons, ±½ gluinos, 0 scalars), value; multiplicity: SU(4) assignments summed in the value.
   */
  terms: { solution: number; helicities: number[]; multiplicity: number; value: Wire }[]
  /** ½ Σ terms; null where the cut is singular or not exact. */
  value: Wire | null
  target: Wire | null
  /** The target's formula in words, e.g. '−½ (st − P²Q²) A_tree'. */
  targetRule: string | null
  deviation: number | null
  verdict: 'singular point' | 'not evaluated' | 'agrees' | 'disagrees'
  note?: string
}

export interface LoopCutResponse {
  theory: 'gluon'
  n: number
  helicities: number[]
  arithmetic: 'float' | 'exact'
  corners: 'closed' | 'bcfw' | 'berends-giele'
  tree: Wire
  boxes: LoopCutBox[]
  /** Σ of the box values and of the targets, over the boxes that have both. */
  sum: Wire | null
  targetSum: Wire | null
  counts: Record<'agrees' | 'disagrees' | 'not evaluated' | 'singular point', number>
  /** The states summed on the cut lines ('n4' or 'gluons'). */
  states: 'n4' | 'gluons'
  /**
   * The N = 4 infrared conditions on the box coefficients (1/ε² and one per independent invariant),
   * null unless every box was summed over the multiplet.
   */
  infrared: {
    rows: { invariant: string; value: Wire; target: Wire; deviation: number; verdict: 'agrees' | 'disagrees' }[]
    verdict: 'agrees' | 'disagrees'
    note: string
  } | null
  verdict: 'singular point' | 'not evaluated' | 'agrees' | 'disagrees'
  tolerance: number | null
  source: string
  warnings: string[]
  ms: number
}
