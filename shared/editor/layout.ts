// Automatic layout of the canvas: each connected component (one term of the residue sum) is laid
// out left to right by dagre, then the components are packed in rows. Pure: nodes in, positions
// out. dagre reports node centres; Vue Flow positions are top-left corners.
import { Graph, layout } from '@dagrejs/dagre'
import type { EditorEdge, EditorNode } from './types'
import { handleLayout, nodeSize } from './geometry'

export interface LayoutOptions {
  /** Row width before the next component wraps to a new row. */
  maxRowWidth?: number
  gap?: number
  nodesep?: number
  ranksep?: number
  origin?: { x: number, y: number }
}

/** Connected components in first-appearance order (ids). */
export function components(nodes: EditorNode[], edges: EditorEdge[]): string[][] {
  const parent = new Map(nodes.map(n => [n.id, n.id]))
  const find = (x: string): string => {
    let r = x
    while (parent.get(r) !== r) r = parent.get(r)!
    parent.set(x, r)
    return r
  }
  for (const e of edges) if (parent.has(e.source) && parent.has(e.target)) parent.set(find(e.source), find(e.target))
  const groups = new Map<string, string[]>()
  for (const n of nodes) {
    const r = find(n.id)
    const g = groups.get(r)
    if (g) g.push(n.id)
    else groups.set(r, [n.id])
  }
  return [...groups.values()]
}

const sideOf = (n: EditorNode | undefined, handle: string | null | undefined) => (n ? handleLayout(n).find(h => h.id === handle)?.side : undefined)

/**
 * Which way an edge runs for the layout, so a node lands on the side of the handle it joins: a leg
 * on a left-side slot goes left of its vertex, on a right-side slot right of it.
 */
function orient(e: EditorEdge, byId: Map<string, EditorNode>): [string, string] {
  const a = byId.get(e.source)
  const b = byId.get(e.target)
  // A term's top-level Line runs from its left side (A_L, path "L…") to its right side (A_R).
  const side = (n: EditorNode | undefined) => (n?.type === 'leg' ? undefined : String((n?.data as { path?: string } | undefined)?.path ?? '')[0])
  if (side(a) === 'L' && side(b) === 'R') return [e.source, e.target]
  if (side(a) === 'R' && side(b) === 'L') return [e.target, e.source]
  const sa = a?.type === 'leg' ? undefined : sideOf(a, e.sourceHandle)
  const sb = b?.type === 'leg' ? undefined : sideOf(b, e.targetHandle)
  if (a?.type === 'leg') return sb === 'right' ? [e.target, e.source] : [e.source, e.target]
  if (b?.type === 'leg') return sa === 'left' ? [e.target, e.source] : [e.source, e.target]
  if (sa === 'left' && sb !== 'left') return [e.target, e.source]
  return [e.source, e.target]
}

/**
 * External legs hanging off one vertex or Block on one side keep the cyclic order of the slots
 * they join: dagre places them by rank only, so two legs often cross on their way in. Their rows
 * are exchanged so the upper slot gets the upper leg.
 */
function untangleLegs(ids: string[], edges: EditorEdge[], byId: Map<string, EditorNode>, local: Map<string, { x: number, y: number }>, stub?: Stub) {
  const inside = new Set(ids)
  const degree = new Map<string, number>()
  for (const e of edges) {
    if (!inside.has(e.source) || !inside.has(e.target)) continue
    degree.set(e.source, (degree.get(e.source) ?? 0) + 1)
    degree.set(e.target, (degree.get(e.target) ?? 0) + 1)
  }
  const groups = new Map<string, { leg: string, slotY: number }[]>()
  for (const e of edges) {
    if (!inside.has(e.source) || !inside.has(e.target)) continue
    const [legId, hubId, handle] = byId.get(e.source)?.type === 'leg' ? [e.source, e.target, e.targetHandle] : [e.target, e.source, e.sourceHandle]
    const hub = byId.get(hubId)
    if (byId.get(legId)?.type !== 'leg' || !hub || hub.type === 'leg' || degree.get(legId) !== 1) continue
    const h = handleLayout(hub).find(x => x.id === handle)
    if (!h) continue
    const key = `${hubId}:${h.side}`
    const g = groups.get(key) ?? []
    g.push({ leg: legId, slotY: h.y })
    groups.set(key, g)
  }
  // The top-level Line's way out takes its slot's row like a leg, so it crosses no leg either.
  const stubHub = stub && byId.get(stub.hub)
  const stubSlot = stubHub && handleLayout(stubHub).find(x => x.id === stub!.handle)
  if (stubSlot && local.has(STUB_ID)) {
    const key = `${stub!.hub}:${stubSlot.side}`
    groups.set(key, [...(groups.get(key) ?? []), { leg: STUB_ID, slotY: stubSlot.y }])
  }
  for (const g of groups.values()) {
    if (g.length < 2) continue
    const rows = g.map(x => ({ ...local.get(x.leg)! })).sort((a, b) => a.y - b.y)
    const bySlot = [...g].sort((a, b) => a.slotY - b.slotY)
    bySlot.forEach((x, k) => { local.set(x.leg, { x: local.get(x.leg)!.x, y: rows[k]!.y }) })
  }
}

