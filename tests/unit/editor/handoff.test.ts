// The packed graph a drawing check hands to a worker: it must give back exactly what drawingGraph
// gives (every node kind, every edge field, odd values as they are), survive structured clone, and
// name the field of anything malformed. The route's own bounds (sizes, depths) still reject hostile
// bodies before anything is packed.
import { describe, expect, it } from 'vitest'
import { expandedGraph } from '#shared/editor/demo'
import { checkDrawing, drawingGraph, packDrawingGraph, unpackDrawingGraph, type PackedGraph } from '#shared/editor/drawing'
import { evaluateRequest } from '#shared/editor/process'
import type { EditorEdge, EditorNode } from '#shared/editor/types'
import { nodeOf } from '#shared/editor/types'
import { evaluate, PhysicsError } from '#shared/physics/index'
import type { Process } from '#shared/schemas/graph'
import { DrawingCheckSchema } from '#shared/schemas/service'
import { runTask, type Outcome } from '../../../server/workers/tasks'

type G = { nodes: EditorNode[], edges: EditorEdge[] }

const at = { x: 12, y: -3 }
/** Every node kind, edges with and without handles and line data, and values no editor writes. */
const everyKind: G = {
  nodes: [
    nodeOf('a', 'leg', at, { label: 1, helicity: -1, comp: 'c1', rot: 2 }),
    nodeOf('b', 'leg', at, { label: 2, helicity: 1 }),
    nodeOf('q', 'leg', at, { label: 4, helicity: 0.5, species: 'qbar1' }),
    nodeOf('c', 'leg', at, { label: '3', helicity: null }),
    nodeOf('d', 'leg', at, {}),
    nodeOf('v1', 'angle', at, { legs: ['1', '2', 'L1'], value: [1, 2] }),
    nodeOf('v2', 'square', at, {}),
    nodeOf('B', 'block', at, { helicities: [-1, 1, -0, 0.5], terms: 3 }),
    nodeOf('B2', 'block', at, { helicities: { odd: true } }),
    nodeOf('B3', 'block', at, { helicities: [1, 'x'] }),
    nodeOf('é ✓,"\n', 'angle', at, {}),
  ],
  edges: [
    { id: 'e1', source: 'a', target: 'v1', sourceHandle: 'p', targetHandle: 'h0', data: { external: true } },
    { id: 'e2', source: 'v1', target: 'B', sourceHandle: 'h2', targetHandle: 'h1', data: { helicity: -1, targetHelicity: 1, line: 'L1', path: 'L' } },
    { id: 'eq', source: 'v1', target: 'v2', sourceHandle: 'h1', targetHandle: 'h0', data: { helicity: 0.5, targetHelicity: -0.5, line: 'L2', species: 'q1' } },
    { id: 'e3', source: 'v2', target: 'B', data: { helicity: 2, line: '' } },
    { id: 'e4', source: 'b', target: 'ghost', sourceHandle: null, targetHandle: undefined },
    { id: 'e5', source: 'é ✓,"\n', target: 'v2', targetHandle: '', data: { external: false, helicity: Number.NaN, line: { name: 'x' } } },
    { id: '', source: 'c', target: 'c', type: 'line' },
  ],
}

const roundTrip = (g: G) => unpackDrawingGraph(structuredClone(packDrawingGraph(g)))

function fieldOf(f: () => unknown): string {
  try {
    f()
  }
  catch (e) {
    expect(e).toBeInstanceOf(PhysicsError)
    return (e as PhysicsError).field
  }
  throw new Error('no error')
}

