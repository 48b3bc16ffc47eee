// Quark amplitudes by BCFW against independent results: the quark-line Berends–Giele current
// (Berends & Giele, Nucl. Phys. B306 (1988) 759) and the MHV closed forms (Mangano & Parke,
// Phys. Rept. 200 (1991) 301; Dixon, hep-ph/9601359), docs/conventions.md "Quarks".
import { describe, expect, it } from 'vitest'
import { Fraction, complexField as C, rationalField as Q } from '#shared/physics/field'
import { randomPoint, rationalPoint } from '#shared/physics/kinematics'
import { bcfw, FERMION_EXCHANGE_SIGN } from '#shared/physics/bcfw'
import { QUARK_SIGMA, threePoint } from '#shared/physics/three-point'
import { defaultShift, isValidShift, vanishes } from '#shared/physics/theories'
import { quarkLineBerendsGiele } from '#shared/physics/targets/quark-line'
import { quarkMhvValue } from '#shared/physics/targets/quark-mhv'
import { relDiff } from './helpers'
import { QCD, oneLineCases, sample } from './quarks-helpers'

const fr = (x: number) => new Fraction(BigInt(x))

describe('q̄qg blocks', () => {
  // Three-point kinematics: all square brackets vanish (angle) or all angle brackets (square).
  const l1: [Fraction, Fraction] = [fr(2), fr(3)]
  const l2: [Fraction, Fraction] = [fr(-1), fr(5)]
  const c = [fr(1), fr(2), fr(3)]
  const l3: [Fraction, Fraction] = [0, 1].map((x) => Q.neg(Q.div(Q.add(Q.mul(c[0]!, l1[x]!), Q.mul(c[1]!, l2[x]!)), c[2]!))) as [Fraction, Fraction]
  const par = c.map((x) => [Q.mul(x, fr(7)), Q.mul(x, fr(-4))] as [Fraction, Fraction])
  const kinds = { angle: { lambda: [l1, l2, l3], lambdaTilde: par }, square: { lambda: par, lambdaTilde: [l1, l2, l3] } }
  for (const kind of ['angle', 'square'] as const) {
    it(`${kind} blocks equal the Feynman-rule current at three points, in every order (σ = ${QUARK_SIGMA[kind]})`, () => {
      let checked = 0
      for (const pdg of [[-1, 1, 21], [-1, 21, 1], [21, -1, 1], [1, -1, 21], [1, 21, -1], [21, 1, -1]]) for (const hq of [0.5, -0.5]) {
        const hg = kind === 'angle' ? -1 : 1
        const h = pdg.map((x) => (x === 21 ? hg : x < 0 ? hq : -hq))
        expect(Q.equals(threePoint(Q, QCD, kinds[kind], h, kind, undefined, pdg), quarkLineBerendsGiele(Q, kinds[kind], h, pdg))).toBe(true)
        checked++
      }
      expect(checked).toBe(12)
    })
  }
  it('a quark line with equal end helicities has no block', () => {
    expect(Q.isZero(threePoint(Q, QCD, kinds.angle, [-0.5, -0.5, -1], 'angle', undefined, [-1, 1, 21]))).toBe(true)
  })
})

describe('fermion sign', () => {
  it('every term with a quark exchanged carries −1 (stated in docs/conventions.md)', () => {
    expect(FERMION_EXCHANGE_SIGN).toBe(-1)
  })
})

/** BCFW, no closed forms anywhere (three-point blocks only), under the default shift. */
function bcfwExact(k: ReturnType<typeof rationalPoint>, h: number[], pdg: number[]) {
  return bcfw(Q, QCD, k, h, defaultShift(QCD, h, pdg), { pdg, closedForms: false }).value
}

