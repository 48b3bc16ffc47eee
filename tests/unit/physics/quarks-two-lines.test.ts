// Two quark lines: BCFW against the Berends–Giele current with quark lines (Berends & Giele,
// Nucl. Phys. B306 (1988) 759), and both against published closed forms: the MHV amplitude of
// the N = 4 superamplitude (Nair, Phys. Lett. B214 (1988) 215) for the four-fermion component
// with one gluino species, which at tree level is N = 1 super-Yang–Mills and, where its fermion
// pairings are those of QCD, the four-quark amplitude (Dixon, hep-ph/9601359; Dixon, Henn, Plefka,
// Schuster, arXiv:1010.3991): ⟨m₁m₂⟩³⟨p₁p₂⟩/(⟨12⟩…⟨n1⟩), m the ends of helicity −½, p of +½.
// Conventions: docs/conventions.md "Two quark lines".
import { describe, expect, it } from 'vitest'
import { complexField as C, rationalField as Q, type Field, type Fraction } from '#shared/physics/field'
import { randomPoint, rationalPoint } from '#shared/physics/kinematics'
import type { Kin } from '#shared/physics/spinors'
import { angle, square } from '#shared/physics/spinors'
import { bcfw } from '#shared/physics/bcfw'
import { defaultShift, isValidShift, vanishes } from '#shared/physics/theories'
import { quarkLineBerendsGiele } from '#shared/physics/targets/quark-line'
import { quarkLinesBerendsGiele } from '#shared/physics/targets/quark-lines'
import { classifyTwoLineMhv, twoLineMhvValue } from '#shared/physics/targets/quark-mhv'
import { exchangedFlavours, linesCross, sameFlavourValue } from '#shared/physics/quarks'
import { evaluate } from '#shared/physics/index'
import { relDiff } from './helpers'
import { QCD, oneLineCases, sample, twoLineCases, type QuarkCase } from './quarks-helpers'

const bcfwOf = <T>(F: Field<T>, k: Kin<T>, { h, pdg }: QuarkCase) => (vanishes(QCD, h, pdg) ? F.zero : bcfw(F, QCD, k, h, defaultShift(QCD, h, pdg), { pdg }).value)

/** The ends of each line: m (helicity −½) and p (+½) of flavours 1 and 2. */
function ends({ h, pdg }: QuarkCase) {
  const find = (f: number, neg: boolean) => pdg.findIndex((c, t) => Math.abs(c) === f && (h[t]! < 0) === neg)
  return { m1: find(1, true), p1: find(1, false), m2: find(2, true), p2: find(2, false) }
}

/** The helicity signs of the four quark legs in their cyclic order, e.g. "-++-". */
const quarkPattern = ({ h, pdg }: QuarkCase) => pdg.flatMap((c, t) => (c === 21 ? [] : [h[t]! < 0 ? '-' : '+'])).join('')

describe('the quark-lines current', () => {
  it('equals the one-line current for every one-line assignment (n = 4, 5, 6, exact)', () => {
    for (const n of [4, 5, 6]) {
      const k = rationalPoint(n, `lines-one-${n}`)
      for (const c of oneLineCases(n)) expect(Q.equals(quarkLinesBerendsGiele(Q, k, c.h, c.pdg), quarkLineBerendsGiele(Q, k, c.h, c.pdg)), `${c.h} ${c.pdg}`).toBe(true)
    }
  })
  it('does not depend on the reference spinors nor on the line that closes the recursion (n = 4, 5 every assignment, n = 6 sampled)', () => {
    for (const n of [4, 5, 6]) {
      const k = rationalPoint(n, `lines-gauge-${n}`)
      const cases = twoLineCases(n)
      let nonzero = 0
      for (const c of n < 6 ? cases : sample(cases, 300)) {
        const v = quarkLinesBerendsGiele(Q, k, c.h, c.pdg)
        expect(Q.equals(v, quarkLinesBerendsGiele(Q, k, c.h, c.pdg, { reference: 7 })), `gauge ${c.h} ${c.pdg}`).toBe(true)
        expect(Q.equals(v, quarkLinesBerendsGiele(Q, k, c.h, c.pdg, { closeOn: 1 })), `closing ${c.h} ${c.pdg}`).toBe(true)
        if (!Q.isZero(v)) nonzero++
      }
      expect(nonzero).toBeGreaterThan(0)
    }
  })
})

