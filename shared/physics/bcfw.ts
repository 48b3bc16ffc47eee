// BCFW on-shell recursion (Britto, Cachazo, Feng, Witten, PRL 94 (2005) 181602) with the signs and
// orientation of docs/conventions.md "BCFW": the [i,j⟩ shift λ̃_i → λ̃_i + z λ̃_j, λ_j → λ_j − z λ_i;
// term(L, h) = A_L(…, −P̂^h) A_R(…, P̂^−h) / P², with −P̂ carried by (λ_P, −λ̃_P).
import { SingularError, negligible, spinorSize, type Field } from './field'
import { sandwichOf, type Bispinor, type Kin, type Spinor } from './spinors'
import { defaultShift, isValidShift, vanishes, type Process } from './theories'
import { threePoint, threePointSurvives, type VertexKind } from './three-point'
import { PhysicsError } from './errors'
import { parkeTaylorAntiMhv, parkeTaylorMhv } from './targets/parke-taylor'
import { GLUON_PDG, linesCross } from './quarks'
import { classifyQuarkMhv, classifyTwoLineMhv, quarkMhvValue, twoLineMhvValue } from './targets/quark-mhv'

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
  /** Closed forms for MHV and anti-MHV sub-blocks: Parke–Taylor, the quark MHV forms (exactly equal; on unless tree). */
  closedForms?: boolean
  /** Refuse trees with more nodes than this. */
  maxNodes?: number
  /** PDG codes of the legs in `h`'s order (default: the process's own). */
  pdg?: number[]
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

const ZERO_HEL = [0]
const GLUON_HEL = [1, -1]
const QUARK_HEL = [0.5, -0.5]

/**
 * The species of A_L's internal leg (PDG code; A_R's is its antiparticle): a gluon when A_L's
 * quark lines are complete, the missing end of its one open line otherwise; null when A_L has
 * more than one open line (no single particle can be exchanged).
 */
export function internalSpecies(c: readonly number[], L: readonly number[]): number | null {
  let open = 0
  let missing = GLUON_PDG
  for (let a = 0; a < L.length; a++) {
    const x = c[L[a]!]!
    if (x === GLUON_PDG) continue
    let paired = false
    for (let b = 0; b < L.length && !paired; b++) paired = c[L[b]!] === -x
    if (paired) continue
    open++
    missing = -x
  }
  return open === 0 ? GLUON_PDG : open === 1 ? missing : null
}

/**
 * Every term with a quark exchanged carries −1 (docs/conventions.md "Quarks"), whatever the
 * exchanged helicity and whichever side holds the quark: with −P̂ as (λ_P, −λ̃_P) this is what the
 * quark-line Berends–Giele current gives ("fermion sign" in physics/quarks-bcfw.test.ts).
 */
export const FERMION_EXCHANGE_SIGN = -1

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
export function channels(n: number, i: number, j: number, colourOrdered: boolean): readonly Channel[] {
  const key = ((n * 64 + i) * 64 + j) * 2 + (colourOrdered ? 1 : 0)
  let c = channelCache.get(key)
  if (!c) channelCache.set(key, (c = computeChannels(n, i, j, colourOrdered)))
  return c
}

type Channel = { readonly L: readonly number[]; readonly R: readonly number[] }
const channelCache = new Map<number, readonly Channel[]>()

