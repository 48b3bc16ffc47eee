// Quadruple cuts of one-loop gluon amplitudes (Britto, Cachazo, Feng, hep-th/0412103) against the
// N = 4 MHV box coefficients of Bern, Dixon, Dunbar, Kosower, Nucl. Phys. B425 (1994) 217
// (hep-ph/9403226): only one-mass and two-mass-easy boxes, each −½ (st − P²Q²) A_tree, the
// four-point box −st A_tree — the same signs in our normalisation (docs/engine.md "Quadruple cuts").
import { describe, expect, it } from 'vitest'
import type Complex from 'complex.js'
import type Fraction from 'fraction.js'
import { complexField as C, rationalField as Q, type Field } from '#shared/physics/field'
import { randomPoint, rationalPoint } from '#shared/physics/kinematics'
import { processOf } from '#shared/physics/theories'
import { det, momentumSum, type Kin } from '#shared/physics/spinors'
import { parkeTaylor } from '#shared/physics/targets/parke-taylor'
import { allBoxes, boxCut, cutStates, helicitiesOf, loopCuts, orientations, rotateBox, solveQuadrupleCut } from '#shared/physics/loop/index'

const p = processOf('gluon')

/** −(r/2)(st − K1²K3² − K2²K4²) A_tree written out again from the corners (r massless opposite pairs). */
function bddk<T>(F: Field<T>, k: Kin<T>, corners: number[][], tree: T): T {
  const m = corners.map((c) => det(F, momentumSum(F, k, c)))
  const s = det(F, momentumSum(F, k, [...corners[0]!, ...corners[1]!]))
  const t = det(F, momentumSum(F, k, [...corners[1]!, ...corners[2]!]))
  const r = Number(corners[0]!.length === 1 && corners[2]!.length === 1) + Number(corners[1]!.length === 1 && corners[3]!.length === 1)
  return F.mul(F.fromInt(-r), F.div(F.mul(F.sub(F.sub(F.mul(s, t), F.mul(m[0]!, m[2]!)), F.mul(m[1]!, m[3]!)), tree), F.fromInt(2)))
}

describe('the cut solutions', () => {
  it.each([[4, 11], [5, 11], [6, 11], [7, 11], [8, 11], [6, 29], [8, 29]])('every box of %i legs (seed %i): both solutions on shell to 1e-14 (float), exactly 0 (exact)', (n, seed) => {
    const kc = randomPoint(n, seed)
    for (const box of allBoxes(n)) {
      const sols = solveQuadrupleCut(C, box.corners.map((c) => momentumSum(C, kc, c)))
      for (const s of sols) {
        expect(s.onShell).toBeLessThan(1e-14)
        // λ λ̃ᵀ reproduces ℓ_k, and the two solutions differ
        s.ell.forEach((P, q) => {
          for (const a of [0, 1]) for (const b of [0, 1]) expect(C.abs(C.sub(C.mul(s.lambda[q]![a]!, s.lambdaTilde[q]![b]!), P[a]![b]!))).toBeLessThan(1e-13)
        })
      }
      expect(C.abs(C.sub(sols[0].ell[0]![0]![0]!, sols[1].ell[0]![0]![0]!))).toBeGreaterThan(1e-6)
    }
    const kq = rationalPoint(n, seed)
    // every box with a massless corner has rational solutions (cut.ts), three-mass included
    for (const box of allBoxes(n).filter((b) => b.kind !== 'four-mass')) {
      const sols = solveQuadrupleCut(Q, box.corners.map((c) => momentumSum(Q, kq, c)))
      for (const s of sols) for (const P of s.ell) expect(Q.isZero(det(Q, P))).toBe(true)
    }
  })
  it('a four-mass box in exact arithmetic needs √Δ: an error on field arithmetic, not a wrong number', () => {
    const kq = rationalPoint(8, 2)
    const box = allBoxes(8).find((b) => b.kind === 'four-mass')!
    expect(() => solveQuadrupleCut(Q, box.corners.map((c) => momentumSum(Q, kq, c)))).toThrow(/irrational square root/)
  })
  it('box inventory: C(n, 4) boxes with the expected kinds at n = 6', () => {
    const kinds = allBoxes(6).map((b) => b.kind)
    expect(kinds).toHaveLength(15)
    expect(kinds.filter((k) => k === 'one-mass')).toHaveLength(6)
    expect(kinds.filter((k) => k === 'two-mass-hard')).toHaveLength(6)
    expect(kinds.filter((k) => k === 'two-mass-easy')).toHaveLength(3)
    expect(allBoxes(8)).toHaveLength(70)
  })
})

