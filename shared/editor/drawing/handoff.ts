// The graph a drawing check hands to a worker thread, as two flat arrays: postMessage's structured
// clone copies a flat array of primitives several times faster than a hundred small objects (the
// 8-gluon NMHV canvas: 0.03 ms against 0.16 ms, bench/drawing.ts). Only what the compiler reads
// crosses (drawingGraph's fields); a value is carried as it is, so the worker sees the graph exactly
// as drawingGraph gives it and validation names the same things wrong.
import { PhysicsError } from '../../physics/errors'
import type { EditorEdge, EditorNode, NodeKind } from '../types'
import { nodeOf } from '../types'

/** Nodes: stride 4 (id, kind, a, b); edges: stride 9 (id, source, target, handles, line data). */
export interface PackedGraph {
  v: 1
  /** Per node: id, kind (0 leg, 1 angle, 2 square, 3 block), leg label or Block helicities, leg helicity. */
  nodes: unknown[]
  /** Per edge: id, source, target (a node's index, or the id when no node has it), sourceHandle, targetHandle, helicity, targetHelicity, line, external. */
  edges: unknown[]
}

const KINDS: readonly NodeKind[] = ['leg', 'angle', 'square', 'block']
const KIND_CODE: Record<string, number> = { leg: 0, angle: 1, square: 2, block: 3 }
const NODE = 4
const EDGE = 9

/** The graph as drawingGraph reads it, packed for postMessage. */
export function packDrawingGraph(g: { nodes?: EditorNode[], edges?: EditorEdge[] }): PackedGraph {
  const nodesIn = g.nodes ?? []
  const edgesIn = g.edges ?? []
  const nodes: unknown[] = new Array(nodesIn.length * NODE)
  const index = new Map<string, number>()
  nodesIn.forEach((n, k) => {
    const d = (n.data ?? {}) as Record<string, unknown>
    const o = k * NODE
    nodes[o] = n.id
    nodes[o + 1] = KIND_CODE[n.type] ?? n.type
    nodes[o + 2] = n.type === 'leg' ? d.label : n.type === 'block' ? d.helicities : undefined
    nodes[o + 3] = n.type === 'leg' ? d.helicity : undefined
    if (!index.has(n.id)) index.set(n.id, k)
  })
  const edges: unknown[] = new Array(edgesIn.length * EDGE)
  edgesIn.forEach((e, k) => {
    const d = (e.data ?? {}) as Record<string, unknown>
    const o = k * EDGE
    edges[o] = e.id
    edges[o + 1] = index.get(e.source) ?? e.source
    edges[o + 2] = index.get(e.target) ?? e.target
    edges[o + 3] = e.sourceHandle ?? null
    edges[o + 4] = e.targetHandle ?? null
    edges[o + 5] = d.helicity
    edges[o + 6] = d.targetHelicity
    edges[o + 7] = d.line
    edges[o + 8] = d.external
  })
  return { v: 1, nodes, edges }
}

const bad = (field: string, why: string) => new PhysicsError(`graph.${field}`, why)

/** The graph back from its packed form (what drawingGraph gives); a malformed one names the field. */
export function unpackDrawingGraph(p: PackedGraph): { nodes: EditorNode[], edges: EditorEdge[] } {
  if (!p || typeof p !== 'object' || p.v !== 1 || !Array.isArray(p.nodes) || !Array.isArray(p.edges)) throw new PhysicsError('graph', 'graph: not a packed drawing graph')
  if (p.nodes.length % NODE !== 0) throw bad('nodes', `${p.nodes.length} entries, not a multiple of ${NODE}`)
  if (p.edges.length % EDGE !== 0) throw bad('edges', `${p.edges.length} entries, not a multiple of ${EDGE}`)
  const nodes: EditorNode[] = new Array(p.nodes.length / NODE)
  const at = { x: 0, y: 0 }
  for (let k = 0, o = 0; o < p.nodes.length; k++, o += NODE) {
    const id = p.nodes[o]
    const kind = KINDS[p.nodes[o + 1] as number]
    if (typeof id !== 'string') throw bad(`nodes.${k}.id`, 'must be a string')
    if (!kind) throw bad(`nodes.${k}.type`, 'must be leg, angle, square or block')
    const data: Record<string, unknown> = {}
    if (kind === 'leg') {
      if (p.nodes[o + 2] !== undefined) data.label = p.nodes[o + 2]
      if (p.nodes[o + 3] !== undefined) data.helicity = p.nodes[o + 3]
    }
    else if (kind === 'block' && p.nodes[o + 2] !== undefined) data.helicities = p.nodes[o + 2]
    nodes[k] = nodeOf(id, kind, at, data)
  }
  const edges: EditorEdge[] = new Array(p.edges.length / EDGE)
  const end = (v: unknown, k: number, which: 'source' | 'target'): string => {
    if (typeof v === 'string') return v
    const n = typeof v === 'number' ? nodes[v] : undefined
    if (!n) throw bad(`edges.${k}.${which}`, 'must be a node index or id')
    return n.id
  }
  const handle = (v: unknown, k: number, which: string): string | null => {
    if (v === null || typeof v === 'string') return v
    throw bad(`edges.${k}.${which}`, 'must be a string or null')
  }
  for (let k = 0, o = 0; o < p.edges.length; k++, o += EDGE) {
    const id = p.edges[o]
    if (typeof id !== 'string') throw bad(`edges.${k}.id`, 'must be a string')
    const data: Record<string, unknown> = {}
    if (p.edges[o + 5] !== undefined) data.helicity = p.edges[o + 5]
    if (p.edges[o + 6] !== undefined) data.targetHelicity = p.edges[o + 6]
    if (p.edges[o + 7] !== undefined) data.line = p.edges[o + 7]
    if (p.edges[o + 8] !== undefined) data.external = p.edges[o + 8]
    edges[k] = { id, source: end(p.edges[o + 1], k, 'source'), target: end(p.edges[o + 2], k, 'target'), sourceHandle: handle(p.edges[o + 3], k, 'sourceHandle'), targetHandle: handle(p.edges[o + 4], k, 'targetHandle'), data }
  }
  return { nodes, edges }
}
