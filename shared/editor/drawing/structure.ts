// What a drawn term means, from the canvas alone (no kinematics): each connected component with a
// vertex or Block is one term of the residue sum. Its top-level Line must separate a channel of the
// shift (docs/conventions.md "BCFW"); each side is a sub-amplitude: one vertex, one Block, or again
// one channel term of its own recursion (under its default shift, or the valid shift the drawing
// fits). Sub-amplitude leg orders are the engine's (A_L(a..b, −P̂), A_R(b+1..a−1, P̂)), so a drawing
// made from the engine's term tree reads back as exactly that tree. The three-point kind at a pole is
// structural: the side holding the λ̃-shifted leg is an angle vertex, the other a square vertex.
import type { Process as GraphProcess } from '../../schemas/graph'
import { channels, internalSpecies, sideSurvives } from '../../physics/bcfw'
import { GLUON_PDG, speciesOfPdg } from '../../physics/quarks'
import { defaultShift, isValidShift, processOf, vanishes, type Process } from '../../physics/theories'
import { threePointSurvives, type VertexKind } from '../../physics/three-point'
import type { EditorEdge, EditorNode, LineData } from '../types'
import { helicityText } from '../types'
import { codeOf, processSpecies, speciesText } from '../species'

/** A leg of a drawn sub-amplitude: an external label, or the Line (edge id) that joins it to the rest. */
export type DrawnLeg = { label: number } | { edge: string }

interface Amp {
  legs: DrawnLeg[]
  helicities: number[]
  /** Theory qcd: PDG codes of the legs (outgoing). */
  pdg?: number[]
}

export type DrawnPart
  = | { kind: 'vertex', node: string, legs: DrawnLeg[], helicities: number[], vertexKind: VertexKind, zero: boolean, pdg?: number[] }
    | { kind: 'block', node: string, legs: DrawnLeg[], helicities: number[], zero: boolean, pdg?: number[] }
    | {
      kind: 'term'
      legs: DrawnLeg[]
      helicities: number[]
      /** Theory qcd: PDG codes of the legs; the Line is a quark when left.pdg ends in one. */
      pdg?: number[]
      /** 0-based positions in `legs`. */
      shift: [number, number]
      /** Positions (in `legs`) of A_L's and A_R's external legs, in the engine's order. */
      L: number[]
      R: number[]
      /** The Line of this channel (edge id) and the helicity at its end on A_L's side. */
      line: string
      helicity: number
      left: DrawnPart
      right: DrawnPart
    }

export interface DrawnIssue {
  /** Node or edge id the message belongs on. */
  id: string
  on: 'node' | 'edge'
  level: 'error' | 'warning'
  message: string
}

export interface DrawnChannel {
  /** Sorted leg labels on the side of the shifted leg i. */
  left: number[]
  /** Helicity of the top-level Line at its end on leg i's side (docs/api.md "Evaluation response", the term's `helicity`). */
  helicity: number
}

export interface DrawnTerm {
  /** The component id (validateGraph's `components[].id`). */
  id: string
  nodeIds: string[]
  /** The channel its top-level Line separates, or null when no Line separates one. */
  channel: DrawnChannel | null
  /** "{1,6} | −": the label the canvas shows. */
  label: string | null
  /** The top-level Line (edge id). */
  lineId: string | null
  /** Vertices and Blocks on either side of the top-level Line. */
  leftNodeIds: string[]
  rightNodeIds: string[]
  /** The term's structure, or null when it cannot be read as a term of the recursion. */
  plan: DrawnPart | null
  /** Whether the channel and internal helicity give a non-vanishing term of the shift. */
  live: boolean
  /** Problems in words: every error message on its nodes and Lines (empty: a well-formed term). */
  problems: string[]
  /** A plan with no problem: the term is what it claims to be. */
  valid: boolean
}

export interface DrawingStructure {
  /** The top-level shift, leg labels (the process's, else the engine's default rule). */
  shift: [number, number] | null
  terms: DrawnTerm[]
  issues: DrawnIssue[]
}

