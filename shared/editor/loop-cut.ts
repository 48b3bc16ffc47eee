// Loop-cut diagrams: each connected piece of the canvas is one ring of a quadruple cut — four
// corners (three-point vertices or Blocks) joined by four internal Lines, the external legs spread
// over the corners in colour order (docs/conventions.md "Loop-cut drawings"). The editor shows
// these checks on the nodes as you draw; the check route compiles the same rings into the
// engine's boxes (shared/physics/loop). Pure TypeScript: the store, the server and the tests share it.
import { DIAGRAM_KINDS, type Process } from '../schemas/graph'
import { LOOP_CUT_MAX_LEGS } from '../schemas/loop-cuts'
import { allBoxes, type Box, type BoxKind } from '../physics/loop/boxes'
import type { BlockData, EditorEdge, EditorNode, LegNode, LineData } from './types'
import { handleIds, helicityText, nodeOf } from './types'
import { bestRotation } from './geometry'
import type { Component, Issue, SlotInfo, Validation } from './validate'
import { helicityAt } from './validate'

export { DIAGRAM_KINDS }
export type DiagramKind = (typeof DIAGRAM_KINDS)[number]
export const diagramKindOf = (g: { kind?: unknown } | null | undefined): DiagramKind => (g?.kind === 'loop-cut' ? 'loop-cut' : 'tree')

export type CornerKind = 'angle' | 'square' | 'block'

/** One drawn ring, read in the engine's orientation (corner q receives line q from corner q−1). */
export interface DrawnRing {
  /** The ring's component id (its first node's id). */
  id: string
  /** 1-based position among the rings on the canvas (reading order of their first nodes). */
  ring: number
  nodeIds: string[]
  legIds: string[]
  /** Per engine corner: the node and its legs (1-based labels, colour order). */
  corners: { nodeId: string, kind: CornerKind, legs: number[] }[]
  /** Per engine line q (into corner q): its edge, and h_q at the outgoing end of corner q−1, null = open. */
  lines: { edgeId: string, helicity: number | null }[]
  /** Index of the box in allBoxes(n), and its kind. */
  box: number
  kind: BoxKind
  /** Per corner 'angle' | 'square' for three-point corners, null for Blocks. */
  threePoint: ('angle' | 'square' | null)[]
}

export interface LoopCutValidation extends Validation {
  rings: DrawnRing[]
  /** Problems of the whole drawing (the process), not of one node. */
  problems: string[]
}

/** Process-level reasons a loop-cut drawing cannot be checked, or null. */
export function loopCutProcessProblem(p: Process | undefined): { field: string, message: string } | null {
  if (!p) return { field: 'graph.process', message: 'set the process (gluons and their helicities) in the header first' }
  if (p.theory !== 'gluon') return { field: 'graph.process.theory', message: `loop cuts are built for colour-ordered gluons; this diagram's theory is ${p.theory}` }
  const n = p.helicities.length
  if (n < 4) return { field: 'graph.process.helicities', message: `a box needs at least 4 legs, got ${n}` }
  if (n > LOOP_CUT_MAX_LEGS) return { field: 'graph.process.helicities', message: `${n} legs exceed the limit of ${LOOP_CUT_MAX_LEGS} for loop cuts` }
  const bad = p.helicities.findIndex(h => h !== 1 && h !== -1)
  if (bad >= 0) return { field: `graph.process.helicities[${bad}]`, message: `gluon helicities are ±1, got ${p.helicities[bad]}` }
  if (p.order && p.order.some((l, i) => l !== i + 1)) return { field: 'graph.process.order', message: 'loop cuts use the colour order 1..n (relabel the legs instead)' }
  return null
}

const cornerWord = (k: CornerKind) => (k === 'block' ? 'Block' : `${k} vertex`)
const legList = (ls: number[]) => ls.join(', ')
const boxText = (corners: number[][]) => corners.map(c => `{${c.join(',')}}`).join('')

