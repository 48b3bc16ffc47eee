// Float arithmetic that knows when it is lost: the regression cases of spurious coincident poles at
// small-integer points, soft regions (escalation to double-double, precision reported), spinors of
// momenta near −z, the spin-0 four-particle test (Benincasa & Cachazo, arXiv:0705.4305: a single
// self-interacting species is consistent for spin 0 and 2 only) and one-sentence warnings.
import { describe, expect, it } from 'vitest'
import { evaluate, spinorsOfMomentum, lostPrecision, floatTolerance, type Momentum } from '#shared/physics/index'
import { complexField as C, rationalField as Q, negligible } from '#shared/physics/field'
import { ddField } from '#shared/physics/double-double'
import { randomPoint, rationalPoint } from '#shared/physics/kinematics'
import { crossShift, scalarFactorisation } from '#shared/physics/cross-shift'
import { probeFalloff } from '#shared/physics/falloff'
import { processOf } from '#shared/physics/theories'
import { cubicScalarAllChannels } from '#shared/physics/targets/cubic-scalar'
import { mandelstam, type Kin } from '#shared/physics/spinors'
import type { Fraction } from '#shared/physics/field'

// Six gluons at small-integer spinors where two BCFW poles of the [2,5⟩ shift coincide: exact
// arithmetic meets an exact zero; doubles used to divide by its rounding remainder (≈ 6e16).
const coincident: { kind: 'exact-spinors'; lambda: [string, string][]; lambdaTilde: [string, string][] } = {
  kind: 'exact-spinors',
  lambda: [['2', '1'], ['1', '-2'], ['-2', '0'], ['-2', '-1'], ['-1', '-2'], ['-1', '1']],
  lambdaTilde: [['-1', '1'], ['1', '-2'], ['-1', '-1'], ['2', '-1'], ['-8/3', '10/3'], ['-1/3', '2/3']],
}

