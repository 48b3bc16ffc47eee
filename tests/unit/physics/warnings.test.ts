// Singular-point warnings and the drawing's message read as one sentence: the reason is said once
// ("vanishes" at most once, "singular point" at most once), with no parenthesis inside a parenthesis
// and no second sentence. The point is the six-gluon one of precision.test.ts where two poles of the
// [2,5⟩ shift coincide (exact zero), and a target formula that divides by zero.
import { describe, expect, it } from 'vitest'
import { evaluate } from '#shared/physics/index'
import { checkDrawing } from '#shared/editor/drawing'
import { expandedGraph } from '#shared/editor/demo'
import { evaluateRequest, toLabels } from '#shared/editor/process'
import type { EditorEdge, EditorNode } from '#shared/editor/types'
import type { Process } from '#shared/schemas/graph'

const coincident = {
  kind: 'exact-spinors' as const,
  lambda: [['2', '1'], ['1', '-2'], ['-2', '0'], ['-2', '-1'], ['-1', '-2'], ['-1', '1']] as [string, string][],
  lambdaTilde: [['-1', '1'], ['1', '-2'], ['-1', '-1'], ['2', '-1'], ['-8/3', '10/3'], ['-1/3', '2/3']] as [string, string][],
}

function expectOneSentence(w: string) {
  expect(w.match(/vanishes/g)?.length ?? 0, w).toBeLessThanOrEqual(1)
  expect(w.match(/singular point/g)?.length ?? 0, w).toBeLessThanOrEqual(1)
  expect(w, w).not.toMatch(/\([^)]* [^)]*\)\s*vanishes/) // a prose aside, then "vanishes" again
  expect(w, w).not.toMatch(/\([^)]*\(/)
  expect(w, w).not.toMatch(/[.!?]\s+[A-Za-z]/)
}

describe('singular-point warnings are one sentence', () => {
  it('a shift meeting an exact zero, in exact and float arithmetic', () => {
    const h = [-1, -1, 1, -1, 1, 1]
    let seen = 0
    for (const arithmetic of ['exact', 'float'] as const) for (const shift of [[2, 5], [1, 4], [3, 6], [5, 2]] as [number, number][]) {
      const r = evaluate({ theory: 'gluon', helicities: h, shift, kinematics: coincident, arithmetic, target: 'berends-giele' })
      for (const w of r.warnings) expectOneSentence(w)
      seen += r.warnings.filter((w) => w.startsWith('singular point')).length
    }
    // One warning for each of the 4 shifts in each of the 2 arithmetics (measured).
    expect(seen).toBe(8)
  })

  it('a target formula dividing by zero', () => {
    const r = evaluate({ theory: 'gluon', helicities: [-1, -1, 1, 1], kinematics: { kind: 'rational', seed: 1 }, arithmetic: 'exact', target: { formula: '<1 2>^4/(<1 2><2 3><3 4><4 1>) + 1/(s(1,2) - s(1,2))' } })
    const w = r.warnings.filter((x) => x.startsWith('singular point'))
    expect(w).toEqual(['singular point: the target formula divides by zero at position 35'])
    for (const x of r.warnings) expectOneSentence(x)
  })

  it('the drawing\'s message at a singular point names the reason once', () => {
    const p: Process = { theory: 'gluon', helicities: [-1, -1, 1, -1, 1, 1], shift: [2, 5] }
    const g = expandedGraph(p)
    const res = toLabels(evaluate(evaluateRequest(p, { kinematics: coincident, arithmetic: 'exact' })), p)
    expect(res.verdict).toBe('singular point')
    const r = checkDrawing(res, p, { nodes: g.nodes as EditorNode[], edges: g.edges as EditorEdge[] })
    expect(r.drawing!.message).toMatch(/^the drawing meets a singular point: under the shift \[2, 5⟩ /)
    expectOneSentence(r.drawing!.message)
  })
})