/** Checks every ring of a loop-cut canvas and reads it as a box of the process. */
export function validateLoopCut(nodesIn: EditorNode[], edges: EditorEdge[], process?: Process): LoopCutValidation {
  const nodes = new Map(nodesIn.map(n => [n.id, n]))
  const issues: Record<string, Issue[]> = {}
  const edgeIssues: Record<string, Issue[]> = {}
  const problems: string[] = []
  const add = (id: string, message: string, level: Issue['level'] = 'error') => { (issues[id] ??= []).push({ level, message }) }
  const addEdge = (id: string, message: string) => { (edgeIssues[id] ??= []).push({ level: 'error', message }) }
  const pp = loopCutProcessProblem(process)
  if (pp) problems.push(pp.message)
  const n = pp ? 0 : process!.helicities.length

  // Edges at each (node, handle), and the pieces of the canvas by union-find.
  const at = new Map<string, EditorEdge[]>()
  const parent = new Map<string, string>(nodesIn.map(x => [x.id, x.id]))
  const find = (x: string): string => {
    let r = x
    while (parent.get(r) !== r) r = parent.get(r)!
    parent.set(x, r)
    return r
  }
  for (const e of edges) {
    if (!nodes.has(e.source) || !nodes.has(e.target)) continue
    if (e.source === e.target) { add(e.source, 'a line from this node back to itself: join two different corners'); continue }
    for (const [id, h] of [[e.source, e.sourceHandle], [e.target, e.targetHandle]] as const) {
      const key = `${id}|${nodes.get(id)!.type === 'leg' ? 'p' : h ?? ''}`
      const list = at.get(key)
      if (list) list.push(e)
      else at.set(key, [e])
    }
    parent.set(find(e.source), find(e.target))
    const a = nodes.get(e.source)!
    const b = nodes.get(e.target)!
    if (a.type === 'leg' && b.type === 'leg') addEdge(e.id, 'two legs joined directly: attach each leg to a corner')
    const d = (e.data ?? {}) as LineData
    if (a.type !== 'leg' && b.type !== 'leg' && d.helicity !== undefined) {
      if (d.targetHelicity !== undefined && d.targetHelicity !== -d.helicity) addEdge(e.id, `this line joins ${helicityText(d.helicity)} to ${helicityText(d.targetHelicity)}: an internal line joins opposite helicities`)
      if (Math.abs(d.helicity) !== 1) addEdge(e.id, `helicity ${helicityText(d.helicity)} on a gluon line (gluons are ±1)`)
    }
  }

  const slots: Record<string, SlotInfo[]> = {}
  for (const node of nodesIn) {
    if (node.type === 'leg') {
      const d = node.data
      const list = at.get(`${node.id}|p`) ?? []
      if (list.length === 0) add(node.id, `leg ${d.label} is not attached: connect it to a corner`)
      if (list.length > 1) add(node.id, `leg ${d.label} is attached ${list.length} times: an external leg enters exactly one corner`)
      if (n) {
        if (!Number.isInteger(d.label) || d.label < 1 || d.label > n) add(node.id, `leg ${d.label} does not exist (legs are 1..${n})`)
        else if (process!.helicities[d.label - 1] !== d.helicity) add(node.id, `leg ${d.label} is ${helicityText(d.helicity)} here but ${helicityText(process!.helicities[d.label - 1]!)} in the process`)
      }
      continue
    }
    slots[node.id] = handleIds(node).map((h) => {
      const list = at.get(`${node.id}|${h}`) ?? []
      const e = list[0]
      let other: SlotInfo['other'] = null
      if (e) {
        const oid = e.source === node.id ? e.target : e.source
        const o = nodes.get(oid)!
        other = o.type === 'leg' ? { kind: 'leg', label: o.data.label, nodeId: oid } : { kind: 'line', nodeId: oid, edgeId: e.id }
      }
      return { handle: h, edges: list, helicity: e ? helicityAt(e, node.id, nodes) : null, other }
    })
  }

  // Pieces in reading order of their first node.
  const pieces = new Map<string, EditorNode[]>()
  for (const node of nodesIn) {
    const r = find(node.id)
    const list = pieces.get(r)
    if (list) list.push(node)
    else pieces.set(r, [node])
  }
  const components: Component[] = []
  const rings: DrawnRing[] = []
  const boxes = n ? allBoxes(n) : []
  let ringNo = 0
  for (const members of pieces.values()) {
    const cornerNodes = members.filter(x => x.type !== 'leg')
    const legNodes = members.filter((x): x is LegNode => x.type === 'leg')
    const id = members[0]!.id
    const lineIds = edges.filter(e => cornerNodes.some(c => c.id === e.source) && nodes.get(e.target)?.type !== 'leg' && nodes.get(e.source)?.type !== 'leg').map(e => e.id)
    components.push({ id, nodeIds: members.map(x => x.id), legIds: legNodes.map(x => x.id), labels: legNodes.map(x => x.data.label), lineIds, isTree: false })
    if (!cornerNodes.length) continue
    ringNo++
    const ring = readRing(cornerNodes, slots, nodes, add)
    if (!ring) continue
    if (!n) continue
    // every leg of the process once, in colour order round the ring
    const labels = ring.flatMap(c => c.legs)
    const seen = new Map<number, number>()
    for (const l of labels) seen.set(l, (seen.get(l) ?? 0) + 1)
    const missing = Array.from({ length: n }, (_, i) => i + 1).filter(l => !seen.has(l))
    const twice = [...seen].filter(([, k]) => k > 1).map(([l]) => l)
    if (twice.length) { for (const c of ring) if (c.legs.some(l => twice.includes(l))) add(c.nodeId, `leg${twice.length > 1 ? 's' : ''} ${legList(twice)} appear${twice.length > 1 ? '' : 's'} more than once in this ring: every external leg sits on exactly one corner`); continue }
    if (missing.length) { add(ring[0]!.nodeId, `this ring lacks leg${missing.length > 1 ? 's' : ''} ${legList(missing)}: every external leg sits on exactly one corner`); continue }
    const order = ringOrder(ring, n)
    if (!order) {
      const where = ring.find(c => c.legs.some((l, i) => i > 0 && l !== (c.legs[i - 1]! % n) + 1)) ?? ring[0]!
      add(where.nodeId, `the legs round this ring (${legList(labels)}) are not in colour order 1..${n} in either direction: move legs so that neighbouring corners carry neighbouring legs`)
      continue
    }
    const { corners } = order
    const boxIdx = boxes.findIndex(b => b.corners.every((c, q) => c.length === corners[q]!.legs.length && c.every((e, t) => e + 1 === corners[q]!.legs[t])))
    if (boxIdx < 0) { add(corners[0]!.nodeId, `corners ${boxText(corners.map(c => c.legs))} are not a box of this process`); continue }
    const threePoint = corners.map(c => (c.kind === 'block' ? null : c.kind))
    const lines = cornerRules(corners, order.lines, threePoint, slots, add)
    blockLegRule(corners, slots, nodes, add)
    const legIds = legNodes.map(x => x.id)
    rings.push({ id, ring: ringNo, nodeIds: members.map(x => x.id), legIds, corners, lines, box: boxIdx, kind: boxes[boxIdx]!.kind, threePoint })
  }
  // a box drawn twice with overlapping internal helicities would count its terms twice
  for (let a = 0; a < rings.length; a++)
    for (let b = 0; b < a; b++) {
      const A = rings[a]!
      const B = rings[b]!
      if (A.box !== B.box) continue
      const overlap = A.lines.every((l, q) => l.helicity === null || B.lines[q]!.helicity === null || l.helicity === B.lines[q]!.helicity)
      if (overlap) add(A.corners[0]!.nodeId, `box ${boxText(A.corners.map(c => c.legs))} is drawn twice (rings ${B.ring} and ${A.ring}) with overlapping internal helicities: its terms would count twice`)
    }
  const errorCount = Object.values(issues).reduce((k, l) => k + l.filter(i => i.level === 'error').length, 0)
    + Object.values(edgeIssues).reduce((k, l) => k + l.length, 0) + problems.length
  return { nodes: issues, edges: edgeIssues, components, slots, errorCount, drawing: { shift: null, terms: [], issues: [] }, rings, problems }
}

