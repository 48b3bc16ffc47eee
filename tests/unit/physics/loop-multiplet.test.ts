// The N = 4 multiplet sum of quadruple cuts (super.ts: corners as super-amplitudes, ∫d⁴η per cut
// line) against Bern, Dixon, Dunbar, Kosower, Nucl. Phys. B425 (1994) 217 (hep-ph/9403226): every
// MHV box — any placement of the two negative helicities — is −½ (st − P²Q²) A_tree (one-mass,
// two-mass-easy), −st A_tree at four points, 0 for two-mass-hard and three-mass boxes, where single
// states do not vanish. NMHV: the infrared conditions (see the describe block below).
import { describe, expect, it } from 'vitest'
import { complexField as C, rationalField as Q, type Field } from '#shared/physics/field'
import { randomPoint, rationalPoint } from '#shared/physics/kinematics'
import { processOf } from '#shared/physics/theories'
import { det, momentumSum, type Kin } from '#shared/physics/spinors'
import { parkeTaylor } from '#shared/physics/targets/parke-taylor'
import { allBoxes, boxCut, cutStates, rotateBox } from '#shared/physics/loop/index'
import { productSign, superCorner } from '#shared/physics/loop/super'
import { cornerTree } from '#shared/physics/loop/coefficient'
import { infraredRows } from '#shared/physics/loop/infrared'

const p = processOf('gluon')

function bddk<T>(F: Field<T>, k: Kin<T>, corners: number[][], tree: T): T {
  const m = corners.map((c) => det(F, momentumSum(F, k, c)))
  const s = det(F, momentumSum(F, k, [...corners[0]!, ...corners[1]!]))
  const t = det(F, momentumSum(F, k, [...corners[1]!, ...corners[2]!]))
  const r = Number(corners[0]!.length === 1 && corners[2]!.length === 1) + Number(corners[1]!.length === 1 && corners[3]!.length === 1)
  return F.mul(F.fromInt(-r), F.div(F.mul(F.sub(F.sub(F.mul(s, t), F.mul(m[0]!, m[2]!)), F.mul(m[1]!, m[3]!)), tree), F.fromInt(2)))
}

const MHV = [[-1, 1, -1, 1], [-1, 1, -1, 1, 1], [-1, 1, 1, -1, 1], [-1, 1, -1, 1, 1, 1], [-1, 1, 1, -1, 1, 1], [1, -1, 1, 1, 1, -1], [-1, 1, 1, 1, -1, 1, 1]]

describe('Grassmann algebra', () => {
  it('signs of monomial products', () => {
    expect(productSign(0b1, 0b10)).toBe(1) // η1·η2
    expect(productSign(0b10, 0b1)).toBe(-1) // η2·η1 = −η1η2
    expect(productSign(0b1, 0b1)).toBe(0)
    expect(productSign(0b101, 0b10)).toBe(-1)
  })
})

describe('super-amplitude corners: their gluon components are the engine\'s trees', () => {
  it.each([4, 5, 6])('%i-point corners, every helicity of the externals and the internal ends', (m) => {
    const k = randomPoint(m, 3)
    for (let mask = 0; mask < 1 << m; mask++) {
      const h = Array.from({ length: m }, (_, i) => ((mask >> i) & 1 ? -1 : 1))
      let poly
      try { poly = superCorner(C, p, k, h.slice(1, -1), null, 'closed') }
      catch { continue }
      const mono = (h[0]! < 0 ? 0xf : 0) | (h[m - 1]! < 0 ? 0xf0 : 0)
      const v = poly.get(mono) ?? C.zero
      const ref = cornerTree(C, p, k, h, 'berends-giele')
      expect(C.abs(C.sub(v, ref))).toBeLessThan(1e-11 * Math.max(1, C.abs(ref)))
    }
  })
})

describe('N = 4 MHV with the multiplet sum against BDDK', () => {
  it.each(MHV)('%j exact: every box equals its target; two-mass-hard boxes vanish only summed', (...h) => {
    const n = h.length
    const k = rationalPoint(n, 2)
    const tree = parkeTaylor(Q, k, h)
    let multiplet = 0
    for (const box of allBoxes(n)) {
      const cut = boxCut(Q, p, k, h, box, { states: 'multiplet' })
      expect(cut.value.equals(bddk(Q, k, box.corners, tree))).toBe(true)
      if (cut.solutions.some((s) => cutStates(box, s.threePoint, h) === 'multiplet')) {
        multiplet++
        // fermions or scalars contribute non-zero terms of their own
        expect(cut.terms.some((t) => t.helicities.some((x) => Math.abs(x) !== 1) && !Q.isZero(t.value))).toBe(true)
      }
    }
    expect(multiplet).toBeGreaterThan(0)
  })
  it.each(MHV)('%j float: within 1e-10', (...h) => {
    const n = h.length
    const k = randomPoint(n, 8)
    const tree = parkeTaylor(C, k, h)
    for (const box of allBoxes(n)) {
      const cut = boxCut(C, p, k, h, box, { states: 'multiplet' })
      const target = bddk(C, k, box.corners, tree)
      const scale = C.abs(target) || Math.max(...cut.terms.map((t) => C.abs(t.value)), 1)
      expect(C.abs(C.sub(cut.value, target)) / scale).toBeLessThan(1e-10)
    }
  })
  it('where only gluons cross, the multiplet sum is the gluon sum (six gluons, every helicity)', () => {
    const k = rationalPoint(6, 5)
    for (let mask = 0; mask < 64; mask += 5) {
      const h = Array.from({ length: 6 }, (_, i) => ((mask >> i) & 1 ? -1 : 1))
      for (const box of allBoxes(6)) {
        const g = boxCut(Q, p, k, h, box)
        if (!g.solutions.every((s) => cutStates(box, s.threePoint, h) === 'gluons')) continue
        expect(boxCut(Q, p, k, h, box, { states: 'multiplet' }).value.equals(g.value)).toBe(true)
      }
    }
  })
  it('a +η at the −ℓ end would break it: the fermion sign matters (−+−+ box)', () => {
    const h = [-1, 1, -1, 1]
    const k = rationalPoint(4, 3)
    const cut = boxCut(Q, p, k, h, allBoxes(4)[0]!, { states: 'multiplet' })
    const gluinos = cut.terms.filter((t) => t.helicities.some((x) => Math.abs(x) === 0.5))
    expect(gluinos.length).toBeGreaterThan(0)
    // flipping every gluino term's sign changes the value away from −st A_tree
    const flipped = cut.terms.reduce((acc, t) => Q.add(acc, gluinos.includes(t) ? Q.neg(t.value) : t.value), Q.zero)
    expect(Q.div(flipped, Q.fromInt(2)).equals(bddk(Q, k, [[0], [1], [2], [3]], parkeTaylor(Q, k, h)))).toBe(false)
  })
})