/** What validateGraph already knows about the canvas. */
export interface StructureInput {
  nodes: EditorNode[]
  /** The nodes by id (the last of a repeated id). */
  byId: Map<string, EditorNode>
  edges: EditorEdge[]
  process?: GraphProcess
  components: { id: string, nodeIds: string[], legIds: string[], labels: number[], lineIds: string[], isTree: boolean }[]
  /** Each vertex's and Block's slots in handle order: the leg label or Line at it (validateGraph's slots, slimmed). */
  slots: Map<string, Slot[]>
  /** Ids (nodes and edges) that already carry an error. */
  errorIds: Set<string>
}

/** The engine's process of a diagram's process (null for an unknown spin). */
export function engineProcess(p: GraphProcess): Process | null {
  if (p.theory === 'spin' && (p.spin === undefined || !Number.isInteger(p.spin) || p.spin < 0)) return null
  return processOf(p.theory, p.spin)
}

/** 1..n (a loop: Array.from over an array-like costs more than a drawn term). */
export function labelsUpTo(n: number): number[] {
  const out: number[] = []
  for (let t = 0; t < n; t++) out.push(t + 1)
  return out
}

/** Colour order (labels) of a process: `order` when it is a permutation, else 1..n. */
function colourOrder(p: GraphProcess, colourOrdered: boolean): number[] {
  const n = p.helicities.length
  const id = labelsUpTo(n)
  if (!colourOrdered || !p.order || p.order.length !== n) return id
  const seen = new Set(p.order)
  return seen.size === n && p.order.every(l => Number.isInteger(l) && l >= 1 && l <= n) ? p.order : id
}

/** The shift a check of this process uses, in leg labels (the process's, else the default rule in colour order). */
export function drawingShift(p: GraphProcess): [number, number] | null {
  const n = p.helicities.length
  if (p.shift) return p.shift[0] !== p.shift[1] && p.shift.every(l => l >= 1 && l <= n) ? p.shift : null
  const ep = engineProcess(p)
  if (!ep) return null
  const order = colourOrder(p, ep.colourOrdered)
  const species = processSpecies(p)
  const d = defaultShift(ep, order.map(l => p.helicities[l - 1]!), species ? order.map(l => codeOf(species[l - 1])) : undefined)
  return [order[d[0]]!, order[d[1]]!]
}

export const channelText = (left: number[]): string => `{${left.join(',')}}`
export const channelLabel = (c: DrawnChannel): string => `${channelText(c.left)} | ${helicityText(c.helicity)}`

const hsOf = (p: Process): number[] => (p.s === 0 ? [0] : [p.s, -p.s])

/**
 * A memo keyed by a process, helicities, an optional shift and PDG codes: a numeric hash, then an
 * exact comparison (building and hashing a string key per call cost more than the lookups saved).
 */
class HelicityMemo<V> {
  private readonly map = new Map<number, { theory: string, s: number, a: number, b: number, h: number[], pdg: number[] | undefined, value: V }[]>()
  private size = 0
  private static hash(p: Process, h: readonly number[], a: number, b: number, pdg?: readonly number[]): number {
    let x = Math.imul(p.s * 4 + 7, 0x01000193) ^ Math.imul(a + 3, 0x9e3779b1) ^ (b + 11) ^ p.theory.length
    for (let t = 0; t < h.length; t++) x = Math.imul(x ^ (h[t]! * 2 + 64), 0x01000193)
    if (pdg) for (let t = 0; t < pdg.length; t++) x = Math.imul(x ^ (pdg[t]! + 1000), 0x01000193)
    return x
  }

  private static same(x: readonly number[] | undefined, y: readonly number[] | undefined): boolean {
    if (x === y) return true
    if (!x || !y || x.length !== y.length) return false
    for (let t = 0; t < x.length; t++) if (!Object.is(x[t], y[t])) return false
    return true
  }

  get(p: Process, h: readonly number[], a: number, b: number, pdg: readonly number[] | undefined, make: () => V): V {
    const k = HelicityMemo.hash(p, h, a, b, pdg)
    const list = this.map.get(k)
    if (list) for (const e of list) if (e.theory === p.theory && e.s === p.s && e.a === a && e.b === b && HelicityMemo.same(e.h, h) && HelicityMemo.same(e.pdg, pdg)) return e.value
    if (this.size > 5000) {
      this.map.clear()
      this.size = 0
    }
    const value = make()
    const e = { theory: p.theory, s: p.s, a, b, h: [...h], pdg: pdg ? [...pdg] : undefined, value }
    const again = this.map.get(k)
    if (again) again.push(e)
    else this.map.set(k, [e])
    this.size++
    return value
  }
}

