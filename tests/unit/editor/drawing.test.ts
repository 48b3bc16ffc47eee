// The drawing compiler on drawn terms built from the engine's own term trees (expandedGraph: the
// editor's Expand and Expand fully), and on broken drawings. The drawn sum must equal the engine's
// recursion of the process and the independent target: Parke–Taylor (PRL 56 (1986) 2459) for MHV,
// Berends–Giele (Nucl. Phys. B306 (1988) 759) otherwise, Hodges (arXiv:1204.1930) / KLT for gravitons.
import { describe, expect, it } from 'vitest'
import { expandedGraph } from '#shared/editor/demo'
import { checkDrawing, type CheckedResponse } from '#shared/editor/drawing'
import { evaluateRequest, toLabels } from '#shared/editor/process'
import { validateGraph } from '#shared/editor/validate'
import type { EditorEdge, EditorNode } from '#shared/editor/types'
import { nodeOf } from '#shared/editor/types'
import { evaluate, floatTolerance } from '#shared/physics/index'
import { DrawingResultSchema } from '#shared/schemas/drawing'
import type { Graph, Process } from '#shared/schemas/graph'
import type { EvaluateRequestInput, WireComplex } from '#shared/schemas/evaluate'
import { flipped } from '../../helpers/drawing'

type G = { nodes: EditorNode[], edges: EditorEdge[] }

const asG = (g: Graph): G => ({ nodes: g.nodes as EditorNode[], edges: g.edges as EditorEdge[] })
const cabs = (w: WireComplex) => Math.hypot(Number(w[0]), Number(w[1]))
const cdiff = (a: WireComplex, b: WireComplex) => Math.hypot(Number(a[0]) - Number(b[0]), Number(a[1]) - Number(b[1]))

function check(p: Process, g: G, kinematics: EvaluateRequestInput['kinematics'] = { kind: 'random', seed: 7 }, arithmetic: 'float' | 'exact' = 'float'): CheckedResponse {
  const res = toLabels(evaluate(evaluateRequest(p, { kinematics, arithmetic })), p)
  return checkDrawing(res, p, g)
}

/** The drawing without one component (a deleted term). */
function without(g: G, compId: string): G {
  const v = validateGraph(g.nodes, g.edges)
  const ids = new Set(v.components.find(c => c.id === compId)!.nodeIds)
  return { nodes: g.nodes.filter(n => !ids.has(n.id)), edges: g.edges.filter(e => !ids.has(e.source) && !ids.has(e.target)) }
}

/** A copy of one component with fresh ids (a term drawn twice). */
function withCopy(g: G, compId: string): G {
  const v = validateGraph(g.nodes, g.edges)
  const ids = new Set(v.components.find(c => c.id === compId)!.nodeIds)
  const nodes = g.nodes.filter(n => ids.has(n.id)).map(n => ({ ...n, id: `${n.id}x` }))
  const edges = g.edges.filter(e => ids.has(e.source)).map(e => ({ ...e, id: `${e.id}x`, source: `${e.source}x`, target: `${e.target}x` }))
  return { nodes: [...g.nodes, ...nodes], edges: [...g.edges, ...edges] }
}

const M = -1
const P = 1
// Every class from MHV to N²MHV at n = 5..8, each under two valid shifts ([+,−⟩ is never used).
const CASES: [string, number[], [number, number][]][] = [
  ['5 MHV', [M, M, P, P, P], [[1, 2], [2, 4]]],
  ['5 anti-MHV', [M, P, M, P, M], [[1, 2], [3, 5]]],
  ['6 MHV', [M, M, P, P, P, P], [[1, 2], [2, 5]]],
  ['6 NMHV split', [M, M, M, P, P, P], [[3, 4], [1, 5]]],
  ['6 NMHV alternating', [M, P, M, P, M, P], [[1, 2], [3, 6]]],
  ['7 MHV', [M, P, M, P, P, P, P], [[1, 2], [3, 7]]],
  ['7 NMHV', [M, M, M, P, P, P, P], [[1, 2], [3, 5]]],
  ['8 MHV', [M, M, P, P, P, P, P, P], [[1, 2], [2, 6]]],
  ['8 NMHV', [M, M, M, P, P, P, P, P], [[3, 4], [1, 2]]],
  ['8 N²MHV', [M, M, M, M, P, P, P, P], [[4, 5], [1, 3]]],
]
const PROCESSES = CASES.flatMap(([name, h, shifts]) => shifts.map(shift => ({ name: `${name} [${shift[0]},${shift[1]}⟩`, p: { theory: 'gluon' as const, helicities: h, shift } })))

