// The coefficient of one box by its quadruple cut: c = ½ Σ_{two solutions} Σ_{internal helicities}
// Π_{corners} A_tree (Britto, Cachazo, Feng, hep-th/0412103), with gluons on the internal lines.
// Orientation (docs/engine.md "Quadruple cuts"): line k carries ℓ_k from corner k−1 into corner
// k. Corner k−1 sees it as the outgoing leg +ℓ_k, spinors (λ, λ̃), helicity h_k; corner k as the
// outgoing leg −ℓ_k, spinors (λ, −λ̃) (docs/conventions.md "Momenta and spinors"), helicity −h_k.
// Corner k lists its legs as (−ℓ_k, its external legs in colour order, +ℓ_{k+1}).
import { spinorSize, type Field } from '../field'
import { angleOf, momentumSum, squareOf, type Kin, type Spinor } from '../spinors'
import { threePoint, type VertexKind } from '../three-point'
import { bcfw } from '../bcfw'
import { defaultShift, type Process } from '../theories'
import { classifyGluon, parkeTaylorAntiMhv, parkeTaylorMhv } from '../targets/parke-taylor'
import { berendsGiele } from '../targets/berends-giele'
import { solveQuadrupleCut, type CutSolution } from './cut'
import type { Box } from './boxes'
import { superCut } from './super'
import { cutStates } from './states'

export type CornerMethod = 'closed' | 'bcfw' | 'berends-giele'

export interface BoxTerm<T> {
  /** 0 or 1. */
  solution: number
  /** h_1..h_4 of the lines at their outgoing (+ℓ) end. */
  helicities: number[]
  value: T
  /** Multiplet sums: how many SU(4) assignments of the states share these helicities. */
  multiplicity?: number
}

export interface BoxCut<T> {
  solutions: { cut: CutSolution<T>; threePoint: (VertexKind | null)[] }[]
  /** The non-zero products of corner amplitudes. */
  terms: BoxTerm<T>[]
  value: T
}

const HELICITY_SETS: number[][] = Array.from({ length: 16 }, (_, m) => [0, 1, 2, 3].map((b) => ((m >> b) & 1 ? 1 : -1)))

/**
 * Which three-point vertex survives at a massless corner: 'square' where the angle spinors of the
 * corner are proportional (⟨ℓ e⟩ = 0), 'angle' where the square spinors are. Exact: the bracket
 * that is exactly zero. Float: the relatively smaller of the two brackets (one of them is a
 * rounding-level remainder at a cut solution).
 */
function vertexKind<T>(F: Field<T>, l: Spinor<T>, lt: Spinor<T>, e: Spinor<T>, et: Spinor<T>): VertexKind {
  const a = F.abs(angleOf(F, l, e)) / (spinorSize(F, l) * spinorSize(F, e))
  const s = F.abs(squareOf(F, lt, et)) / (spinorSize(F, lt) * spinorSize(F, et))
  return a <= s ? 'square' : 'angle'
}

/** A gluon tree of four or more legs by the chosen method (vanishing classes give 0). */
export function cornerTree<T>(F: Field<T>, p: Process, k: Kin<T>, h: number[], method: CornerMethod): T {
  const c = classifyGluon(h)
  if (c.kind === 'vanishing') return F.zero
  if (method === 'berends-giele') return berendsGiele(F, k, h)
  if (method === 'bcfw') return bcfw(F, p, k, h, defaultShift(p, h), { closedForms: false }).value
  if (c.kind === 'mhv') return parkeTaylorMhv(F, k, c.i, c.j)
  if (c.kind === 'anti-mhv') return parkeTaylorAntiMhv(F, k, c.i, c.j)
  return bcfw(F, p, k, h, defaultShift(p, h)).value
}

/**
 * The quadruple-cut coefficient of a box. `order` is the order in which the four corners are
 * evaluated and multiplied (a permutation of 0..3; the result must not depend on it).
 */
export function boxCut<T>(F: Field<T>, p: Process, k: Kin<T>, h: readonly number[], box: Box, opts: { corners?: CornerMethod; order?: number[]; states?: 'gluons' | 'multiplet' | 'auto' } = {}): BoxCut<T> {
  const method = opts.corners ?? 'closed'
  // default: three-point corners first, whose helicity rule zeroes most products before a tree is built
  const order = opts.order ?? [0, 1, 2, 3].sort((a, b) => box.corners[a]!.length - box.corners[b]!.length)
  const K = box.corners.map((c) => momentumSum(F, k, c))
  const cuts = solveQuadrupleCut(F, K)
  const minusOne = F.fromInt(-1)
  const neg = (s: Spinor<T>): Spinor<T> => [F.mul(minusOne, s[0]), F.mul(minusOne, s[1])]
  const solutions = cuts.map((cut) => ({
    cut,
    threePoint: box.corners.map((c, q) => (c.length === 1 ? vertexKind(F, cut.lambda[q]!, cut.lambdaTilde[q]!, k.lambda[c[0]!]!, k.lambdaTilde[c[0]!]!) : null)),
  }))
  const terms: BoxTerm<T>[] = []
  let value = F.zero
  solutions.forEach(({ cut, threePoint: kinds }, sIdx) => {
    // corner q's legs (−ℓ_q, its externals, +ℓ_{q+1}) do not depend on the helicities: built once
    const kins: Kin<T>[] = box.corners.map((ext, q) => {
      const out = (q + 1) % 4
      return {
        lambda: [cut.lambda[q]!, ...ext.map((e) => k.lambda[e]!), cut.lambda[out]!],
        lambdaTilde: [neg(cut.lambdaTilde[q]!), ...ext.map((e) => k.lambdaTilde[e]!), cut.lambdaTilde[out]!],
      }
    })
    // 'auto': the multiplet only where SU(4) counting lets more than gluons cross (the same value, cheaper)
    if (opts.states === 'multiplet' || (opts.states === 'auto' && cutStates(box, kinds, h) === 'multiplet')) {
      // the N = 4 multiplet by Grassmann integration over the four internal η's (super.ts)
      for (const t of superCut(F, p, box, h, kins, kinds, method, order, sIdx)) {
        terms.push(t)
        value = F.add(value, t.value)
      }
      return
    }
    // its amplitude for (h_in of −ℓ_q, h_out of +ℓ_{q+1}), memoized over the four values
    const memo: (T | undefined)[] = new Array(16)
    const corner = (q: number, hIn: number, hOut: number): T => {
      const key = q * 4 + (hIn > 0 ? 2 : 0) + (hOut > 0 ? 1 : 0)
      const hit = memo[key]
      if (hit !== undefined) return hit
      const ext = box.corners[q]!
      const hs = [hIn, ...ext.map((e) => h[e]!), hOut]
      const v = ext.length === 1 ? threePoint(F, p, kins[q]!, hs, kinds[q]!) : cornerTree(F, p, kins[q]!, hs, method)
      memo[key] = v
      return v
    }
    for (const hl of HELICITY_SETS) {
      let prod = F.one
      for (const q of order) {
        const c = corner(q, -hl[q]!, hl[(q + 1) % 4]!)
        if (F.isZero(c)) { prod = F.zero; break }
        prod = F.mul(prod, c)
      }
      if (F.isZero(prod)) continue
      terms.push({ solution: sIdx, helicities: hl, value: prod })
      value = F.add(value, prod)
    }
  })
  return { solutions, terms, value: F.div(value, F.fromInt(2)) }
}
