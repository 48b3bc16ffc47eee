// Target selection (docs/api.md "Evaluation request") and evaluation through the registry; the values themselves are
// checked against outside references in the other files of this folder.
import { describe, expect, it } from 'vitest'
import { complexField as C, rationalField as Q } from '#shared/physics/field'
import { TARGETS, applicableTargets, autoTarget, evaluateTarget } from '#shared/physics/targets'
import type { TargetName, TargetTheory } from '#shared/physics/targets'
import { parkeTaylor } from '#shared/physics/targets/parke-taylor'
import { berendsGiele } from '#shared/physics/targets/berends-giele'
import { PhysicsError } from '#shared/physics/errors'
import { randomComplexPoint, randomRationalPoint, relDiff } from './_points'

describe('applicable targets and the auto choice', () => {
  it.each<[TargetTheory, number[], number | undefined, TargetName[], TargetName | null]>([
    ['gluon', [-1, -1, 1, 1, 1], undefined, ['parke-taylor', 'berends-giele'], 'parke-taylor'],
    ['gluon', [1, 1, -1, -1, -1], undefined, ['parke-taylor', 'berends-giele'], 'parke-taylor'],
    ['gluon', [-1, -1, -1, 1, 1, 1], undefined, ['berends-giele'], 'berends-giele'],
    ['gluon', [1, 1, 1, 1, 1], undefined, ['parke-taylor', 'berends-giele'], 'parke-taylor'],
    ['graviton', [-2, -2, 2, 2, 2, 2, 2], undefined, ['hodges', 'klt'], 'hodges'],
    ['graviton', [-2, 2, -2, 2, 2], undefined, ['hodges', 'klt'], 'hodges'],
    ['graviton', [-2, -2, -2, 2, 2, 2], undefined, ['klt'], 'klt'],
    ['graviton', [-2, -2, -2, 2, 2, 2, 2], undefined, ['klt'], 'klt'],
    ['graviton', [-2, -2, 2, 2, 2, 2, 2, 2], undefined, ['hodges'], 'hodges'],
    ['spin', [-2, -2, 2, 2], 2, ['hodges', 'klt'], 'hodges'],
    ['spin', [-1, -1, 1, 1], 1, [], null],
    ['spin', [-3, -3, 3, 3], 3, [], null],
    ['scalar-cubic', [0, 0, 0, 0, 0], undefined, ['feynman'], 'feynman'],
    ['gluon', [-2, -2, 2, 2], undefined, [], null],
  ])('%s %j (spin %s) → %j, auto %s', (theory, h, spin, list, auto) => {
    expect(applicableTargets(theory, h, spin)).toEqual(list)
    expect(autoTarget(theory, h, spin)).toBe(auto)
  })
})

describe('evaluateTarget', () => {
  it('dispatches to the target functions', () => {
    const k = randomComplexPoint(6, 'registry')
    const h = [-1, 1, -1, 1, 1, 1]
    expect(relDiff(evaluateTarget('parke-taylor', C, k, h), parkeTaylor(C, k, h))).toBe(0)
    expect(relDiff(evaluateTarget('berends-giele', C, k, h), berendsGiele(C, k, h))).toBe(0)
  })
  it('vanishing classes give exactly zero for every gluon and graviton target', () => {
    const k = randomRationalPoint(5, 'registry-zero')
    for (const name of ['parke-taylor', 'berends-giele'] as const) expect(evaluateTarget(name, Q, k, [1, 1, -1, 1, 1]).n).toBe(0n)
    for (const name of ['hodges', 'klt'] as const) expect(evaluateTarget(name, Q, k, [2, 2, 2, 2, 2]).n).toBe(0n)
  })
  it.each<[TargetName, number[], RegExp]>([
    ['parke-taylor', [-1, -1, -1, 1, 1, 1], /^target: Parke–Taylor applies only/],
    ['hodges', [-1, -1, 1, 1], /^target: hodges applies to gravitons/],
    ['feynman', [-1, -1, 1, 1], /^target: feynman applies to scalars/],
    ['klt', [0, 0, 0, 0], /^target: klt applies to gravitons/],
  ])('%s with helicities %j is refused (422, field target)', (name, h, msg) => {
    const k = randomComplexPoint(h.length, 'registry-bad')
    let err: unknown
    try {
      evaluateTarget(name, C, k, h)
    }
    catch (e) {
      err = e
    }
    expect(err).toBeInstanceOf(PhysicsError)
    expect((err as PhysicsError).message).toMatch(msg)
    expect((err as PhysicsError).field).toBe('target')
  })
})

describe('catalogue entries', () => {
  it('one entry per target, each with a label, theories, a description and a source', () => {
    expect(TARGETS.map((t) => t.name).sort()).toEqual(['berends-giele', 'berends-giele-quark', 'berends-giele-quark-lines', 'feynman', 'hodges', 'klt', 'parke-taylor', 'quark-mhv', 'quark-pairs-mhv'])
    expect(Object.fromEntries(TARGETS.map((t) => [t.name, [t.label, t.theories]]))).toEqual({
      'quark-mhv': ['Quark MHV (Mangano–Parke)', ['qcd']],
      'berends-giele-quark': ['Berends–Giele with a quark line', ['qcd']],
      'berends-giele-quark-lines': ['Berends–Giele with two quark lines', ['qcd']],
      'quark-pairs-mhv': ['Two quark pairs MHV (N = 1 form)', ['qcd']],
      'parke-taylor': ['Parke–Taylor', ['gluon', 'qcd']],
      'berends-giele': ['Berends–Giele', ['gluon', 'qcd']],
      'hodges': ['Hodges determinant', ['graviton', 'spin']],
      'klt': ['KLT relations', ['graviton', 'spin']],
      'feynman': ['Feynman diagrams', ['scalar-cubic']],
    })
    // Each source is a citation: a journal with volume and year, an arXiv number, or says it is common practice.
    for (const t of TARGETS) expect(t.source).toMatch(/\b[A-Z][\w. ]+ [A-Z]?\d+ \(\d{4}\) \d+|arXiv:\d{4}\.\d{4,5}|common practice/)
    // Every theory a target names offers it in the catalogue's sense: it applies to some process of that theory.
    const sample: Record<string, [number[], number?, number[]?][]> = {
      'gluon': [[[-1, -1, 1, 1]]], 'graviton': [[[-2, -2, 2, 2]]], 'spin': [[[-2, -2, 2, 2], 2]], 'scalar-cubic': [[[0, 0, 0, 0]]],
      'qcd': [[[-1, -1, 1, 1]], [[-0.5, 0.5, -1, 1], undefined, [-1, 1, 21, 21]], [[-0.5, 0.5, 0.5, -0.5], undefined, [-1, 1, -2, 2]]],
    }
    for (const t of TARGETS) for (const th of t.theories) expect(sample[th]!.some(([h, s, pdg]) => t.applies(th, h, s, pdg))).toBe(true)
  })
})