type Local = { pos: Map<string, { x: number, y: number }>, w: number, h: number, stubY?: number }

// dagre's result depends only on the node sizes and the oriented edges in insertion order, so a
// shape met before (every re-layout of a canvas: the next expansion step, undo, a re-expand) is not
// laid out again. The 8 groups of a fully expanded 8-gluon NMHV are 8 different shapes, so the
// first layout of a canvas gains nothing.
const shapes = new Map<string, { x: number, y: number, width: number, height: number }[]>()
const SHAPES_KEPT = 500

/**
 * Where one side of a term meets the other: the node the top-level Line leaves from and whether
 * that Line runs out to the right (left side) or in from the left (right side).
 */
type Stub = { hub: string, handle: string | null | undefined, out: boolean }
const STUB_ID = '\u0000stub'
// A stand-in for the other side, as tall as a leg, so a leg in the Line's rank is set beside the
// Line instead of on it.
const STUB = { width: 2, height: 44 }

/** The dagre layout (centres and sizes, in the order of ids; the stub last) of one group's shape. */
function dagreShape(ids: string[], edges: EditorEdge[], byId: Map<string, EditorNode>, nodesep: number, ranksep: number, stub?: Stub) {
  const index = new Map(ids.map((id, k) => [id, k]))
  const sizes = ids.map(id => nodeSize(byId.get(id)!))
  const pairs: [number, number][] = []
  for (const e of edges) {
    if (!index.has(e.source) || !index.has(e.target) || e.source === e.target) continue
    const [a, b] = orient(e, byId)
    pairs.push([index.get(a)!, index.get(b)!])
  }
  if (stub && index.has(stub.hub)) {
    sizes.push(STUB)
    pairs.push(stub.out ? [index.get(stub.hub)!, ids.length] : [ids.length, index.get(stub.hub)!])
  }
  const key = `${nodesep},${ranksep}|${sizes.map(z => `${z.width}x${z.height}`).join(',')}|${pairs.map(([a, b]) => `${a}>${b}`).join(',')}`
  const hit = shapes.get(key)
  if (hit) return hit
  const g = new Graph()
  g.setGraph({ rankdir: 'LR', nodesep, ranksep, marginx: 0, marginy: 0 })
  g.setDefaultEdgeLabel(() => ({}))
  sizes.forEach((z, k) => g.setNode(String(k), { ...z }))
  for (const [a, b] of pairs) g.setEdge(String(a), String(b))
  // No incremental re-layout state: each call lays out a fresh graph (and is faster without it).
  layout(g, { useDynamic: false })
  const out = sizes.map((_, k) => {
    const p = g.node(String(k)) as { x: number, y: number, width: number, height: number }
    return { x: p.x, y: p.y, width: p.width, height: p.height }
  })
  if (shapes.size >= SHAPES_KEPT) shapes.clear()
  shapes.set(key, out)
  return out
}

/** One group of nodes laid out left to right by dagre, with top-left positions from (0, 0). */
function layoutGroup(ids: string[], edges: EditorEdge[], byId: Map<string, EditorNode>, nodesep: number, ranksep: number, stub?: Stub): Local {
  const placed = dagreShape(ids, edges, byId, nodesep, ranksep, stub)
  let minX = Infinity
  let minY = Infinity
  let maxX = -Infinity
  let maxY = -Infinity
  const local = new Map<string, { x: number, y: number }>()
  ids.forEach((id, k) => {
    const p = placed[k]!
    const tl = { x: p.x - p.width / 2, y: p.y - p.height / 2 }
    local.set(id, tl)
    minX = Math.min(minX, tl.x)
    minY = Math.min(minY, tl.y)
    maxX = Math.max(maxX, tl.x + p.width)
    maxY = Math.max(maxY, tl.y + p.height)
  })
  // The stub only reserves room; it is not drawn and does not widen the group.
  const s = placed[ids.length]
  if (s) local.set(STUB_ID, { x: s.x - s.width / 2, y: s.y - s.height / 2 })
  untangleLegs(ids, edges, byId, local, stub)
  const stubY = s && local.get(STUB_ID)!.y + s.height / 2 - minY
  local.delete(STUB_ID)
  for (const [id, p] of local) local.set(id, { x: p.x - minX, y: p.y - minY })
  return { pos: local, w: maxX - minX, h: maxY - minY, ...(stubY !== undefined ? { stubY } : {}) }
}