/** The live (channel, internal helicity) pairs of an amplitude under a shift: the terms the recursion sums. */
export function liveChannels(p: Process, h: readonly number[], shift: readonly [number, number], pdg?: readonly number[]): readonly LiveChannel[] {
  return liveMemo.get(p, h, shift[0], shift[1], pdg, () => computeLive(p, h, shift, pdg))
}

interface LiveChannel { L: readonly number[], R: readonly number[], helicity: number }
const liveMemo = new HelicityMemo<readonly LiveChannel[]>()

function computeLive(p: Process, h: readonly number[], shift: readonly [number, number], pdg?: readonly number[]): LiveChannel[] {
  const out: LiveChannel[] = []
  if (vanishes(p, h, pdg)) return out
  for (const { L, R } of channels(h.length, shift[0], shift[1], p.colourOrdered)) {
    // Theory qcd: the species exchanged (bcfw.ts internalSpecies); a quark carries ±½.
    const x0 = pdg ? internalSpecies(pdg, L) : null
    if (pdg && x0 === null) continue
    const cL = pdg ? [...L.map(t => pdg[t]!), x0!] : undefined
    const cR = pdg ? [...R.map(t => pdg[t]!), x0 === GLUON_PDG ? x0 : -x0!] : undefined
    for (const x of pdg && x0 !== GLUON_PDG ? [0.5, -0.5] : hsOf(p)) {
      if (sideSurvives(p, [...L.map(t => h[t]!), x], 'angle', cL) && sideSurvives(p, [...R.map(t => h[t]!), -x], 'square', cR)) out.push({ L, R, helicity: x })
    }
  }
  return out
}

type ChannelList = ReturnType<typeof channels>
const maskCache = new Map<number, Map<number, ChannelList[number]>>()

/** The channels of a shift keyed by the bit mask of their left positions (cached: the same few recur at every level). */
function channelsByMask(n: number, sh: readonly [number, number], colourOrdered: boolean): Map<number, ChannelList[number]> {
  const k = ((n * 32 + sh[0]) * 32 + sh[1]) * 2 + (colourOrdered ? 1 : 0)
  let m = maskCache.get(k)
  if (!m) maskCache.set(k, (m = new Map(channels(n, sh[0], sh[1], colourOrdered).map(c => [c.L.reduce((x, u) => x | (1 << u), 0), c]))))
  return m
}

const shiftMemo = new HelicityMemo<readonly [number, number]>()

/** The default shift of a sub-amplitude (memoized: the same helicities recur in every term). */
function subShift(p: Process, h: readonly number[], pdg?: readonly number[]): [number, number] {
  const d = shiftMemo.get(p, h, -1, -1, pdg, () => defaultShift(p, h, pdg ? [...pdg] : undefined))
  return [d[0], d[1]]
}

interface Link { edge: string, to: string, rank: number }

/** The amplitude's legs at `at`, then the channel's Line with helicity h. */
function subAmp(amp: Amp, at: readonly number[], line: DrawnLeg, h: number): Amp {
  const legs: DrawnLeg[] = []
  const helicities: number[] = []
  for (const u of at) {
    legs.push(amp.legs[u]!)
    helicities.push(amp.helicities[u]!)
  }
  legs.push(line)
  helicities.push(h)
  return { legs, helicities }
}

/** A node's Lines to other vertices or Blocks that hold the same Line at their end, with the Line's rank (once per node). */
function linksOf(ctx: Ctx, id: string): Link[] {
  let out = ctx.links.get(id)
  if (out) return out
  out = []
  for (const s of ctx.slots.get(id)!) {
    if (s.edge && s.to && ctx.slots.get(s.to)?.some(o => o.edge === s.edge)) out.push({ edge: s.edge, to: s.to, rank: lineRank(ctx.edgeById.get(s.edge)) })
  }
  ctx.links.set(id, out)
  return out
}

/** A slot of a vertex or Block: the leg label or the Line (edge id, node at its other end) it holds, and the helicity arriving. */
export interface Slot { leg: number | null, edge: string | null, to: string | null, helicity: number | null, code: number | null }

