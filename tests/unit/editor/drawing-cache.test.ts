// The worker's cache of compiled drawings: a check run again on the same packed canvas (at a new
// point, target or arithmetic) answers exactly as a fresh compile does, and any change to the
// drawing or the process (a flipped Line, a renamed Line, a deleted term, another shift) is compiled
// afresh, so a wrong drawing still says so. Values are checked against the uncached checkDrawing,
// which drawing.test.ts checks against Parke–Taylor / Berends–Giele.
import { beforeEach, describe, expect, it } from 'vitest'
import { expandedGraph } from '#shared/editor/demo'
import { checkDrawing, compileDrawing, drawingGraph, drawnValues, packDrawingGraph, sharedParts, type CheckedResponse } from '#shared/editor/drawing'
import { Complex, complexField } from '#shared/physics/field'
import { evaluateRequest, toLabels } from '#shared/editor/process'
import type { EditorEdge, EditorNode } from '#shared/editor/types'
import { evaluate } from '#shared/physics/index'
import type { Process } from '#shared/schemas/graph'
import type { EvaluateRequestInput } from '#shared/schemas/evaluate'
import { DRAWING_CACHE_SIZE, checkPackedDrawing, clearDrawingCache, compilePacked } from '../../../server/workers/drawing-cache'
import { runTask } from '../../../server/workers/tasks'
import { validateGraph } from '#shared/editor/validate'
import { flipped } from '../../helpers/drawing'

type G = { nodes: EditorNode[], edges: EditorEdge[] }

const p8: Process = { theory: 'gluon', helicities: [-1, -1, -1, 1, 1, 1, 1, 1], shift: [3, 4] }
const g8 = expandedGraph(p8, true) as G

function resOf(p: Process, kinematics: EvaluateRequestInput['kinematics'] = { kind: 'random', seed: 7 }, arithmetic: 'float' | 'exact' = 'float') {
  return toLabels(evaluate(evaluateRequest(p, { kinematics, arithmetic })), p)
}

/** The packed drawing as the worker receives it (structured clone: a fresh copy every time). */
const sent = (g: G) => structuredClone(packDrawingGraph(g))

const lineOf = (r: CheckedResponse) => r.drawing!.terms.find(t => t.lineId)!.lineId!