interface RingCorner { nodeId: string, kind: CornerKind, legs: number[], inEdge: string, outEdge: string }

/**
 * Walks one piece as a ring: four corners, each with two internal Lines to two other corners and
 * the rest of its slots on legs; a Block's legs sit together between its two line slots. Returns
 * the corners in walk order (legs read in the Block's slot order from the line it is entered by),
 * or null after naming what is wrong.
 */
function readRing(cornerNodes: EditorNode[], slots: Record<string, SlotInfo[]>, nodes: Map<string, EditorNode>, add: (id: string, m: string) => void): RingCorner[] | null {
  let ok = true
  const lines = new Map<string, SlotInfo[]>()
  for (const c of cornerNodes) {
    const ss = slots[c.id]!
    const open = ss.filter(s => !s.edges.length).length
    const crowded = ss.filter(s => s.edges.length > 1).length
    const internal = ss.filter(s => s.other?.kind === 'line')
    lines.set(c.id, internal)
    const what = cornerWord(c.type as CornerKind)
    if (c.type === 'block' && ss.length < 3) { add(c.id, `a Block corner needs its two line slots and at least one leg slot (it has ${ss.length} slots)`); ok = false; continue }
    if (open) { add(c.id, `${open} open slot${open > 1 ? 's' : ''} on this ${what}: connect every slot to a leg or a Line`); ok = false }
    if (crowded) { add(c.id, `${crowded} slot${crowded > 1 ? 's' : ''} with more than one connection: one Line or leg per slot`); ok = false }
    if (!open && !crowded && internal.length !== 2) { add(c.id, `a corner of a box has two internal Lines (to its neighbours in the ring); this ${what} has ${internal.length}`); ok = false }
  }
  if (!ok) return null
  if (cornerNodes.length !== 4) {
    const shape = cornerNodes.length === 3 ? 'a triangle' : cornerNodes.length === 2 ? 'a bubble' : cornerNodes.length === 1 ? 'a tadpole' : `a ring of ${cornerNodes.length} corners`
    for (const c of cornerNodes) add(c.id, `this is ${shape}, not a box: a quadruple cut has exactly four corners`)
    return null
  }
  // walk from the first corner along its first line
  const first = cornerNodes[0]!
  const out: RingCorner[] = []
  let prevEdge = lines.get(first.id)![1]!.other as { nodeId: string, edgeId: string }
  let cur = first.id
  for (let step = 0; step < 4; step++) {
    const ls = lines.get(cur)!
    const inSlot = ls.find(s => (s.other as { edgeId: string }).edgeId === prevEdge.edgeId) ?? ls[0]!
    const outSlot = ls.find(s => s !== inSlot)!
    const node = nodes.get(cur)!
    const ss = slots[cur]!
    const k = ss.length
    const iIn = ss.indexOf(inSlot)
    const iOut = ss.indexOf(outSlot)
    // legs between the two line slots, going up from the in slot, or (the other arc) down from it
    const up: SlotInfo[] = []
    for (let t = (iIn + 1) % k; t !== iOut; t = (t + 1) % k) up.push(ss[t]!)
    const down: SlotInfo[] = []
    for (let t = (iIn - 1 + k) % k; t !== iOut; t = (t - 1 + k) % k) down.push(ss[t]!)
    if (up.length && down.length) { add(cur, 'the two Lines of this Block must sit on neighbouring slots, with all its legs together between them (colour order)'); return null }
    const legs = (up.length ? up : down).map(s => (s.other as { label: number }).label)
    if (!legs.length) { add(cur, 'a corner without an external leg is not a box corner: put at least one leg on it'); return null }
    out.push({ nodeId: cur, kind: node.type as CornerKind, legs, inEdge: (inSlot.other as { edgeId: string }).edgeId, outEdge: (outSlot.other as { edgeId: string }).edgeId })
    const next = outSlot.other as { nodeId: string, edgeId: string }
    prevEdge = next
    cur = next.nodeId
    if (step < 3 && cur === first.id) break
  }
  if (out.length !== 4 || cur !== first.id || new Set(out.map(c => c.nodeId)).size !== 4) {
    for (const c of cornerNodes) add(c.id, 'the four corners do not close into one ring: join each corner to its two neighbours, once each')
    return null
  }
  return out
}