interface Ctx {
  p: Process
  slots: Map<string, Slot[]>
  byId: Map<string, EditorNode>
  edgeById: Map<string, EditorEdge>
  lineName: (edge: string) => string
  links: Map<string, Link[]>
}

interface Found { part: DrawnPart | null, issues: DrawnIssue[] }

function legText(ctx: Ctx, l: DrawnLeg): string {
  return 'label' in l ? `leg ${l.label}` : `line ${ctx.lineName(l.edge)}`
}

/** Line number of a generated Line ("L12" → 12): the engine numbers a channel's Line before the Lines below it. */
function lineRank(e: EditorEdge | undefined): number {
  const m = /^L(\d+)$/.exec(String(((e?.data ?? {}) as LineData).line ?? ''))
  return m ? Number(m[1]) : Number.MAX_SAFE_INTEGER
}

/**
 * Reads a region of the canvas (a connected set of vertices and Blocks) as the amplitude `amp`.
 * `kind` is the three-point kind the parent's shift allows for it; `shift` is fixed at the top.
 */
function readAmp(ctx: Ctx, amp: Amp, region: string[], kind: VertexKind | null, whyOf: () => string, shift: [number, number] | null): Found {
  const { p } = ctx
  if (region.length === 1) {
    const id = region[0]!
    const node = ctx.byId.get(id)!
    const legs = amp.legs
    if (node.type === 'block') {
      const zero = vanishes(p, amp.helicities, amp.pdg)
      const issues: DrawnIssue[] = []
      if (legs.length === 3 && kind && !threePointSurvives(p, amp.helicities, kind, amp.pdg)) issues.push({ id, on: 'node', level: 'error', message: `${whyOf()}, only ${kind === 'angle' ? 'an angle' : 'a square'} three-point amplitude survives, and helicities (${amp.helicities.map(helicityText).join(',')}) do not allow one` })
      return { part: { kind: 'block', node: id, legs, helicities: amp.helicities, zero: zero || issues.length > 0, ...(amp.pdg ? { pdg: amp.pdg } : {}) }, issues }
    }
    const vk = kind ?? (node.type as VertexKind)
    const issues: DrawnIssue[] = []
    if (node.type !== vk) issues.push({ id, on: 'node', level: 'error', message: `${whyOf()}: at the pole its ${vk === 'angle' ? 'square' : 'angle'} brackets vanish, so only ${vk === 'angle' ? 'an angle' : 'a square'} vertex survives here, not ${vk === 'angle' ? 'a square' : 'an angle'} vertex` })
    else if (!threePointSurvives(p, amp.helicities, vk, amp.pdg)) {
      const sum = amp.helicities.reduce((a, b) => a + b, 0)
      const total = sum === 0 ? '0' : `${sum > 0 ? '+' : '−'}${Math.abs(sum)}`
      issues.push({ id, on: 'node', level: 'error', message: `${whyOf()}, only ${vk === 'angle' ? 'an angle' : 'a square'} vertex survives, but helicities (${amp.helicities.map(helicityText).join(',')}) sum to ${total}: this term vanishes (flip the internal helicity)` })
    }
    return { part: { kind: 'vertex', node: id, legs, helicities: amp.helicities, vertexKind: vk, zero: issues.length > 0, ...(amp.pdg ? { pdg: amp.pdg } : {}) }, issues }
  }
  // Several nodes: one channel term of this amplitude's own recursion.
  const inside = new Set(region)
  // Positions of the amplitude's legs: external labels and the Lines that leave the region.
  const byLabel = new Map<number, number>()
  const byEdge = new Map<string, number>()
  amp.legs.forEach((l, t) => {
    if ('label' in l) byLabel.set(l.label, t)
    else byEdge.set(l.edge, t)
  })
  const lines: { edge: string, a: string, b: string, rank: number }[] = []
  for (const id of region) {
    for (const x of linksOf(ctx, id)) if (inside.has(x.to) && id < x.to) lines.push({ edge: x.edge, a: id, b: x.to, rank: x.rank })
  }
  // Stable insertion sort: a region has a few Lines, often in order already (sort with a comparator costs more).
  for (let t = 1; t < lines.length; t++) {
    const x = lines[t]!
    let u = t - 1
    while (u >= 0 && lines[u]!.rank > x.rank) {
      lines[u + 1] = lines[u]!
      u--
    }
    lines[u + 1] = x
  }
  // For each Line: the amplitude's legs on its `a` side (a bit mask of positions; −1 when one repeats) and the nodes there.
  const sideOf = (line: { edge: string, a: string }) => {
    let mask = 0
    const nodes: string[] = []
    const seen = new Set([line.a])
    const stack = [line.a]
    while (stack.length) {
      const x = stack.pop()!
      nodes.push(x)
      for (const s of ctx.slots.get(x)!) {
        if (s.edge === line.edge) continue
        if (s.to && inside.has(s.to)) {
          if (!seen.has(s.to)) { seen.add(s.to); stack.push(s.to) }
          continue
        }
        const t = s.leg !== null ? byLabel.get(s.leg) : s.edge !== null ? byEdge.get(s.edge) : undefined
        if (t !== undefined && mask !== -1) mask = mask & (1 << t) ? -1 : mask | (1 << t)
      }
    }
    return { mask, nodes }
  }
  const sides: ({ mask: number, nodes: string[] } | undefined)[] = new Array(lines.length)
  const n = amp.legs.length
  const all = n >= 31 ? -1 : (1 << n) - 1
  // The given shift at the top; below, the default shift first, then the other valid ones.
  const d = shift ?? subShift(p, amp.helicities, amp.pdg)
  let others: [number, number][] | null = null
  let best: Found | null = null
  for (let si = 0; ; si++) {
    if (si === 1) {
      if (shift) break
      others = []
      for (let a = 0; a < n; a++) for (let b = 0; b < n; b++) if (a !== b && !(a === d[0] && b === d[1]) && isValidShift(p, amp.helicities, a, b, amp.pdg)) others.push([a, b])
    }
    const sh = si === 0 ? d : others![si - 1]
    if (!sh) break
    const byMask = channelsByMask(n, sh, p.colourOrdered)
    for (let t = 0; t < lines.length; t++) {
      const line = lines[t]!
      const side = (sides[t] ??= sideOf(line))
      if (side.mask === -1) continue
      let ch = byMask.get(side.mask)
      let flip = false
      if (!ch) {
        ch = byMask.get(all & ~side.mask)
        flip = true
      }
      if (!ch) continue
      const sideSet = new Set(side.nodes)
      const leftEnd = flip ? line.b : line.a
      const rightEnd = flip ? line.a : line.b
      const leftNodes = flip ? region.filter(x => !sideSet.has(x)) : side.nodes
      const rightNodes = flip ? side.nodes : region.filter(x => !sideSet.has(x))
      const hAt = (node: string) => ctx.slots.get(node)!.find(s => s.edge === line.edge)?.helicity ?? null
      const h = hAt(leftEnd)
      const hr = hAt(rightEnd)
      if (h === null || hr === null) continue
      const edgeLeg: DrawnLeg = { edge: line.edge }
      const ampL = subAmp(amp, ch.L, edgeLeg, h)
      const ampR = subAmp(amp, ch.R, edgeLeg, hr)
      const flowIssue = amp.pdg ? speciesAcross(ctx, amp.pdg, ch.L, ch.R, ampL, ampR, line.edge, leftEnd) : null
      if (flowIssue === 'skip') continue
      const [si, sj] = sh
      const left = readAmp(ctx, ampL, leftNodes, 'angle', () => `this side of line ${ctx.lineName(line.edge)} holds the shifted ${legText(ctx, amp.legs[si]!)} (λ̃ shifted)`, null)
      const right = readAmp(ctx, ampR, rightNodes, 'square', () => `this side of line ${ctx.lineName(line.edge)} holds the shifted ${legText(ctx, amp.legs[sj]!)} (λ shifted)`, null)
      const issues = left.issues.length || right.issues.length || flowIssue ? [...(flowIssue ? [flowIssue] : []), ...left.issues, ...right.issues] : left.issues
      const found: Found = {
        part: left.part && right.part ? { kind: 'term', legs: amp.legs, helicities: amp.helicities, ...(amp.pdg ? { pdg: amp.pdg } : {}), shift: sh, L: [...ch.L], R: [...ch.R], line: line.edge, helicity: h, left: left.part, right: right.part } : null,
        issues,
      }
      if (found.part && issues.length === 0) return found
      if (!best || (found.part && !best.part) || (!!found.part === !!best.part && issues.length < best.issues.length)) best = found
    }
  }
  if (best) return best
  const names = amp.legs.map(l => legText(ctx, l).replace(/^leg /, '').replace(/^line /, '')).join(', ')
  if (shift) return { part: null, issues: [] }
  return {
    part: null,
    issues: [{ id: region[0]!, on: 'node', level: 'error', message: `the sub-amplitude (${names}) drawn here is not one channel term of its recursion under any valid shift: no line inside it separates a channel` }],
  }
}

