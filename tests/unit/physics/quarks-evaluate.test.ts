// The qcd theory through the engine's entry: species per leg on the request, targets chosen by
// the registry, errors naming the field. Values are checked against the quark-line Berends–Giele
// current and the quark MHV forms (their papers beside quarks-bcfw.test.ts).
import { describe, expect, it } from 'vitest'
import { evaluate, PhysicsError } from '#shared/physics/index'
import { rationalField as Q } from '#shared/physics/field'
import { rationalPoint } from '#shared/physics/kinematics'
import { angle, square } from '#shared/physics/spinors'
import { bcfw } from '#shared/physics/bcfw'
import { defaultShift, isValidShift } from '#shared/physics/theories'
import { oneLineCases, sample, speciesNames, QCD } from './quarks-helpers'
import { classifyTwoLineMhv } from '#shared/physics/targets/quark-mhv'
import { pdgOfSpecies } from '#shared/physics/quarks'

describe('evaluate with species', () => {
  for (const n of [4, 5, 6, 7, 8]) {
    it(`n = ${n}, float: agrees with the auto target`, () => {
      for (const { h, pdg } of sample(oneLineCases(n, { nonVanishing: true }), 6)) {
        const r = evaluate({ theory: 'qcd', helicities: h, species: speciesNames(pdg), kinematics: { kind: 'random', seed: `q${n}` } })
        expect(r.verdict, `${h} ${pdg} ${r.warnings.join('; ')}`).toBe('agrees')
        expect(['quark-mhv', 'berends-giele-quark']).toContain(r.target!.name)
        expect(r.species).toEqual(speciesNames(pdg))
      }
    })
  }
  it('exact, n = 6, both quark targets by name', () => {
    const h = [-0.5, 1, -1, 0.5, -1, 1]
    const species = ['qbar1', 'g', 'g', 'q1', 'g', 'g']
    const r = evaluate({ theory: 'qcd', helicities: h, species, kinematics: { kind: 'rational', seed: 3 }, arithmetic: 'exact', target: 'berends-giele-quark' })
    expect(r.verdict).toBe('agrees')
    const m = evaluate({ theory: 'qcd', helicities: [-0.5, 1, -1, 0.5, 1], species: ['qbar2', 'g', 'g', 'q2', 'g'], kinematics: { kind: 'rational', seed: 3 }, arithmetic: 'exact' })
    expect(m.target!.name).toBe('quark-mhv')
    expect(m.verdict).toBe('agrees')
  })
  it('without species a qcd process is gluons (backward compatible)', () => {
    const r = evaluate({ theory: 'qcd', helicities: [-1, -1, 1, 1, 1], kinematics: { kind: 'random', seed: 1 } })
    expect(r.target!.name).toBe('parke-taylor')
    expect(r.verdict).toBe('agrees')
  })
  it('a quark line with equal end helicities is zero, with a warning', () => {
    const r = evaluate({ theory: 'qcd', helicities: [-0.5, -0.5, -1, 1, 1], species: ['qbar1', 'q1', 'g', 'g', 'g'], kinematics: { kind: 'random', seed: 1 } })
    expect(r.value).toEqual([0, 0])
    expect(r.warnings.some((w) => w.includes('equal helicities'))).toBe(true)
  })
  const bad: [string, object, string][] = [
    ['unknown species', { helicities: [-0.5, 0.5, -1, 1], species: ['qbar1', 'q1', 'x', 'g'] }, 'species[2]'],
    ['a line without its partner', { helicities: [-0.5, 1, -1, 1], species: ['qbar1', 'g', 'g', 'g'] }, 'species[0]'],
    ['a quark with helicity 1', { helicities: [-1, 0.5, -1, 1], species: ['qbar1', 'q1', 'g', 'g'] }, 'helicities[0]'],
    ['a gluon with helicity 1/2', { helicities: [-0.5, 0.5, -0.5, 1], species: ['qbar1', 'q1', 'g', 'g'] }, 'helicities[2]'],
    ['lengths differ', { helicities: [-0.5, 0.5, -1, 1], species: ['qbar1', 'q1', 'g'] }, 'species'],
    ['a flavour twice', { helicities: [-0.5, 0.5, -0.5, 0.5], species: ['qbar1', 'q1', 'qbar1', 'q1'] }, 'species[2]'],
  ]
  for (const [what, body, field] of bad) {
    it(`refused: ${what} (field ${field})`, () => {
      try {
        evaluate({ theory: 'qcd', kinematics: { kind: 'random', seed: 1 }, ...body } as never)
        expect.unreachable()
      }
      catch (e) {
        expect(e).toBeInstanceOf(PhysicsError)
        expect((e as PhysicsError).field).toBe(field)
      }
    })
  }
  it('quark species on a gluon process are refused', () => {
    expect(() => evaluate({ theory: 'gluon', helicities: [-1, -1, 1, 1], species: ['q1', 'g', 'g', 'g'], kinematics: { kind: 'random', seed: 1 } })).toThrow(/species\[0\]/)
  })
})

