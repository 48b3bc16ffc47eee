// The diagram document (a Diagram's `graph`). Versioned; an empty graph is valid.
// The process (theory, helicities, colour order, shift) is optional on save and required
// only when a check runs (see requireProcess).
import { z } from 'zod'
import { boundedExtras, boundedFields } from './json-bounds'
import { THEORY_NAMES } from '../physics/theories'

export const GRAPH_SCHEMA_VERSION = 1

/** What a diagram draws: channel terms of a tree recursion (the default) or one-loop quadruple cuts. */
export const DIAGRAM_KINDS = ['tree', 'loop-cut'] as const

export const TheorySchema = z.enum(THEORY_NAMES, {
  error: `must be ${THEORY_NAMES.slice(0, -1).join(', ')} or ${THEORY_NAMES.at(-1)}`,
})

const finite = z.number().refine(Number.isFinite, { error: 'must be a finite number' })

export const ProcessSchema = z.object({
  theory: TheorySchema,
  spin: z.number().optional(),
  helicities: z.array(finite).min(3, { error: 'needs at least 3 legs' }).max(16, { error: 'at most 16 legs' }),
  /** Species per leg for theory qcd ("g", "q1".."q6", "qbar1".."qbar6"); omitted: all the theory's first species. */
  species: z.array(z.string().max(16)).max(16).optional(),
  /** Colour order as leg labels (1..n); defaults to 1..n. */
  order: z.array(z.number().int().positive()).optional(),
  shift: z.tuple([z.number().int().positive(), z.number().int().positive()]).optional(),
})

export const NodeKindSchema = z.enum(['leg', 'angle', 'square', 'block'])

export const GraphNodeSchema = z.object({
  id: z.string().min(1).max(64),
  type: NodeKindSchema,
  position: z.object({ x: finite, y: finite }),
  data: z.record(z.string(), z.unknown()).superRefine(boundedFields).default({}),
}).loose().superRefine(boundedExtras(['id', 'type', 'position', 'data']))

export const GraphEdgeSchema = z.object({
  id: z.string().min(1).max(128),
  source: z.string().min(1).max(64),
  target: z.string().min(1).max(64),
  sourceHandle: z.string().max(64).nullish(),
  targetHandle: z.string().max(64).nullish(),
  type: z.string().max(32).optional(),
  data: z.record(z.string(), z.unknown()).superRefine(boundedFields).optional(),
}).loose().superRefine(boundedExtras(['id', 'source', 'target', 'sourceHandle', 'targetHandle', 'type', 'data']))

export const GraphSchema = z.object({
  schemaVersion: z.literal(GRAPH_SCHEMA_VERSION, { error: `must be ${GRAPH_SCHEMA_VERSION}` }).optional(),
  /** Absent: 'tree'. */
  kind: z.enum(DIAGRAM_KINDS, { error: `must be ${DIAGRAM_KINDS.join(' or ')}` }).optional(),
  process: ProcessSchema.optional(),
  /** Evaluation settings the editor remembers (kinematics, target, arithmetic). */
  settings: z.record(z.string(), z.unknown()).superRefine(boundedFields).optional(),
  nodes: z.array(GraphNodeSchema).max(3000, { error: 'at most 3000 nodes' }),
  edges: z.array(GraphEdgeSchema).max(6000, { error: 'at most 6000 edges' }),
  viewport: z.object({ x: finite, y: finite, zoom: finite }).optional(),
}).superRefine((g, ctx) => {
  const ids = new Set<string>()
  g.nodes.forEach((node, i) => {
    if (ids.has(node.id)) ctx.addIssue({ code: 'custom', path: ['nodes', i, 'id'], message: `duplicate node id "${node.id}"` })
    ids.add(node.id)
  })
  g.edges.forEach((edge, i) => {
    if (!ids.has(edge.source)) ctx.addIssue({ code: 'custom', path: ['edges', i, 'source'], message: `no node "${edge.source}"` })
    if (!ids.has(edge.target)) ctx.addIssue({ code: 'custom', path: ['edges', i, 'target'], message: `no node "${edge.target}"` })
  })
  if (g.process) {
    const n = g.process.helicities.length
    g.process.order?.forEach((label, i) => {
      if (label > n) ctx.addIssue({ code: 'custom', path: ['process', 'order', i], message: `leg ${label} does not exist (legs are 1..${n})` })
    })
    g.process.shift?.forEach((label, i) => {
      if (label > n) ctx.addIssue({ code: 'custom', path: ['process', 'shift', i], message: `leg ${label} does not exist (legs are 1..${n})` })
    })
  }
})

export type Graph = z.infer<typeof GraphSchema>
export type GraphNode = z.infer<typeof GraphNodeSchema>
export type GraphEdge = z.infer<typeof GraphEdgeSchema>
export type Process = z.infer<typeof ProcessSchema>

/** T without its index signature: the declared fields only. */
type Declared<T> = { [K in keyof T as string extends K ? never : number extends K ? never : K]: T[K] }
/**
 * The graph as a route returns it: nodes and edges with their declared fields (extras pass through
 * untyped). A typed fetch cannot carry an index signature, which would hide every named field.
 */
export type GraphView = Omit<Graph, 'nodes' | 'edges'> & { nodes: Declared<GraphNode>[], edges: Declared<GraphEdge>[] }

export const emptyGraph = (): Graph => ({ schemaVersion: GRAPH_SCHEMA_VERSION, nodes: [], edges: [] })