describe('n = 4: single-gluon exchange', () => {
  // Vertices γ^μ/√2 with the side signs s₁, s₂, the gluon propagator 1/s and the Fierz identity
  // ⟨a|γ^μ|b]⟨c|γ_μ|d] = 2⟨ac⟩[db] (common practice) give κ₁κ₂ s₁s₂ ⟨m₁m₂⟩[p₂p₁]/s with κ = −1
  // for a line whose q̄ has helicity −½ (the one-line convention) — the sign now fixed, not only |A|.
  it('A = κ₁κ₂ s₁s₂ ⟨m₁m₂⟩[p₂p₁]/s_line in every order and helicity, BCFW and target', () => {
    const k = rationalPoint(4, 'two-lines-fierz')
    let checked = 0
    for (const c of twoLineCases(4)) {
      const { m1, p1, m2, p2 } = ends(c)
      const line1 = [0, 1, 2, 3].filter((t) => Math.abs(c.pdg[t]!) === 1)
      if ((line1[1]! - line1[0]!) !== 1 && (line1[1]! - line1[0]!) !== 3) continue // crossing lines: zero
      // s = +1 when the exchanged gluon sits between q̄ and q at the vertex, i.e. q follows q̄ cyclically
      const side = (f: number) => {
        const bar = c.pdg.indexOf(-f)
        return c.pdg[(bar + 1) % 4] === f ? -1 : 1
      }
      const kappa = [1, 2].reduce((s, f) => s * (c.h[c.pdg.indexOf(-f)]! < 0 ? -1 : 1), 1)
      const s = Q.mul(angle(Q, k, line1[0]!, line1[1]!), square(Q, k, line1[1]!, line1[0]!))
      let want = Q.div(Q.mul(angle(Q, k, m1, m2), square(Q, k, p2, p1)), s)
      if (kappa * side(1) * side(2) < 0) want = Q.neg(want)
      expect(Q.equals(quarkLinesBerendsGiele(Q, k, c.h, c.pdg), want), `target ${c.h} ${c.pdg}`).toBe(true)
      expect(Q.equals(bcfwOf(Q, k, c), want), `BCFW ${c.h} ${c.pdg}`).toBe(true)
      checked++
    }
    expect(checked).toBe(64)
  })
  it('the example of docs/conventions.md: A(q̄₁⁺ q₁⁻ q̄₂⁻ q₂⁺) = ⟨23⟩[14]/s₁₂', () => {
    const k = rationalPoint(4, 'two-lines-fierz')
    const want = Q.div(Q.mul(angle(Q, k, 1, 2), square(Q, k, 0, 3)), Q.mul(angle(Q, k, 0, 1), square(Q, k, 1, 0)))
    expect(Q.equals(quarkLinesBerendsGiele(Q, k, [0.5, -0.5, -0.5, 0.5], [-1, 1, -2, 2]), want)).toBe(true)
  })
})

/** Every helicity assignment of every placement of the quark legs, or of every k-th placement. */
function everyHelicity(n: number, step: number): QuarkCase[] {
  const cases = twoLineCases(n, { nonVanishing: true })
  const placements = [...new Set(cases.map((c) => c.pdg.join()))].filter((_, t) => t % step === 0)
  const keep = new Set(placements)
  return cases.filter((c) => keep.has(c.pdg.join()))
}