function computeChannels(n: number, i: number, j: number, colourOrdered: boolean): Channel[] {
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

/** Whether a side of a channel can be non-zero, from its helicities alone (three-point kinds structurally). */
export function sideSurvives(p: Process, h: readonly number[], kind: VertexKind, pdg?: readonly number[]): boolean {
  if (h.length === 3) return threePointSurvives(p, h, kind, pdg)
  return pdg ? !codesVanish(h, pdg) : !vanishes(p, h)
}

/**
 * The qcd vanishing rule (quarks.ts `qcdVanishes`) on helicities and codes directly: a line with
 * equal end helicities, n ≥ 4 with fewer than two minus or two plus legs, or crossing lines. Speed: it runs for
 * both sides of every channel.
 */
function codesVanish(h: readonly number[], c: readonly number[]): boolean {
  const n = h.length
  let minus = 0
  for (let t = 0; t < n; t++) {
    if (h[t]! < 0) minus++
    const x = c[t]!
    if (x === GLUON_PDG || x < 0) continue
    for (let u = 0; u < n; u++) if (c[u] === -x && h[u] === h[t]) return true
  }
  return n >= 4 && (minus < 2 || n - minus < 2 || linesCross(c))
}

/** A number per helicities and codes (5 bits a leg up to n = 10), the memo key of quarkRules. */
function rulesKey(h: readonly number[], c: readonly number[]): number | string {
  if (h.length > 10) return `${h.join(',')}|${c.join(',')}`
  let key = 1
  for (let t = 0; t < h.length; t++) {
    const x = c[t]!
    key = key * 32 + (x === GLUON_PDG ? 0 : 2 + 2 * (x + 6)) + (h[t]! > 0 ? 1 : 0)
  }
  return key
}

const quarkRuleMemo = new Map<number | string, { vanishes: boolean; shift: [number, number]; cost: number }>()

/**
 * Speed: the registry's vanishing rule and, of the valid shifts, the one with the fewest
 * closed-form evaluations below it (as cheapestShift does for gluons), for legs with species;
 * memoized per helicities and codes. Only valid shifts are candidates, so the rule stays valid.
 */
function quarkRules(p: Process, h: readonly number[], c: readonly number[]): { vanishes: boolean; shift: [number, number]; cost: number } {
  const key = rulesKey(h, c) // only qcd carries codes
  let r = quarkRuleMemo.get(key)
  if (r) return r
  const n = h.length
  const v = vanishes(p, h, c)
  r = { vanishes: v, shift: defaultShift(p, h, c), cost: v ? 0 : 1 }
  const gluons = c.every((x) => x === GLUON_PDG)
  if (!v && gluons) r.cost = cheapestShift(h).cost
  else if (!v && n > 3 && classifyQuarkMhv(h, c).kind === 'other' && !classifyTwoLineMhv(h, c)) {
    let best = Infinity
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
      if (i === j || !isValidShift(p, h, i, j, c)) continue
      let cost = 0
      for (const { L, R } of channels(n, i, j, true)) {
        const x = internalSpecies(c, L)
        if (x === null) continue
        const cL = [...L.map((t) => c[t]!), x]
        const cR = [...R.map((t) => c[t]!), x === GLUON_PDG ? x : -x]
        for (const y of x === GLUON_PDG ? GLUON_HEL : QUARK_HEL) {
          const hL = [...L.map((t) => h[t]!), y]
          const hR = [...R.map((t) => h[t]!), -y]
          if (!sideSurvives(p, hL, 'angle', cL) || !sideSurvives(p, hR, 'square', cR)) continue
          cost += 1 + (hL.length === 3 ? 0 : quarkRules(p, hL, cL).cost) + (hR.length === 3 ? 0 : quarkRules(p, hR, cR).cost)
        }
        if (cost >= best) break
      }
      if (cost < best) [best, r.shift] = [cost, [i, j]]
    }
    if (best < Infinity) r.cost = best
  }
  quarkRuleMemo.set(key, r)
  return r
}

/** Label list like "1,2,5" for messages. */
function labelsOf(legs: LegRef[] | undefined, idx: readonly number[]): string {
  return idx.map((t) => (legs ? ('label' in legs[t]! ? String((legs[t] as { label: number }).label) : (legs[t] as { line: string }).line) : String(t + 1))).join(',')
}

interface SumResult<T> {
  value: T
  terms: Term<T>[]
}

function poleName(legs: LegRef[] | undefined, L: readonly number[]): string {
  return `the pole s(${labelsOf(legs, L)})`
}

export interface ChannelKinematics<T> {
  /** P² at z = 0. */
  P2: T
  /** z* = −P²/⟨i|P|j]. */
  z: T
  /** A_L's legs: its external legs (î shifted) in the channel's order, then −P̂ as (λ_P, −λ̃_P). */
  kL: Kin<T>
  /** A_R's legs: its external legs (ĵ shifted), then P̂ as (λ_P, λ̃_P). */
  kR: Kin<T>
}

/**
 * The kinematics of one channel of the [i,j⟩ shift (0-based positions in `k`), docs/conventions.md
 * "BCFW": P, z*, the rank-one split of P̂ and the shifted spinors of both sides. Throws
 * SingularError when P² or ⟨i|P|j] vanishes. Shared by the recursion and the drawing compiler.
 */
