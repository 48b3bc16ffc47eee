// The editor's node and edge data (what a Diagram's graph.nodes[].data and graph.edges[].data
// hold). Framework-free so the store, the seed and the unit tests share it.
import type { WireComplex, WireLeg } from '../schemas/evaluate'

export type NodeKind = 'leg' | 'angle' | 'square' | 'block'

/** Where a generated node sits in the term tree: component id and path of its sub-amplitude. */
export interface Origin {
  /** Visual rotation of the slots round the node (the cyclic order stays). */
  rot?: number
  /** Component id (one connected term of the residue sum). */
  comp?: string
  /** Index of the top-level term of the expansion. */
  term?: number
  /** Path of the sub-amplitude in the term tree ("L", "R", "L.0.R", …). */
  path?: string
}

export interface LegData extends Origin {
  /** External leg label 1..n. */
  label: number
  /** Outgoing helicity. */
  helicity: number
  /** Species (theory qcd: "g", "q1", "qbar1", …); absent: the theory's only species, or a gluon. */
  species?: string
}

export interface VertexData extends Origin {
  /** Leg names around the vertex in cyclic order (handles h0, h1, h2), from an expansion. */
  legs?: string[]
  value?: WireComplex
}

export interface BlockData extends Origin {
  /** Helicity at each handle h0..h(k−1), in the block's leg order. */
  helicities: number[]
  legs?: string[]
  /** Number of channel terms below (an expansion's sub-amplitude); 0 or absent: not expandable. */
  terms?: number
  shift?: [number, number]
  value?: WireComplex
}

export interface LineData extends Origin {
  /** Internal on-shell line: helicity at the source end (the target end carries −h unless set). */
  helicity?: number
  targetHelicity?: number
  /** Theory qcd: the species leaving the source end (the target end carries its antiparticle); absent: a gluon. */
  species?: string
  /** Line name from the term tree (L1, L2, …). */
  line?: string
  /** An attachment of an external leg (solid, no badge). */
  external?: boolean
}

interface NodeOf<T extends NodeKind, D> {
  id: string
  type: T
  position: { x: number, y: number }
  /** The kind's data; extra keys a newer version wrote are kept as they are. */
  data: D & Record<string, unknown>
}
export type LegNode = NodeOf<'leg', LegData>
export type AngleNode = NodeOf<'angle', VertexData>
export type SquareNode = NodeOf<'square', VertexData>
export type BlockNode = NodeOf<'block', BlockData>
/** A node of the graph, discriminated by `type`: `n.type === 'leg'` narrows `n.data` to LegData. */
export type EditorNode = LegNode | AngleNode | SquareNode | BlockNode

/** A node from untyped graph data (a saved document, an edit that changes the kind): the one cast. */
export function nodeOf(id: string, type: NodeKind, position: { x: number, y: number }, data: object): EditorNode {
  return { id, type, position, data } as EditorNode
}

export interface EditorEdge {
  id: string
  source: string
  target: string
  sourceHandle?: string | null
  targetHandle?: string | null
  type?: string
  data?: Record<string, unknown>
}

export const legName = (l: WireLeg): string => ('label' in l ? String(l.label) : l.line)

export const sign = (h: number): string => (h > 0 ? '+' : h < 0 ? '−' : '0')

/** "+2", "−1", "0": a helicity as people write it. */
export function helicityText(h: number): string {
  if (h === 0) return '0'
  const a = Math.abs(h)
  const mag = Number.isInteger(a) ? String(a) : `${2 * a}/2`
  return `${h > 0 ? '+' : '−'}${a === 1 ? '' : mag}`
}

/** Number of handles of a node (vertex 3, block k, leg 1). */
export function handleCount(n: EditorNode): number {
  if (n.type === 'leg') return 1
  if (n.type === 'block') return (n.data.helicities ?? []).length
  return 3
}

// One shared list per slot count: validation asks for them on every node of every check.
const HANDLE_IDS: readonly string[][] = Array.from({ length: 65 }, (_, k) => Array.from({ length: k }, (_, t) => `h${t}`))
const LEG_HANDLES: readonly string[] = ['p']

export function handleIds(n: EditorNode): readonly string[] {
  if (n.type === 'leg') return LEG_HANDLES
  const k = handleCount(n)
  return HANDLE_IDS[k] ?? Array.from({ length: k }, (_, t) => `h${t}`)
}