// Helicity configurations where every cut carries gluons only (SU(4) counting, states.ts).
const GLUON_ONLY: number[][] = [[-1, -1, 1, 1], [-1, -1, 1, 1, 1], [1, -1, -1, 1, 1], [-1, -1, 1, 1, 1, 1], [1, 1, -1, -1, 1, 1]]

describe('N = 4 MHV boxes against BDDK', () => {
  it.each(GLUON_ONLY)('%j exact: every box coefficient equals the target exactly', (...h) => {
    const n = h.length
    for (const seed of [1, 2]) {
      const k = rationalPoint(n, seed)
      const tree = parkeTaylor(Q, k, h)
      for (const box of allBoxes(n)) {
        const cut = boxCut(Q, p, k, h, box)
        cut.solutions.forEach((s) => expect(cutStates(box, s.threePoint, h)).toBe('gluons'))
        expect(cut.value.equals(bddk(Q, k, box.corners, tree))).toBe(true)
      }
    }
  })
  it.each(GLUON_ONLY)('%j float: every box coefficient within 1e-12 of the target', (...h) => {
    const n = h.length
    const k = randomPoint(n, 5)
    const tree = parkeTaylor(C, k, h)
    for (const box of allBoxes(n)) {
      const target = bddk(C, k, box.corners, tree)
      const v = boxCut(C, p, k, h, box).value
      const scale = Math.max(C.abs(target), 1e-300)
      expect(C.abs(C.sub(v, target)) / (C.abs(target) === 0 ? 1 : scale)).toBeLessThan(1e-12)
    }
  })
  it('the four-point box: −st A_tree, with both solutions contributing one term each', () => {
    const k = rationalPoint(4, 3)
    const h = [-1, -1, 1, 1]
    const cut = boxCut(Q, p, k, h, allBoxes(4)[0]!)
    expect(cut.terms.map((t) => t.solution).sort()).toEqual([0, 1])
    const st = Q.mul(det(Q, momentumSum(Q, k, [0, 1])), det(Q, momentumSum(Q, k, [1, 2])))
    expect(cut.value.equals(Q.neg(Q.mul(st, parkeTaylor(Q, k, h))))).toBe(true)
  })
  it('alternating −+−+: one solution carries the whole multiplet, and the pure-gluon cut then differs from N = 4', () => {
    const h = [-1, 1, -1, 1]
    const k = rationalPoint(4, 3)
    const box = allBoxes(4)[0]!
    const cut = boxCut(Q, p, k, h, box)
    expect(cut.solutions.map((s) => cutStates(box, s.threePoint, h)).sort()).toEqual(['gluons', 'multiplet'])
    expect(cut.value.equals(bddk(Q, k, box.corners, parkeTaylor(Q, k, h)))).toBe(false)
  })
  it('every non-zero gluon term is an orientation the SU(4) counting allows (the counting sees what the trees see)', () => {
    for (const h of [[-1, 1, -1, 1], [-1, 1, 1, -1, 1, 1], [-1, -1, 1, 1, 1, 1], [-1, -1, -1, 1, 1, 1]]) {
      const k = randomPoint(h.length, 7)
      for (const box of allBoxes(h.length)) {
        const cut = boxCut(C, p, k, h, box)
        for (const t of cut.terms) {
          const allowed = [...orientations(box, cut.solutions[t.solution]!.threePoint, h).values()].flat().map(helicitiesOf)
          expect(allowed).toContainEqual(t.helicities)
        }
      }
    }
  })
})

describe('independence of how the corners are evaluated', () => {
  it('the order of corner evaluation and the choice of first corner do not change the coefficient', () => {
    const h = [-1, 1, -1, 1, 1, 1]
    const k = rationalPoint(6, 4)
    for (const box of allBoxes(6)) {
      const ref = boxCut(Q, p, k, h, box).value
      expect(boxCut(Q, p, k, h, box, { order: [3, 1, 0, 2] }).value.equals(ref)).toBe(true)
      for (const r of [1, 2, 3]) expect(boxCut(Q, p, k, h, rotateBox(box, r)).value.equals(ref)).toBe(true)
    }
  })
  it('closed forms, BCFW and Berends–Giele corners give the same coefficients (NMHV six gluons, float and exact)', () => {
    const h = [-1, 1, -1, 1, -1, 1]
    const kq = rationalPoint(6, 6)
    const kc = randomPoint(6, 6)
    for (const box of allBoxes(6)) {
      const e = boxCut(Q, p, kq, h, box).value as Fraction
      expect(boxCut(Q, p, kq, h, box, { corners: 'bcfw' }).value.equals(e)).toBe(true)
      expect(boxCut(Q, p, kq, h, box, { corners: 'berends-giele' }).value.equals(e)).toBe(true)
      const f = boxCut(C, p, kc, h, box).value as Complex
      const bg = boxCut(C, p, kc, h, box, { corners: 'berends-giele' }).value as Complex
      expect(C.abs(C.sub(f, bg))).toBeLessThan(1e-10 * Math.max(1, C.abs(f)))
    }
  })
})

