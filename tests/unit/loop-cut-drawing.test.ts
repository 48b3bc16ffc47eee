// Loop-cut drawings: generated rings of every box read back as the engine's boxes, their checked
// coefficients equal POST /api/loop-cuts' (the quadruple cut, Britto, Cachazo, Feng,
// hep-th/0412103) and agree with the N = 4 MHV coefficients (Bern, Dixon, Dunbar, Kosower,
// hep-ph/9403226); broken rings are named on the node that is wrong.
import { describe, expect, it } from 'vitest'
import { createPinia, setActivePinia } from 'pinia'
import { useEditorStore } from '~~/stores/editor'
import { boxRings, validateLoopCut, diagramKindOf, tidyRings } from '#shared/editor/loop-cut'
import { checkLoopCutDrawing, compileRings } from '#shared/editor/loop-cut-check'
import { loopCuts, allBoxes } from '#shared/physics/loop/index'
import type { EditorEdge, EditorNode } from '#shared/editor/types'
import type { Process } from '#shared/schemas/graph'

const gluons = (h: number[]): Process => ({ theory: 'gluon', helicities: h })
const messages = (v: ReturnType<typeof validateLoopCut>) => Object.values(v.nodes).flat().map(i => i.message).concat(Object.values(v.edges).flat().map(i => i.message))

describe('generated boxes', () => {
  for (const h of [[-1, -1, 1, 1], [-1, 1, -1, 1, 1], [-1, -1, 1, 1, 1], [-1, -1, 1, 1, 1, 1], [-1, 1, 1, -1, 1, 1]]) {
    it(`every box of ${h.map(x => (x > 0 ? '+' : '−')).join('')} is drawn, read back and equals the engine`, () => {
      const p = gluons(h)
      const g = boxRings(p)
      const v = validateLoopCut(g.nodes, g.edges, p)
      expect(v.errorCount, messages(v).join('\n')).toBe(0)
      expect(v.rings.map(r => r.box)).toEqual(allBoxes(h.length).map((_, i) => i))
      expect(v.rings.every(r => r.lines.every(l => l.helicity === null))).toBe(true)
      const r = checkLoopCutDrawing({ helicities: h }, compileRings(v.rings))
      const engine = loopCuts({ helicities: h })
      expect(r.missing).toEqual([])
      r.boxes.forEach((b, i) => {
        const e = engine.boxes[i]!
        expect(b.corners).toEqual(e.corners)
        if (e.value) {
          expect(b.value![0]).toBeCloseTo(e.value[0] as number, 12)
          expect(b.value![1]).toBeCloseTo(e.value[1] as number, 12)
        }
        expect(b.verdict).toBe(e.verdict)
      })
      expect(r.verdict).toBe(engine.verdict)
    })
  }
  it('exact arithmetic: the four-point box equals −st A_tree exactly', () => {
    const p = gluons([-1, -1, 1, 1])
    const g = boxRings(p)
    const v = validateLoopCut(g.nodes, g.edges, p)
    const r = checkLoopCutDrawing({ helicities: p.helicities, arithmetic: 'exact' }, compileRings(v.rings))
    expect(r.boxes[0]!.value).toEqual(r.boxes[0]!.target)
    expect(r.boxes[0]!.targetRule).toBe('−st A_tree')
    expect(r.verdict).toBe('agrees')
  })
  it('drawn internal helicities keep only their terms; both four-point terms are needed', () => {
    const p = gluons([-1, -1, 1, 1])
    const g = boxRings(p)
    const v = validateLoopCut(g.nodes, g.edges, p)
    const engine = loopCuts({ helicities: p.helicities }).boxes[0]!
    const one = engine.terms[0]!
    const r = checkLoopCutDrawing({ helicities: p.helicities }, [{ ...compileRings(v.rings)[0]!, helicities: one.helicities }])
    expect(r.rings[0]!.summed).toBe('drawn')
    expect(r.rings[0]!.terms).toHaveLength(1)
    expect(r.boxes[0]!.verdict).toBe('disagrees')
    expect(r.boxes[0]!.note).toMatch(/leave out 1 of its 2 non-zero terms/)
  })
  it('tidy puts scattered rings back on the grid, still the same boxes', () => {
    const p = gluons([-1, -1, 1, 1, 1])
    const g = boxRings(p)
    const scattered = g.nodes.map((n, i) => ({ ...n, position: { x: (i * 37) % 200, y: (i * 53) % 150 } }))
    const tidy = tidyRings(scattered, g.edges, p)
    expect(tidy.map(n => n.position)).toEqual(g.nodes.map(n => n.position))
    expect(validateLoopCut(tidy, g.edges, p).rings.map(r => r.box)).toEqual([0, 1, 2, 3, 4])
  })
  it('the kind lives in the graph', () => {
    expect(diagramKindOf({ kind: 'loop-cut' })).toBe('loop-cut')
    expect(diagramKindOf({})).toBe('tree')
  })
})