/**
 * Theory qcd: sets the species the channel exchanges (the recursion's, bcfw.ts internalSpecies) on
 * both sides; 'skip' when no single particle can be exchanged; a message on the Line when it is
 * drawn carrying another species or with its fermion arrow reversed.
 */
function speciesAcross(ctx: Ctx, pdg: number[], L: readonly number[], R: readonly number[], ampL: Amp, ampR: Amp, edge: string, leftEnd: string): DrawnIssue | null | 'skip' {
  const x = internalSpecies(pdg, L)
  if (x === null) return 'skip'
  ampL.pdg = [...L.map(u => pdg[u]!), x]
  ampR.pdg = [...R.map(u => pdg[u]!), x === GLUON_PDG ? x : -x]
  const drawn = ctx.slots.get(leftEnd)!.find(s => s.edge === edge)?.code ?? GLUON_PDG
  if (drawn === x) return null
  const name = ctx.lineName(edge)
  const q = (c: number) => speciesText(speciesOfPdg(c))
  const flow = (c: number) => `fermion flow from the ${c > 0 ? 'side of the shifted λ̃ leg to the other' : 'other side to the side of the shifted λ̃ leg'}`
  const message = x !== GLUON_PDG && drawn === -x
    ? `line ${name}: its fermion arrow points the wrong way: this channel exchanges ${q(x)} with ${flow(x)}`
    : drawn === GLUON_PDG
      ? `line ${name} is drawn as a gluon, but this channel exchanges a quark (${q(x)}, ${flow(x)})`
      : x === GLUON_PDG
        ? `line ${name} is drawn as a quark line (${q(drawn)}), but this channel exchanges a gluon`
        : `line ${name} carries ${q(drawn)}, but this channel exchanges ${q(x)}`
  return { id: edge, on: 'edge', level: 'error', message }
}

