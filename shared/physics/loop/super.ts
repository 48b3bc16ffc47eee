// The N = 4 state sum of a quadruple cut by on-shell superspace (common practice): each corner is a
// super-amplitude, the sum over the multiplet on a cut line is ∫d⁴η of that line. Corners:
//   MHV (k = 2):        δ⁸(Q) / (⟨12⟩…⟨m1⟩),   δ⁸(Q) = Π_A Σ_{i<j} ⟨ij⟩ η_i^A η_j^A;
//   anti-MHV (k = m−2): (−1)^m Π_A Π_r (C⊥η^A)_r / (κ⁴ [12]…[m1]), C⊥ the m−2 rows orthogonal to
//                       λ̃ (Schouten rows on a pivot pair a, b), κ = [ab]^(m−3);
// normalised so their gluon components are the engine's Parke–Taylor forms and three-point
// vertices (a negative-helicity gluon is the coefficient of η^1η^2η^3η^4, a positive one of 1).
// The −ℓ end of a line carries −η (super-momentum λη flips with λ̃). Grassmann signs are kept by
// an exact algebra on bitmask monomials, so fermion loops get their sign without hand rules.
import type { Field } from '../field'
import { PhysicsError } from '../errors'
import { angleOf, squareOf, type Kin } from '../spinors'
import type { Process } from '../theories'
import type { VertexKind } from '../three-point'
import type { Box } from './boxes'
import { cornerTree, type BoxTerm, type CornerMethod } from './coefficient'

/** A Grassmann polynomial: monomial (bit g set: generator g present, product in increasing g) → coefficient. */
export type Grassmann<T> = Map<number, T>

function popcount(x: number): number {
  let c = 0
  for (let y = x; y; y &= y - 1) c++
  return c
}

/** The sign of (monomial a)(monomial b) brought to increasing order; 0 when they share a generator. */
export function productSign(a: number, b: number): number {
  if (a & b) return 0
  let swaps = 0
  for (let y = b; y; y &= y - 1) {
    const j = 31 - Math.clz32(y & -y)
    swaps += popcount(a >>> (j + 1))
  }
  return swaps % 2 ? -1 : 1
}

export function gMul<T>(F: Field<T>, x: Grassmann<T>, y: Grassmann<T>, keep?: (m: number) => boolean): Grassmann<T> {
  const out: Grassmann<T> = new Map()
  for (const [a, ca] of x) {
    for (const [b, cb] of y) {
      const s = productSign(a, b)
      if (!s) continue
      const m = a | b
      if (keep && !keep(m)) continue
      const v = s > 0 ? F.mul(ca, cb) : F.neg(F.mul(ca, cb))
      const old = out.get(m)
      out.set(m, old === undefined ? v : F.add(old, v))
    }
  }
  return out
}

/** The N = 4 sector of a corner that no closed super-amplitude here covers (NMHV corners crossed by fermions). */
export class UnsupportedCorner extends PhysicsError {
  constructor(m: number, k: number) {
    super('states', `a ${m}-point ${k === 3 ? 'NMHV' : `N^${k - 2}MHV`} corner crossed by gluinos and scalars needs a super-amplitude beyond MHV and anti-MHV; this box is not summed`)
  }
}

/**
 * The super-amplitude of a corner with legs (−ℓ_in, externals, +ℓ_out) and gluon externals `hs`
 * (inner legs only), with the external components taken: a polynomial in the internal η's, local
 * generators in^A = bit A, out^A = bit 4 + A. `vertex` is the surviving three-point kind.
 */
export function superCorner<T>(F: Field<T>, p: Process, kin: Kin<T>, ext: readonly number[], vertex: VertexKind | null, method: CornerMethod, unsupported?: Set<number>): Grassmann<T> {
  const m = ext.length + 2
  const neg = ext.filter((h) => h < 0).length
  const sectors = vertex ? [vertex === 'square' ? 1 : 2] : Array.from({ length: m - 3 }, (_, i) => i + 2)
  const out: Grassmann<T> = new Map()
  let unsupportedSector: { m: number; k: number } | null = null
  for (const k of sectors) {
    const d = k - neg
    if (d < 0 || d > 2) continue
    let poly: Grassmann<T>
    if (k === 2) poly = mhvCorner(F, kin, ext)
    else if (k === m - 2) poly = antiMhvCorner(F, kin, ext)
    else if (d === 1) {
      // thrown only if a complete assignment of the cut uses this sector (superSolution)
      // its gluon components are trees; the gluino and scalar ones are flagged
      if (!unsupported) throw new UnsupportedCorner(m, k)
      poly = new Map([[0xf0, cornerTree(F, p, kin, [1, ...ext, -1], method)], [0x0f, cornerTree(F, p, kin, [-1, ...ext, 1], method)]])
      for (let S = 1; S < 15; S++) {
        const mono = S | ((~S & 0xf) << 4)
        unsupported.add(mono)
        poly.set(mono, F.zero)
      }
      unsupportedSector = { m, k }
    }
    else {
      // only gluons cross: both internal ends + (d = 0) or both − (d = 2)
      const h = d === 0 ? 1 : -1
      const v = cornerTree(F, p, kin, [h, ...ext, h], method)
      poly = new Map([[d === 0 ? 0 : 0xff, v]])
    }
    for (const [mono, v] of poly) {
      const old = out.get(mono)
      out.set(mono, old === undefined ? v : F.add(old, v))
    }
  }
  if (unsupportedSector) (unsupported as Set<number> & { sector?: { m: number; k: number } }).sector = unsupportedSector
  return out
}

