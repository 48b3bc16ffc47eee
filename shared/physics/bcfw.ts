// BCFW on-shell recursion (Britto, Cachazo, Feng, Witten, PRL 94 (2005) 181602) with the signs and
// orientation of CONVENTIONS.md "BCFW": the [i,j⟩ shift λ̃_i → λ̃_i + z λ̃_j, λ_j → λ_j − z λ_i;
// term(L, h) = A_L(…, −P̂^h) A_R(…, P̂^−h) / P², with −P̂ carried by (λ_P, −λ̃_P).
import { SingularError, type Field } from './field'
import { det, momentumSum, sandwichOf, type Bispinor, type Kin, type Spinor } from './spinors'
import { defaultShift, vanishes, type Process } from './theories'
import { threePoint, threePointSurvives, type VertexKind } from './three-point'
import { PhysicsError } from './errors'
import { classifyGluon, parkeTaylorAntiMhv, parkeTaylorMhv } from './targets/parke-taylor'

/** A leg of a (sub-)amplitude: an external label (1-based) or an internal line L1, L2, … */
export type LegRef = { label: number } | { line: string }

export interface Vertex<T> {
  kind: VertexKind
  legs: LegRef[]
  helicities: number[]
  value: T
}

export interface Term<T> {
  /** Sorted 1-based positions (= labels at the top level) of this amplitude's legs on the side of leg i. */
  left: number[]
  /** In a term tree below the top: the legs behind `left`. */
  leftLegs?: LegRef[]
  helicity: number
  z: T
  pole: T
  value: T
  children: { left: SubAmplitude<T> | Vertex<T>; right: SubAmplitude<T> | Vertex<T> } | null
}

export interface SubAmplitude<T> {
  value: T
  /** 1-based positions in `legs`. */
  shift: [number, number]
  legs: LegRef[]
  helicities: number[]
  terms: Term<T>[]
}

export interface BcfwOptions {
  /** Expand children down to three-point vertices (no closed forms). */
  tree?: boolean
  /** Use Parke–Taylor for MHV and anti-MHV gluon sub-blocks (exactly equal; on unless tree). */
  closedForms?: boolean
  /** Refuse trees with more nodes than this. */
  maxNodes?: number
}

interface Ctx<T> {
  F: Field<T>
  p: Process
  tree: boolean
  closedForms: boolean
  lines: number
  nodes: number
  maxNodes: number
}

export const DEFAULT_MAX_TREE_NODES = 20000

/** Rank-one split P̂ = λ_P λ̃_Pᵀ from its largest entry (r, c): λ_P = column c, λ̃_P = row r / P̂_rc. */
export function splitRankOne<T>(F: Field<T>, P: Bispinor<T>): { lambda: Spinor<T>; lambdaTilde: Spinor<T> } {
  let r = 0
  let c = 0
  let best = -1
  for (const a of [0, 1]) for (const b of [0, 1]) {
    const v = F.abs(P[a]![b]!)
    if (v > best) [best, r, c] = [v, a, b]
  }
  const pivot = P[r]![c]!
  return {
    lambda: [P[0][c]!, P[1][c]!],
    lambdaTilde: [F.div(P[r]![0]!, pivot, 'P̂ = 0'), F.div(P[r]![1]!, pivot, 'P̂ = 0')],
  }
}

/** Left sets of the [i,j⟩ shift (0-based): each with A_L's and A_R's external legs in their order. */
export function channels(n: number, i: number, j: number, colourOrdered: boolean): { L: number[]; R: number[] }[] {
  const out: { L: number[]; R: number[] }[] = []
  if (colourOrdered) {
    for (let m = 2; m <= n - 2; m++) {
      for (let o = 0; o < m; o++) {
        const a = (i - o + n) % n
        const L = Array.from({ length: m }, (_, t) => (a + t) % n)
        if (L.includes(j)) continue
        const R = Array.from({ length: n - m }, (_, t) => (a + m + t) % n)
        out.push({ L, R })
      }
    }
    return out
  }
  const others = Array.from({ length: n }, (_, t) => t).filter((t) => t !== i && t !== j)
  const count = 1 << others.length
  for (let mask = 0; mask < count; mask++) {
    const Lset = new Set([i, ...others.filter((_, b) => mask & (1 << b))])
    if (Lset.size < 2 || Lset.size > n - 2) continue
    const L = Array.from({ length: n }, (_, t) => t).filter((t) => Lset.has(t))
    const R = Array.from({ length: n }, (_, t) => t).filter((t) => !Lset.has(t))
    out.push({ L, R })
  }
  return out
}

