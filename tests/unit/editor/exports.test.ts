import { describe, expect, it } from 'vitest'
import { evaluate, rationalPoint, kinToWire, rationalField } from '#shared/physics/index'
import { shiftedKin } from '#shared/physics/falloff'
import { Fraction } from '#shared/physics/field'
import { termsCsv, termsLatex, canvasSvg, exportCaption } from '#shared/editor/exports'
import { kinematicsOf, defaultEvalSettings } from '#shared/editor/kinematics'
import { falloffFit, log10AbsRational, shiftExact } from '#shared/editor/falloff'
import { expandedGraph } from '#shared/editor/demo'
import type { Process } from '#shared/schemas/graph'
import type { EditorNode } from '#shared/editor/types'

const p: Process = { theory: 'gluon', helicities: [-1, -1, 1, 1, 1], shift: [1, 2] }

describe('term table exports', () => {
  const r = evaluate({ theory: 'gluon', helicities: p.helicities, shift: p.shift, kinematics: { kind: 'random', seed: 3 } })
  it('CSV: a header, one row per term, the total and the target', () => {
    const lines = termsCsv(r, p).trim().split('\n')
    expect(lines[0]).toMatch(/^# shift \[1,2>, arithmetic float/)
    expect(lines[1]).toBe('channel,helicity,z_re,z_im,pole_re,pole_im,value_re,value_im,abs,phase_over_pi')
    expect(lines).toHaveLength(2 + r.terms.length + 2)
    expect(lines.at(-1)).toMatch(/^target:parke-taylor,/)
    // The total row holds the residue sum exactly as the server sent it.
    expect(lines.at(-2)!.split(',')[6]).toBe(String(r.value![0]))
  })
  it('LaTeX: a booktabs tabular with every term', () => {
    const t = termsLatex(r, p)
    expect(t).toContain('\\begin{tabular}{llrrrr}')
    expect((t.match(/\\\\\n/g) ?? []).length).toBeGreaterThanOrEqual(r.terms.length + 2)
    expect(t).toContain('\\end{tabular}')
  })
})

describe('canvas SVG', () => {
  it('draws every node with its shape and escapes the title', () => {
    const g = expandedGraph(p, true)
    const svg = canvasSvg(g.nodes as EditorNode[], g.edges, { shift: [1, 2], title: 'A <b> & "c"' })
    expect(svg.startsWith('<svg xmlns="http://www.w3.org/2000/svg"')).toBe(true)
    expect((svg.match(/<polygon/g) ?? []).length).toBe(g.nodes.filter(n => n.type === 'angle').length)
    expect(svg).toContain('A &lt;b&gt; &amp; &quot;c&quot;')
    expect((svg.match(/>z</g) ?? []).length).toBe(g.nodes.filter(n => n.type === 'leg' && [1, 2].includes((n.data as { label: number }).label)).length)
  })
})

describe('kinematics panel', () => {
  it.each([
    ['not json', 'kinematics: not valid JSON'],
    ['[[1, 0, 0, 1], [1, 0, 0, -1]]', 'kinematics: 2 legs pasted for a process of 5'],
    ['{"momenta": [[1, 0, 0, "x"]]}', 'kinematics.momenta[0][3]'],
    ['{"lambda": [[[1, 0], [0, 1]]], "lambdaTilde": 3}', 'kinematics.lambdaTilde'],
  ])('pasted %s → %s', (pasted, message) => {
    const r = kinematicsOf({ ...defaultEvalSettings(), kind: 'pasted', pasted }, 5)
    expect('message' in r && r.message).toContain(message)
  })
  it('seeded kinds keep the seed as a number when it is one', () => {
    expect(kinematicsOf({ ...defaultEvalSettings(), kind: 'physical', seed: '7', energy: 2 }, 5)).toEqual({ kinematics: { kind: 'physical', seed: 7, energy: 2 } })
    expect(kinematicsOf({ ...defaultEvalSettings(), kind: 'rational', seed: 'abc' }, 5)).toEqual({ kinematics: { kind: 'rational', seed: 'abc' } })
  })
})

describe('falloff points', () => {
  it('shifts exact spinors as the engine does', () => {
    const k = rationalPoint(5, 'x')
    const w = kinToWire(rationalField, k) as { lambda: [string, string][], lambdaTilde: [string, string][] }
    const mine = shiftExact(w.lambda, w.lambdaTilde, 0, 1, 1000n)
    const theirs = kinToWire(rationalField, shiftedKin(k, 0, 1, new Fraction(1000))) as { lambda: [string, string][], lambdaTilde: [string, string][] }
    const same = (a: string, b: string) => new Fraction(a).equals(new Fraction(b))
    mine.lambda.forEach((s, t) => s.forEach((x, c) => expect(same(x, theirs.lambda[t]![c]!)).toBe(true)))
    mine.lambdaTilde.forEach((s, t) => s.forEach((x, c) => expect(same(x, theirs.lambdaTilde[t]![c]!)).toBe(true)))
  })
  it('log10 of huge rationals without overflow, and the fitted exponent', () => {
    expect(log10AbsRational('-3/4')).toBeCloseTo(Math.log10(0.75), 12)
    expect(log10AbsRational(`1${'0'.repeat(400)}/7`)).toBeCloseTo(400 - Math.log10(7), 10)
    const pts = [2, 3, 4, 5, 6, 7].map(x => ({ log10z: x, log10abs: 1.3 - 2 * x + 10 ** (-x) }))
    expect(falloffFit(pts)).toMatchObject({ exponent: -2 })
  })
})

describe('exported figures are captioned', () => {
  it('the SVG says the process and the shift, and labels every slot of a Block', () => {
    const q: Process = { theory: 'gluon', helicities: [-1, 1, -1, 1, 1, 1], shift: [1, 3], order: [1, 2, 3, 4, 6, 5] }
    const g = expandedGraph(q, false)
    const caption = exportCaption(q)
    expect(caption).toBe('A₆(1⁻, 2⁺, 3⁻, 4⁺, 6⁺, 5⁺) · gluons (colour-ordered) · shift [1,3⟩')
    const svg = canvasSvg(g.nodes as EditorNode[], g.edges, { shift: q.shift, title: 'Six gluons', caption })
    expect(svg).toContain(`data-role="caption">${caption}</text>`)
    const blocks = g.nodes.filter(n => n.type === 'block')
    expect(blocks).toHaveLength(2)
    const slots = blocks.reduce((a, b) => a + (b.data as { helicities: number[] }).helicities.length, 0)
    expect((svg.match(/data-role="slot"/g) ?? []).length).toBe(slots)
    // A Block's slot joined to an internal line is labelled by the line (P…), the others by leg.
    expect(svg).toMatch(/data-role="slot">P\d+[⁺⁻]</)
    expect(svg).toMatch(/data-role="slot">\d+[⁺⁻]</)
    // The width leaves room for the caption.
    expect(Number(/width="(\d+)"/.exec(svg)![1])).toBeGreaterThanOrEqual(caption.length * 7)
  })
  it('other theories and no shift', () => {
    expect(exportCaption({ theory: 'spin', spin: 3, helicities: [-3, -3, 3, 3] })).toBe('A₄(1⁻³, 2⁻³, 3⁺³, 4⁺³) · single species of spin s, s = 3 · default shift')
    expect(exportCaption({ theory: 'graviton', helicities: [-2, -2, 2, 2, 2], shift: [1, 2] })).toBe('M₅(1⁻², 2⁻², 3⁺², 4⁺², 5⁺²) · gravitons · shift [1,2⟩')
    expect(exportCaption(null)).toBe('no process set')
  })
})