describe('the three-point rule the editor checks', () => {
  it('at both cut solutions of every box up to eight legs, neighbouring three-point corners alternate, opposite ones agree, and the solutions swap every kind', () => {
    for (const h of [[-1, -1, 1, 1], [-1, 1, -1, 1, 1, 1], [-1, -1, 1, 1, 1, 1, 1], [-1, 1, -1, 1, 1, -1, 1, 1]]) {
      for (const seed of [1, 2]) {
        // The rule is kinematic: gluon-only cuts give every box both solutions.
        const r = loopCuts({ helicities: h, kinematics: { kind: 'random', seed }, target: 'none', states: 'gluons' })
        expect(r.boxes.every(b => b.solutions.length === 2)).toBe(true)
        for (const b of r.boxes) {
          const [s1, s2] = b.solutions.map(x => x.threePoint)
          s1!.forEach((k, q) => { if (k) expect(s2![q]).toBe(k === 'angle' ? 'square' : 'angle') })
          const q0 = s1!.findIndex(k => k)
          s1!.forEach((k, q) => { if (k && q0 >= 0) expect(k === s1![q0]).toBe((q - q0) % 2 === 0) })
        }
      }
    }
  })
})

describe('broken rings are named', () => {
  const p = gluons([-1, -1, 1, 1])
  const fresh = () => boxRings(p)
  const corners = (g: { nodes: EditorNode[] }) => g.nodes.filter(n => n.type !== 'leg')
  const internal = (g: { nodes: EditorNode[], edges: EditorEdge[] }) => g.edges.filter(e => !(e.data as { external?: boolean }).external)

  it('a missing internal line: open slots', () => {
    const g = fresh()
    const cut = internal(g)[0]!
    const v = validateLoopCut(g.nodes, g.edges.filter(e => e !== cut), p)
    expect(v.rings).toHaveLength(0)
    expect(v.nodes[cut.source]!.map(i => i.message).join()).toMatch(/open slot/)
  })
  it('a missing corner: a triangle', () => {
    const g = fresh()
    // three corners, one of them a Block with two legs
    const nodes: EditorNode[] = [
      { id: 'a', type: 'angle', position: { x: 0, y: 0 }, data: {} },
      { id: 's', type: 'square', position: { x: 0, y: 0 }, data: {} },
      { id: 'b', type: 'block', position: { x: 0, y: 0 }, data: { helicities: [1, 1, 1, 1] } },
      ...[1, 2, 3, 4].map(l => ({ id: `l${l}`, type: 'leg' as const, position: { x: 0, y: 0 }, data: { label: l, helicity: p.helicities[l - 1]! } })),
    ]
    const edges: EditorEdge[] = [
      { id: 'x1', source: 'l1', target: 'a', sourceHandle: 'p', targetHandle: 'h1', data: { external: true } },
      { id: 'x2', source: 'l2', target: 's', sourceHandle: 'p', targetHandle: 'h1', data: { external: true } },
      { id: 'x3', source: 'l3', target: 'b', sourceHandle: 'p', targetHandle: 'h1', data: { external: true } },
      { id: 'x4', source: 'l4', target: 'b', sourceHandle: 'p', targetHandle: 'h2', data: { external: true } },
      { id: 'i1', source: 'a', target: 's', sourceHandle: 'h2', targetHandle: 'h0', data: {} },
      { id: 'i2', source: 's', target: 'b', sourceHandle: 'h2', targetHandle: 'h0', data: {} },
      { id: 'i3', source: 'b', target: 'a', sourceHandle: 'h3', targetHandle: 'h0', data: {} },
    ]
    void g
    const v = validateLoopCut(nodes, edges, p)
    expect(v.nodes.a!.map(i => i.message).join()).toMatch(/triangle, not a box/)
  })
  it('a three-point corner of the wrong kind', () => {
    const g = fresh()
    const c = corners(g)[1]!
    const nodes = g.nodes.map(n => (n.id === c.id ? { ...n, type: n.type === 'angle' ? 'square' as const : 'angle' as const } : n))
    const v = validateLoopCut(nodes, g.edges, p)
    expect(v.nodes[c.id]!.map(i => i.message).join()).toMatch(/the cut makes this corner a (angle|square) vertex/)
  })
  it('equal helicities across a line, and helicities that do not fit a vertex', () => {
    const g = fresh()
    const e = internal(g)[0]!
    const edges = g.edges.map(x => (x.id === e.id ? { ...x, data: { helicity: 1, targetHelicity: 1 } } : x))
    const v = validateLoopCut(g.nodes, edges, p)
    expect(v.edges[e.id]!.map(i => i.message).join()).toMatch(/joins \+ to \+: an internal line joins opposite helicities/)
    // corner 1 (leg 1−, an angle vertex) needs two −: make both its lines + at its end
    const a = corners(g)[0]!
    const both = g.edges.map(x => (!(x.data as { external?: boolean }).external && (x.source === a.id || x.target === a.id) ? { ...x, data: x.source === a.id ? { helicity: 1 } : { helicity: -1 } } : x))
    const w = validateLoopCut(g.nodes, both, p)
    expect(w.nodes[a.id]!.map(i => i.message).join()).toMatch(/an angle vertex of gluons needs two − and one \+; here −, \+, \+/)
  })
  it('legs out of colour order, a leg missing, a leg of the wrong helicity', () => {
    const g = fresh()
    const swapped = g.nodes.map(n => (n.type === 'leg' && (n.data.label === 2 || n.data.label === 3) ? { ...n, data: { ...n.data, label: 5 - (n.data.label as number), helicity: p.helicities[4 - (n.data.label as number)]! } } : n)) as EditorNode[]
    expect(messages(validateLoopCut(swapped, g.edges, p)).join()).toMatch(/not in colour order 1..4/)
    const leg4 = g.nodes.find(n => n.type === 'leg' && n.data.label === 4)!
    const without = validateLoopCut(g.nodes.filter(n => n !== leg4), g.edges.filter(e => e.source !== leg4.id), p)
    expect(messages(without).join()).toMatch(/open slot/)
    const wrong = g.nodes.map(n => (n === leg4 ? { ...n, data: { ...n.data, helicity: -1 } } : n)) as EditorNode[]
    expect(messages(validateLoopCut(wrong, g.edges, p)).join()).toMatch(/leg 4 is − here but \+ in the process/)
  })
  it('a box drawn twice, and a process that is not gluons', () => {
    const a = fresh()
    const b = fresh()
    const v = validateLoopCut([...a.nodes, ...b.nodes], [...a.edges, ...b.edges], p)
    expect(messages(v).join()).toMatch(/is drawn twice \(rings 1 and 2\)/)
    const s = validateLoopCut(a.nodes, a.edges, { theory: 'scalar-cubic', helicities: [0, 0, 0, 0] })
    expect(s.problems.join()).toMatch(/colour-ordered gluons/)
  })
})