function internalHelicities(p: Process): number[] {
  return p.s === 0 ? [0] : [p.s, -p.s]
}

function sideSurvives(p: Process, h: number[], kind: VertexKind): boolean {
  return h.length === 3 ? threePointSurvives(p, h, kind) : !vanishes(p, h)
}

/** Label list like "1,2,5" for messages. */
function labelsOf(legs: LegRef[] | undefined, idx: number[]): string {
  return idx.map((t) => (legs ? ('label' in legs[t]! ? String((legs[t] as { label: number }).label) : (legs[t] as { line: string }).line) : String(t + 1))).join(',')
}

interface SumResult<T> {
  value: T
  terms: Term<T>[]
}

function bcfwSum<T>(ctx: Ctx<T>, k: Kin<T>, h: number[], shift: [number, number], legs: LegRef[] | undefined, wantTerms: boolean, top = false): SumResult<T> {
  const { F, p } = ctx
  const n = h.length
  const [i, j] = shift
  const li = k.lambda[i]!
  const ltj = k.lambdaTilde[j]!
  const hs = internalHelicities(p)
  let value = F.zero
  const terms: Term<T>[] = []
  for (const { L, R } of channels(n, i, j, p.colourOrdered)) {
    const hL = L.map((t) => h[t]!)
    const hR = R.map((t) => h[t]!)
    const live = hs.filter((x) => sideSurvives(p, [...hL, x], 'angle') && sideSurvives(p, [...hR, -x], 'square'))
    if (live.length === 0) continue
    const P = momentumSum(F, k, L)
    const P2 = det(F, P)
    const what = `the pole s(${labelsOf(legs, L)})`
    if (F.isZero(P2)) throw new SingularError(`${what} vanishes`)
    const ipj = sandwichOf(F, li, P, ltj)
    const z = F.neg(F.div(P2, ipj, `⟨${i + 1}|P|${j + 1}] of the channel s(${labelsOf(legs, L)})`))
    const Phat: Bispinor<T> = [
      [F.add(P[0][0], F.mul(z, F.mul(li[0], ltj[0]))), F.add(P[0][1], F.mul(z, F.mul(li[0], ltj[1])))],
      [F.add(P[1][0], F.mul(z, F.mul(li[1], ltj[0]))), F.add(P[1][1], F.mul(z, F.mul(li[1], ltj[1])))],
    ]
    const sp = splitRankOne(F, Phat)
    const ltI = k.lambdaTilde[i]!
    const hatLtI: Spinor<T> = [F.add(ltI[0], F.mul(z, ltj[0])), F.add(ltI[1], F.mul(z, ltj[1]))]
    const lJ = k.lambda[j]!
    const hatLJ: Spinor<T> = [F.sub(lJ[0], F.mul(z, li[0])), F.sub(lJ[1], F.mul(z, li[1]))]
    const kL: Kin<T> = {
      lambda: [...L.map((t) => k.lambda[t]!), sp.lambda],
      lambdaTilde: [...L.map((t) => (t === i ? hatLtI : k.lambdaTilde[t]!)), [F.neg(sp.lambdaTilde[0]), F.neg(sp.lambdaTilde[1])]],
    }
    const kR: Kin<T> = {
      lambda: [...R.map((t) => (t === j ? hatLJ : k.lambda[t]!)), sp.lambda],
      lambdaTilde: [...R.map((t) => k.lambdaTilde[t]!), sp.lambdaTilde],
    }
    let line: string | undefined
    if (ctx.tree) line = `L${++ctx.lines}`
    const legsL = legs && line ? [...L.map((t) => legs[t]!), { line }] : undefined
    const legsR = legs && line ? [...R.map((t) => legs[t]!), { line }] : undefined
    for (const x of live) {
      const left = side(ctx, kL, [...hL, x], 'angle', legsL)
      if (F.isZero(left.value)) continue
      const right = side(ctx, kR, [...hR, -x], 'square', legsR)
      const tv = F.div(F.mul(left.value, right.value), P2, what)
      value = F.add(value, tv)
      if (wantTerms) {
        terms.push({
          left: L.map((t) => t + 1).sort((a, b) => a - b),
          ...(ctx.tree && legs && !top ? { leftLegs: L.slice().sort((a, b) => a - b).map((t) => legs[t]!) } : {}),
          helicity: x,
          z,
          pole: P2,
          value: tv,
          children: ctx.tree ? { left: left.node!, right: right.node! } : null,
        })
      }
    }
  }
  return { value, terms }
}

