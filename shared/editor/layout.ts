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
  const sa = a?.type === 'leg' ? undefined : sideOf(a, e.sourceHandle)
  const sb = b?.type === 'leg' ? undefined : sideOf(b, e.targetHandle)
  if (a?.type === 'leg') return sb === 'right' ? [e.target, e.source] : [e.source, e.target]
  if (b?.type === 'leg') return sa === 'left' ? [e.target, e.source] : [e.source, e.target]
  if (sa === 'left' && sb !== 'left') return [e.target, e.source]
  return [e.source, e.target]
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
    const inside = new Set(ids)
    const g = new Graph()
    g.setGraph({ rankdir: 'LR', nodesep, ranksep, marginx: 0, marginy: 0 })
    g.setDefaultEdgeLabel(() => ({}))
    for (const id of ids) g.setNode(id, { ...nodeSize(byId.get(id)!) })
    for (const e of edges) {
      if (!inside.has(e.source) || !inside.has(e.target) || e.source === e.target) continue
      const [a, b] = orient(e, byId)
      g.setEdge(a, b)
    }
    // No incremental re-layout state: each call lays out a fresh graph (and is faster without it).
    layout(g, { useDynamic: false })
    let minX = Infinity
    let minY = Infinity
    let maxX = -Infinity
    let maxY = -Infinity
    const local = new Map<string, { x: number, y: number }>()
    for (const id of ids) {
      const p = g.node(id) as { x: number, y: number, width: number, height: number }
      const tl = { x: p.x - p.width / 2, y: p.y - p.height / 2 }
      local.set(id, tl)
      minX = Math.min(minX, tl.x)
      minY = Math.min(minY, tl.y)
      maxX = Math.max(maxX, tl.x + p.width)
      maxY = Math.max(maxY, tl.y + p.height)
    }
    const w = maxX - minX
    const h = maxY - minY
    if (x > origin.x && x + w > origin.x + maxRowWidth) {
      x = origin.x
      y += rowHeight + gap
      rowHeight = 0
    }
    for (const [id, p] of local) out.set(id, { x: Math.round(x + p.x - minX), y: Math.round(y + p.y - minY) })
    x += w + gap
    rowHeight = Math.max(rowHeight, h)
  }
  return out
}

/** The nodes with laid-out positions (new objects; the input is not changed). */
export function layoutGraph(nodes: EditorNode[], edges: EditorEdge[], opts: LayoutOptions = {}): EditorNode[] {
  const pos = layoutPositions(nodes, edges, opts)
  return nodes.map(n => ({ ...n, position: pos.get(n.id) ?? n.position }))
}