describe('BCFW = the quark-lines current', () => {
  for (const [n, step] of [[4, 1], [5, 1], [6, 1], [7, 40]] as [number, number][]) {
    it(`exact, n = ${n}: every helicity assignment of ${step === 1 ? 'every' : `every ${step}th`} placement of the quarks`, () => {
      const k = rationalPoint(n, `two-lines-bg-${n}`)
      let nonzero = 0
      for (const c of everyHelicity(n, step)) {
        const t = quarkLinesBerendsGiele(Q, k, c.h, c.pdg)
        expect(Q.equals(bcfwOf(Q, k, c), t), `${c.h} ${c.pdg}`).toBe(true)
        if (!Q.isZero(t)) nonzero++
      }
      expect(nonzero).toBeGreaterThan(0)
    })
  }
  for (const [n, step] of [[4, 1], [5, 1], [6, 6], [7, 40]] as [number, number][]) {
    it(`float, n = ${n}: every helicity assignment of ${step === 1 ? 'every' : `every ${step}th`} placement`, () => {
      const k = randomPoint(n, `two-lines-float-${n}`)
      for (const c of everyHelicity(n, step)) {
        const t = quarkLinesBerendsGiele(C, k, c.h, c.pdg)
        if (C.abs(t) === 0) continue // crossing lines
        expect(relDiff(C, bcfwOf(C, k, c), t), `${c.h} ${c.pdg}`).toBeLessThan(1e-9)
      }
    })
  }
})

describe('every valid shift gives the target', () => {
  for (const n of [5, 6]) {
    it(`n = ${n}, exact, sampled assignments`, () => {
      const k = rationalPoint(n, `two-lines-shifts-${n}`)
      let shifts = 0
      for (const c of sample(twoLineCases(n, { nonVanishing: true }), n === 5 ? 40 : 12)) {
        const t = quarkLinesBerendsGiele(Q, k, c.h, c.pdg)
        for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
          if (i === j || !isValidShift(QCD, c.h, i, j, c.pdg)) continue
          expect(Q.equals(bcfw(Q, QCD, k, c.h, [i, j], { pdg: c.pdg }).value, t), `${c.h} ${c.pdg} [${i + 1},${j + 1}⟩`).toBe(true)
          shifts++
        }
      }
      expect(shifts).toBeGreaterThan(50)
    })
  }
})