describe('BCFW = quark-line Berends–Giele, exact', () => {
  for (const n of [4, 5, 6]) {
    it(`n = ${n}: every quark-line position and helicity assignment`, () => {
      const k = rationalPoint(n, `quarks-bg-${n}`)
      let nonzero = 0
      for (const { h, pdg } of oneLineCases(n, { conserving: false })) {
        const v = vanishes(QCD, h, pdg) ? Q.zero : bcfwExact(k, h, pdg)
        const t = quarkLineBerendsGiele(Q, k, h, pdg)
        expect(Q.equals(v, t), `${h} ${pdg}`).toBe(true)
        if (!Q.isZero(t)) nonzero++
      }
      expect(nonzero).toBeGreaterThan(0)
    })
  }
  for (const n of [7, 8]) {
    it(`n = ${n}: sampled assignments (closed forms in the sub-blocks)`, () => {
      const k = rationalPoint(n, `quarks-bg-${n}`)
      for (const { h, pdg } of sample(oneLineCases(n, { nonVanishing: true }), n === 7 ? 24 : 8)) {
        const v = bcfw(Q, QCD, k, h, defaultShift(QCD, h, pdg), { pdg }).value
        expect(Q.equals(v, quarkLineBerendsGiele(Q, k, h, pdg)), `${h} ${pdg}`).toBe(true)
      }
    })
  }
})

describe('BCFW = quark-line Berends–Giele, float', () => {
  for (const n of [4, 5, 6, 7, 8]) {
    it(`n = ${n}`, () => {
      const k = randomPoint(n, `quarks-float-${n}`)
      const cases = oneLineCases(n, { nonVanishing: true })
      for (const { h, pdg } of n <= 5 ? cases : sample(cases, 30)) {
        const v = bcfw(C, QCD, k, h, defaultShift(QCD, h, pdg), { pdg }).value
        expect(relDiff(C, v, quarkLineBerendsGiele(C, k, h, pdg)), `${h} ${pdg}`).toBeLessThan(1e-9)
      }
    })
  }
})

describe('MHV closed forms', () => {
  const mhvCases = (n: number) => oneLineCases(n).filter(({ h, pdg }) => {
    const g = h.filter((x, t) => pdg[t] === 21)
    return g.filter((x) => x < 0).length === 1 || g.filter((x) => x > 0).length === 1
  })
  for (const n of [4, 5, 6, 7, 8]) {
    it(`n = ${n}: Berends–Giele and BCFW equal the closed form (MHV and its conjugate)`, () => {
      const k = rationalPoint(n, `quarks-mhv-${n}`)
      const cases = mhvCases(n)
      for (const { h, pdg } of n <= 6 ? cases : sample(cases, 40)) {
        const cf = quarkMhvValue(Q, k, h, pdg)!
        expect(Q.equals(quarkLineBerendsGiele(Q, k, h, pdg), cf), `BG ${h} ${pdg}`).toBe(true)
        if (n <= 6) expect(Q.equals(bcfwExact(k, h, pdg), cf), `BCFW ${h} ${pdg}`).toBe(true)
      }
    })
  }
})

describe('gauge invariance of the quark-line current', () => {
  it('independent of the reference spinors (n = 4, 5 every assignment; n = 6 sampled)', () => {
    for (const n of [4, 5, 6]) {
      const k = rationalPoint(n, `quarks-gauge-${n}`)
      for (const { h, pdg } of n < 6 ? oneLineCases(n) : sample(oneLineCases(n), 120)) {
        expect(Q.equals(quarkLineBerendsGiele(Q, k, h, pdg), quarkLineBerendsGiele(Q, k, h, pdg, { reference: 5 })), `${h} ${pdg}`).toBe(true)
      }
    }
  })
})

describe('every valid shift gives the same amplitude', () => {
  it('n = 6, one line, exact', () => {
    const k = rationalPoint(6, 'quarks-shifts')
    for (const { h, pdg } of sample(oneLineCases(6, { nonVanishing: true }), 12)) {
      const t = quarkLineBerendsGiele(Q, k, h, pdg)
      for (let i = 0; i < 6; i++) for (let j = 0; j < 6; j++) {
        if (i === j || !isValidShift(QCD, h, i, j, pdg)) continue
        expect(Q.equals(bcfw(Q, QCD, k, h, [i, j], { pdg }).value, t), `${h} ${pdg} [${i + 1},${j + 1}⟩`).toBe(true)
      }
    }
  })
})
