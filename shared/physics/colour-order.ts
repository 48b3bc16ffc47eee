// Colour order (docs/conventions.md "Colour order"). A process may name a colour order σ as leg
// labels; the engine numbers legs 1..n in the order given, so a request is rewritten into σ's
// order (helicities, point, shift) and the answer mapped back to the labels. One copy for the
// worker, the batch runner, the editor and the page.
import { PhysicsError } from './errors'
import { isColourOrdered } from './theories'
import type { EvaluateResponse, WireTerm } from '../schemas/evaluate'

export function isIdentity(order: readonly number[]): boolean {
  return order.every((l, k) => l === k + 1)
}

/** What is wrong with an order as a permutation of 1..n (field path and message), or null. */
export function orderProblem(order: readonly number[], n: number): { field: string; message: string } | null {
  if (order.length !== n) return { field: 'order', message: `${order.length} labels given for ${n} legs` }
  const seen = new Set<number>()
  for (let k = 0; k < order.length; k++) {
    const l = order[k]!
    if (!Number.isInteger(l) || l < 1 || l > n) return { field: `order[${k}]`, message: `leg ${l} does not exist (legs are 1..${n})` }
    if (seen.has(l)) return { field: `order[${k}]`, message: `leg ${l} appears twice; the colour order must name every leg once` }
    seen.add(l)
  }
  return null
}

/** Checks that an order is a permutation of 1..n (PhysicsError naming `order`). */
export function checkOrder(order: readonly number[], n: number): void {
  const e = orderProblem(order, n)
  if (e) throw new PhysicsError(e.field, e.message)
}

/** The order the engine must take legs in, or null when the labels are already it. */
export function effectiveOrder(theory: string, order: readonly number[] | undefined): number[] | null {
  return order && isColourOrdered(theory) && !isIdentity(order) ? [...order] : null
}

/** The entries of a per-label list (1..n) in the colour order. */
export function inOrder<T>(xs: readonly T[], order: readonly number[]): T[] {
  return order.map((l) => xs[l - 1]!)
}

/** A per-position list (in the colour order) back in label order. */
export function toLabelOrder<T>(xs: readonly T[], order: readonly number[]): T[] {
  const out = new Array<T>(xs.length)
  xs.forEach((x, k) => (out[order[k]! - 1] = x))
  return out
}

/** A shift in labels as positions in the colour order. */
export function shiftInOrder(shift: readonly [number, number], order: readonly number[]): [number, number] {
  const pos = new Map(order.map((l, k) => [l, k + 1]))
  return [pos.get(shift[0]) ?? shift[0], pos.get(shift[1]) ?? shift[1]]
}

/** Leg references (`legs`, `{ label }`) inside a wire tree, positions → labels. */
export function relabelLegs(x: unknown, order: readonly number[]): unknown {
  if (Array.isArray(x)) return x.map((y) => relabelLegs(y, order))
  if (x && typeof x === 'object') {
    const o = x as Record<string, unknown>
    if (typeof o.label === 'number' && Object.keys(o).length === 1) return { label: order[o.label - 1] ?? o.label }
    const out: Record<string, unknown> = {}
    for (const [k, v] of Object.entries(o)) out[k] = k === 'legs' || k === 'leftLegs' || k === 'children' || k === 'left' || k === 'right' || k === 'terms' ? relabelLegs(v, order) : v
    return out
  }
  return x
}

/** An evaluation answered in colour-order positions, in the labels (shift, terms, point). */
export function responseToLabels(r: EvaluateResponse, order: readonly number[]): EvaluateResponse {
  if (isIdentity(order)) return r
  return {
    ...r,
    shift: [order[r.shift[0] - 1]!, order[r.shift[1] - 1]!],
    terms: r.terms.map((t): WireTerm => ({
      ...t,
      left: t.left.map((p) => order[p - 1]!).sort((a, b) => a - b),
      children: t.children ? (relabelLegs(t.children, order) as WireTerm['children']) : null,
    })),
    kinematics: { lambda: toLabelOrder(r.kinematics.lambda, order), lambdaTilde: toLabelOrder(r.kinematics.lambdaTilde, order) },
  }
}