/**
 * Compiles the drawn terms of a canvas. Components that already carry an error (open slots, a loop,
 * missing legs, …) are listed with those problems and no plan; the shifted-legs rule applies to
 * every component, complete or not, so a node says so while it is being drawn.
 */
export function compileStructure(input: StructureInput): DrawingStructure {
  const { edges, process, byId, slots } = input
  const species = processSpecies(process)
  const issues: DrawnIssue[] = []
  const terms: DrawnTerm[] = []
  const p = process ? engineProcess(process) : null
  const shift = process ? drawingShift(process) : null
  const edgeById = new Map<string, EditorEdge>()
  for (const e of edges) edgeById.set(e.id, e)
  let anon = 0
  const anonNames = new Map<string, string>()
  const lineName = (edge: string) => {
    const name = ((edgeById.get(edge)?.data ?? {}) as LineData).line
    if (name) return name
    if (!anonNames.has(edge)) anonNames.set(edge, `#${++anon}`)
    return anonNames.get(edge)!
  }
  const ctx: Ctx | null = p ? { p, slots, byId, edgeById, lineName, links: new Map() } : null
  const n = process?.helicities.length ?? 0
  const order = process && p ? colourOrder(process, p.colourOrdered) : []
  const pos = new Map(order.map((l, k) => [l, k]))
  for (const comp of input.components) {
    const inner = comp.nodeIds.filter(id => byId.get(id)?.type !== 'leg')
    if (!inner.length) continue
    const term: DrawnTerm = { id: comp.id, nodeIds: comp.nodeIds, channel: null, label: null, lineId: null, leftNodeIds: [], rightNodeIds: [], plan: null, live: false, problems: [], valid: false }
    terms.push(term)
    // Both shifted legs on one vertex or Block: no line of this term can separate them.
    if (shift) {
      for (const id of inner) {
        let i = false
        let j = false
        for (const x of slots.get(id) ?? []) {
          if (x.leg === shift[0]) i = true
          else if (x.leg === shift[1]) j = true
        }
        if (i && j) {
          const what = byId.get(id)!.type === 'block' ? 'Block' : 'vertex'
          const message = `both shifted legs ${shift[0]} and ${shift[1]} of [${shift[0]}, ${shift[1]}⟩ sit on this ${what}: a term's top-level line must separate them`
          issues.push({ id, on: 'node', level: 'error', message })
          term.problems.push(message)
        }
      }
    }
    if (!ctx || !shift || !process) continue
    const broken = comp.nodeIds.some(id => input.errorIds.has(id)) || comp.lineIds.some(id => input.errorIds.has(id)) || !comp.isTree
    const labels = new Set(comp.labels)
    if (broken || labels.size !== n || comp.labels.length !== n) {
      if (!term.problems.length) term.problems.push('this term is not complete yet (see the messages on its nodes)')
      continue
    }
    if (term.problems.length) continue
    const amp: Amp = { legs: order.map(l => ({ label: l })), helicities: order.map(l => process.helicities[l - 1]!), ...(species ? { pdg: order.map(l => codeOf(species[l - 1])) } : {}) }
    const top: [number, number] = [pos.get(shift[0])!, pos.get(shift[1])!]
    const found = readAmp(ctx, amp, inner, null, () => '', top)
    issues.push(...found.issues)
    term.problems.push(...found.issues.map(x => x.message))
    const part = found.part
    if (!part || part.kind !== 'term') {
      // Say which lines separate the shifted legs without being a channel of the shift.
      const message = lineProblems(ctx, inner, comp.lineIds, shift, order, issues)
      term.problems.push(message)
      issues.push({ id: inner[0]!, on: 'node', level: 'error', message })
      continue
    }
    const left = part.L.map(t => order[t]!).sort((a, b) => a - b)
    term.channel = { left, helicity: part.helicity }
    term.label = channelLabel(term.channel)
    term.lineId = part.line
    const collect = (x: DrawnPart, out: string[]) => {
      if (x.kind === 'term') { collect(x.left, out); collect(x.right, out) }
      else out.push(x.node)
    }
    collect(part.left, term.leftNodeIds)
    collect(part.right, term.rightNodeIds)
    term.live = liveChannels(ctx.p, amp.helicities, top, amp.pdg).some(c => c.helicity === part.helicity && c.L.length === part.L.length && c.L.every((u, k) => u === part.L[k]))
    term.plan = part
    term.valid = found.issues.length === 0
  }
  return { shift, terms, issues }
}

