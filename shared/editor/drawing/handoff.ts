// The graph a drawing check hands to a worker thread, packed: postMessage's structured clone copies
// one string and one Float64Array almost for free, where a hundred small objects (or a flat array of
// a thousand short strings) cost as much as the engine's whole check (bench/drawing.ts). Only what
// the compiler reads crosses (drawingGraph's fields), and every value exactly as it is (a number,
// string, boolean, null, absent, or anything else as is), so the worker sees the graph drawingGraph
// gives and validation names the same things wrong.
import { PhysicsError } from '../../physics/errors'
import type { EditorEdge, EditorNode, NodeKind } from '../types'
import { nodeOf } from '../types'

/**
 * `nums` holds, per node, its kind (0 leg, 1 angle, 2 square, 3 block) then its id, and for a leg
 * its label, helicity and species, for a Block its helicities; per edge its id, source, target, handles and
 * line data (helicity, targetHelicity, line, external, species). Each value is a tag and its payload; string
 * payloads are lengths into `text`, values of no simple kind are indices into `other`.
 */
export interface PackedGraph {
  v: 3
  nodeCount: number
  edgeCount: number
  nums: Float64Array
  text: string
  other: unknown[]
}

const KINDS: readonly NodeKind[] = ['leg', 'angle', 'square', 'block']
const KIND_CODE: Record<string, number> = { leg: 0, angle: 1, square: 2, block: 3 }
// Value tags.
const ABSENT = 0
const NULL = 1
const NUM = 2
const STR = 3
const TRUE = 4
const FALSE = 5
const OTHER = 6
const NUMS = 7

const numbersOnly = (v: unknown[]) => {
  for (let t = 0; t < v.length; t++) if (typeof v[t] !== 'number') return false
  return true
}

// One scratch buffer per thread, grown as needed; each pack copies out what it wrote.
let scratch = new Float64Array(4096)

/** The graph as drawingGraph reads it, packed for postMessage. */
export function packDrawingGraph(g: { nodes?: EditorNode[], edges?: EditorEdge[] }): PackedGraph {
  const nodesIn = g.nodes ?? []
  const edgesIn = g.edges ?? []
  // At most 3 numbers per value plus list items: grown before each node or edge when it may not fit.
  let nums = scratch
  let n = 0
  let text = ''
  const other: unknown[] = []
  const room = (k: number) => {
    if (n + k <= nums.length) return
    const next = new Float64Array(Math.max(nums.length * 2, n + k))
    next.set(nums.subarray(0, n))
    scratch = nums = next
  }
  const put = (v: unknown) => {
    if (v === undefined) nums[n++] = ABSENT
    else if (v === null) nums[n++] = NULL
    else if (typeof v === 'number') { nums[n++] = NUM; nums[n++] = v }
    else if (typeof v === 'string') { nums[n++] = STR; nums[n++] = v.length; text += v }
    else if (v === true) nums[n++] = TRUE
    else if (v === false) nums[n++] = FALSE
    else if (Array.isArray(v) && numbersOnly(v)) {
      room(v.length + 2)
      nums[n++] = NUMS
      nums[n++] = v.length
      for (let t = 0; t < v.length; t++) nums[n++] = v[t] as number
    }
    else { nums[n++] = OTHER; nums[n++] = other.length; other.push(v) }
  }
  for (let k = 0; k < nodesIn.length; k++) {
    const nd = nodesIn[k]!
    room(16)
    const d = (nd.data ?? {}) as Record<string, unknown>
    const code = KIND_CODE[nd.type]
    if (code === undefined) { nums[n++] = -1; put(nd.type) }
    else nums[n++] = code
    put(nd.id)
    if (nd.type === 'leg') { put(d.label); put(d.helicity); put(d.species) }
    else if (nd.type === 'block') put(d.helicities)
  }
  for (const e of edgesIn) {
    room(32)
    const d = (e.data ?? {}) as Record<string, unknown>
    put(e.id)
    // Ends as strings: an index of node ids cost more to build than the longer text costs to copy.
    put(e.source)
    put(e.target)
    put(e.sourceHandle ?? null)
    put(e.targetHandle ?? null)
    put(d.helicity)
    put(d.targetHelicity)
    put(d.line)
    put(d.external)
    put(d.species)
  }
  return { v: 3, nodeCount: nodesIn.length, edgeCount: edgesIn.length, nums: nums.slice(0, n), text, other }
}

