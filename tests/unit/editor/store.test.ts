import { beforeEach, describe, expect, it } from 'vitest'
import { createPinia, setActivePinia } from 'pinia'
import { useEditorStore } from '~~/stores/editor'
import { evaluate } from '#shared/physics/index'
import type { Process } from '#shared/schemas/graph'
import { GraphSchema } from '#shared/schemas/graph'
import { processFromCanvas, matchTerms, componentChannels, toLabels, evaluateRequest } from '#shared/editor/process'
import { validateGraph } from '#shared/editor/validate'
import { blockPaths } from '#shared/editor/expand'

const doc = (process?: Process) => ({ id: 1, projectId: 1, title: 'T', version: 1, role: 'editor' as const, graph: { schemaVersion: 1 as const, ...(process ? { process } : {}), nodes: [], edges: [] } })

function treeOf(p: Process) {
  const r = evaluate({ theory: p.theory, helicities: p.helicities, shift: p.shift, kinematics: { kind: 'random', seed: 'structure' }, tree: true, target: 'none' })
  return r
}

/** Builds the four-gluon recursion of [1,2⟩ for (−−++) by hand: L = {4,1} on an angle vertex, {2,3} on a square vertex. */
function handBuiltFour(s: ReturnType<typeof useEditorStore>) {
  const a = s.addNode('angle', { x: 0, y: 0 })
  const b = s.addNode('square', { x: 200, y: 0 })
  const legs = [[1, -1], [2, -1], [3, 1], [4, 1]].map(([label, h]) => s.addNode('leg', { x: 0, y: 0 }, { label, helicity: h }))
  s.connect({ source: legs[0]!, target: a, sourceHandle: 'p', targetHandle: 'h0' })
  s.connect({ source: legs[3]!, target: a, sourceHandle: 'p', targetHandle: 'h1' })
  s.connect({ source: legs[1]!, target: b, sourceHandle: 'p', targetHandle: 'h0' })
  s.connect({ source: legs[2]!, target: b, sourceHandle: 'p', targetHandle: 'h1' })
  const line = s.connect({ source: a, target: b, sourceHandle: 'h2', targetHandle: 'h2' })
  return { a, b, legs, line: line! }
}

