// The drawing compiler on qcd processes (one quark line and gluons): drawn terms built from the
// engine's own term trees (expandedGraph) must sum to the engine's recursion and to the independent
// target — the quark MHV formula (Mangano, Parke, Phys. Rept. 200 (1991) 301) or the quark-line
// Berends–Giele current (Berends, Giele, Nucl. Phys. B306 (1988) 759) — and broken drawings (a
// fermion arrow reversed, a quark Line drawn as a gluon) must disagree naming the Line.
import { describe, expect, it } from 'vitest'
import { expandedGraph } from '#shared/editor/demo'
import { checkDrawing } from '#shared/editor/drawing'
import { evaluateRequest, toLabels } from '#shared/editor/process'
import { codeOf, fermionFlow, speciesProblem, vertexFlowProblem } from '#shared/editor/species'
import { validateGraph } from '#shared/editor/validate'
import type { EditorEdge, EditorNode, LineData } from '#shared/editor/types'
import { evaluate, floatTolerance } from '#shared/physics/index'
import { isValidShift, processOf } from '#shared/physics/theories'
import type { Graph, Process } from '#shared/schemas/graph'
import type { WireComplex } from '#shared/schemas/evaluate'

type G = { nodes: EditorNode[], edges: EditorEdge[] }
const asG = (g: Graph): G => ({ nodes: g.nodes as EditorNode[], edges: g.edges as EditorEdge[] })
const cabs = (w: WireComplex) => Math.hypot(Number(w[0]), Number(w[1]))
const cdiff = (a: WireComplex, b: WireComplex) => Math.hypot(Number(a[0]) - Number(b[0]), Number(a[1]) - Number(b[1]))
const F = 0.5
const G1 = 1

// q̄q with 2, 3, 4 gluons, the line at different places in the colour order.
const CASES: [string, number[], string[]][] = [
  ['q̄⁻q⁺g⁻g⁺', [-F, F, -G1, G1], ['qbar1', 'q1', 'g', 'g']],
  ['q̄⁺g⁻q⁻g⁺', [F, -G1, -F, G1], ['qbar2', 'g', 'q2', 'g']],
  ['q̄⁻q⁺g⁻g⁺g⁺', [-F, F, -G1, G1, G1], ['qbar1', 'q1', 'g', 'g', 'g']],
  ['q⁻g⁺q̄⁺g⁻g⁺', [-F, G1, F, -G1, G1], ['q1', 'g', 'qbar1', 'g', 'g']],
  ['q̄⁻q⁺g⁻g⁺g⁻g⁺', [-F, F, -G1, G1, -G1, G1], ['qbar1', 'q1', 'g', 'g', 'g', 'g']],
  ['q̄⁻g⁺g⁻q⁺g⁻g⁺', [-F, G1, -G1, F, -G1, G1], ['qbar3', 'g', 'g', 'q3', 'g', 'g']],
]

/** Two valid shifts of a process (labels), adjacent ones first, as a user would pick them. */
function twoShifts(h: number[], species: string[]): [number, number][] {
  const n = h.length
  const codes = species.map(codeOf)
  const p = processOf('qcd')
  const out: [number, number][] = []
  for (const d of [1, 2, n - 1]) for (let i = 0; i < n; i++) {
    const j = (i + d) % n
    if (out.length < 2 && isValidShift(p, h, i, j, codes) && !out.some(s => s[0] === i + 1 && s[1] === j + 1)) out.push([i + 1, j + 1])
  }
  return out
}

const PROCESSES = CASES.flatMap(([name, h, species]) => twoShifts(h, species).map(shift => ({ name: `${name} [${shift[0]},${shift[1]}⟩`, p: { theory: 'qcd' as const, helicities: h, species, shift } })))

function check(p: Process, g: G) {
  const res = toLabels(evaluate(evaluateRequest(p, { kinematics: { kind: 'random', seed: 11 } })), p)
  return { res, r: checkDrawing(res, p, g) }
}

describe('qcd: drawn terms from the engine\'s term tree sum to the recursion', () => {
  it('every process has two valid shifts', () => {
    for (const [name, h, species] of CASES) expect(twoShifts(h, species), name).toHaveLength(2)
  })

  it.each(PROCESSES)('$name: top level and fully expanded', ({ p }) => {
    for (const full of [false, true]) {
      const g = expandedGraph(p, full)
      const { res, r } = check(g.process!, asG(g))
      expect(res.terms.length).toBeGreaterThan(0)
      expect(r.drawing!.comparison.messages).toEqual([])
      expect(r.verdict).toBe('agrees')
      expect(cdiff(r.value!, res.value!) / cabs(res.value!)).toBeLessThan(1e-12)
      expect(['quark-mhv', 'berends-giele-quark']).toContain(res.target!.name)
      expect(cdiff(r.value!, res.target!.value!) / cabs(res.target!.value!)).toBeLessThan(floatTolerance(p.helicities.length))
      // Every quark Line carries a species and an arrow; gluon Lines none; every vertex keeps the flow.
      const v = validateGraph(g.nodes as EditorNode[], g.edges as EditorEdge[], g.process)
      expect(v.errorCount).toBe(0)
      const byId = new Map((g.nodes as EditorNode[]).map(n => [n.id, n]))
      for (const e of g.edges as EditorEdge[]) {
        const d = (e.data ?? {}) as LineData
        if (d.external) continue
        expect(fermionFlow(e, byId) !== null).toBe(Math.abs(d.helicity!) === 0.5)
      }
    }
  })
})

