// Hodges' determinant formula for MHV graviton amplitudes (Hodges, arXiv:1204.1930), in the
// conventions of docs/conventions.md (overall sign +1 for every n), negative-helicity legs a, b:
//   M_n = ⟨ab⟩⁸ det(Φ with rows i,j,k and columns p,q,r removed) · (−1)^(i+j+k+p+q+r)
//         / (⟨ij⟩⟨jk⟩⟨ki⟩ ⟨pq⟩⟨qr⟩⟨rp⟩),
//   Φ_kl = [kl]/⟨kl⟩ (k ≠ l),  Φ_kk = −Σ_{l≠k} [kl]⟨lx⟩⟨ly⟩ / (⟨kl⟩⟨kx⟩⟨ky⟩),
// with rows = columns by default (then the sign is +1 and the denominator a square). Removing
// different rows and columns carries the cofactor sign (Hodges, ibid.); x, y are any reference legs.
// The parity conjugate (two + legs) swaps angle and square brackets; every bracket appears an
// even number of times, so the sign stays +1.
import type { Field } from '../field'
import type { Kin, Spinor } from '../spinors'
import { PhysicsError } from '../errors'
import { checkTargetPoint } from './parke-taylor'

export interface HodgesOptions {
  /** Three removed rows (0-based, distinct). Default: the first three legs. */
  rows?: [number, number, number]
  /** Three removed columns (0-based, distinct). Default: the rows. */
  cols?: [number, number, number]
  /** Reference legs of the diagonal (0-based). Default: the first two removed rows. */
  x?: number
  y?: number
}

export type GravitonClass = { kind: 'mhv' | 'anti-mhv'; a: number; b: number } | { kind: 'vanishing' } | { kind: 'other' }

/** Classifies graviton helicities (±2): MHV (two −2), its conjugate (two +2), vanishing, or other. */
export function classifyGraviton(helicities: readonly number[]): GravitonClass {
  const minus: number[] = []
  const plus: number[] = []
  helicities.forEach((h, a) => {
    if (h === -2) minus.push(a)
    else if (h === 2) plus.push(a)
    else throw new PhysicsError(`helicities[${a}]`, 'a graviton has helicity ±2')
  })
  if (minus.length === 2) return { kind: 'mhv', a: minus[0]!, b: minus[1]! }
  if (plus.length === 2) return { kind: 'anti-mhv', a: plus[0]!, b: plus[1]! }
  if (helicities.length >= 4 && (minus.length < 2 || plus.length < 2)) return { kind: 'vanishing' }
  return { kind: 'other' }
}

/** Determinant by Gaussian elimination over the field (partial pivoting by modulus). */
export function determinant<T>(F: Field<T>, A: T[][]): T {
  const m = A.length
  const M = A.map((r) => r.slice())
  let det = F.one
  for (let c = 0; c < m; c++) {
    let piv = -1
    let best = -1
    for (let r = c; r < m; r++) {
      const v = M[r]![c]!
      if (F.isZero(v)) continue
      const a = F.abs(v)
      if (a > best) {
        best = a
        piv = r
      }
    }
    if (piv < 0) return F.zero
    if (piv !== c) {
      const t = M[piv]!
      M[piv] = M[c]!
      M[c] = t
      det = F.neg(det)
    }
    const row = M[c]!
    const p = row[c]!
    det = F.mul(det, p)
    for (let r = c + 1; r < m; r++) {
      const R = M[r]!
      if (F.isZero(R[c]!)) continue
      const f = F.div(R[c]!, p)
      for (let cc = c + 1; cc < m; cc++) R[cc] = F.sub(R[cc]!, F.mul(f, row[cc]!))
    }
  }
  return det
}

function distinctLegs(xs: readonly number[], n: number, what: string): void {
  if (xs.length !== 3 || new Set(xs).size !== 3 || xs.some((x) => !Number.isInteger(x) || x < 0 || x >= n)) {
    throw new PhysicsError('target', `Hodges' formula needs three distinct ${what} among the legs`)
  }
}

/**
 * Hodges' formula with brackets `a` (the "angle" role) and `b` (the "square" role): the MHV
 * amplitude with angle = ⟨⟩, square = [] and special legs s1, s2; its parity conjugate with the
 * roles swapped.
 */
