// From the diagram to an evaluation: the process of a hand-built canvas, the request sent to
// POST /api/evaluate, the colour order, and which channel terms of the shift the canvas holds.
import type { Process } from '../schemas/graph'
import type { EvaluateRequestInput, EvaluateResponse, Kinematics, WireTerm } from '../schemas/evaluate'
import { inOrder, orderProblem, responseToLabels, shiftInOrder } from '../physics/colour-order'
import { THEORIES, theoryOfSpin } from '../physics/theories'
import type { EditorEdge, EditorNode } from './types'
import type { Component } from './validate'
import { helicityAt, isExternal } from './validate'

/** Colour order of the process: the leg labels in order (1..n by default). */
export function orderOf(p: Process): number[] {
  const n = p.helicities.length
  return p.order && p.order.length === n ? p.order : Array.from({ length: n }, (_, t) => t + 1)
}

/** Checks a colour order: a permutation of 1..n. Returns an error message or null. */
export function orderError(order: number[], n: number): string | null {
  const e = orderProblem(order, n)
  return e ? `order: ${e.message}` : null
}

/**
 * The evaluate request of a process. The server numbers legs 1..n in the order given, which is the
 * colour order: positions follow `order`, and labels are mapped back with `labelOf`.
 */
export function evaluateRequest(p: Process, opts: { kinematics: Kinematics | EvaluateRequestInput['kinematics'], target?: EvaluateRequestInput['target'], arithmetic?: 'float' | 'exact', tree?: boolean, probeFalloff?: boolean }): EvaluateRequestInput {
  const order = orderOf(p)
  return {
    theory: p.theory,
    ...(THEORIES[p.theory].needsSpin ? { spin: p.spin } : {}),
    helicities: inOrder(p.helicities, order),
    ...(p.species && THEORIES[p.theory].species.length > 1 ? { species: inOrder(p.species, order) } : {}),
    kinematics: opts.kinematics,
    ...(p.shift ? { shift: shiftInOrder(p.shift, order) } : {}),
    target: opts.target ?? 'auto',
    arithmetic: opts.arithmetic ?? 'float',
    tree: opts.tree ?? false,
    probeFalloff: opts.probeFalloff ?? false,
  }
}

export function labelMap(p: Process): (pos: number) => number {
  const order = orderOf(p)
  return pos => order[pos - 1] ?? pos
}

/**
 * A response of POST /api/evaluate for evaluateRequest(p) in the diagram's labels: positions in
 * the colour order become leg labels (as the stored checks already report them).
 */
export function toLabels(r: EvaluateResponse, p: Process): EvaluateResponse {
  return responseToLabels(r, orderOf(p))
}

/**
 * The process a hand-built canvas describes: helicities by leg label from its legs. Returns the
 * process or a message saying what is missing. The theory follows |h| unless `base` sets it.
 */
export function processFromCanvas(nodes: EditorNode[], base?: Process): { process: Process } | { error: string } {
  const legs = nodes.filter(n => n.type === 'leg').map(n => n.data)
  if (!legs.length) return { error: 'the canvas has no legs: drag legs from the palette, or set the process in the header and expand' }
  const byLabel = new Map<number, number>()
  for (const l of legs) {
    const prev = byLabel.get(l.label)
    if (prev !== undefined && prev !== l.helicity) return { error: `leg ${l.label} is ${prev > 0 ? '+' : '−'} in one term and ${l.helicity > 0 ? '+' : '−'} in another` }
    byLabel.set(l.label, l.helicity)
  }
  const n = Math.max(...byLabel.keys())
  const missing = Array.from({ length: n }, (_, t) => t + 1).filter(l => !byLabel.has(l))
  if (missing.length) return { error: `legs are labelled 1..${n}, but ${missing.join(', ')} ${missing.length > 1 ? 'are' : 'is'} missing` }
  const helicities = Array.from({ length: n }, (_, t) => byLabel.get(t + 1)!)
  const s = Math.abs(helicities[0]!)
  if (helicities.some(h => Math.abs(h) !== s)) return { error: 'the legs mix particles of different spin; one theory at a time' }
  const theory = base?.theory ?? theoryOfSpin(s)
  return {
    process: {
      theory,
      ...(THEORIES[theory].needsSpin ? { spin: base?.spin ?? s } : {}),
      helicities,
      ...(base?.order && base.order.length === n ? { order: base.order } : {}),
      ...(base?.shift && base.shift.every(l => l <= n) ? { shift: base.shift } : {}),
    },
  }
}