/**
 * The ring read in colour order: the direction (walk or reverse) in which the legs run 1..n
 * cyclically, rotated so corner 0 is the engine's first corner of that box; per line the helicity
 * at the end of the corner it leaves. Null when no direction is in colour order.
 */
function ringOrder(ring: RingCorner[], n: number): { corners: DrawnRing['corners'], lines: { edgeId: string, from: string }[] } | null {
  for (const dir of [1, -1]) {
    const seq = dir === 1 ? ring : [...ring].reverse()
    const cs = seq.map(c => ({ nodeId: c.nodeId, kind: c.kind, legs: dir === 1 ? c.legs : [...c.legs].reverse(), into: dir === 1 ? c.inEdge : c.outEdge }))
    const labels = cs.flatMap(c => c.legs)
    if (!labels.every((l, i) => i === 0 || l === (labels[i - 1]! % n) + 1)) continue
    // the engine's boxes start at the corner whose legs start lowest (allBoxes: first cut a < b < c < d)
    let start = 0
    for (let q = 1; q < 4; q++) if (cs[q]!.legs[0]! < cs[start]!.legs[0]!) start = q
    const rot = [0, 1, 2, 3].map(q => cs[(q + start) % 4]!)
    return {
      corners: rot.map(({ nodeId, kind, legs }) => ({ nodeId, kind, legs })),
      lines: rot.map((c, q) => ({ edgeId: c.into, from: rot[(q + 3) % 4]!.nodeId })),
    }
  }
  return null
}