describe('drawn terms from the engine\'s term tree: the drawn sum is the recursion', () => {
  it.each(PROCESSES)('$name: every channel term, top level and fully expanded', ({ p }) => {
    const res = evaluate(evaluateRequest(p, { kinematics: { kind: 'random', seed: 7 } }))
    const scale = Math.max(...res.terms.map(t => cabs(t.value)))
    expect(res.target!.name).toBe((res.terms.length && p.helicities.filter(x => x < 0).length === 2) || p.helicities.filter(x => x > 0).length === 2 ? 'parke-taylor' : 'berends-giele')
    for (const full of [false, true]) {
      if (full && p.helicities.length === 8 && p.helicities.filter(x => x < 0).length === 4) continue // N²MHV at 8: top level only (the full tree is large)
      const g = expandedGraph(p, full)
      const r = checkDrawing(res, g.process!, asG(g))
      expect(DrawingResultSchema.safeParse(r.drawing).success).toBe(true)
      expect(r.drawing!.comparison.messages).toEqual([])
      expect(r.drawing!.comparison.complete).toBe(true)
      expect(r.verdict).toBe('agrees')
      // The drawn sum against the engine's own recursion (same point, same shift) …
      expect(cdiff(r.value!, res.value!) / cabs(res.value!)).toBeLessThan(1e-12)
      // … and against the independent target (Parke–Taylor or Berends–Giele).
      expect(cdiff(r.value!, res.target!.value!) / cabs(res.target!.value!)).toBeLessThan(floatTolerance(p.helicities.length))
      // Each channel's drawn terms add up to the engine's term of that channel.
      for (const t of res.terms) {
        const mine = r.drawing!.terms.filter(d => d.channel!.join(',') === t.left.join(',') && d.internalHelicity === t.helicity)
        expect(mine.length).toBeGreaterThan(0)
        const sum = mine.reduce<[number, number]>((a, d) => [a[0] + Number(d.value![0]), a[1] + Number(d.value![1])], [0, 0])
        expect(cdiff(sum, t.value) / scale).toBeLessThan(1e-12)
        expect(cdiff(mine[0]!.zStar!, t.z) / cabs(t.z)).toBeLessThan(1e-12)
      }
      if (!full) expect(r.drawing!.terms).toHaveLength(res.terms.length)
    }
  })

  it('a colour-ordered process with a colour order: the drawing follows the order', () => {
    const p: Process = { theory: 'gluon', helicities: [M, M, M, P, P, P], order: [1, 3, 2, 4, 6, 5], shift: [1, 3] }
    for (const full of [false, true]) {
      const g = expandedGraph(p, full)
      // The engine answers in colour-order positions; the check route maps them back to labels.
      const res = toLabels(evaluate(evaluateRequest(g.process!, { kinematics: { kind: 'random', seed: 2 } })), g.process!)
      const r = checkDrawing(res, g.process!, asG(g))
      expect(r.drawing!.comparison.messages).toEqual([])
      expect(r.verdict).toBe('agrees')
      expect(cdiff(r.value!, res.value!) / cabs(res.value!)).toBeLessThan(1e-12)
    }
  })

  it('exact arithmetic: the drawn sum of 6-gluon NMHV equals Berends–Giele exactly', () => {
    const p: Process = { theory: 'gluon', helicities: [M, M, M, P, P, P], shift: [3, 4] }
    const g = expandedGraph(p, true)
    const r = check(g.process!, asG(g), { kind: 'rational', seed: 3 }, 'exact')
    expect(r.target!.name).toBe('berends-giele')
    expect(r.value).toEqual(r.target!.value)
    expect(r.deviation).toBe(0)
    expect(r.verdict).toBe('agrees')
  })

  it.each<[number[], [number, number]]>([
    [[-2, -2, 2, 2], [1, 2]],
    [[-2, -2, 2, 2], [1, 3]],
    [[-2, 2, -2, 2, 2], [1, 2]],
    [[-2, -2, 2, 2, 2], [2, 4]],
    [[-2, -2, -2, 2, 2], [1, 2]],
    [[-2, -2, 2, 2, 2, 2], [1, 2]],
  ])('gravitons %j under %j: the fully expanded drawing agrees with Hodges', (h, shift) => {
    const p: Process = { theory: 'graviton', helicities: h, shift }
    const g = expandedGraph(p, true)
    const r = check(g.process!, asG(g), { kind: 'random', seed: 5 })
    expect(r.target!.name).toBe('hodges')
    expect(r.drawing!.comparison.messages).toEqual([])
    expect(r.verdict).toBe('agrees')
    expect(cdiff(r.value!, r.drawing!.recursion.value!) / cabs(r.value!)).toBeLessThan(1e-12)
  })
})