/**
 * The two sides of a term drawn by an expansion (nodes carry their path "L…" / "R…"), each with
 * its own legs; null for a hand-built component.
 */
function sidesOf(ids: string[], edges: EditorEdge[], byId: Map<string, EditorNode>): [string[], string[]] | null {
  const side = new Map<string, string>()
  for (const id of ids) {
    const n = byId.get(id)!
    if (n.type === 'leg') continue
    const s = String((n.data as { path?: string }).path ?? '')[0]
    if (s !== 'L' && s !== 'R') return null
    side.set(id, s)
  }
  for (const e of edges) {
    const [leg, hub] = byId.get(e.source)?.type === 'leg' ? [e.source, e.target] : [e.target, e.source]
    if (byId.get(leg)?.type === 'leg' && side.has(hub)) side.set(leg, side.get(hub)!)
  }
  const L = ids.filter(id => side.get(id) === 'L')
  const R = ids.filter(id => side.get(id) === 'R')
  return L.length && R.length && L.length + R.length === ids.length ? [L, R] : null
}

/** The top-level Line's ends [left hub, right hub, their handles]: the one edge joining the sides. */
function topLine(sides: [string[], string[]], edges: EditorEdge[]) {
  const L = new Set(sides[0])
  const R = new Set(sides[1])
  const e = edges.find(x => (L.has(x.source) && R.has(x.target)) || (R.has(x.source) && L.has(x.target)))
  if (!e) return undefined
  return L.has(e.source) ? [e.source, e.target, e.sourceHandle, e.targetHandle] as const : [e.target, e.source, e.targetHandle, e.sourceHandle] as const
}

/** Top-left positions for every node. */
export function layoutPositions(nodes: EditorNode[], edges: EditorEdge[], opts: LayoutOptions = {}): Map<string, { x: number, y: number }> {
  const { maxRowWidth = 1500, gap = 70, nodesep = 28, ranksep = 78, origin = { x: 0, y: 0 } } = opts
  const byId = new Map(nodes.map(n => [n.id, n]))
  const out = new Map<string, { x: number, y: number }>()
  let x = origin.x
  let y = origin.y
  let rowHeight = 0
  for (const ids of components(nodes, edges)) {
    // A term's left side left of its right side, each laid out on its own, centred on each other.
    const sides = sidesOf(ids, edges, byId)
    let local: Local
    if (sides) {
      const line = topLine(sides, edges)
      const L = layoutGroup(sides[0], edges, byId, nodesep, ranksep, line && { hub: line[0], handle: line[2], out: true })
      const R = layoutGroup(sides[1], edges, byId, nodesep, ranksep, line && { hub: line[1], handle: line[3], out: false })
      // The two ends of the top-level Line at one height (else the sides centred on each other).
      const dy = L.stubY !== undefined && R.stubY !== undefined ? L.stubY - R.stubY : (L.h - R.h) / 2
      const top = Math.min(0, dy)
      const h = Math.max(L.h, R.h + dy) - top
      const pos = new Map<string, { x: number, y: number }>()
      for (const [id, p] of L.pos) pos.set(id, { x: p.x, y: p.y - top })
      for (const [id, p] of R.pos) pos.set(id, { x: p.x + L.w + ranksep, y: p.y + dy - top })
      local = { pos, w: L.w + ranksep + R.w, h }
    }
    else local = layoutGroup(ids, edges, byId, nodesep, ranksep)
    if (x > origin.x && x + local.w > origin.x + maxRowWidth) {
      x = origin.x
      y += rowHeight + gap
      rowHeight = 0
    }
    for (const [id, p] of local.pos) out.set(id, { x: Math.round(x + p.x), y: Math.round(y + p.y) })
    x += local.w + gap
    rowHeight = Math.max(rowHeight, local.h)
  }
  return out
}

/** The nodes with laid-out positions (new objects; the input is not changed). */
export function layoutGraph(nodes: EditorNode[], edges: EditorEdge[], opts: LayoutOptions = {}): EditorNode[] {
  const pos = layoutPositions(nodes, edges, opts)
  return nodes.map(n => ({ ...n, position: pos.get(n.id) ?? n.position }))
}