/** The graph back from its packed form (what drawingGraph gives); a malformed one names the field. */
export function unpackDrawingGraph(p: PackedGraph): { nodes: EditorNode[], edges: EditorEdge[] } {
  if (!p || typeof p !== 'object' || p.v !== 3 || !(p.nums instanceof Float64Array) || typeof p.text !== 'string' || !Array.isArray(p.other)
    || !Number.isInteger(p.nodeCount) || !Number.isInteger(p.edgeCount) || p.nodeCount < 0 || p.edgeCount < 0) throw new PhysicsError('graph', 'not a packed drawing graph')
  const { nums, text, other } = p
  let at = 0
  let pos = 0
  let field = 'graph'
  const fail = (why: string): never => {
    throw new PhysicsError(field, why)
  }
  const num = (): number => (at < nums.length ? nums[at++]! : fail('ends early'))
  const nodes: EditorNode[] = new Array(p.nodeCount)
  const get = (): unknown => {
    const tag = num()
    switch (tag) {
      case ABSENT: return undefined
      case NULL: return null
      case NUM: return num()
      case STR: {
        const len = num()
        if (!Number.isInteger(len) || len < 0 || pos + len > text.length) fail('a string runs past the text')
        return text.slice(pos, (pos += len))
      }
      case TRUE: return true
      case FALSE: return false
      case OTHER: {
        const k = num()
        return Number.isInteger(k) && k >= 0 && k < other.length ? other[k] : fail('no such value')
      }
      case NUMS: {
        const len = num()
        if (!Number.isInteger(len) || len < 0 || at + len > nums.length) fail('a list runs past the numbers')
        const out: number[] = []
        for (let t = 0; t < len; t++) out.push(nums[at++]!)
        return out
      }
      default: return fail(`unknown value tag ${tag}`)
    }
  }
  const str = (f: string): string => {
    field = f
    const v = get()
    return typeof v === 'string' ? v : fail('must be a string')
  }
  const origin = { x: 0, y: 0 }
  for (let k = 0; k < p.nodeCount; k++) {
    field = `graph.nodes.${k}.type`
    const kind = KINDS[num()] ?? fail('must be leg, angle, square or block')
    const id = str(`graph.nodes.${k}.id`)
    const data: Record<string, unknown> = {}
    field = `graph.nodes.${k}.data`
    if (kind === 'leg') {
      const label = get()
      const helicity = get()
      const species = get()
      if (label !== undefined) data.label = label
      if (helicity !== undefined) data.helicity = helicity
      if (species !== undefined) data.species = species
    }
    else if (kind === 'block') {
      const hs = get()
      if (hs !== undefined) data.helicities = hs
    }
    nodes[k] = nodeOf(id, kind, origin, data)
  }
  const edges: EditorEdge[] = new Array(p.edgeCount)
  const handle = (f: string): string | null => {
    field = f
    const v = get()
    return v === null || typeof v === 'string' ? v : fail('must be a string or null')
  }
  for (let k = 0; k < p.edgeCount; k++) {
    const id = str(`graph.edges.${k}.id`)
    const source = str(`graph.edges.${k}.source`)
    const target = str(`graph.edges.${k}.target`)
    const sourceHandle = handle(`graph.edges.${k}.sourceHandle`)
    const targetHandle = handle(`graph.edges.${k}.targetHandle`)
    field = `graph.edges.${k}.data`
    const data: Record<string, unknown> = {}
    const helicity = get()
    const targetHelicity = get()
    const line = get()
    const external = get()
    const species = get()
    if (helicity !== undefined) data.helicity = helicity
    if (targetHelicity !== undefined) data.targetHelicity = targetHelicity
    if (line !== undefined) data.line = line
    if (external !== undefined) data.external = external
    if (species !== undefined) data.species = species
    edges[k] = { id, source, target, sourceHandle, targetHandle, data }
  }
  field = 'graph'
  if (at !== nums.length || pos !== text.length) fail('trailing data after the last edge')
  return { nodes, edges }
}
