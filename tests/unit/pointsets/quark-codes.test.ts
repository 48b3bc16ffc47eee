// Les Houches events with quarks (Alwall et al., hep-ph/0609017: IDUP are PDG codes, 21 gluon,
// ±1..±6 quarks) run as points of a qcd process with species per leg.
import { describe, expect, it } from 'vitest'
import { speciesCodeMismatch } from '#shared/pointsets/species'
import { evaluate } from '#shared/physics/index'

describe('particle codes against species', () => {
  it('q q̄ → g g: incoming u and ū fit the outgoing ū and u legs (crossed), gluons fit g', () => {
    expect(speciesCodeMismatch(['qbar2', 'q2', 'g', 'g'], [2, -2, 21, 21])).toBeNull()
  })
  it('q g → q g fits qbar1 g q1 g', () => {
    expect(speciesCodeMismatch(['qbar1', 'g', 'q1', 'g'], [1, 21, 1, 21])).toBeNull()
  })
  it('a gluon code on a quark leg is refused, naming the leg', () => {
    expect(speciesCodeMismatch(['qbar1', 'q1', 'g', 'g'], [21, 1, 21, 21])).toMatch(/^leg 1 has particle code 21/)
    expect(speciesCodeMismatch(['qbar1', 'q1', 'g', 'g'], [-1, 2, 21, 21])).toMatch(/^leg 2/)
  })
  it('a crossed q g → q g event evaluates as a qcd point (momenta with an incoming quark)', () => {
    // u(p1) g(p2) → u(p3) g(p4), incoming crossed to outgoing (p → −p): leg 1 is an outgoing ū
    const E = 0.5
    const c = 0.6, s = 0.8
    const momenta: [number, number, number, number][] = [[-E, 0, 0, -E], [-E, 0, 0, E], [E, E * s, 0, E * c], [E, -E * s, 0, -E * c]]
    const r = evaluate({ theory: 'qcd', species: ['qbar2', 'g', 'q2', 'g'], helicities: [-0.5, -1, 0.5, 1], kinematics: { kind: 'momenta', momenta } })
    expect(r.verdict).toBe('agrees')
    expect(r.target!.name).toBe('quark-mhv')
  })
})