/**
 * Per corner: a three-point corner's kind must be the one the cut solution allows (neighbouring
 * three-point corners alternate, opposite ones agree: the two solutions are parity conjugates,
 * docs/conventions.md "Loop-cut drawings"), and drawn helicities must fit its kind and close.
 * Writes the lines' helicities (null = open) in the engine's orientation into `lines`.
 */
function cornerRules(corners: DrawnRing['corners'], linesIn: { edgeId: string, from: string }[], threePoint: ('angle' | 'square' | null)[], slots: Record<string, SlotInfo[]>, add: (id: string, m: string) => void): DrawnRing['lines'] {
  const lines = linesIn.map((l) => {
    const s = slots[l.from]!.find(x => x.other?.kind === 'line' && x.other.edgeId === l.edgeId)
    return { edgeId: l.edgeId, helicity: s?.helicity ?? null }
  })
  // the solution the drawing shows: the one most three-point corners fit (ties: the first corner's)
  const kindAt = (q: number, s: number) => ((q + s) % 2 === 0 ? 'angle' : 'square')
  const misfits = (s: number) => threePoint.filter((k, q) => k && k !== kindAt(q, s)).length
  const firstQ = threePoint.findIndex(k => k !== null)
  if (firstQ >= 0) {
    const own = threePoint[firstQ] === kindAt(firstQ, 0) ? 0 : 1
    const s = misfits(1 - own) < misfits(own) ? 1 - own : own
    threePoint.forEach((k, q) => {
      if (k && k !== kindAt(q, s)) add(corners[q]!.nodeId, `the cut makes this corner a ${kindAt(q, s)} vertex (neighbouring three-point corners alternate, opposite ones agree): swap its kind`)
    })
  }
  for (const c of corners) {
    if (c.kind === 'block') continue
    const s = slots[c.nodeId]!
    const hs = s.map(x => x.helicity)
    const open = hs.filter(h => h === null).length
    const fixed = hs.filter((h): h is number => h !== null)
    // the sums the open lines could still make: angle needs Σh = −1, square Σh = +1 (gluons: no all-equal vertex)
    const want = c.kind === 'angle' ? -1 : 1
    const base = fixed.reduce((a, b) => a + b, 0)
    const reachable = Array.from({ length: open + 1 }, (_, m) => base + open - 2 * m)
    if (!reachable.includes(want)) add(c.nodeId, `an ${c.kind} vertex of gluons needs ${c.kind === 'angle' ? 'two − and one +' : 'one − and two +'}; here ${hs.map(h => (h === null ? 'open' : helicityText(h))).join(', ')}`)
  }
  return lines
}