interface SideResult<T> {
  value: T
  node?: SubAmplitude<T> | Vertex<T>
}

function side<T>(ctx: Ctx<T>, k: Kin<T>, h: number[], kind: VertexKind, legs: LegRef[] | undefined): SideResult<T> {
  const { F, p } = ctx
  if (h.length === 3) {
    const value = threePoint(F, p, k, h, kind)
    if (ctx.tree) {
      if (++ctx.nodes > ctx.maxNodes) throw new PhysicsError('tree', `the term tree has more than ${ctx.maxNodes} nodes; ask for tree: false`)
      return { value, node: { kind, legs: legs!, helicities: h, value } }
    }
    return { value }
  }
  if (!ctx.tree) return { value: amplitudeValue(ctx, k, h) }
  const shift = defaultShift(p, h)
  if (++ctx.nodes > ctx.maxNodes) throw new PhysicsError('tree', `the term tree has more than ${ctx.maxNodes} nodes; ask for tree: false`)
  if (vanishes(p, h)) return { value: F.zero, node: { value: F.zero, shift: [shift[0] + 1, shift[1] + 1], legs: legs!, helicities: h, terms: [] } }
  const r = bcfwSum(ctx, k, h, shift, legs, true)
  return { value: r.value, node: { value: r.value, shift: [shift[0] + 1, shift[1] + 1], legs: legs!, helicities: h, terms: r.terms } }
}

function amplitudeValue<T>(ctx: Ctx<T>, k: Kin<T>, h: number[]): T {
  const { F, p } = ctx
  if (vanishes(p, h)) return F.zero
  if (ctx.closedForms && p.theory === 'gluon') {
    const c = classifyGluon(h)
    if (c.kind === 'mhv') return parkeTaylorMhv(F, k, c.i, c.j)
    if (c.kind === 'anti-mhv') return parkeTaylorAntiMhv(F, k, c.i, c.j)
  }
  return bcfwSum(ctx, k, h, defaultShift(p, h), undefined, false).value
}

export interface BcfwResult<T> {
  value: T
  terms: Term<T>[]
}

/**
 * The residue sum of the n-point amplitude under the [i,j⟩ shift (0-based), with the top-level
 * terms (and, with `tree`, their children down to three-point vertices). Sub-amplitudes are
 * shifted by the default-shift rule, which is always valid for them. Throws SingularError when a
 * pole or a bracket divided by vanishes.
 */
export function bcfw<T>(F: Field<T>, p: Process, k: Kin<T>, h: number[], shift: [number, number], opts: BcfwOptions = {}): BcfwResult<T> {
  const ctx: Ctx<T> = {
    F,
    p,
    tree: !!opts.tree,
    closedForms: opts.closedForms ?? !opts.tree,
    lines: 0,
    nodes: 0,
    maxNodes: opts.maxNodes ?? DEFAULT_MAX_TREE_NODES,
  }
  if (vanishes(p, h)) return { value: F.zero, terms: [] }
  const legs: LegRef[] = h.map((_, t) => ({ label: t + 1 }))
  return bcfwSum(ctx, k, h, shift, legs, true, true)
}

/** The amplitude value only (default shift at the top), the fast path used by the other modules. */
export function bcfwValue<T>(F: Field<T>, p: Process, k: Kin<T>, h: number[], shift?: [number, number]): T {
  return bcfw(F, p, k, h, shift ?? defaultShift(p, h)).value
}