describe('the cubic scalar', () => {
  it.each<[number, [number, number]]>([[5, [1, 3]], [6, [1, 3]], [6, [2, 5]]])('%i scalars under %j: the drawn sum equals the planar cubic diagrams, top level and fully expanded', (n, shift) => {
    const p: Process = { theory: 'scalar-cubic', helicities: Array<number>(n).fill(0), shift }
    for (const full of [false, true]) {
      const g = expandedGraph(p, full)
      const r = check(g.process!, asG(g))
      expect(r.target!.name).toBe('feynman')
      expect(r.drawing!.comparison.messages).toEqual([])
      expect(r.verdict).toBe('agrees')
    }
  })
})

describe('broken drawings disagree and say why', () => {
  const p6: Process = { theory: 'gluon', helicities: [M, P, M, P, M, P], shift: [1, 2] }

  it.each(PROCESSES.filter(x => x.p.helicities.length <= 7))('$name: deleting any one term names its channel', ({ p }) => {
    const g = asG(expandedGraph(p, false))
    const terms = validateGraph(g.nodes, g.edges, p).drawing.terms
    for (const t of terms) {
      const r = check(p, without(g, t.id))
      expect(r.verdict).toBe('disagrees')
      const word = t.channel!.helicity > 0 ? '+' : '−'
      expect(r.drawing!.comparison.missing.map(m => m.message)).toEqual([`channel {${t.channel!.left.join(',')}} with internal helicity ${word} is not drawn`])
      expect(r.drawing!.message).toContain(`channel {${t.channel!.left.join(',')}} with internal helicity ${word} is not drawn`)
    }
  })

  it('six-gluon demo: flipping the internal helicity of a term names it', () => {
    const g = asG(expandedGraph(p6, false))
    const t = validateGraph(g.nodes, g.edges, p6).drawing.terms[0]!
    const r = check(p6, flipped(g, t.lineId!))
    expect(r.verdict).toBe('disagrees')
    const ch = `{${t.channel!.left.join(',')}}`
    const all = r.drawing!.comparison.messages.join(' | ')
    const was = t.channel!.helicity > 0 ? '+' : '−'
    expect(all).toContain(`channel ${ch} with internal helicity ${was} is not drawn`)
    // Listed once, as the flipped channel with the helicity drawn, naming its term; nothing duplicated.
    expect(r.drawing!.comparison.duplicated).toEqual([])
    expect(r.drawing!.comparison.wrongHelicity).toEqual([{ left: t.channel!.left, helicity: -t.channel!.helicity, terms: [t.id], message: `channel ${ch} is drawn with internal helicity ${t.channel!.helicity > 0 ? '−' : '+'}, the wrong way round: its term has internal helicity ${was}` }])
    // The vertex on leg i's side says why on the node.
    const v = validateGraph(flipped(g, t.lineId!).nodes, flipped(g, t.lineId!).edges, p6)
    expect(Object.values(v.nodes).flat().map(i => i.message).join(' ')).toMatch(/holds the shifted leg 1 \(λ̃ shifted\)/)
  })

  it('a term drawn twice is named', () => {
    const g = asG(expandedGraph(p6, false))
    const t = validateGraph(g.nodes, g.edges, p6).drawing.terms[1]!
    const r = check(p6, withCopy(g, t.id))
    expect(r.verdict).toBe('disagrees')
    const word = t.channel!.helicity > 0 ? '+' : '−'
    expect(r.drawing!.comparison.duplicated.map(d => d.message)).toEqual([`channel {${t.channel!.left.join(',')}} with internal helicity ${word} is drawn twice`])
  })

  it('fully expanded: deleting one sub-term of a channel names the channel as incomplete', () => {
    // Four-graviton sub-amplitudes have two terms under their shift (channels over all subsets).
    const p: Process = { theory: 'graviton', helicities: [-2, -2, 2, 2, 2], shift: [1, 2] }
    const g = asG(expandedGraph(p, true))
    const terms = validateGraph(g.nodes, g.edges, p).drawing.terms
    const key = (t: typeof terms[number]) => `${t.channel!.left}|${t.channel!.helicity}`
    const shared = terms.find(t => terms.filter(u => key(u) === key(t)).length > 1)!
    const r = check(p, without(g, shared.id))
    expect(r.verdict).toBe('disagrees')
    expect(r.drawing!.comparison.incomplete).toHaveLength(1)
    expect(r.drawing!.comparison.incomplete[0]!.message).toMatch(new RegExp(`^channel \\{${shared.channel!.left.join(',')}\\} with internal helicity \\S+, sub-amplitude \\([^)]*\\): its term \\{[^}]*\\} \\| \\S+ under \\[[^⟩]*⟩ is not drawn$`))
  })

  /** Four gluons (−−++) by hand: angle vertex a holds legs x, y and the line (helicity ha at a), square vertex b the other two. */
  function four(x: number, y: number, ha: number): G {
    const others = [1, 2, 3, 4].filter(l => l !== x && l !== y)
    const hel = [M, M, P, P]
    const legs = [x, y, ...others].map(l => ({ id: `l${l}`, type: 'leg' as const, position: { x: 0, y: 0 }, data: { label: l, helicity: hel[l - 1]! } }))
    const nodes: EditorNode[] = [
      { id: 'a', type: 'angle', position: { x: 0, y: 0 }, data: {} },
      { id: 'b', type: 'square', position: { x: 0, y: 0 }, data: {} },
      ...legs,
    ]
    const edges: EditorEdge[] = [
      { id: 'ex', source: `l${x}`, target: 'a', sourceHandle: 'p', targetHandle: 'h0', data: { external: true } },
      { id: 'ey', source: `l${y}`, target: 'a', sourceHandle: 'p', targetHandle: 'h1', data: { external: true } },
      { id: 'e1', source: `l${others[0]}`, target: 'b', sourceHandle: 'p', targetHandle: 'h0', data: { external: true } },
      { id: 'e2', source: `l${others[1]}`, target: 'b', sourceHandle: 'p', targetHandle: 'h1', data: { external: true } },
      { id: 'line', source: 'a', target: 'b', sourceHandle: 'h2', targetHandle: 'h2', data: { helicity: ha } },
    ]
    return { nodes, edges }
  }

  it('four gluons by hand: the right assembly agrees; both shifted legs on one vertex is named on the node and disagrees', () => {
    const p: Process = { theory: 'gluon', helicities: [M, M, P, P], shift: [1, 2] }
    const good = check(p, four(4, 1, M))
    expect(good.drawing!.comparison.messages).toEqual([])
    expect(good.verdict).toBe('agrees')
    const bad = four(1, 2, P)
    const v = validateGraph(bad.nodes, bad.edges, p)
    expect(v.nodes.a!.map(i => i.message)).toContain('both shifted legs 1 and 2 of [1, 2⟩ sit on this vertex: a term\'s top-level line must separate them')
    const r = check(p, bad)
    expect(r.verdict).toBe('disagrees')
    expect(r.drawing!.comparison.missing.map(m => m.message)).toEqual(['channel {1,4} with internal helicity − is not drawn'])
    expect(r.drawing!.comparison.invalid[0]!.message).toMatch(/both shifted legs 1 and 2/)
  })

  it('a line that does not separate a channel of the shift is named on the line', () => {
    // Five gluons under [1,2⟩: vertex u(1,3), v(2), w(4,5); the line u–v separates {1,3}, not consecutive.
    const p: Process = { theory: 'gluon', helicities: [M, M, P, P, P], shift: [1, 2] }
    const leg = (l: number) => ({ id: `l${l}`, type: 'leg' as const, position: { x: 0, y: 0 }, data: { label: l, helicity: p.helicities[l - 1]! } })
    const nodes: EditorNode[] = [
      { id: 'u', type: 'angle', position: { x: 0, y: 0 }, data: {} },
      { id: 'v', type: 'square', position: { x: 0, y: 0 }, data: {} },
      { id: 'w', type: 'angle', position: { x: 0, y: 0 }, data: {} },
      ...[1, 2, 3, 4, 5].map(leg),
    ]
    const ext = (l: number, to: string, h: string) => ({ id: `e${l}`, source: `l${l}`, target: to, sourceHandle: 'p', targetHandle: h, data: { external: true } })
    const edges: EditorEdge[] = [
      ext(1, 'u', 'h0'), ext(3, 'u', 'h1'), ext(2, 'v', 'h1'), ext(4, 'w', 'h0'), ext(5, 'w', 'h1'),
      { id: 'uv', source: 'u', target: 'v', sourceHandle: 'h2', targetHandle: 'h0', data: { helicity: M } },
      { id: 'vw', source: 'v', target: 'w', sourceHandle: 'h2', targetHandle: 'h2', data: { helicity: M } },
    ]
    const v = validateGraph(nodes, edges, p)
    expect(v.edges.uv!.map(i => i.message)).toContain('line #1 separates {1,3} from {2,4,5}: not a channel of [1, 2⟩ (its legs are not consecutive in the colour order)')
    expect(v.drawing.terms[0]!.channel).toBeNull()
    const r = check(p, { nodes, edges })
    expect(r.verdict).toBe('disagrees')
    expect(r.drawing!.comparison.invalid[0]!.message).toMatch(/no line of this term separates a channel of \[1, 2⟩/)
    // Five-gluon MHV under [1,2⟩ has one live term: {1,4,5} (the {1,5} term vanishes).
    expect(r.drawing!.comparison.missing.map(m => m.left)).toEqual([[1, 4, 5]])
  })

  it('a graph with no drawn terms is not a drawing; the demo diagrams read back without a message', () => {
    const g = expandedGraph(p6, false)
    const v = validateGraph(g.nodes as EditorNode[], g.edges, g.process)
    expect(v.drawing.terms.map(t => t.label)).toEqual(v.drawing.terms.map(t => `{${t.channel!.left.join(',')}} | ${t.channel!.helicity > 0 ? '+' : '−'}`))
    expect(v.drawing.terms.every(t => t.valid && t.leftNodeIds.length > 0 && t.rightNodeIds.length > 0)).toBe(true)
    expect(validateGraph([], [], p6).drawing.terms).toEqual([])
  })
})

describe('any edit of a drawing gets an answer, never an exception', () => {
  it.each<[string, Process, boolean]>([
    ['6 gluons, fully expanded', { theory: 'gluon', helicities: [M, M, M, P, P, P], shift: [3, 4] }, true],
    ['7 gluons, top level with Blocks', { theory: 'gluon', helicities: [M, P, M, P, M, P, P], shift: [1, 2] }, false],
    ['5 gravitons, fully expanded', { theory: 'graviton', helicities: [-2, -2, 2, 2, 2], shift: [1, 2] }, true],
  ])('%s: random deletions, flips, kind changes and re-wirings are checked without throwing', (_, p, full) => {
    const base = asG(expandedGraph(p, full))
    const res = evaluate(evaluateRequest(p, { kinematics: { kind: 'random', seed: 9 } }))
    let seed = 12345
    const rnd = (k: number) => {
      seed = (seed * 1103515245 + 12345) % 2 ** 31
      return seed % k
    }
    const verdicts = new Set<string>()
    for (let trial = 0; trial < 200; trial++) {
      let g: G = { nodes: base.nodes.map(n => ({ ...n })), edges: base.edges.map(e => ({ ...e })) }
      for (let step = 0; step <= rnd(3); step++) {
        const what = rnd(5)
        if (what === 0) g = { ...g, edges: g.edges.filter((_, t) => t !== rnd(g.edges.length)) }
        else if (what === 1) {
          const lines = g.edges.filter(e => !(e.data as { external?: boolean }).external)
          if (lines.length) g = flipped(g, lines[rnd(lines.length)]!.id)
        }
        else if (what === 2) {
          const k = rnd(g.nodes.length)
          g = { ...g, nodes: g.nodes.map((n, t) => (t === k && n.type !== 'leg' ? nodeOf(n.id, n.type === 'angle' ? 'square' : n.type === 'square' ? 'block' : 'angle', n.position, n.data) : n)) }
        }
        else if (what === 3) {
          const k = rnd(g.edges.length)
          const to = g.nodes[rnd(g.nodes.length)]!.id
          g = { ...g, edges: g.edges.map((e, t) => (t === k ? { ...e, target: to, targetHandle: `h${rnd(3)}` } : e)) }
        }
        else g = { ...g, nodes: g.nodes.filter((_, t) => t !== rnd(g.nodes.length)) }
        const ids = new Set(g.nodes.map(n => n.id))
        g = { ...g, edges: g.edges.filter(e => ids.has(e.source) && ids.has(e.target)) }
      }
      const r = checkDrawing(res, p, g)
      expect(DrawingResultSchema.safeParse(r.drawing).success).toBe(true)
      if (!r.drawing!.comparison.complete) expect(r.verdict).not.toBe('agrees')
      verdicts.add(r.verdict)
    }
    expect(verdicts.has('disagrees')).toBe(true)
  })
})