/** The message for a complete term with no channel Line, naming the lines on the path between the shifted legs. */
function lineProblems(ctx: Ctx, inner: string[], lineIds: string[], shift: [number, number], order: number[], issues: DrawnIssue[]): string {
  const [i, j] = shift
  const sh = `[${i}, ${j}⟩`
  const inside = new Set(inner)
  for (const edge of lineIds) {
    const e = ctx.edgeById.get(edge)
    if (!e || !inside.has(e.source) || !inside.has(e.target)) continue
    // Labels on the source side.
    const legs: number[] = []
    const seen = new Set([e.source])
    const stack = [e.source]
    while (stack.length) {
      const x = stack.pop()!
      for (const s of ctx.slots.get(x)!) {
        if (s.edge === edge) continue
        if (s.leg !== null) legs.push(s.leg)
        if (s.to && !seen.has(s.to)) { seen.add(s.to); stack.push(s.to) }
      }
    }
    if (legs.includes(i) === legs.includes(j)) continue
    const side = (legs.includes(i) ? legs : order.filter(l => !legs.includes(l))).sort((a, b) => a - b)
    const other = order.filter(l => !side.includes(l)).sort((a, b) => a - b)
    const why = ctx.p.colourOrdered ? 'its legs are not consecutive in the colour order' : 'each side needs at least two legs'
    issues.push({ id: edge, on: 'edge', level: 'error', message: `line ${ctx.lineName(edge)} separates ${channelText(side)} from ${channelText(other)}: not a channel of ${sh} (${why})` })
  }
  return `no line of this term separates a channel of ${sh}: its top-level line must have the shifted leg ${i} on one side and ${j} on the other, with a channel of the shift on each side`
}
