// The quadruple cut of a box: the two loop momenta ℓ with ℓ_k² = 0 on all four propagators.
// Corners K1..K4 (outgoing sums of external momenta, colour order), ℓ_1 enters corner 1 and
// ℓ_{k+1} = ℓ_k − K_k, so ℓ_4 = ℓ_1 + K4 (docs/engine.md "Quadruple cuts").
// Three of the four conditions are linear in ℓ (2ℓ·K1 = K1², 2ℓ·(K1+K2) = (K1+K2)², 2ℓ·K4 = −K4²):
// ℓ = ℓ₀ + τ v with v spanning their null space, and ℓ² = 0 is a quadratic in τ. Its root is a
// square root: exact only where the discriminant is a rational square (every box with a
// three-point corner next to … at rational points; four-mass and three-mass generally not).
import { SingularError, negligible, type Field } from '../field'
import { PhysicsError } from '../errors'
import { splitRankOne } from '../bcfw'
import { bispinorAdd, bispinorScale, det, type Bispinor, type Spinor } from '../spinors'

export interface CutSolution<T> {
  /** ℓ_1..ℓ_4 as bispinors. */
  ell: Bispinor<T>[]
  /** Per line a factorisation ℓ_k = λ λ̃ᵀ. */
  lambda: Spinor<T>[]
  lambdaTilde: Spinor<T>[]
  /** max_k |ℓ_k²| / |ℓ_k|² (|ℓ| the largest bispinor entry); exactly 0 in exact arithmetic. */
  onShell: number
}

/** √x in the field, or null when it is not in the field (exact: not a rational square). */
export function fieldSqrt<T>(F: Field<T>, x: T): T | null {
  if (!F.sqrt) throw new PhysicsError('arithmetic', `the ${F.kind} arithmetic here has no square root for the cut solutions`)
  return F.sqrt(x)
}

/** The row r with r·(L00, L01, L10, L11) = 2ℓ·K (docs/conventions.md "Momenta and spinors"). */
function rowOf<T>(K: Bispinor<T>): T[] {
  return [K[1][1], K[1][0], K[0][1], K[0][0]]
}
// signs of rowOf: 2ℓ·K = L00 K11 + L11 K00 − L01 K10 − L10 K01
const ROW_SIGN = [1, -1, -1, 1]

function det3<T>(F: Field<T>, m: T[][]): T {
  const [a, b, c] = m as [T[], T[], T[]]
  const t1 = F.mul(a[0]!, F.sub(F.mul(b[1]!, c[2]!), F.mul(b[2]!, c[1]!)))
  const t2 = F.mul(a[1]!, F.sub(F.mul(b[0]!, c[2]!), F.mul(b[2]!, c[0]!)))
  const t3 = F.mul(a[2]!, F.sub(F.mul(b[0]!, c[1]!), F.mul(b[1]!, c[0]!)))
  return F.add(F.sub(t1, t2), t3)
}

const toBispinor = <T>(x: T[]): Bispinor<T> => [[x[0]!, x[1]!], [x[2]!, x[3]!]]
const sizeOf = <T>(F: Field<T>, P: Bispinor<T>) => Math.max(F.abs(P[0][0]), F.abs(P[0][1]), F.abs(P[1][0]), F.abs(P[1][1]))

/**
 * The two solutions of the quadruple cut with corners K[0..3]. Throws SingularError where the
 * cut degenerates (a vanishing Gram determinant, a double root) and PhysicsError on field
 * `arithmetic` when exact arithmetic would need an irrational square root.
 */