describe('loopCuts (the route body)', () => {
  it('six-gluon MHV: 15 boxes, all agree; the 2-mass-hard boxes are exactly 0', () => {
    const r = loopCuts({ helicities: [-1, -1, 1, 1, 1, 1], arithmetic: 'exact' })
    expect(r.boxes).toHaveLength(15)
    expect(r.verdict).toBe('agrees')
    expect(r.counts.agrees).toBe(15)
    for (const b of r.boxes.filter((x) => x.kind === 'two-mass-hard')) expect(b.value).toEqual(['0', '0'])
  })
  it('non-adjacent MHV: the multiplet cuts are summed over N = 4 and agree; with gluons only they are not compared', () => {
    const r = loopCuts({ helicities: [-1, 1, 1, -1, 1, 1] })
    expect(r.verdict).toBe('agrees')
    expect(r.counts.agrees).toBe(15)
    expect(r.boxes.some((b) => b.states.startsWith('N = 4 multiplet'))).toBe(true)
    expect(r.infrared?.verdict).toBe('agrees')
    const g = loopCuts({ helicities: [-1, 1, 1, -1, 1, 1], states: 'gluons' })
    // 15 boxes of six legs: the 4 whose cut carries the fermion multiplet are not compared with gluons only.
    expect(g.counts).toEqual({ 'agrees': 11, 'disagrees': 0, 'not evaluated': 4, 'singular point': 0 })
    expect(g.infrared).toBeNull()
    expect(g.boxes.filter((b) => b.verdict === 'not evaluated').every((b) => b.note?.startsWith('fermions') && b.states.startsWith('gluons only (asked for)'))).toBe(true)
  })
  it('six-gluon NMHV: no per-box target; the infrared conditions agree (exact), tree by BCFW', () => {
    const r = loopCuts({ helicities: [-1, 1, -1, 1, -1, 1], arithmetic: 'exact' })
    expect(r.verdict).toBe('agrees')
    expect(r.counts['not evaluated']).toBe(15)
    expect(r.infrared!.rows).toHaveLength(10)
    expect(r.infrared!.rows.every((x) => x.deviation === 0)).toBe(true)
    expect(r.tree).not.toEqual(['0', '0'])
  })
  it('seven-gluon −+−+−++: boxes with an NMHV corner that gluinos cross say they are not summed; no infrared check then', () => {
    const r = loopCuts({ helicities: [-1, 1, -1, 1, -1, 1, 1] })
    const open = r.boxes.filter((b) => b.states === '—')
    expect(open.length).toBeGreaterThan(0)
    expect(open.every((b) => b.verdict === 'not evaluated' && /6-point NMHV corner crossed by gluinos/.test(b.note ?? ''))).toBe(true)
    expect(r.infrared).toBeNull()
  })
  it('eight-gluon split N²MHV −−−−++++: every box summed, the infrared conditions agree (float)', () => {
    const r = loopCuts({ helicities: [-1, -1, -1, -1, 1, 1, 1, 1] })
    expect(r.infrared?.verdict).toBe('agrees')
  })
  it.each([
    [{ helicities: [-1, 1, 1] }, 'helicities'],
    [{ helicities: [-1, 1, 1, 1, 1, 1, 1, 1, 1] }, 'helicities'],
    [{ helicities: [-1, 2, 1, 1] }, 'helicities[1]'],
    [{ helicities: [-1, -1, 1, 1], arithmetic: 'exact', kinematics: { kind: 'random', seed: 1 } }, 'arithmetic'],
  ])('%j → PhysicsError on %s', (body, field) => {
    expect(() => loopCuts(body as never)).toThrow(expect.objectContaining({ field }))
  })
})