describe('editor store', () => {
  beforeEach(() => setActivePinia(createPinia()))

  it('undo and redo walk back and forth through changes, and a new change clears redo', () => {
    const s = useEditorStore()
    s.load(doc())
    const a = s.addNode('angle', { x: 1, y: 2 })
    s.addNode('square', { x: 3, y: 4 })
    expect(s.nodes).toHaveLength(2)
    s.undo()
    expect(s.nodes.map(n => n.id)).toEqual([a])
    s.undo()
    expect(s.nodes).toHaveLength(0)
    s.undo()
    expect(s.nodes).toHaveLength(0)
    s.redo()
    s.redo()
    expect(s.nodes).toHaveLength(2)
    s.undo()
    s.moveNodes({ [a]: { x: 50, y: 60 } })
    expect(s.redoStack).toHaveLength(0)
    expect(s.nodes[0]!.position).toEqual({ x: 50, y: 60 })
    s.undo()
    expect(s.nodes[0]!.position).toEqual({ x: 1, y: 2 })
  })

  it('deleting a node removes its lines, and undo brings both back', () => {
    const s = useEditorStore()
    s.load(doc())
    const { a } = handBuiltFour(s)
    expect(s.edges).toHaveLength(5)
    s.select([a])
    s.removeSelected()
    expect(s.edges).toHaveLength(2)
    s.undo()
    expect(s.edges).toHaveLength(5)
  })

  it('refuses to glue a leg to a leg, or a handle to itself', () => {
    const s = useEditorStore()
    s.load(doc())
    const a = s.addNode('leg', { x: 0, y: 0 })
    const b = s.addNode('leg', { x: 0, y: 0 })
    expect(s.connect({ source: a, target: b, sourceHandle: 'p', targetHandle: 'p' })).toBeNull()
    const v = s.addNode('angle', { x: 0, y: 0 })
    expect(s.connect({ source: v, target: v, sourceHandle: 'h0', targetHandle: 'h1' })).toBeNull()
    expect(s.edges).toHaveLength(0)
  })

  it('a viewer changes nothing', () => {
    const s = useEditorStore()
    s.load({ ...doc(), role: 'viewer' })
    s.addNode('angle', { x: 0, y: 0 })
    expect(s.nodes).toHaveLength(0)
    expect(s.readOnly).toBe(true)
  })

  it('a hand-built four-gluon recursion validates, maps to its process and matches the server\'s only term', () => {
    const s = useEditorStore()
    s.load(doc())
    handBuiltFour(s)
    const got = processFromCanvas(s.nodes)
    expect('process' in got).toBe(true)
    const p = { ...(got as { process: Process }).process, shift: [1, 2] as [number, number] }
    expect(p).toMatchObject({ theory: 'gluon', helicities: [-1, -1, 1, 1] })
    s.setProcess(p)
    expect(s.validation.errorCount).toBe(0)
    const r = treeOf(p)
    expect(r.terms).toHaveLength(1)
    const m = matchTerms(p, r.terms, s.validation.components, s.nodes, s.edges, null)
    expect([...m.keys()]).toEqual([0])
    // The channel seen from leg 1: {1,4} with the line's helicity at the angle-vertex end.
    const comp = s.validation.components.find(c => c.nodeIds.length > 1)!
    expect(componentChannels(comp, s.nodes, s.edges, [1, 2])).toEqual([expect.objectContaining({ left: [1, 4], helicity: r.terms[0]!.helicity })])
    expect(GraphSchema.safeParse(s.toGraph()).success).toBe(true)
  })

  it('shows what is wrong on the node: kind against helicities, open slots, a line of equal helicities, missing legs', () => {
    const s = useEditorStore()
    s.load(doc({ theory: 'gluon', helicities: [-1, -1, 1, 1], shift: [1, 2] }))
    const { a, b, line, legs } = handBuiltFour(s)
    s.setNodeType(a, 'square')
    let v = s.validation
    // Decided structurally, as the engine does: the side holding the λ̃-shifted leg 1 is an angle vertex.
    expect(v.nodes[a]!.map(i => i.message).join(' ')).toMatch(/holds the shifted leg 1 \(λ̃ shifted\): at the pole its square brackets vanish, so only an angle vertex survives here, not a square vertex/)
    s.undo()
    s.updateEdgeData(line, { targetHelicity: 1, helicity: 1 })
    v = s.validation
    expect(v.nodes[b]!.map(i => i.message).join(' ')).toMatch(/joins \+ to \+: an internal line joins opposite helicities/)
    s.undo()
    s.removeIds([legs[2]!])
    v = s.validation
    expect(v.nodes[b]!.map(i => i.message).join(' ')).toMatch(/2 of 3 slots connected/)
    expect(Object.values(v.nodes).flat().map(i => i.message).join(' ')).toMatch(/momentum does not close: leg 3 of the process is missing/)
  })

  it('flags a loop, a doubled leg and a helicity the theory does not have', () => {
    const nodes = [
      { id: 'a', type: 'angle' as const, position: { x: 0, y: 0 }, data: {} },
      { id: 'b', type: 'square' as const, position: { x: 0, y: 0 }, data: {} },
      { id: 'l1', type: 'leg' as const, position: { x: 0, y: 0 }, data: { label: 1, helicity: 2 } },
      { id: 'l1b', type: 'leg' as const, position: { x: 0, y: 0 }, data: { label: 1, helicity: -1 } },
    ]
    const edges = [
      { id: 'x', source: 'a', target: 'b', sourceHandle: 'h0', targetHandle: 'h0', data: { helicity: 1 } },
      { id: 'y', source: 'a', target: 'b', sourceHandle: 'h1', targetHandle: 'h1', data: { helicity: -1 } },
      { id: 'z', source: 'l1', target: 'a', sourceHandle: 'p', targetHandle: 'h2' },
      { id: 'w', source: 'l1b', target: 'b', sourceHandle: 'p', targetHandle: 'h2' },
    ]
    const v = validateGraph(nodes, edges, { theory: 'gluon', helicities: [-1, -1, 1, 1] })
    const all = Object.values(v.nodes).flat().map(i => i.message).join(' | ')
    expect(all).toMatch(/closed loop/)
    expect(all).toMatch(/leg 1 appears twice/)
    expect(all).toMatch(/helicity \+2 does not belong to gluons/)
  })

  it('expands the six-gluon process into its channel terms, then blocks down to three-point vertices, and collapses back', () => {
    const s = useEditorStore()
    const p: Process = { theory: 'gluon', helicities: [-1, 1, -1, 1, -1, 1], shift: [2, 3] }
    s.load(doc(p))
    const r = treeOf(p)
    s.applyExpansion(r.terms, [2, 3], 'structure')
    const comps = () => s.validation.components.filter(c => c.nodeIds.length > 1)
    expect(comps()).toHaveLength(r.terms.length)
    expect(s.validation.errorCount).toBe(0)
    // Every term holds all six legs once.
    for (const c of comps()) expect([...c.labels].sort()).toEqual([1, 2, 3, 4, 5, 6])
    const block = s.nodes.find(n => n.type === 'block' && s.canExpand(n.id))!
    expect(block).toBeDefined()
    const before = comps().length
    const k = (block.data as { terms: number }).terms
    s.expandBlock(block.id)
    expect(comps()).toHaveLength(before - 1 + k)
    const inner = s.nodes.find(n => n.type !== 'leg' && s.collapsiblePath(n.id) !== null)!
    s.collapseAt(inner.id)
    expect(comps()).toHaveLength(before)
    s.expandAll()
    expect(s.nodes.some(n => n.type === 'block')).toBe(false)
    expect(s.validation.errorCount).toBe(0)
    for (const spec of s.expansion!.specs) expect(blockPaths(r.terms, spec)).toEqual([])
    // Every expanded term maps back to its top-level term.
    const m = matchTerms(p, r.terms, s.validation.components, s.nodes, s.edges, s.expansion!.key)
    expect([...m.keys()].sort()).toEqual(r.terms.map((_, t) => t))
    s.undo()
    expect(comps()).toHaveLength(before)
  })

  it('colour order: a process in order 1 3 2 4 expands with the diagram\'s labels', () => {
    const s = useEditorStore()
    const p: Process = { theory: 'gluon', helicities: [-1, 1, -1, 1], order: [1, 3, 2, 4], shift: [1, 3] }
    s.load(doc(p))
    // Positions: (1, 3, 2, 4) → helicities (−, −, +, +), shift positions [1, 2].
    const req = evaluateRequest(p, { kinematics: { kind: 'random', seed: 1 }, tree: true, target: 'none' })
    expect(req).toMatchObject({ helicities: [-1, -1, 1, 1], shift: [1, 2] })
    const r = evaluate(req)
    s.applyExpansion(toLabels(r, p).terms, [1, 3], 'structure')
    const labels = s.nodes.filter(n => n.type === 'leg').map(n => n.data)
    for (const l of labels) expect(l.helicity).toBe(p.helicities[l.label - 1])
    expect(s.validation.errorCount).toBe(0)
  })

  it('keeps an unsaved draft and knows when the document is dirty', () => {
    const s = useEditorStore()
    s.load(doc())
    expect(s.dirty).toBe(false)
    s.addNode('angle', { x: 0, y: 0 })
    expect(s.dirty).toBe(true)
    s.markSaved({ version: 2 })
    expect(s.dirty).toBe(false)
    expect(s.version).toBe(2)
  })
})