/** Local generator of leg t (0 = in, m−1 = out, else the (t−1)-th external) and index A; null for a positive external. */
function generatorOf(t: number, m: number, negIndex: (number | null)[], A: number): number | null {
  if (t === 0) return A
  if (t === m - 1) return 4 + A
  const j = negIndex[t - 1]
  return j === null || j === undefined ? null : 8 + 4 * j + A
}

function negIndices(ext: readonly number[]): (number | null)[] {
  let c = 0
  return ext.map((h) => (h < 0 ? c++ : null))
}

/** Product over the four SU(4) indices of per-index factors, keeping monomials with every negative external's η^A; then the external blocks taken off. */
function assemble<T>(F: Field<T>, perIndex: (A: number) => Grassmann<T>, nNeg: number, scale: T): Grassmann<T> {
  let acc: Grassmann<T> = new Map([[0, F.one]])
  for (let A = 0; A < 4; A++) acc = gMul(F, acc, perIndex(A))
  const extMask = nNeg ? ((1 << (4 * nNeg)) - 1) << 8 : 0
  const out: Grassmann<T> = new Map()
  // The external blocks η_i^1…η_i^4 are even: taking them off leaves the internal part, no sign.
  for (const [mono, v] of acc) if ((mono & extMask) === extMask) out.set(mono & 0xff, F.mul(v, scale))
  return out
}

function requireAll(negMask: number): (mono: number) => boolean {
  return (mono) => (mono & negMask) === negMask
}

function mhvCorner<T>(F: Field<T>, kin: Kin<T>, ext: readonly number[]): Grassmann<T> {
  const m = ext.length + 2
  const ni = negIndices(ext)
  const nNeg = ni.filter((x) => x !== null).length
  let pt = F.one
  for (let a = 0; a < m; a++) pt = F.mul(pt, angleOf(F, kin.lambda[a]!, kin.lambda[(a + 1) % m]!))
  const perIndex = (A: number): Grassmann<T> => {
    let negMask = 0
    for (const j of ni) if (j !== null) negMask |= 1 << (8 + 4 * j + A)
    const f: Grassmann<T> = new Map()
    for (let i = 0; i < m; i++) {
      const gi = generatorOf(i, m, ni, A)
      if (gi === null) continue
      for (let j = i + 1; j < m; j++) {
        const gj = generatorOf(j, m, ni, A)
        if (gj === null) continue
        const mono = (1 << gi) | (1 << gj)
        // a component needs η^A of every negative-helicity external
        if (!requireAll(negMask)(mono)) continue
        const s = productSign(1 << gi, 1 << gj)
        const b = angleOf(F, kin.lambda[i]!, kin.lambda[j]!)
        const old = f.get(mono)
        const v = s > 0 ? b : F.neg(b)
        f.set(mono, old === undefined ? v : F.add(old, v))
      }
    }
    return f
  }
  return assemble(F, perIndex, nNeg, F.div(F.one, pt, 'an angle bracket of adjacent corner legs vanishes'))
}

function antiMhvCorner<T>(F: Field<T>, kin: Kin<T>, ext: readonly number[]): Grassmann<T> {
  const m = ext.length + 2
  const ni = negIndices(ext)
  const nNeg = ni.filter((x) => x !== null).length
  const Lt = kin.lambdaTilde
  let den = F.one
  for (let a = 0; a < m; a++) den = F.mul(den, squareOf(F, Lt[a]!, Lt[(a + 1) % m]!))
  // pivot pair: the largest |[ab]| (any non-zero one in exact arithmetic)
  let pa = 0, pb = 1, best = -1
  for (let a = 0; a < m; a++) for (let b = a + 1; b < m; b++) {
    const v = F.abs(squareOf(F, Lt[a]!, Lt[b]!))
    if (v > best) { best = v; pa = a; pb = b }
  }
  const ab = squareOf(F, Lt[pa]!, Lt[pb]!)
  const rows: [number, T][][] = []
  for (let c = 0; c < m; c++) {
    if (c === pa || c === pb) continue
    rows.push([[c, ab], [pa, squareOf(F, Lt[pb]!, Lt[c]!)], [pb, squareOf(F, Lt[c]!, Lt[pa]!)]])
  }
  const perIndex = (A: number): Grassmann<T> => {
    let negMask = 0
    for (const j of ni) if (j !== null) negMask |= 1 << (8 + 4 * j + A)
    let f: Grassmann<T> = new Map([[0, F.one]])
    for (const row of rows) {
      const lin: Grassmann<T> = new Map()
      for (const [t, coef] of row) {
        const g = generatorOf(t, m, ni, A)
        if (g === null) continue
        const old = lin.get(1 << g)
        lin.set(1 << g, old === undefined ? coef : F.add(old, coef))
      }
      f = gMul(F, f, lin)
    }
    return new Map([...f].filter(([mono]) => requireAll(negMask)(mono)))
  }
  const kappa4 = F.pow(ab, 4 * (m - 3))
  let scale = F.div(F.one, F.mul(kappa4, den), 'a square bracket of adjacent corner legs vanishes')
  if (m % 2) scale = F.neg(scale)
  return assemble(F, perIndex, nNeg, scale)
}