/** A Block corner's helicities at its leg slots are its legs' (its line slots are read from the Lines). */
function blockLegRule(corners: DrawnRing['corners'], slots: Record<string, SlotInfo[]>, nodes: Map<string, EditorNode>, add: (id: string, m: string) => void) {
  for (const c of corners) {
    if (c.kind !== 'block') continue
    for (const s of slots[c.nodeId]!) {
      if (s.other?.kind !== 'leg') continue
      const nd = nodes.get(c.nodeId)!
      const own = nd.type === 'block' ? nd.data.helicities?.[Number(s.handle.slice(1))] : undefined
      if (own !== undefined && s.helicity !== null && own !== s.helicity) add(c.nodeId, `slot ${s.handle} of this Block is ${helicityText(own)} but leg ${s.other.label} is ${helicityText(s.helicity)}`)
    }
  }
}

// ---- generating boxes ----

const CORNER_AT = [{ x: 0, y: 0 }, { x: 380, y: 0 }, { x: 380, y: 280 }, { x: 0, y: 280 }]
/** Which side of the corner faces the ring's inside and which the outside, per corner position. */
const OUTSIDE: ('left' | 'right')[] = ['left', 'right', 'right', 'left']
/** Three-point slot positions (in, leg, out) per corner position (docs: vertex slots left, upper right, lower right). */
const VERTEX_SLOTS = [[2, 0, 1], [0, 1, 2], [1, 2, 0], [2, 0, 1]]
export const RING_CELL = { width: 760, height: 460 }

const ringColumns = (count: number) => Math.max(1, Math.ceil(Math.sqrt(count * 1.6)))
const cellOrigin = (idx: number, cols: number, origin = { x: 0, y: 0 }) => ({ x: origin.x + (idx % cols) * RING_CELL.width + 150, y: origin.y + Math.floor(idx / cols) * RING_CELL.height + 90 })
/** Where corner q of a ring sits (a Block a little up and left, it is larger). */
function cornerAt(o: { x: number, y: number }, q: number, legs: number) {
  const x = o.x + CORNER_AT[q]!.x
  const y = o.y + CORNER_AT[q]!.y
  return legs === 1 ? { x, y } : { x: x - 40, y: y - 20 }
}
/** Where leg t of corner q goes: outside the ring, a Block's legs stacked. */
function legAt(o: { x: number, y: number }, q: number, legs: number, t: number) {
  const x = o.x + CORNER_AT[q]!.x
  const y = o.y + CORNER_AT[q]!.y
  const dx = OUTSIDE[q] === 'left' ? -130 : legs === 1 ? 130 : 200
  const dy = legs === 1 ? (q < 2 ? -40 : 40) : -20 + t * 36 - ((legs - 1) * 36) / 2 + 20
  return { x: x + dx, y: y + dy }
}

/** Tidy for a loop cut: every ring that reads as a box moved to its place on the grid (ids, slots and Lines kept). */
export function tidyRings(nodes: EditorNode[], edges: EditorEdge[], process?: Process): EditorNode[] {
  const v = validateLoopCut(nodes, edges, process)
  const cols = ringColumns(v.rings.length)
  const pos = new Map<string, { x: number, y: number }>()
  v.rings.forEach((r, idx) => {
    const o = cellOrigin(idx, cols)
    r.corners.forEach((c, q) => {
      pos.set(c.nodeId, cornerAt(o, q, c.legs.length))
      c.legs.forEach((label, t) => {
        const other = v.slots[c.nodeId]!.find(s => s.other?.kind === 'leg' && s.other.label === label)?.other
        if (other?.kind === 'leg') pos.set(other.nodeId, legAt(o, q, c.legs.length, t))
      })
    })
  })
  return nodes.map(n => (pos.has(n.id) ? { ...n, position: pos.get(n.id)! } : n))
}