describe('qcd: broken drawings disagree naming the Line', () => {
  // The first process whose full expansion exchanges a quark.
  const hasQuarkLine = (g: G) => g.edges.some(e => (e.data as LineData).species)
  const { p } = PROCESSES.find(x => hasQuarkLine(asG(expandedGraph(x.p, true))))!
  const g = asG(expandedGraph(p, true))
  const quarkLine = g.edges.find(e => (e.data as LineData).species)!
  const name = (quarkLine.data as LineData).line!

  it('the expansion holds a quark Line', () => {
    expect(quarkLine).toBeTruthy()
    expect(check(p, g).r.verdict).toBe('agrees')
  })

  it('a fermion arrow reversed', () => {
    const d = quarkLine.data as LineData
    const anti = d.species!.startsWith('qbar') ? d.species!.replace('qbar', 'q') : d.species!.replace('q', 'qbar')
    const broken: G = { nodes: g.nodes, edges: g.edges.map(e => (e.id === quarkLine.id ? { ...e, data: { ...d, species: anti } } : e)) }
    const { r } = check(p, broken)
    expect(r.verdict).toBe('disagrees')
    expect(r.drawing!.terms.flatMap(t => t.problems).join(' | ')).toContain(`line ${name}: its fermion arrow points the wrong way`)
    // Both vertices at its ends say so in words.
    const v = validateGraph(broken.nodes, broken.edges, p)
    const msgs = [v.nodes[quarkLine.source], v.nodes[quarkLine.target]].flat().map(i => i?.message ?? '').join(' | ')
    expect(msgs).toMatch(/quark line flows into this vertex twice/)
    expect(msgs).toMatch(/quark line flows out of this vertex twice/)
  })

  it('a quark Line drawn as a gluon', () => {
    const d = { ...(quarkLine.data as LineData) }
    delete d.species
    const broken: G = { nodes: g.nodes, edges: g.edges.map(e => (e.id === quarkLine.id ? { ...e, data: d as Record<string, unknown> } : e)) }
    const { r } = check(p, broken)
    expect(r.verdict).toBe('disagrees')
    expect(r.drawing!.terms.flatMap(t => t.problems).join(' | ')).toContain(`line ${name} is drawn as a gluon, but this channel exchanges a quark`)
    expect(r.drawing!.comparison.messages.length).toBeGreaterThan(0)
    const v = validateGraph(broken.nodes, broken.edges, p)
    expect(v.edges[quarkLine.id]!.map(i => i.message).join(' | ')).toMatch(/on a gluon line/)
  })
})

describe('species rules in words', () => {
  it('the vertex flow rule', () => {
    expect(vertexFlowProblem([21, 21, 21])).toBeNull()
    expect(vertexFlowProblem([-1, 1, 21])).toBeNull()
    expect(vertexFlowProblem([1, 1, 21])).toMatch(/flows out of this vertex twice/)
    expect(vertexFlowProblem([-1, 2, 21])).toMatch(/flavours 1 and 2/)
  })
  it('a process with a quark and no antiquark, and an invalid shift, are named by leg', () => {
    expect(speciesProblem({ theory: 'qcd', helicities: [-F, F, -G1, G1], species: ['q1', 'g', 'g', 'g'] })).toMatch(/^leg 2: a gluon has helicity ±1/)
    expect(speciesProblem({ theory: 'qcd', helicities: [-F, G1, -G1, G1], species: ['q1', 'g', 'g', 'g'] })).toMatch(/^leg 1: q1 has no partner qbar1/)
    // [q̄⁻, q⁺⟩ adjacent: exponent 0 by the falloff table (docs/conventions.md "Falloff").
    expect(speciesProblem({ theory: 'qcd', helicities: [-F, F, -G1, G1], species: ['qbar1', 'q1', 'g', 'g'], shift: [1, 2] })).toMatch(/not valid/)
    expect(speciesProblem({ theory: 'qcd', helicities: [-F, F, -G1, G1], species: ['qbar1', 'q1', 'g', 'g'], shift: [3, 4] })).toBeNull()
  })
})