export function channelKinematics<T>(F: Field<T>, k: Kin<T>, shift: readonly [number, number], L: readonly number[], R: readonly number[], legs?: LegRef[]): ChannelKinematics<T> {
  const [i, j] = shift
  const lam = k.lambda
  const lamT = k.lambdaTilde
  const li = lam[i]!
  const ltj = lamT[j]!
  const ltI = lamT[i]!
  const lJ = lam[j]!
  const nL = L.length
  const nR = R.length
  // P = Σ_{k∈L} λ_k λ̃_kᵀ at z = 0
  let P00 = F.zero, P01 = F.zero, P10 = F.zero, P11 = F.zero
  for (let t = 0; t < nL; t++) {
    const l = lam[L[t]!]!
    const lt = lamT[L[t]!]!
    P00 = F.add(P00, F.mul(l[0], lt[0]))
    P01 = F.add(P01, F.mul(l[0], lt[1]))
    P10 = F.add(P10, F.mul(l[1], lt[0]))
    P11 = F.add(P11, F.mul(l[1], lt[1]))
  }
  const d0 = F.mul(P00, P11)
  const d1 = F.mul(P01, P10)
  const P2 = F.sub(d0, d1)
  // in floats a pole below the tolerance of its terms is an exact zero lost to rounding
  if (F.zeroTolerance !== undefined ? negligible(F, P2, F.abs(d0) + F.abs(d1)) : F.isZero(P2)) throw new SingularError(`${poleName(legs, L)} vanishes`)
  const P: Bispinor<T> = [[P00, P01], [P10, P11]]
  const ipj = sandwichOf(F, li, P, ltj)
  if (F.zeroTolerance !== undefined ? negligible(F, ipj, spinorSize(F, li) * spinorSize(F, ltj) * (F.abs(P00) + F.abs(P01) + F.abs(P10) + F.abs(P11))) : F.isZero(ipj))
    throw new SingularError(`⟨${i + 1}|P|${j + 1}] of the channel s(${labelsOf(legs, L)}) vanishes, so the shift has no pole there`)
  const z = F.neg(F.div(P2, ipj))
  // P̂ = P + z* λ_i λ̃_jᵀ
  const Phat: Bispinor<T> = [
    [F.add(P00, F.mul(z, F.mul(li[0], ltj[0]))), F.add(P01, F.mul(z, F.mul(li[0], ltj[1])))],
    [F.add(P10, F.mul(z, F.mul(li[1], ltj[0]))), F.add(P11, F.mul(z, F.mul(li[1], ltj[1])))],
  ]
  const sp = splitRankOne(F, Phat)
  const hatLtI: Spinor<T> = [F.add(ltI[0], F.mul(z, ltj[0])), F.add(ltI[1], F.mul(z, ltj[1]))]
  const hatLJ: Spinor<T> = [F.sub(lJ[0], F.mul(z, li[0])), F.sub(lJ[1], F.mul(z, li[1]))]
  const kL: Kin<T> = { lambda: new Array(nL + 1), lambdaTilde: new Array(nL + 1) }
  for (let t = 0; t < nL; t++) {
    const e = L[t]!
    kL.lambda[t] = lam[e]!
    kL.lambdaTilde[t] = e === i ? hatLtI : lamT[e]!
  }
  kL.lambda[nL] = sp.lambda
  kL.lambdaTilde[nL] = [F.neg(sp.lambdaTilde[0]), F.neg(sp.lambdaTilde[1])]
  const kR: Kin<T> = { lambda: new Array(nR + 1), lambdaTilde: new Array(nR + 1) }
  for (let t = 0; t < nR; t++) {
    const e = R[t]!
    kR.lambda[t] = e === j ? hatLJ : lam[e]!
    kR.lambdaTilde[t] = lamT[e]!
  }
  kR.lambda[nR] = sp.lambda
  kR.lambdaTilde[nR] = sp.lambdaTilde
  return { P2, z, kL, kR }
}