let seq = 0
const gid = (p: string) => `${p}${(seq++).toString(36)}`

/**
 * The rings of every box of the process (or of the boxes listed), one labelled ring per box,
 * on a grid. Three-point corners are drawn at one cut solution (the first corner an angle vertex
 * unless a `solution` flips them); Lines are left open, so a check sums every internal helicity
 * and both cut solutions.
 */
export function boxRings(process: Process, which?: number[], origin = { x: 0, y: 0 }): { nodes: EditorNode[], edges: EditorEdge[] } {
  const n = process.helicities.length
  const boxes = allBoxes(n)
  const list = which ?? boxes.map((_, i) => i)
  // a wide canvas: about twice as many columns as rows
  const cols = ringColumns(list.length)
  const nodes: EditorNode[] = []
  const edges: EditorEdge[] = []
  list.forEach((b, idx) => {
    const box = boxes[b]!
    const r = drawBox(process, box, b, cellOrigin(idx, cols, origin))
    nodes.push(...r.nodes)
    edges.push(...r.edges)
  })
  return { nodes, edges }
}

function drawBox(process: Process, box: Box, index: number, o: { x: number, y: number }): { nodes: EditorNode[], edges: EditorEdge[] } {
  const nodes: EditorNode[] = []
  const edges: EditorEdge[] = []
  const firstQ = box.corners.findIndex(c => c.length === 1)
  const ids = box.corners.map(c => gid(c.length === 1 ? 'v' : 'b'))
  // slot handles per corner: in line, legs, out line
  const handles = box.corners.map((c, q) => {
    if (c.length === 1) return VERTEX_SLOTS[q]!.map(t => `h${t}`)
    return Array.from({ length: c.length + 2 }, (_, t) => `h${t}`)
  })
  box.corners.forEach((legs, q) => {
    const at = cornerAt(o, q, legs.length)
    const meta = { ring: index + 1 }
    if (legs.length === 1) {
      const kind = (q - firstQ) % 2 === 0 ? 'angle' : 'square'
      nodes.push(nodeOf(ids[q]!, kind, at, meta))
    }
    else {
      const k = legs.length + 2
      const inside = OUTSIDE[q] === 'left' ? 'right' : 'left'
      const want = Array.from({ length: k }, (_, t) => (t === 0 || t === k - 1 ? inside : OUTSIDE[q]!))
      const helicities = [1, ...legs.map(e => process.helicities[e]!), 1]
      nodes.push(nodeOf(ids[q]!, 'block', at, { ...meta, helicities, legs: ['ℓ', ...legs.map(e => String(e + 1)), 'ℓ'], rot: bestRotation('block', k, want) } satisfies BlockData & Record<string, unknown>))
    }
    legs.forEach((e, t) => {
      const lid = gid('l')
      nodes.push(nodeOf(lid, 'leg', legAt(o, q, legs.length, t), { label: e + 1, helicity: process.helicities[e]!, ring: index + 1 }))
      edges.push({ id: gid('e'), source: lid, target: ids[q]!, sourceHandle: 'p', targetHandle: handles[q]![legs.length === 1 ? 1 : t + 1]!, type: 'line', data: { external: true } })
    })
  })
  // line q+1 leaves corner q (its out slot) into corner q+1 (its in slot); open helicity
  for (let q = 0; q < 4; q++) {
    const next = (q + 1) % 4
    const outH = handles[q]!.at(-1)!
    const inH = handles[next]![0]!
    edges.push({ id: gid('e'), source: ids[q]!, target: ids[next]!, sourceHandle: outH, targetHandle: inH, type: 'line', data: {} })
  }
  return { nodes, edges }
}

/** "box 3 · one-mass · {1}{2}{3}{4,5}": the ring's label on the canvas and in the results. */
export function ringLabel(r: Pick<DrawnRing, 'box' | 'kind' | 'corners'>): string {
  return `box ${r.box + 1} · ${r.kind} · ${boxText(r.corners.map(c => c.legs))}`
}