describe('independence of the evaluation order (multiplet sum)', () => {
  it('corner order and first corner do not change the coefficient (NMHV six gluons, exact)', () => {
    const h = [-1, 1, -1, 1, -1, 1]
    const k = rationalPoint(6, 4)
    for (const box of allBoxes(6)) {
      const ref = boxCut(Q, p, k, h, box, { states: 'multiplet' }).value
      expect(boxCut(Q, p, k, h, box, { states: 'multiplet', order: [3, 1, 0, 2] }).value.equals(ref)).toBe(true)
      for (const r of [1, 2, 3]) expect(boxCut(Q, p, k, h, rotateBox(box, r), { states: 'multiplet' }).value.equals(ref)).toBe(true)
    }
  })
})

// The poles of the one-loop N = 4 amplitude, −(1/ε²) Σ_i (−s_{i,i+1})^(−ε) A_tree (BDDK,
// hep-ph/9403226), against Σ boxes b F with the box functions' poles (infrared.ts; from memory,
// checked here first on the MHV boxes): 1 condition from 1/ε², one per independent invariant.
describe('infrared conditions of the N = 4 box coefficients', () => {
  const check = (h: number[], seed: number) => {
    const n = h.length
    const k = rationalPoint(n, seed)
    const boxes = allBoxes(n)
    const c = boxes.map((box) => boxCut(Q, p, k, h, box, { states: 'multiplet' }).value)
    const rows = infraredRows(Q, k, boxes, c, cornerTree(Q, p, k, h, 'closed'))!
    for (const r of rows) expect(r.value.equals(r.target), `${JSON.stringify(r.legs)}`).toBe(true)
    return rows
  }
  it.each([[-1, -1, 1, 1], [-1, 1, -1, 1, 1], [-1, -1, 1, 1, 1, 1], [-1, 1, 1, -1, 1, 1], [-1, 1, -1, 1, 1, 1, 1]])('MHV %j: every condition holds exactly', (...h) => {
    const rows = check(h, 3)
    // the 1/ε² row and one per distinct two- and three-particle invariant
    expect(rows.length).toBeGreaterThanOrEqual(h.length === 4 ? 3 : 1 + h.length)
  })
  it.each([[-1, -1, -1, 1, 1, 1], [-1, 1, -1, 1, -1, 1], [-1, -1, 1, -1, 1, 1], [1, -1, -1, 1, -1, 1]])('six-gluon NMHV %j: every condition holds exactly (two seeds)', (...h) => {
    const rows = check(h, 1)
    check(h, 7)
    expect(rows).toHaveLength(1 + 6 + 3)
  })
  it('seven-gluon NMHV −−−++++: 35 boxes (three-mass ones included), every condition exact', () => {
    const rows = check([-1, -1, -1, 1, 1, 1, 1], 2)
    expect(rows).toHaveLength(1 + 7 + 7)
  })
  it('the conditions see a wrong coefficient: one two-mass-hard box off by 1 % fails', () => {
    const h = [-1, -1, -1, 1, 1, 1]
    const k = rationalPoint(6, 1)
    const boxes = allBoxes(6)
    const c = boxes.map((box) => boxCut(Q, p, k, h, box, { states: 'multiplet' }).value)
    const i = boxes.findIndex((b, j) => b.kind === 'two-mass-hard' && !Q.isZero(c[j]!))
    c[i] = Q.mul(c[i]!, Q.div(Q.fromInt(101), Q.fromInt(100)))
    const rows = infraredRows(Q, k, boxes, c, cornerTree(Q, p, k, h, 'closed'))!
    expect(rows.some((r) => !r.value.equals(r.target))).toBe(true)
  })
  it('the gluon-only sum fails them for NMHV (fermions and scalars are needed)', () => {
    const h = [-1, 1, -1, 1, -1, 1]
    const k = rationalPoint(6, 1)
    const boxes = allBoxes(6)
    const c = boxes.map((box) => boxCut(Q, p, k, h, box).value)
    const rows = infraredRows(Q, k, boxes, c, cornerTree(Q, p, k, h, 'closed'))!
    expect(rows.some((r) => !r.value.equals(r.target))).toBe(true)
  })
})