export interface CanvasChannel {
  /** Sorted labels on the side of shifted leg i. */
  left: number[]
  /** Helicity of the line at the end on leg i's side (the term `helicity` of docs/api.md). */
  helicity: number
  edgeId: string
}

/**
 * The channels a component realises for the [i,j⟩ shift: every internal line whose cut separates
 * leg i from leg j with at least two legs on each side.
 */
export function componentChannels(comp: Component, nodes: EditorNode[], edges: EditorEdge[], shift: [number, number]): CanvasChannel[] {
  if (!comp.isTree) return []
  const byId = new Map(nodes.map(n => [n.id, n]))
  const inside = new Set(comp.nodeIds)
  const compEdges = edges.filter(e => inside.has(e.source) && inside.has(e.target))
  const adj = new Map<string, { to: string, edge: EditorEdge }[]>()
  for (const e of compEdges) {
    ;(adj.get(e.source) ?? adj.set(e.source, []).get(e.source)!).push({ to: e.target, edge: e })
    ;(adj.get(e.target) ?? adj.set(e.target, []).get(e.target)!).push({ to: e.source, edge: e })
  }
  const labelOf = (id: string) => { const n = byId.get(id); return n?.type === 'leg' ? n.data.label : null }
  const out: CanvasChannel[] = []
  for (const e of compEdges) {
    if (isExternal(e, byId)) continue
    // Legs reachable from e.source without crossing e.
    const side = new Set<number>()
    const stack = [e.source]
    const seen = new Set([e.source, e.target])
    while (stack.length) {
      const x = stack.pop()!
      const l = labelOf(x)
      if (l !== null) side.add(l)
      for (const { to, edge } of adj.get(x) ?? []) {
        if (edge.id === e.id || seen.has(to)) continue
        seen.add(to)
        stack.push(to)
      }
    }
    const all = comp.labels
    const other = all.filter(l => !side.has(l))
    const [i, j] = shift
    let left: number[]
    let end: string
    if (side.has(i) && !side.has(j)) { left = [...side]; end = e.source }
    else if (!side.has(i) && other.includes(i) && side.has(j)) { left = other; end = e.target }
    else continue
    if (left.length < 2 || all.length - left.length < 2) continue
    const h = helicityAt(e, end, byId)
    if (h === null) continue
    out.push({ left: left.sort((a, b) => a - b), helicity: h, edgeId: e.id })
  }
  return out
}

/**
 * Which component realises which server term: expanded components carry their term index (when
 * the expansion matches the process); hand-built ones are matched by channel and helicity.
 */
export function matchTerms(p: Process, terms: WireTerm[], comps: Component[], nodes: EditorNode[], edges: EditorEdge[], expandedFor: string | null): Map<number, string[]> {
  const out = new Map<number, string[]>()
  const byId = new Map(nodes.map(n => [n.id, n]))
  const key = (left: number[], h: number) => `${left.join(',')}|${h}`
  const termByKey = new Map(terms.map((t, k) => [key(t.left, t.helicity), k]))
  for (const c of comps) {
    if (!c.nodeIds.some(id => byId.get(id)!.type !== 'leg')) continue
    const tagged = byId.get(c.id)?.data as { term?: number } | undefined
    let k: number | undefined
    if (expandedFor !== null && expandedFor === processKey(p) && tagged?.term !== undefined) k = tagged.term
    else if (p.shift) {
      for (const ch of componentChannels(c, nodes, edges, p.shift)) {
        k = termByKey.get(key(ch.left, ch.helicity))
        if (k !== undefined) break
      }
    }
    if (k === undefined) continue
    const list = out.get(k) ?? []
    list.push(c.id)
    out.set(k, list)
  }
  return out
}

/** Identifies the process an expansion was made for. */
export function processKey(p: Process): string {
  return JSON.stringify([p.theory, p.spin ?? null, p.helicities, orderOf(p), p.shift ?? null, ...(p.species ? [p.species] : [])])
}