/** A local corner monomial on the global line generators (line l, index A = bit 4l + A): its sign and mask. */
function toGlobal(mono: number, q: number): { sign: number; mask: number } {
  const inLine = q
  const outLine = (q + 1) % 4
  let mask = 0
  let sign = 1
  for (let g = 0; g < 8; g++) {
    if (!(mono & (1 << g))) continue
    const G = g < 4 ? 4 * inLine + g : 4 * outLine + (g - 4)
    const s = productSign(mask, 1 << G)
    sign *= s
    mask |= 1 << G
    if (g < 4) sign = -sign // the −ℓ end carries −η
  }
  return { sign, mask }
}

/** The state name of a line from the η count at its +ℓ end. */
export function stateOf(count: number): 'gluon' | 'gluino' | 'scalar' {
  return count === 0 || count === 4 ? 'gluon' : count === 2 ? 'scalar' : 'gluino'
}

/**
 * The N = 4 state sum of one cut solution: Σ over consistent η assignments of the corner
 * products, ∫Π_l d⁴η_l (the coefficient of η_1^1…η_4^4), grouped by the helicities h_1..h_4 of
 * the lines at their +ℓ end (1 − (η count)/2: ±1 gluons, ±½ gluinos, 0 scalars).
 */
export function superSolution<T>(F: Field<T>, corners: Grassmann<T>[], order: readonly number[], unsupported: (Set<number> & { sector?: { m: number; k: number } })[] = []): { helicities: number[]; multiplicity: number; value: T }[] {
  // per corner: its monomials in global form, indexed by the in-set (bits of the in-line)
  const g = corners.map((poly, q) => [...poly].map(([mono, v]) => {
    const t = toGlobal(mono, q)
    return { inSet: mono & 0xf, outSet: (mono >> 4) & 0xf, sign: t.sign, mask: t.mask, v, q, unsupported: unsupported[q]?.sector !== undefined && unsupported[q]!.has(mono) }
  }))
  const groups = new Map<string, { helicities: number[]; multiplicity: number; value: T }>()
  const pick: (typeof g)[number] = []
  const walk = (q: number) => {
    if (q === 4) {
      // lines complete: in-set of corner l and out-set of corner l−1 partition the four indices
      if ((pick[0]!.inSet | pick[3]!.outSet) !== 0xf || (pick[0]!.inSet & pick[3]!.outSet)) return
      let mask = 0
      let sign = 1
      let v = F.one
      for (const c of order) {
        const x = pick[c]!
        sign *= productSign(mask, x.mask) * x.sign
        mask |= x.mask
        v = F.mul(v, x.v)
      }
      if (mask !== 0xffff || sign === 0) return
      const bad = pick.find((x) => x.unsupported)
      if (bad) throw new UnsupportedCorner(unsupported[bad.q]!.sector!.m, unsupported[bad.q]!.sector!.k)
      if (sign < 0) v = F.neg(v)
      const helicities = [0, 1, 2, 3].map((l) => 1 - popcount(pick[(l + 3) % 4]!.outSet) / 2)
      const key = helicities.join(',')
      const old = groups.get(key)
      if (old) { old.multiplicity++; old.value = F.add(old.value, v) }
      else groups.set(key, { helicities, multiplicity: 1, value: v })
      return
    }
    for (const x of g[q]!) {
      if (q > 0) {
        const prev = pick[q - 1]!
        if ((x.inSet | prev.outSet) !== 0xf || (x.inSet & prev.outSet)) continue
      }
      pick[q] = x
      walk(q + 1)
    }
  }
  walk(0)
  return [...groups.values()].filter((t) => !F.isZero(t.value))
}

export interface SuperTerm<T> extends BoxTerm<T> {
  /** How many SU(4) assignments share these helicities (4 gluino, 6 scalar routings). */
  multiplicity: number
}

/** Corner kinematics of a solution as coefficient.ts builds them; exported for the multiplet path. */
export type CornerKins<T> = Kin<T>[]

export function superCut<T>(F: Field<T>, p: Process, box: Box, h: readonly number[], kins: CornerKins<T>, kinds: readonly (VertexKind | null)[], method: CornerMethod, order: readonly number[], solution: number): SuperTerm<T>[] {
  const flags = box.corners.map(() => new Set<number>())
  const polys = box.corners.map((ext, q) => superCorner(F, p, kins[q]!, ext.map((e) => h[e]!), kinds[q]!, method, flags[q]))
  if (polys.some((x) => x.size === 0)) return []
  return superSolution(F, polys, order, flags).map((t) => ({ solution, ...t }))
}