function hodgesCore<T>(
  F: Field<T>,
  n: number,
  ang: (i: number, j: number) => T,
  sq: (i: number, j: number) => T,
  s1: number,
  s2: number,
  opts: HodgesOptions | undefined,
): T {
  if (n === 3) {
    // No rows remain: M₃ = ⟨ab⟩⁸ / (⟨12⟩⟨23⟩⟨31⟩)², the square of the gluon three-point amplitude.
    const c = F.mul(F.mul(ang(0, 1), ang(1, 2)), ang(2, 0))
    return F.div(F.pow(ang(s1, s2), 8), F.mul(c, c), 'an angle bracket vanishes')
  }
  const rows = opts?.rows ?? [0, 1, 2]
  const cols = opts?.cols ?? rows
  distinctLegs(rows, n, 'rows')
  distinctLegs(cols, n, 'columns')
  const x0 = opts?.x ?? rows[0]
  const y0 = opts?.y ?? rows[1]
  const keptR = [...Array(n).keys()].filter((i) => !rows.includes(i))
  const keptC = [...Array(n).keys()].filter((i) => !cols.includes(i))
  // Φ_kl = [kl]/⟨kl⟩, needed for all pairs in the diagonal sums.
  const phi: T[][] = Array.from({ length: n }, () => new Array<T>(n).fill(F.zero))
  for (let k = 0; k < n; k++) {
    for (let l = k + 1; l < n; l++) {
      const v = F.div(sq(k, l), ang(k, l), 'an angle bracket vanishes')
      phi[k]![l] = v
      phi[l]![k] = v
    }
  }
  const diag = (k: number): T => {
    // The diagonal is independent of x, y (momentum conservation); a reference equal to k is
    // replaced by another leg, which leaves the value unchanged.
    const refs = [x0, y0, ...Array(n).keys()].filter((l, idx, all) => l !== k && all.indexOf(l) === idx)
    const x = refs[0]!, y = refs[1]!
    let s = F.zero
    for (let l = 0; l < n; l++) {
      if (l === k) continue
      s = F.add(s, F.mul(phi[k]![l]!, F.div(F.mul(ang(l, x), ang(l, y)), F.mul(ang(k, x), ang(k, y)), 'an angle bracket vanishes')))
    }
    return F.neg(s)
  }
  const M = keptR.map((r) => keptC.map((c) => (r === c ? diag(r) : phi[r]![c]!)))
  const d = determinant(F, M)
  const [i, j, k] = rows
  const [p, q, r] = cols
  const den = F.mul(F.mul(F.mul(ang(i, j), ang(j, k)), ang(k, i)), F.mul(F.mul(ang(p, q), ang(q, r)), ang(r, p)))
  let v = F.div(F.mul(F.pow(ang(s1, s2), 8), d), den, 'an angle bracket of the removed legs vanishes')
  if ((i + j + k + p + q + r) % 2 === 1) v = F.neg(v)
  return v
}

/** The graviton amplitude for MHV or anti-MHV helicities (±2, 0-based legs); zero for vanishing classes. */
export function hodges<T>(F: Field<T>, k: Kin<T>, helicities: number[], opts?: HodgesOptions): T {
  const n = helicities.length
  checkTargetPoint(k, n, "Hodges' formula")
  const c = classifyGraviton(helicities)
  if (c.kind === 'vanishing') return F.zero
  if (c.kind === 'other') throw new PhysicsError('target', "Hodges' formula applies only to MHV helicities and their parity conjugate")
  const L = k.lambda, Lt = k.lambdaTilde
  const angle = (a: Spinor<T>, b: Spinor<T>) => F.sub(F.mul(a[0], b[1]), F.mul(a[1], b[0]))
  const square = (a: Spinor<T>, b: Spinor<T>) => F.sub(F.mul(a[1], b[0]), F.mul(a[0], b[1]))
  if (c.kind === 'mhv') {
    return hodgesCore(F, n, (i, j) => angle(L[i]!, L[j]!), (i, j) => square(Lt[i]!, Lt[j]!), c.a, c.b, opts)
  }
  // Parity: ⟨ij⟩ ↔ [ij] (each up to a sign that cancels, every bracket enters an even number of times).
  return hodgesCore(F, n, (i, j) => square(Lt[i]!, Lt[j]!), (i, j) => angle(L[i]!, L[j]!), c.a, c.b, opts)
}
