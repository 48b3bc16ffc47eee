// The editor's limit and identity panel, framework-free: which checks apply to the canvas's process,
// the request bodies of POST /api/limit-checks, and the verdict of an answer spelled out with its
// numbers and thresholds (the same thresholds the engine judged with). Positions are colour-order
// positions; labels are the diagram's leg labels.
import { LAST_MAX, RATE_SLACK } from '../physics/checks/soft'
import type { IdentityResponse, LimitCheckRequestInput, LimitPathResponse } from '../schemas/limit-checks'
import type { Process } from '../schemas/graph'
import { inOrder } from '../physics/colour-order'
import { orderOf } from './process'

export const IDENTITY_CHECKS = [
  { id: 'kleiss-kuijf', label: 'Kleiss–Kuijf' },
  { id: 'bcj', label: 'BCJ' },
  { id: 'u1-decoupling', label: 'photon decoupling' },
  { id: 'reflection', label: 'reflection' },
  { id: 'cyclicity', label: 'cyclicity' },
] as const
export type IdentityId = typeof IDENTITY_CHECKS[number]['id']

export interface LimitPlan {
  n: number
  theory: Process['theory']
  /** Helicities in colour order (position 1..n). */
  helicities: number[]
  /** The diagram's label of a position (1-based). */
  label: (pos: number) => number
  soft: boolean
  subleading: boolean
  collinear: boolean
  identities: boolean
  /** Why nothing applies (null when something does). */
  why: string | null
}

export function limitPlan(p: Process | undefined): LimitPlan | null {
  if (!p) return null
  const order = orderOf(p)
  const n = p.helicities.length
  const gluon = p.theory === 'gluon'
  const soft = (gluon || p.theory === 'graviton') && n >= 5
  const collinear = gluon && n >= 5
  const identities = gluon && n >= 4
  const why = !gluon && p.theory !== 'graviton'
    ? `the limit and identity checks apply to gluons and gravitons, not ${p.theory}`
    : !soft && !identities ? 'the soft check needs n ≥ 5 (A_{n−1} with at least four legs)' : null
  return { n, theory: p.theory, helicities: inOrder(p.helicities, order), label: pos => order[pos - 1] ?? pos, soft, subleading: soft && !gluon, collinear, identities, why }
}

export function softBody(plan: LimitPlan, pos: number, order: 'leading' | 'subleading'): LimitCheckRequestInput {
  return { check: 'soft', theory: plan.theory as 'gluon' | 'graviton', helicities: plan.helicities, soft: pos, order }
}
export function collinearBody(plan: LimitPlan, pos: number, z: number): LimitCheckRequestInput {
  return { check: 'collinear', theory: 'gluon', helicities: plan.helicities, leg: pos, z }
}
export function identityBody(plan: LimitPlan, identity: IdentityId, arithmetic: 'float' | 'exact'): LimitCheckRequestInput {
  return { check: 'identity', theory: 'gluon', helicities: plan.helicities, identity, arithmetic }
}

const e = (x: number) => x.toExponential(1)

/** The verdict of a soft or collinear path with its arithmetic. */
export function pathVerdict(r: LimitPathResponse): string {
  const last = r.rows[r.rows.length - 1]!
  const lastText = `last |ratio − 1| = ${e(last.deviation)} at ${r.check === 'soft' ? 'ε' : 'δ'} = ${e(last.x)} (must be < ${e(LAST_MAX)})`
  const rateText = r.rate === null
    ? '|ratio − 1| stays at rounding level, so no rate is fitted'
    : `fitted rate ${r.rate.toFixed(3)} (expected ${r.expectedRate}; must be > ${(r.expectedRate - RATE_SLACK).toFixed(2)})`
  return `${rateText}; ${lastText} → ${r.holds ? 'holds' : 'fails'}`
}

/** The verdict of an identity with its arithmetic. */
export function identityVerdict(r: IdentityResponse): string {
  if (r.arithmetic === 'exact' || r.tolerance === null)
    return `Σ = ${r.sum[0]} + ${r.sum[1]}i in exact rationals (must be exactly 0) → ${r.holds ? 'holds' : 'fails'}`
  return `residual |Σ| / max |term| = ${e(r.residual)} (must be ≤ tolerance ${e(r.tolerance)}) → ${r.holds ? 'holds' : 'fails'}`
}