function bcfwSum<T>(ctx: Ctx<T>, k: Kin<T>, h: number[], shift: [number, number], legs: LegRef[] | undefined, wantTerms: boolean, top = false, c?: number[]): SumResult<T> {
  const { F, p } = ctx
  const n = h.length
  const [i, j] = shift
  const hsBoson = p.s === 0 ? ZERO_HEL : p.s === 1 ? GLUON_HEL : [p.s, -p.s]
  let value = F.zero
  const terms: Term<T>[] = []
  for (const { L, R } of channels(n, i, j, p.colourOrdered)) {
    const nL = L.length
    const nR = R.length
    let cL: number[] | undefined
    let cR: number[] | undefined
    let cInt = GLUON_PDG
    if (c) {
      const x = internalSpecies(c, L)
      if (x === null) continue
      cInt = x
      cL = new Array<number>(nL + 1)
      cR = new Array<number>(nR + 1)
      for (let t = 0; t < nL; t++) cL[t] = c[L[t]!]!
      for (let t = 0; t < nR; t++) cR[t] = c[R[t]!]!
      cL[nL] = x
      cR[nR] = x === GLUON_PDG ? x : -x
    }
    const hs = cInt === GLUON_PDG ? hsBoson : QUARK_HEL
    const hL: number[] = new Array(nL + 1)
    const hR: number[] = new Array(nR + 1)
    for (let t = 0; t < nL; t++) hL[t] = h[L[t]!]!
    for (let t = 0; t < nR; t++) hR[t] = h[R[t]!]!
    let live0 = false
    let live1 = false
    for (let a = 0; a < hs.length; a++) {
      const x = hs[a]!
      hL[nL] = x
      hR[nR] = -x
      const ok = sideSurvives(p, hL, 'angle', cL) && sideSurvives(p, hR, 'square', cR)
      if (a === 0) live0 = ok
      else live1 = ok
    }
    if (!live0 && !live1) continue
    const { P2, z, kL, kR } = channelKinematics(F, k, shift, L, R, legs)
    let line: string | undefined
    if (ctx.tree) line = `L${++ctx.lines}`
    const legsL = legs && line ? [...L.map((t) => legs[t]!), { line }] : undefined
    const legsR = legs && line ? [...R.map((t) => legs[t]!), { line }] : undefined
    for (let a = 0; a < hs.length; a++) {
      if (!(a === 0 ? live0 : live1)) continue
      const x = hs[a]!
      const hLx = hL.slice()
      hLx[nL] = x
      const left = side(ctx, kL, hLx, 'angle', legsL, cL)
      if (F.isZero(left.value)) continue
      const hRx = hR.slice()
      hRx[nR] = -x
      const right = side(ctx, kR, hRx, 'square', legsR, cR)
      let tv = F.div(F.mul(left.value, right.value), P2)
      if (cInt !== GLUON_PDG && FERMION_EXCHANGE_SIGN < 0) tv = F.neg(tv)
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

function side<T>(ctx: Ctx<T>, k: Kin<T>, h: number[], kind: VertexKind, legs: LegRef[] | undefined, c?: number[]): SideResult<T> {
  const { F, p } = ctx
  if (h.length === 3) {
    const value = threePoint(F, p, k, h, kind, undefined, c)
    if (ctx.tree) {
      if (++ctx.nodes > ctx.maxNodes) throw new PhysicsError('tree', `the term tree has more than ${ctx.maxNodes} nodes; ask for tree: false`)
      return { value, node: { kind, legs: legs!, helicities: h, value } }
    }
    return { value }
  }
  if (!ctx.tree) return { value: amplitudeValue(ctx, k, h, c) }
  const shift = defaultShift(p, h, c)
  if (++ctx.nodes > ctx.maxNodes) throw new PhysicsError('tree', `the term tree has more than ${ctx.maxNodes} nodes; ask for tree: false`)
  if (vanishes(p, h, c)) return { value: F.zero, node: { value: F.zero, shift: [shift[0] + 1, shift[1] + 1], legs: legs!, helicities: h, terms: [] } }
  const r = bcfwSum(ctx, k, h, shift, legs, true, false, c)
  return { value: r.value, node: { value: r.value, shift: [shift[0] + 1, shift[1] + 1], legs: legs!, helicities: h, terms: r.terms } }
}

function amplitudeValue<T>(ctx: Ctx<T>, k: Kin<T>, h: number[], c?: number[]): T {
  const { F, p } = ctx
  if (c && c.some((x) => x !== GLUON_PDG)) {
    const rules = quarkRules(p, h, c)
    if (rules.vanishes) return F.zero
    if (ctx.closedForms) {
      const v = quarkMhvValue(F, k, h, c) ?? twoLineMhvValue(F, k, h, c)
      if (v !== null) return v
    }
    return subSum(ctx, k, h, rules.shift, c)
  }
  if (ctx.closedForms && (p.theory === 'gluon' || p.theory === 'qcd')) {
    // one pass: the two minus (MHV) or two plus (anti-MHV) legs, or a vanishing class
    const n = h.length
    let minus = 0
    let m0 = -1, m1 = -1, p0 = -1, p1 = -1
    for (let t = 0; t < n; t++) {
      if (h[t]! < 0) {
        if (minus === 0) m0 = t
        else if (minus === 1) m1 = t
        minus++
      }
      else if (t - minus === 0) p0 = t
      else if (t - minus === 1) p1 = t
    }
    if (minus === 2) return parkeTaylorMhv(F, k, m0, m1)
    if (n - minus === 2) return parkeTaylorAntiMhv(F, k, p0, p1)
    if (minus < 2 || n - minus < 2) return F.zero
    return subSum(ctx, k, h, cheapestShift(h).shift)
  }
  if (vanishes(p, h)) return F.zero
  return subSum(ctx, k, h, p.colourOrdered ? defaultShift(p, h) : cheapestSubsetShift(p, h))
}

const subsetCostMemo = new Map<string, { cost: number; types: [number, number] }>()

/**
 * Speed, for theories with channels over all subsets (gravitons): the amplitude is symmetric, so
 * the number of terms below a shift depends only on the counts of minus and plus legs and on the
 * helicities of the two shifted legs. Of the valid types [−,−⟩, [−,+⟩, [+,+⟩ the one with the fewest
 * terms (memoized per counts) is used, on the first legs of those helicities.
 */
function subsetCost(p: Process, minus: number, plus: number): { cost: number; types: [number, number] } {
  const key = `${p.theory}:${p.s}:${minus}:${plus}`
  const hit = subsetCostMemo.get(key)
  if (hit) return hit
  const n = minus + plus
  const h = [...Array<number>(minus).fill(-p.s), ...Array<number>(plus).fill(p.s)]
  let best = { cost: Infinity, types: [-1, 1] as [number, number] }
  if (n === 3) best = { cost: 0, types: best.types }
  else if (vanishes(p, h)) best = { cost: 0, types: best.types }
  else {
    for (const types of [[-1, -1], [-1, 1], [1, 1]] as [number, number][]) {
      const i = types[0] < 0 ? 0 : minus
      const j = types[1] < 0 ? (types[0] < 0 ? 1 : 0) : types[0] > 0 ? minus + 1 : minus
      if (i >= n || j >= n || (types[0] < 0 && types[1] < 0 && minus < 2) || (types[0] > 0 && types[1] > 0 && plus < 2)) continue
      if (!isValidShift(p, h, i, j)) continue
      let cost = 0
      for (const { L, R } of channels(n, i, j, false)) {
        for (const x of [p.s, -p.s]) {
          const hL = [...L.map((t) => h[t]!), x]
          const hR = [...R.map((t) => h[t]!), -x]
          if (!sideSurvives(p, hL, 'angle') || !sideSurvives(p, hR, 'square')) continue
          const c = (hh: number[]) => (hh.length === 3 ? 0 : subsetCost(p, hh.filter((y) => y < 0).length, hh.filter((y) => y > 0).length).cost)
          cost += 1 + c(hL) + c(hR)
        }
      }
      if (cost < best.cost) best = { cost, types }
    }
  }
  subsetCostMemo.set(key, best)
  return best
}

function cheapestSubsetShift(p: Process, h: number[]): [number, number] {
  let minus = 0
  for (const x of h) if (x < 0) minus++
  const { types } = subsetCost(p, minus, h.length - minus)
  const i = h.findIndex((x) => Math.sign(x) === types[0])
  const j = h.findIndex((x, t) => t !== i && Math.sign(x) === types[1])
  return i >= 0 && j >= 0 && isValidShift(p, h, i, j) ? [i, j] : defaultShift(p, h)
}

/**
 * A sub-amplitude by BCFW under the chosen shift. Its value does not depend on the (valid) shift,
 * so when that shift meets a spurious singularity — a pole or bracket of its own terms vanishing
 * exactly, which small rationals can hit by accident — the other valid shifts are tried in turn.
 */
function subSum<T>(ctx: Ctx<T>, k: Kin<T>, h: number[], first: [number, number], c?: number[]): T {
  try {
    return bcfwSum(ctx, k, h, first, undefined, false, false, c).value
  }
  catch (e) {
    if (!(e instanceof SingularError)) throw e
    const n = h.length
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
      if (i === j || (i === first[0] && j === first[1]) || !isValidShift(ctx.p, h, i, j, c)) continue
      try {
        return bcfwSum(ctx, k, h, [i, j], undefined, false, false, c).value
      }
      catch (e2) {
        if (!(e2 instanceof SingularError)) throw e2
      }
    }
    throw e
  }
}

const gluonProcess: Process = { theory: 'gluon', s: 1, colourOrdered: true }
const costMemo = new Map<string, { cost: number; shift: [number, number] }>()

/**
 * Speed: the valid adjacent gluon shift with the fewest closed-form evaluations below it, found
 * from the helicities alone (memoized per helicity string; MHV, anti-MHV and three-point blocks
 * cost 1, vanishing ones 0). Only valid shifts are candidates, so the rule stays valid.
 */
export function cheapestShift(h: readonly number[]): { cost: number; shift: [number, number] } {
  const key = h.join('')
  const hit = costMemo.get(key)
  if (hit) return hit
  const n = h.length
  let best = { cost: Infinity, shift: defaultShift(gluonProcess, h) }
  let minus = 0
  for (const x of h) if (x < 0) minus++
  if (n === 3 || minus === 2 || n - minus === 2) best = { cost: 1, shift: best.shift }
  else if (minus < 2 || n - minus < 2) best = { cost: 0, shift: best.shift }
  else {
    for (let a = 0; a < n; a++) {
      for (const [i, j] of [[a, (a + 1) % n], [(a + 1) % n, a]] as [number, number][]) {
        if (!isValidShift(gluonProcess, h, i, j)) continue
        let cost = 0
        for (const { L, R } of channels(n, i, j, true)) {
          const hL = [...L.map((t) => h[t]!), 0]
          const hR = [...R.map((t) => h[t]!), 0]
          for (const x of GLUON_HEL) {
            hL[L.length] = x
            hR[R.length] = -x
            if (!sideSurvives(gluonProcess, hL, 'angle') || !sideSurvives(gluonProcess, hR, 'square')) continue
            cost += 1 + (hL.length === 3 ? 0 : cheapestShift(hL).cost) + (hR.length === 3 ? 0 : cheapestShift(hR).cost)
          }
          if (cost >= best.cost) break
        }
        if (cost < best.cost) best = { cost, shift: [i, j] }
      }
    }
  }
  costMemo.set(key, best)
  return best
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
  const c = opts.pdg ?? (p.pdg && p.pdg.length === h.length ? p.pdg : undefined)
  if (vanishes(p, h, c)) return { value: F.zero, terms: [] }
  const legs: LegRef[] = h.map((_, t) => ({ label: t + 1 }))
  return bcfwSum(ctx, k, h, shift, legs, true, true, c)
}

/**
 * A sub-amplitude's value as the recursion computes one below the top (closed forms, the cheapest
 * valid shift): what a Block stands for.
 */
export function subAmplitudeValue<T>(F: Field<T>, p: Process, k: Kin<T>, h: number[], pdg?: number[]): T {
  if (h.length === 3) throw new PhysicsError('helicities', 'a three-point amplitude is a vertex, not a block')
  const ctx: Ctx<T> = { F, p, tree: false, closedForms: true, lines: 0, nodes: 0, maxNodes: DEFAULT_MAX_TREE_NODES }
  return amplitudeValue(ctx, k, h, pdg)
}

/** The amplitude value only (default shift at the top), the fast path used by the other modules. */
export function bcfwValue<T>(F: Field<T>, p: Process, k: Kin<T>, h: number[], shift?: [number, number], pdg?: number[]): T {
  return bcfw(F, p, k, h, shift ?? defaultShift(p, h, pdg), { pdg }).value
}