describe('two quark lines of different flavours', () => {
  for (const arithmetic of ['float', 'exact'] as const) {
    it(`${arithmetic}: the auto target (the two-line MHV form, else the quark-lines current) agrees (n = 4..7)`, () => {
      for (const [h, species] of [
        [[-0.5, 0.5, 0.5, -0.5], ['qbar1', 'q1', 'qbar2', 'q2']],
        [[-0.5, 0.5, -1, 0.5, -0.5], ['qbar1', 'q1', 'g', 'qbar2', 'q2']],
        [[0.5, -1, -0.5, 0.5, 1, -0.5], ['qbar3', 'g', 'q3', 'qbar1', 'g', 'q1']],
        [[-0.5, 1, -1, 0.5, 0.5, -1, -0.5], ['qbar2', 'g', 'g', 'q2', 'qbar5', 'g', 'q5']],
      ] as [number[], string[]][]) {
        const r = evaluate({ theory: 'qcd', helicities: h, species, kinematics: { kind: arithmetic === 'exact' ? 'rational' : 'random', seed: 4 }, arithmetic })
        expect(r.target!.name).toBe(classifyTwoLineMhv(h, species.map(pdgOfSpecies)) ? 'quark-pairs-mhv' : 'berends-giele-quark-lines')
        expect(r.verdict, `${species} ${r.warnings.join('; ')}`).toBe('agrees')
      }
    })
  }

  // One gluon exchanged between the lines (colour-ordered Feynman rules, vertices γ^μ/√2 and the
  // Fierz identity ⟨a|γ^μ|b]⟨c|γ_μ|d] = 2⟨ac⟩[db], common practice): |A₄| = |⟨m₁m₂⟩[p₁p₂] / s_line|
  // with m the negative and p the positive end of each line. The sign, a convention, is pinned in
  // physics/quarks-two-lines.test.ts.
  it('n = 4: the magnitude of single-gluon exchange, every order and helicity', () => {
    const k = rationalPoint(4, 'two-lines')
    let checked = 0
    for (const pdg of [[-1, 1, -2, 2], [-1, -2, 2, 1], [-1, 1, 2, -2], [1, -1, -2, 2]]) for (const s1 of [1, -1]) for (const s2 of [1, -1]) {
      const h = pdg.map((c) => (Math.abs(c) === 1 ? (c < 0 ? s1 : -s1) : c < 0 ? s2 : -s2) / 2)
      const m1 = [0, 1, 2, 3].find((t) => Math.abs(pdg[t]!) === 1 && h[t]! < 0)!
      const p1 = [0, 1, 2, 3].find((t) => Math.abs(pdg[t]!) === 1 && h[t]! > 0)!
      const m2 = [0, 1, 2, 3].find((t) => Math.abs(pdg[t]!) === 2 && h[t]! < 0)!
      const p2 = [0, 1, 2, 3].find((t) => Math.abs(pdg[t]!) === 2 && h[t]! > 0)!
      const line = [0, 1, 2, 3].filter((t) => Math.abs(pdg[t]!) === 1)
      const s = Q.mul(angle(Q, k, line[0]!, line[1]!), square(Q, k, line[1]!, line[0]!))
      const want = Q.div(Q.mul(angle(Q, k, m1, m2), square(Q, k, p1, p2)), s)
      const shift = defaultShift(QCD, h, pdg)
      expect(isValidShift(QCD, h, shift[0], shift[1], pdg), `${h} ${pdg}`).toBe(true)
      const v = bcfw(Q, QCD, k, h, shift, { pdg }).value
      expect(Q.equals(v, want) || Q.equals(v, Q.neg(want)), `${h} ${pdg}`).toBe(true)
      checked++
    }
    expect(checked).toBe(16)
  })
  // A missed boundary term would make valid shifts disagree.
  for (const [h, pdg] of [
    [[-0.5, 0.5, -1, 0.5, -0.5], [-1, 1, 21, -2, 2]],
    [[-0.5, 0.5, -1, 0.5, -0.5, 1], [-1, 1, 21, -2, 2, 21]],
    [[0.5, -1, -0.5, 0.5, 1, -0.5], [-1, 21, 1, -2, 21, 2]],
    [[-0.5, -0.5, 1, 0.5, -1, 0.5], [-1, -2, 21, 2, 21, 1]],
  ] as [number[], number[]][]) {
    it(`n = ${h.length} [${speciesNames(pdg).join(' ')}]: every valid shift gives the same value (exact)`, () => {
      const n = h.length
      const k = rationalPoint(n, 'two-lines-shifts')
      const ref = bcfw(Q, QCD, k, h, defaultShift(QCD, h, pdg), { pdg }).value
      expect(Q.isZero(ref)).toBe(false)
      let shifts = 0
      for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
        if (i === j || !isValidShift(QCD, h, i, j, pdg)) continue
        expect(Q.equals(bcfw(Q, QCD, k, h, [i, j], { pdg }).value, ref), `[${i + 1},${j + 1}⟩`).toBe(true)
        shifts++
      }
      expect(shifts).toBeGreaterThan(3)
    })
  }
})
