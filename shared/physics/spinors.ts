// Spinor-helicity primitives, exactly as in docs/conventions.md:
// P = [[p0+p3, p1 − i p2], [p1 + i p2, p0 − p3]], P_ab = λ_a λ̃_b,
// ⟨ij⟩ = λ_i[0] λ_j[1] − λ_i[1] λ_j[0], [ij] = λ̃_i[1] λ̃_j[0] − λ̃_i[0] λ̃_j[1], s_ij = ⟨ij⟩[ji].
import type { Field } from './field'

export type Spinor<T> = [T, T]
/** A 2×2 bispinor [[P00, P01], [P10, P11]]. */
export type Bispinor<T> = [[T, T], [T, T]]

/** A phase-space point: per leg (0-based here, labels 1..n outside) an angle and a square spinor. */
export interface Kin<T> {
  lambda: Spinor<T>[]
  lambdaTilde: Spinor<T>[]
}

export function angleOf<T>(F: Field<T>, a: Spinor<T>, b: Spinor<T>): T {
  return F.sub(F.mul(a[0], b[1]), F.mul(a[1], b[0]))
}

export function squareOf<T>(F: Field<T>, a: Spinor<T>, b: Spinor<T>): T {
  return F.sub(F.mul(a[1], b[0]), F.mul(a[0], b[1]))
}

/** ⟨ij⟩ with 0-based leg indices. */
export function angle<T>(F: Field<T>, k: Kin<T>, i: number, j: number): T {
  return angleOf(F, k.lambda[i]!, k.lambda[j]!)
}

/** [ij] with 0-based leg indices. */
export function square<T>(F: Field<T>, k: Kin<T>, i: number, j: number): T {
  return squareOf(F, k.lambdaTilde[i]!, k.lambdaTilde[j]!)
}

/** The bispinor λ λ̃ᵀ of one massless leg. */
export function outer<T>(F: Field<T>, l: Spinor<T>, lt: Spinor<T>): Bispinor<T> {
  return [
    [F.mul(l[0], lt[0]), F.mul(l[0], lt[1])],
    [F.mul(l[1], lt[0]), F.mul(l[1], lt[1])],
  ]
}

export function bispinorZero<T>(F: Field<T>): Bispinor<T> {
  return [[F.zero, F.zero], [F.zero, F.zero]]
}

export function bispinorAdd<T>(F: Field<T>, a: Bispinor<T>, b: Bispinor<T>): Bispinor<T> {
  return [
    [F.add(a[0][0], b[0][0]), F.add(a[0][1], b[0][1])],
    [F.add(a[1][0], b[1][0]), F.add(a[1][1], b[1][1])],
  ]
}

export function bispinorScale<T>(F: Field<T>, c: T, a: Bispinor<T>): Bispinor<T> {
  return [
    [F.mul(c, a[0][0]), F.mul(c, a[0][1])],
    [F.mul(c, a[1][0]), F.mul(c, a[1][1])],
  ]
}

/** Σ_{k∈legs} λ_k λ̃_kᵀ (0-based legs). */
export function momentumSum<T>(F: Field<T>, k: Kin<T>, legs: readonly number[]): Bispinor<T> {
  let P = bispinorZero(F)
  for (const i of legs) P = bispinorAdd(F, P, outer(F, k.lambda[i]!, k.lambdaTilde[i]!))
  return P
}

/** det P = P² (mostly-minus metric). */
export function det<T>(F: Field<T>, P: Bispinor<T>): T {
  return F.sub(F.mul(P[0][0], P[1][1]), F.mul(P[0][1], P[1][0]))
}

/** Minkowski product v·w = (V00 W11 + V11 W00 − V01 W10 − V10 W01)/2. */
export function dot<T>(F: Field<T>, v: Bispinor<T>, w: Bispinor<T>): T {
  const twice = F.sub(
    F.add(F.mul(v[0][0], w[1][1]), F.mul(v[1][1], w[0][0])),
    F.add(F.mul(v[0][1], w[1][0]), F.mul(v[1][0], w[0][1])),
  )
  return F.div(twice, F.fromInt(2))
}

/** s(legs) = (Σ p_k)² (0-based legs). */
export function mandelstam<T>(F: Field<T>, k: Kin<T>, legs: readonly number[]): T {
  return det(F, momentumSum(F, k, legs))
}

/** ⟨a|P|b] = λ̃_b[0] (P11 λ_a[0] − P01 λ_a[1]) + λ̃_b[1] (P00 λ_a[1] − P10 λ_a[0]). */
export function sandwichOf<T>(F: Field<T>, la: Spinor<T>, P: Bispinor<T>, ltb: Spinor<T>): T {
  const x = F.sub(F.mul(P[1][1], la[0]), F.mul(P[0][1], la[1]))
  const y = F.sub(F.mul(P[0][0], la[1]), F.mul(P[1][0], la[0]))
  return F.add(F.mul(ltb[0], x), F.mul(ltb[1], y))
}

/** ⟨i|Σ_{k∈legs} p_k|j] (0-based). */
export function sandwich<T>(F: Field<T>, k: Kin<T>, i: number, legs: readonly number[], j: number): T {
  return sandwichOf(F, k.lambda[i]!, momentumSum(F, k, legs), k.lambdaTilde[j]!)
}