export function solveQuadrupleCut<T>(F: Field<T>, K: readonly Bispinor<T>[]): [CutSolution<T>, CutSolution<T>] {
  const [K1, K2, , K4] = K as [Bispinor<T>, Bispinor<T>, Bispinor<T>, Bispinor<T>]
  const K12 = bispinorAdd(F, K1, K2)
  const signed = (r: T[]) => r.map((x, j) => (ROW_SIGN[j]! < 0 ? F.neg(x) : x))
  const M = [signed(rowOf(K1)), signed(rowOf(K12)), signed(rowOf(K4))]
  const rhs = [det(F, K1), det(F, K12), F.neg(det(F, K4))]
  const minor = (col: number, rows: T[][]) => rows.map((r) => r.filter((_, j) => j !== col))
  // null vector by cofactors: v_j = (−1)^j det(M without column j)
  const v = [0, 1, 2, 3].map((j) => {
    const d = det3(F, minor(j, M))
    return j % 2 === 0 ? d : F.neg(d)
  })
  let jStar = 0
  for (let j = 1; j < 4; j++) if (F.abs(v[j]!) > F.abs(v[jStar]!)) jStar = j
  const scale = Math.max(...M.flat().map((x) => F.abs(x)), 1e-300)
  if (negligible(F, v[jStar]!, scale ** 3)) throw new SingularError('the corner momenta of the box are linearly dependent')
  // Particular solution with x_{j*} = 0 by Cramer's rule on the other three columns.
  const A = minor(jStar, M)
  const dA = det3(F, A)
  const sub = [0, 1, 2].map((c) => det3(F, A.map((r, i) => r.map((x, cc) => (cc === c ? rhs[i]! : x)))))
  const x0: T[] = []
  for (let j = 0, c = 0; j < 4; j++) x0.push(j === jStar ? F.zero : F.div(sub[c++]!, dA, 'a singular cut system'))
  const L0 = toBispinor(x0)
  const V = toBispinor(v)
  // det(L0 + τ V) = det L0 + 2b τ + a τ²
  const a = det(F, V)
  const twoB = F.sub(F.add(F.mul(L0[0][0], V[1][1]), F.mul(L0[1][1], V[0][0])), F.add(F.mul(L0[0][1], V[1][0]), F.mul(L0[1][0], V[0][1])))
  const b = F.div(twoB, F.fromInt(2))
  const c = det(F, L0)
  const disc = F.sub(F.mul(b, b), F.mul(a, c))
  const vs = sizeOf(F, V)
  if (negligible(F, a, vs * vs)) throw new SingularError('the cut has a single solution (vanishing Gram determinant of the box)')
  if (negligible(F, disc, F.abs(b) ** 2 + F.abs(a) * F.abs(c))) throw new SingularError('the two cut solutions coincide')
  const root = fieldSqrt(F, disc)
  if (root === null) throw new PhysicsError('arithmetic', 'the cut solutions of this box involve an irrational square root; exact arithmetic needs a rational discriminant (use float)')
  // τ = (−b ± √Δ)/a, the pair from q = −(b ± √Δ) with the larger |q| (no cancellation): τ₁ = q/a, τ₂ = c/q.
  const qPlus = F.neg(F.add(b, root))
  const qMinus = F.neg(F.sub(b, root))
  const q = F.abs(qPlus) >= F.abs(qMinus) ? qPlus : qMinus
  const taus = [F.div(q, a), F.div(c, q, 'a vanishing cut root')]
  const Kscale = Math.max(...K.map((P) => sizeOf(F, P)))
  const sols = taus.map((tau) => {
    let l1 = bispinorAdd(F, L0, bispinorScale(F, tau, V))
    if (F.kind === 'float') l1 = newtonStep(F, M, rhs, l1)
    const ell: Bispinor<T>[] = [l1]
    for (let k = 0; k < 3; k++) ell.push(bispinorAdd(F, ell[k]!, bispinorScale(F, F.fromInt(-1), K[k]!)))
    const split = ell.map((P) => splitRankOne(F, P))
    const onShell = Math.max(...ell.map((P) => {
      // relative to the box's own scale: ℓ_k = ℓ_1 − K… carries rounding of the size of K
      const s = Math.max(sizeOf(F, P), Kscale)
      return F.abs(det(F, P)) / (s * s)
    }))
    if (ell.some((P) => sizeOf(F, P) === 0)) throw new SingularError('a cut loop momentum vanishes')
    return { ell, lambda: split.map((s) => s.lambda), lambdaTilde: split.map((s) => s.lambdaTilde), onShell }
  })
  return [sols[0]!, sols[1]!]
}

/**
 * One Newton step on the four cut conditions (three linear rows M·x = rhs and det x = 0), which
 * takes the float solution to the rounding of its last operations.
 */
function newtonStep<T>(F: Field<T>, M: T[][], rhs: T[], L: Bispinor<T>): Bispinor<T> {
  const x = [L[0][0], L[0][1], L[1][0], L[1][1]]
  const f = M.map((r, i) => F.sub(r.reduce((acc, m, j) => F.add(acc, F.mul(m, x[j]!)), F.zero), rhs[i]!))
  f.push(det(F, L))
  const J = [...M.map((r) => [...r]), [x[3]!, F.neg(x[2]!), F.neg(x[1]!), x[0]!]]
  // Gaussian elimination with partial pivoting on [J | f]
  const A = J.map((r, i) => [...r, f[i]!])
  for (let c = 0; c < 4; c++) {
    let piv = c
    for (let r = c + 1; r < 4; r++) if (F.abs(A[r]![c]!) > F.abs(A[piv]![c]!)) piv = r
    if (F.isZero(A[piv]![c]!)) return L
    ;[A[c], A[piv]] = [A[piv]!, A[c]!]
    for (let r = c + 1; r < 4; r++) {
      const m = F.div(A[r]![c]!, A[c]![c]!)
      for (let j = c; j < 5; j++) A[r]![j] = F.sub(A[r]![j]!, F.mul(m, A[c]![j]!))
    }
  }
  const d: T[] = [F.zero, F.zero, F.zero, F.zero]
  for (let r = 3; r >= 0; r--) {
    let acc: T = A[r]![4]!
    for (let j = r + 1; j < 4; j++) acc = F.sub(acc, F.mul(A[r]![j]!, d[j]!))
    d[r] = F.div(acc, A[r]![r]!)
  }
  return [[F.sub(x[0]!, d[0]!), F.sub(x[1]!, d[1]!)], [F.sub(x[2]!, d[2]!), F.sub(x[3]!, d[3]!)]]
}