describe('the store on a loop-cut diagram', () => {
  it('keeps the kind, starts Lines open, cycles them open → + → − → open, generates and tidies rings', () => {
    setActivePinia(createPinia())
    const s = useEditorStore()
    const p = gluons([-1, -1, 1, 1])
    s.load({ id: 1, projectId: 1, title: 'Box', version: 1, role: 'editor', graph: { schemaVersion: 1, kind: 'loop-cut', process: p, nodes: [], edges: [] } })
    expect(s.kind).toBe('loop-cut')
    expect(s.toGraph().kind).toBe('loop-cut')
    const a = s.addNode('angle', { x: 0, y: 0 })
    const b = s.addNode('square', { x: 100, y: 0 })
    const e = s.connect({ source: a, target: b, sourceHandle: 'h1', targetHandle: 'h2' })!
    const data = () => s.edges.find(x => x.id === e)!.data
    expect(data()).toEqual({})
    s.flipLine(e)
    expect(data()).toEqual({ helicity: 1, targetHelicity: -1 })
    s.flipLine(e)
    expect(data()).toEqual({ helicity: -1, targetHelicity: 1 })
    s.flipLine(e)
    expect(data()).toEqual({})
    expect(s.generateBoxes()).toBe(1)
    expect(s.validation.rings).toHaveLength(1)
    s.undo()
    expect(s.nodes).toHaveLength(2)
    s.load({ id: 2, projectId: 1, title: 'Tree', version: 1, role: 'editor', graph: { schemaVersion: 1, process: p, nodes: [], edges: [] } })
    expect(s.kind).toBe('tree')
    expect(s.toGraph().kind).toBeUndefined()
  })
})