describe('packed drawing graph', () => {
  it('gives back what drawingGraph gives, for every node kind and edge field', () => {
    expect(roundTrip(everyKind)).toEqual(drawingGraph(everyKind))
    expect(roundTrip({ nodes: [], edges: [] })).toEqual({ nodes: [], edges: [] })
    // -0 and non-integers cross as they are.
    expect(Object.is((roundTrip(everyKind).nodes[7]!.data as { helicities: number[] }).helicities[2], -0)).toBe(true)
  })

  it('gives back fully expanded canvases exactly, and their checks do not change', () => {
    for (const p of [
      { theory: 'gluon', helicities: [-1, -1, -1, 1, 1, 1, 1, 1], shift: [3, 4] },
      { theory: 'graviton', helicities: [-2, -2, -2, 2, 2], shift: [1, 2] },
      { theory: 'qcd', helicities: [-0.5, 0.5, -1, 1, 1], species: ['qbar1', 'q1', 'g', 'g', 'g'], shift: [3, 1] },
    ] as Process[]) {
      const g = expandedGraph(p, true) as G
      const back = roundTrip(g)
      expect(back).toEqual(drawingGraph(g))
      const res = evaluate(evaluateRequest(p, { kinematics: { kind: 'random', seed: 3 } }))
      expect(checkDrawing(res, p, back)).toEqual(checkDrawing(res, p, g))
    }
  })

  it('names the field of a malformed packed graph', () => {
    const good = packDrawingGraph(everyKind)
    expect(fieldOf(() => unpackDrawingGraph({ ...good, v: 1 } as unknown as PackedGraph))).toBe('graph')
    expect(fieldOf(() => unpackDrawingGraph({ ...good, nums: [] } as unknown as PackedGraph))).toBe('graph')
    const kind = good.nums.slice()
    kind[0] = 9
    expect(fieldOf(() => unpackDrawingGraph({ ...good, nums: kind }))).toBe('graph.nodes.0.type')
    expect(fieldOf(() => unpackDrawingGraph({ ...good, nums: good.nums.slice(0, good.nums.length - 3) }))).toMatch(/^graph\.edges\.6\./)
    expect(fieldOf(() => unpackDrawingGraph({ ...good, text: good.text.slice(1) }))).toMatch(/^graph\./)
    expect(fieldOf(() => unpackDrawingGraph({ ...good, edgeCount: good.edgeCount - 1 }))).toBe('graph')
    expect(fieldOf(() => unpackDrawingGraph({ ...good, other: [] }))).toMatch(/^graph\.nodes\.\d+\.data$/)
  })

  it('the worker answers a malformed one with a 422 naming the field, and a packed one as the objects', () => {
    const p: Process = { theory: 'gluon', helicities: [-1, -1, 1, 1, 1], shift: [1, 2] }
    const g = expandedGraph(p, true) as G
    const req = evaluateRequest(p, { kinematics: { kind: 'random', seed: 5 } })
    const packed = packDrawingGraph(g)
    const strip = (o: Outcome) => (o.ok ? { ...(o.value as object), ms: 0 } : o)
    expect(strip(runTask(structuredClone({ kind: 'checkDrawing', req, process: p, graph: packed })))).toEqual(strip(runTask({ kind: 'checkDrawing', req, process: p, graph: drawingGraph(g) })))
    const bad = runTask({ kind: 'checkDrawing', req, process: p, graph: { ...packed, nums: packed.nums.slice(0, 7) } })
    expect(bad.ok).toBe(false)
    expect(bad.ok === false && bad.status).toBe(422)
    expect(bad.ok === false && bad.field).toMatch(/^graph\./)
  })

  it('the route still bounds the graph before it is packed, naming the field', () => {
    const base = { kinematics: { kind: 'random', seed: 1 } }
    let deep: unknown = 1
    for (let k = 0; k < 40; k++) deep = [deep]
    const nested = DrawingCheckSchema.safeParse({ ...base, graph: { nodes: [{ id: 'a', type: 'leg', position: { x: 0, y: 0 }, data: { label: deep } }], edges: [] } })
    expect(nested.success).toBe(false)
    expect(nested.error!.issues[0]!.path).toEqual(['graph', 'nodes', 0, 'data', 'label'])
    const many = DrawingCheckSchema.safeParse({ ...base, graph: { nodes: Array.from({ length: 3001 }, (_, k) => ({ id: `n${k}`, type: 'angle', position: { x: 0, y: 0 } })), edges: [] } })
    expect(many.success).toBe(false)
    expect(many.error!.issues[0]!.path).toEqual(['graph', 'nodes'])
  })
})