describe('MHV with two quark lines (the N = 1 four-gluino form)', () => {
  // All gluons +: only the quarks carry −. Where the two + ends are neighbours among the quark legs,
  // the other fermion pairing of N = 1 crosses and vanishes, so one QCD amplitude is the whole form;
  // where the quarks alternate q̄ q q̄ q with helicities − + − + (cyclically), both N = 1 pairings are
  // quark lines and the form is the same-flavour combination A − A(q's exchanged).
  const form = (kk: Kin<Fraction>, c: QuarkCase) => {
    const n = c.h.length
    const { m1, p1, m2, p2 } = ends(c)
    let den = Q.one
    for (let t = 0; t < n; t++) den = Q.mul(den, angle(Q, kk, t, (t + 1) % n))
    const a = angle(Q, kk, m1, m2)
    return Q.div(Q.mul(Q.mul(a, Q.mul(a, a)), angle(Q, kk, p1, p2)), den)
  }
  const conjugateForm = (kk: Kin<Fraction>, c: QuarkCase) => {
    const n = c.h.length
    const { m1, p1, m2, p2 } = ends(c)
    let den = Q.one
    for (let t = 0; t < n; t++) den = Q.mul(den, square(Q, kk, t, (t + 1) % n))
    const a = square(Q, kk, p1, p2)
    const v = Q.div(Q.mul(Q.mul(a, Q.mul(a, a)), square(Q, kk, m1, m2)), den)
    return n % 2 ? Q.neg(v) : v
  }
  for (const n of [4, 5, 6, 7]) {
    it(`n = ${n}: ${n < 7 ? 'every' : 'sampled'} position, target${n <= 6 ? ' and BCFW' : ''} equal the form with sign +1 (conjugate: (−1)ⁿ)`, () => {
      const k = rationalPoint(n, `two-lines-mhv-${n}`)
      let single = 0
      let pairs = 0
      const cases = twoLineCases(n)
      for (const c of n < 7 ? cases : sample(cases, 3000)) {
        const minusGluons = c.h.filter((x, t) => c.pdg[t] === 21 && x < 0).length
        const conj = n > 4 && minusGluons === n - 4 // at n = 4 both classes are the same helicities
        if (minusGluons !== 0 && !conj) continue
        const pattern = quarkPattern(c)
        const want = conj ? conjugateForm(k, c) : form(k, c)
        const v = quarkLinesBerendsGiele(Q, k, c.h, c.pdg)
        if (['-++-', '+--+', '--++', '++--'].includes(pattern)) {
          if (Q.isZero(v)) { // the crossing flavour assignment
            expect(classifyTwoLineMhv(c.h, c.pdg)).toBeNull()
            continue
          }
          expect(Q.equals(v, want), `${c.h} ${c.pdg}`).toBe(true)
          expect(Q.equals(twoLineMhvValue(Q, k, c.h, c.pdg)!, want), `engine form ${c.h} ${c.pdg}`).toBe(true)
          if (n <= 6) expect(Q.equals(bcfw(Q, QCD, k, c.h, defaultShift(QCD, c.h, c.pdg), { pdg: c.pdg, closedForms: false }).value, want), `BCFW ${c.h} ${c.pdg}`).toBe(true)
          single++
        }
        else if (classifyTwoLineMhv(c.h, c.pdg)) expect.unreachable(`the form claims ${c.h} ${c.pdg}`)
        if ((pattern === '-+-+' || pattern === '+-+-') && c.pdg.filter((x) => x !== 21).every((x, t, a) => Math.sign(x) !== Math.sign(a[(t + 1) % 4]!))) {
          const same = sameFlavourValue<Fraction>((x, y) => Q.sub(x, y), (pdg) => quarkLinesBerendsGiele(Q, k, c.h, pdg), c.pdg)
          expect(Q.equals(same, want), `same flavour ${c.h} ${c.pdg}`).toBe(true)
          pairs++
        }
      }
      expect(single).toBeGreaterThan(0)
      expect(pairs).toBeGreaterThan(0)
    })
  }
})

describe('crossing lines', () => {
  it('vanish: no planar diagram (target and BCFW exactly 0, n = 4..6), and evaluate says so', () => {
    for (const n of [4, 5, 6]) {
      const k = rationalPoint(n, `two-lines-cross-${n}`)
      const cases = twoLineCases(n).filter((c) => linesCross(c.pdg))
      expect(cases.length).toBeGreaterThan(0)
      for (const c of sample(cases, 100)) {
        expect(vanishes(QCD, c.h, c.pdg)).toBe(true)
        expect(Q.isZero(quarkLinesBerendsGiele(Q, k, c.h, c.pdg)), `${c.h} ${c.pdg}`).toBe(true)
        expect(Q.isZero(bcfw(Q, QCD, k, c.h, defaultShift(QCD, c.h, c.pdg), { pdg: c.pdg }).value), `${c.h} ${c.pdg}`).toBe(true)
      }
    }
    const r = evaluate({ theory: 'qcd', helicities: [-0.5, 0.5, 0.5, -0.5, 1], species: ['qbar1', 'qbar2', 'q1', 'q2', 'g'], kinematics: { kind: 'random', seed: 2 } })
    expect(r.value).toEqual([0, 0])
    expect(r.warnings.some((w) => w.includes('cross'))).toBe(true)
  })
})

describe('same flavour', () => {
  it('the exchanged assignment swaps the flavours of the two quarks', () => {
    expect(exchangedFlavours([-1, 1, 21, -2, 2])).toEqual([-1, 2, 21, -2, 1])
    expect(exchangedFlavours([1, 21, -3, 3, -1])).toEqual([3, 21, -3, 1, -1])
  })
})