describe('spurious coincident poles at small-integer points', () => {
  it.each([[[-1, -1, 1, -1, 1, 1]], [[1, -1, -1, 1, 1, -1]], [[-1, -1, -1, 1, 1, 1]]])('6 gluons %j, shift [2,5⟩: float answers as exact does, never a huge number', (h) => {
    const exact = evaluate({ theory: 'gluon', helicities: h, shift: [2, 5], kinematics: coincident, arithmetic: 'exact', target: 'berends-giele' })
    const float = evaluate({ theory: 'gluon', helicities: h, shift: [2, 5], kinematics: coincident, target: 'berends-giele' })
    expect(exact.verdict).toBe('singular point')
    expect(float.verdict).toBe('singular point')
    expect(float.value).toBeNull()
    const w = float.warnings.find((x) => x.startsWith('singular point:'))!
    expect(w).toMatch(/^singular point: under the shift \[2, 5⟩ .* vanishes; another valid shift may avoid it$/)
  })

  it('every shift at the same point: float says what exact says, and the regular ones agree with Berends–Giele', () => {
    const h = [-1, -1, 1, -1, 1, 1]
    let agreeing = 0
    for (let i = 1; i <= 6; i++) for (let j = 1; j <= 6; j++) {
      if (i === j) continue
      const req = { theory: 'gluon' as const, helicities: h, shift: [i, j] as [number, number], kinematics: coincident, target: 'berends-giele' as const }
      const e = evaluate({ ...req, arithmetic: 'exact' })
      const f = evaluate(req)
      expect(f.verdict, `[${i},${j}⟩`).toBe(e.verdict)
      if (f.verdict === 'agrees') agreeing++
      if (f.value) expect(Math.hypot(...(f.value as number[]))).toBeLessThan(1e3)
    }
    expect(agreeing).toBeGreaterThan(3)
  })

  it('negligible: exact zero only in exact arithmetic, 1e-10 of the scale in doubles, 1e-22 in double-double', () => {
    expect(negligible(Q, Q.zero, 1)).toBe(true)
    expect(negligible(Q, Q.fromInt(1), 1e300)).toBe(false)
    expect(negligible(C, C.fromInt(1), 1e11)).toBe(true)
    expect(negligible(C, C.fromInt(1), 1e9)).toBe(false)
    expect(negligible(ddField, ddField.fromInt(1), 1e21)).toBe(false)
    expect(negligible(ddField, ddField.fromInt(1), 1e23)).toBe(true)
  })

  it('generic float points are untouched: BCFW = Berends–Giele to 1e-12 at n = 6..8', () => {
    for (const n of [6, 7, 8]) {
      const h = Array.from({ length: n }, (_, t) => (t % 2 ? 1 : -1))
      const r = evaluate({ theory: 'gluon', helicities: h, kinematics: { kind: 'random', seed: n } })
      expect(r.verdict).toBe('agrees')
      expect(r.deviation!).toBeLessThan(1e-12)
      expect(r.precision!.arithmetic).toBe('double')
    }
  })
})

/** 2 → 3 with leg 3 soft (energy eps of √s = 1), legs 4, 5 back to back; the engine re-solves λ̃ of 4, 5. */
function softMomenta(eps: number): Momentum[] {
  const [a, th, ph] = [0.7, 1.1, 0.4]
  return [
    [-0.5, 0, 0, -0.5],
    [-0.5, 0, 0, 0.5],
    [eps, eps * Math.sin(th) * Math.cos(ph), eps * Math.sin(th) * Math.sin(ph), eps * Math.cos(th)],
    [0.5, 0.5 * Math.sin(a), 0, 0.5 * Math.cos(a)],
    [0.5, -0.5 * Math.sin(a), 0, -0.5 * Math.cos(a)],
  ]
}

describe('near a soft region: condition estimated, escalated to double-double', () => {
  // in plain doubles these gave deviations 8.6e-8, 1.3e-7 and 1.6e-6 against Parke–Taylor
  it.each([[[-1, -1, 1, 1, 1]], [[-1, 1, -1, 1, 1]], [[1, -1, 1, -1, 1]]])('5 gluons %j, leg 3 at 1e-9 of √s agrees with Parke–Taylor', (h) => {
    const r = evaluate({ theory: 'gluon', helicities: h, kinematics: { kind: 'momenta', momenta: softMomenta(1e-9) } })
    expect(r.verdict).toBe('agrees')
    expect(r.deviation!).toBeLessThan(1e-15)
    expect(r.precision!.arithmetic).toBe('double-double')
    expect(r.precision!.condition).toBeLessThan(1e-9)
    expect(r.precision!.estimated!).toBeLessThan(floatTolerance(5))
    expect(r.warnings.some((w) => /poorly conditioned .* double-double$/.test(w))).toBe(true)
  })

  it('a deviation within the reached precision is no verdict (precision loss), a larger one still disagrees', () => {
    expect(lostPrecision('disagrees', 5, 4e-8, 1e-7)).toBe(true)
    expect(lostPrecision('disagrees', 5, 1e-3, 1e-7)).toBe(false)
    expect(lostPrecision('disagrees', 5, 4e-8, 1e-12)).toBe(false)
    expect(lostPrecision('agrees', 5, 1e-12, 1e-7)).toBe(false)
  })

  it('a formula target with a dropped factor still disagrees at the soft point (no false rescue)', () => {
    const r = evaluate({ theory: 'gluon', helicities: [-1, -1, 1, 1, 1], kinematics: { kind: 'momenta', momenta: softMomenta(1e-9) }, target: { formula: '<1 2>^4/(<1 2><2 3><3 4><4 5><5 1>) * 1.000001' } })
    expect(r.verdict).toBe('disagrees')
  })
})

describe('spinors of momenta near −z', () => {
  // p+ = p⊥²/(2 p0) stays above 1e-10 p0 for p⊥ ≥ 1e-4 (the +z branch's formulas); 1e-5 takes the −z branch
  it.each([1e-2, 1e-3, 1e-4, 1e-5])('p⊥ = %f: λ λ̃ᵀ reproduces p to 1e-15', (pt) => {
    const p0 = 1.3
    const p: Momentum = [p0, pt * Math.cos(0.3), pt * Math.sin(0.3), -Math.sqrt(p0 * p0 - pt * pt)]
    const { lambda: l, lambdaTilde: lt } = spinorsOfMomentum(p)
    const got = [
      [l[0].mul(lt[0]), l[0].mul(lt[1])],
      [l[1].mul(lt[0]), l[1].mul(lt[1])],
    ]
    // P = [[p0 + p3, p1 − i p2], [p1 + i p2, p0 − p3]]
    const want = [
      [{ re: p[0] + p[3], im: 0 }, { re: p[1], im: -p[2] }],
      [{ re: p[1], im: p[2] }, { re: p[0] - p[3], im: 0 }],
    ]
    for (const a of [0, 1]) for (const b of [0, 1]) {
      expect(Math.abs(got[a]![b]!.re - want[a]![b]!.re)).toBeLessThan(1e-15 * p0)
      expect(Math.abs(got[a]![b]!.im - want[a]![b]!.im)).toBeLessThan(1e-15 * p0)
    }
    // the +z branch's phase: λ[0] = λ̃[0] = √p+ real and positive; the −z branch's: λ[1] = λ̃[1] = √p−
    const first = pt >= 1e-4 ? 0 : 1
    expect(l[first].im).toBe(0)
    expect(l[first].re).toBeGreaterThan(0)
    expect(lt[first].re).toBe(l[first].re)
  })
})

describe('spin 0 in the four-particle test (Benincasa & Cachazo, arXiv:0705.4305)', () => {
  it('every shift of a single scalar species is invalid, its exponent measured 0 (the diagram sum 1/s + 1/t + 1/u)', () => {
    const p = processOf('spin', 0)
    for (const [i, j] of [[0, 1], [0, 2], [2, 1]] as [number, number][]) {
      const f = probeFalloff(p, [0, 0, 0, 0], i, j)
      expect(f.measured).toBe(true)
      expect(f.exponent).toBe(0)
      expect(f.valid).toBe(false)
    }
  })

  it('the all-diagram sum is 1/s + 1/t + 1/u at n = 4 and has (2n−5)!! = 15 diagrams at n = 5 (1 at each vertex, exactly)', () => {
    const k = rationalPoint(4, 3)
    const s = (a: number, b: number) => mandelstam(Q, k, [a, b])
    expect(cubicScalarAllChannels(Q, k).equals(Q.add(Q.add(Q.div(Q.one, s(0, 1)), Q.div(Q.one, s(0, 2))), Q.div(Q.one, s(0, 3))))).toBe(true)
    // n = 5: Σ over the 15 pairs of compatible propagators 1/(s_A s_B)
    const k5 = rationalPoint(5, 4)
    const sets: number[][] = []
    for (let m = 1; m < 32; m++) {
      const S = [0, 1, 2, 3, 4].filter((t) => m & (1 << t))
      if (S.length === 2) sets.push(S)
    }
    let sum = Q.zero
    let count = 0
    for (let a = 0; a < sets.length; a++) for (let b = a + 1; b < sets.length; b++) {
      if (sets[a]!.some((x) => sets[b]!.includes(x))) continue
      sum = Q.add(sum, Q.div(Q.one, Q.mul(mandelstam(Q, k5, sets[a]!), mandelstam(Q, k5, sets[b]!))))
      count++
    }
    expect(count).toBe(15)
    expect(cubicScalarAllChannels(Q, k5).equals(sum)).toBe(true)
  })

  it('consistent for s = 0 (factorisation on every pole) and s = 2 (all valid shifts agree)', () => {
    const r0 = crossShift(Q, processOf('spin', 0), rationalPoint(4, 17), [0, 0, 0, 0])
    expect(r0.test).toBe('factorisation')
    expect(r0.rows.every((x) => !x.valid)).toBe(true)
    expect(r0.poles!.map((x) => x.pole.join(','))).toEqual(['1,2', '1,3', '1,4'])
    expect(r0.agree).toBe(true)
    const f0 = crossShift(C, processOf('spin', 0), randomPoint(4, 1), [0, 0, 0, 0])
    expect(f0.agree).toBe(true)
    const r2 = crossShift(Q, processOf('spin', 2), rationalPoint(4, 17), [-2, -2, 2, 2])
    expect(r2.test).toBe('shifts')
    expect(r2.agree).toBe(true)
  })

  it.each([1, 3, 4])('inconsistent for s = %i', (s) => {
    const r = crossShift(Q, processOf('spin', s), rationalPoint(4, 17), [-s, -s, s, s])
    expect(r.test).toBe('shifts')
    expect(r.agree).toBe(false)
  })

  it('the residue check catches a wrong amplitude (a dropped diagram, a doubled one)', () => {
    expect(scalarFactorisation(4).every((x) => x.factorises)).toBe(true)
    expect(scalarFactorisation(5).every((x) => x.factorises)).toBe(true)
    const inv = (k: Kin<Fraction>, a: number, b: number) => Q.div(Q.one, mandelstam(Q, k, [a, b]))
    const dropped = scalarFactorisation(4, 'factorisation', (k) => Q.add(inv(k, 0, 1), inv(k, 0, 3)))
    expect(dropped.map((x) => x.factorises)).toEqual([true, false, true])
    const doubled = scalarFactorisation(4, 'factorisation', (k) => Q.add(cubicScalarAllChannels(Q, k), inv(k, 0, 3)))
    expect(doubled.map((x) => x.factorises)).toEqual([true, true, false])
  })

  it('evaluate() for spin 0: boundary term suspected under any shift', () => {
    const r = evaluate({ theory: 'spin', spin: 0, helicities: [0, 0, 0, 0], kinematics: { kind: 'rational', seed: 1 }, arithmetic: 'exact', target: { formula: '1/s(1,2) + 1/s(1,3) + 1/s(1,4)' } })
    expect(r.verdict).toBe('boundary term suspected')
  })
})

describe('warnings are one sentence each', () => {
  it('a target formula dividing by zero', () => {
    const r = evaluate({ theory: 'gluon', helicities: [-1, -1, 1, 1], kinematics: { kind: 'rational', seed: 1 }, arithmetic: 'exact', target: { formula: '1/(<1 2> - <1 2>)' } })
    expect(r.verdict).toBe('singular point')
    const w = r.warnings.filter((x) => x.startsWith('singular point'))
    expect(w).toEqual(['singular point: the target formula divides by zero at position 2'])
  })

  it('no warning repeats "vanishes"', () => {
    const h = [-1, -1, 1, -1, 1, 1]
    for (const shift of [[2, 5], [1, 4], [3, 6]] as [number, number][]) {
      const r = evaluate({ theory: 'gluon', helicities: h, shift, kinematics: coincident, arithmetic: 'exact', target: 'berends-giele' })
      for (const w of r.warnings) expect(w.match(/vanishes/g)?.length ?? 0).toBeLessThanOrEqual(1)
    }
  })
})