describe('compiled drawings kept by the worker', () => {
  beforeEach(() => clearDrawingCache())

  it('a drawing checked again is served from the cache and answers as a fresh check does', () => {
    const proc = { ...p8, shift: resOf(p8).shift }
    const first = compilePacked(proc, sent(g8))
    expect(compilePacked(proc, sent(g8))).toBe(first)
    for (const [kin, arith] of [[{ kind: 'random', seed: 7 }, 'float'], [{ kind: 'random', seed: 11 }, 'float'], [{ kind: 'rational', seed: 3 }, 'exact']] as const) {
      const res = resOf(p8, kin, arith)
      const cached = checkPackedDrawing(res, p8, sent(g8))
      expect(cached).toEqual(checkDrawing(res, p8, drawingGraph(g8)))
      expect(cached.verdict).toBe('agrees')
    }
    expect(compilePacked(proc, sent(g8))).toBe(first)
  })

  it('a changed drawing or process is compiled afresh: a wrong drawing after a right one still says so', () => {
    const res = resOf(p8)
    expect(checkPackedDrawing(res, p8, sent(g8)).verdict).toBe('agrees')
    const line = lineOf(checkDrawing(res, p8, g8))
    const flip = flipped(g8, line)
    const wrong = checkPackedDrawing(res, p8, sent(flip))
    expect(wrong).toEqual(checkDrawing(res, p8, flip))
    expect(wrong.verdict).not.toBe('agrees')
    expect(wrong.drawing!.comparison.wrongHelicity.length).toBe(1)
    // A renamed Line changes only the text of the pack.
    const renamed: G = { nodes: g8.nodes, edges: g8.edges.map(e => (e.id === line ? { ...e, data: { ...e.data, line: 'Lx' } } : e)) }
    expect(checkPackedDrawing(res, p8, sent(renamed))).toEqual(checkDrawing(res, p8, renamed))
    // A deleted term: the drawing misses a channel.
    const v = compileDrawing({ ...p8, shift: res.shift }, g8)
    const gone = new Set(v.structure.terms[0]!.nodeIds)
    const missing: G = { nodes: g8.nodes.filter(n => !gone.has(n.id)), edges: g8.edges.filter(e => !gone.has(e.source) && !gone.has(e.target)) }
    const r = checkPackedDrawing(res, p8, sent(missing))
    expect(r).toEqual(checkDrawing(res, p8, missing))
    expect(r.drawing!.comparison.missing.length).toBe(1)
    // The same canvas under another shift is another compile.
    const other: Process = { ...p8, shift: [1, 2] }
    const res2 = resOf(other)
    expect(checkPackedDrawing(res2, other, sent(g8))).toEqual(checkDrawing(res2, other, g8))
    // And the right drawing, checked again, agrees again.
    expect(checkPackedDrawing(res, p8, sent(g8)).verdict).toBe('agrees')
  })

  it('numbers are compared bit for bit (−0 is not 0) and values of no simple kind are never cached', () => {
    const res = resOf(p8)
    const proc = { ...p8, shift: res.shift }
    const first = compilePacked(proc, sent(g8))
    // A leg's helicity −0 and 0: two (wrong) drawings, each compiled on its own.
    const legAt = g8.nodes.findIndex(n => n.type === 'leg')
    const withHelicity = (h: number): G => ({ nodes: g8.nodes.map((n, k) => (k === legAt ? { ...n, data: { ...n.data, helicity: h } } as EditorNode : n)), edges: g8.edges })
    const plus = compilePacked(proc, sent(withHelicity(0)))
    const minus = compilePacked(proc, sent(withHelicity(-0)))
    expect(minus).not.toBe(plus)
    expect(compilePacked(proc, sent(withHelicity(-0)))).toBe(minus)
    expect(compilePacked(proc, sent(g8))).toBe(first)
    const odd = { ...sent(g8), other: [{}] }
    expect(compilePacked(proc, odd)).not.toBe(compilePacked(proc, odd))
  })

  it('keeps the most recently used drawings', () => {
    const res = resOf(p8)
    const proc = { ...p8, shift: res.shift }
    const first = compilePacked(proc, sent(g8))
    const seeds = Array.from({ length: DRAWING_CACHE_SIZE }, (_, k) => k)
    // Other drawings (the same canvas with one leg moved off its slot) push it out once there are more than the cache holds.
    const others = seeds.map(k => ({ nodes: g8.nodes, edges: g8.edges.map((e, t) => (t === k ? { ...e, targetHandle: `h${9 + k}` } : e)) }))
    others.slice(0, DRAWING_CACHE_SIZE - 1).forEach(g => compilePacked(proc, sent(g)))
    expect(compilePacked(proc, sent(g8))).toBe(first)
    others.forEach(g => compilePacked(proc, sent(g)))
    expect(compilePacked(proc, sent(g8))).not.toBe(first)
  })

  it('the worker task answers a packed drawing checked twice as the objects', () => {
    const req = evaluateRequest(p8, { kinematics: { kind: 'random', seed: 5 } })
    const strip = (o: ReturnType<typeof runTask>) => (o.ok ? { ...(o.value as object), ms: 0 } : o)
    const objects = strip(runTask({ kind: 'checkDrawing', req, process: p8, graph: drawingGraph(g8) }))
    expect(strip(runTask({ kind: 'checkDrawing', req, process: p8, graph: sent(g8) }))).toEqual(objects)
    expect(strip(runTask({ kind: 'checkDrawing', req, process: p8, graph: sent(g8) }))).toEqual(objects)
  })

  it('the check\'s validation (no slot records) finds what the editor\'s does, on whole and broken canvases', () => {
    const res = resOf(p8)
    const proc = { ...p8, shift: res.shift }
    const line = lineOf(checkDrawing(res, p8, g8))
    // Whole, a flipped Line, a leg off its slot, a Line to a slot the vertex lacks.
    const broken: G[] = [
      g8,
      flipped(g8, line),
      { nodes: g8.nodes, edges: g8.edges.filter((_, t) => t !== 0) },
      { nodes: g8.nodes, edges: g8.edges.map((e, t) => (t === 1 ? { ...e, targetHandle: 'h7' } : e)) },
    ]
    // Quarks: codes at every slot, and a quark Line drawn as a gluon.
    const pq: Process = { theory: 'qcd', helicities: [-0.5, 0.5, -1, 1, 1], species: ['qbar1', 'q1', 'g', 'g', 'g'], shift: [3, 1] }
    const gq = expandedGraph(pq, true) as G
    const gluonLine: G = { nodes: gq.nodes, edges: gq.edges.map(e => (e.data?.species ? { ...e, data: { ...e.data, species: undefined } } : e)) }
    const all: [Process, G][] = [...broken.map(g => [proc, g] as [Process, G]), [pq, gq], [pq, gluonLine]]
    for (const [pr, g] of all) {
      const full = validateGraph(g.nodes, g.edges, pr)
      const lean = validateGraph(g.nodes, g.edges, pr, { slots: false })
      expect(lean.slots).toEqual({})
      expect({ ...lean, slots: full.slots }).toEqual(full)
    }
    expect(validateGraph(gluonLine.nodes, gluonLine.edges, pq).errorCount).toBeGreaterThan(0)
  })

  it('components sharing a channel evaluate it once, to the same values as each alone; a term drawn twice still counts twice', () => {
    // 8-gluon NMHV under [1,2⟩ fully expanded: ten components, several per channel.
    const p: Process = { theory: 'gluon', helicities: [-1, 1, -1, 1, 1, -1, 1, 1], shift: [1, 2] }
    const g = expandedGraph(p, true) as G
    const res = resOf(p)
    const proc = { ...p, shift: res.shift }
    const { structure, shared } = compileDrawing(proc, g)
    expect(shared).not.toBeNull()
    expect(sharedParts(structure)).toEqual(shared)
    expect(shared!.cks).toBeLessThan([...shared!.ids.values()].filter(x => x.ck >= 0).length)
    const c = (x: unknown) => new Complex((x as number[])[0]!, (x as number[])[1]!)
    const sp = (s: unknown) => [c((s as unknown[])[0]), c((s as unknown[])[1])]
    const kin = { lambda: res.kinematics.lambda.map(sp), lambdaTilde: res.kinematics.lambdaTilde.map(sp) } as never
    const once = drawnValues(complexField, proc, structure, kin, shared)
    const each = drawnValues(complexField, proc, structure, kin, null)
    expect(once).toEqual(each)
    expect(checkDrawing(res, p, g).verdict).toBe('agrees')
    // Every Line in turn drawn joining a helicity to itself (a kept error: its two sides differ from a
    // consistent drawing's), the rest as they were: shared and unshared evaluations still agree.
    for (const e of g.edges) {
      const d = e.data as { helicity?: number, external?: boolean }
      if (d.external || d.helicity === undefined) continue
      const odd: G = { nodes: g.nodes, edges: g.edges.map(x => (x === e ? { ...x, data: { ...x.data, targetHelicity: d.helicity } } : x)) }
      const c2 = compileDrawing(proc, odd)
      expect(drawnValues(complexField, proc, c2.structure, kin, c2.shared)).toEqual(drawnValues(complexField, proc, c2.structure, kin, null))
    }
    // The same term drawn twice: shared, and summed twice.
    const v = compileDrawing(proc, g8)
    const ids = new Set(v.structure.terms[0]!.nodeIds)
    const copy: G = {
      nodes: [...g8.nodes, ...g8.nodes.filter(n => ids.has(n.id)).map(n => ({ ...n, id: `${n.id}x` }))],
      edges: [...g8.edges, ...g8.edges.filter(e => ids.has(e.source)).map(e => ({ ...e, id: `${e.id}x`, source: `${e.source}x`, target: `${e.target}x` }))],
    }
    const res8 = resOf(p8)
    const twice = compileDrawing({ ...p8, shift: res8.shift }, copy)
    expect(twice.shared).not.toBeNull()
    const r = checkDrawing(res8, p8, copy)
    expect(r.verdict).not.toBe('agrees')
    expect(r.drawing!.comparison.duplicated.length).toBe(1)
    const values = r.drawing!.terms.map(t => t.value!)
    const sum = values.reduce<[number, number]>((a, x) => [a[0] + Number(x[0]), a[1] + Number(x[1])], [0, 0])
    expect(Math.hypot(Number(r.drawing!.sum![0]) - sum[0], Number(r.drawing!.sum![1]) - sum[1])).toBeLessThan(1e-12 * Math.hypot(sum[0], sum[1]))
    expect(values[0]).toEqual(values.at(-1))
  })
})
