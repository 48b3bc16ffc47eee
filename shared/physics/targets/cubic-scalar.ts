// Colour-ordered cubic scalar: the sum of all planar cubic tree diagrams, vertex 1, propagator
// +1/P² (docs/conventions.md), e.g. A_4 = 1/s12 + 1/s23. Computed by a memoized recursion over
// intervals of the legs 1..n−1 (leg n closes the amplitude) — each planar cubic tree is a unique
// way of splitting every interval in two, so this is the diagram sum (common practice; the
// diagrams are counted by the Catalan number C_{n−2}, the count of triangulations of an n-gon).
//   W(a) = 1,  W(a..b) = Σ_c W(a..c) W(c+1..b) / P²_{a..b},  A_n = Σ_c W(1..c) W(c+1..n−1).
import type { Field } from '../field'
import type { Kin } from '../spinors'
import { PhysicsError } from '../errors'

export function cubicScalarFeynman<T>(F: Field<T>, k: Kin<T>): T {
  const n = k.lambda.length
  if (n < 3) throw new PhysicsError('target', 'the cubic-scalar diagram sum needs at least three legs')
  if (k.lambdaTilde.length !== n) throw new PhysicsError('target', 'the angle and square spinor lists have different lengths')
  if (n === 3) return F.one
  const m = n - 1
  // Interval momenta as [P00, P01, P10, P11], index a*m+b.
  const mom: [T, T, T, T][] = new Array(m * m)
  const W: T[] = new Array(m * m)
  for (let a = 0; a < m; a++) {
    let P: [T, T, T, T] = [F.zero, F.zero, F.zero, F.zero]
    for (let b = a; b < m; b++) {
      const l = k.lambda[b]!, lt = k.lambdaTilde[b]!
      P = [F.add(P[0], F.mul(l[0], lt[0])), F.add(P[1], F.mul(l[0], lt[1])), F.add(P[2], F.mul(l[1], lt[0])), F.add(P[3], F.mul(l[1], lt[1]))]
      mom[a * m + b] = P
    }
    W[a * m + a] = F.one
  }
  for (let len = 2; len <= m; len++) {
    for (let a = 0; a + len - 1 < m; a++) {
      const b = a + len - 1
      let s = F.zero
      for (let c = a; c < b; c++) s = F.add(s, F.mul(W[a * m + c]!, W[(c + 1) * m + b]!))
      if (len === m) return s
      const P = mom[a * m + b]!
      const p2 = F.sub(F.mul(P[0], P[3]), F.mul(P[1], P[2]))
      W[a * m + b] = F.div(s, p2, `the propagator of legs ${a + 1}..${b + 1} vanishes`)
    }
  }
  throw new Error('unreachable')
}

/**
 * A single scalar species with a cubic coupling (theory `spin`, s = 0): the sum of all cubic tree
 * diagrams, not only the planar ones, e.g. A_4 = 1/s12 + 1/s13 + 1/s14. Off-shell currents over
 * subsets of the legs 1..n−1 (bit masks): J({a}) = 1, J(S) = Σ J(A) J(S∖A) / P²_S over the splits
 * with A holding the lowest leg of S; A_n = the same sum for S = {1..n−1} without the propagator.
 * Each cubic tree is one way of splitting every set in two, so this is the diagram sum
 * ((2n−5)!! diagrams; common practice).
 */
export function cubicScalarAllChannels<T>(F: Field<T>, k: Kin<T>): T {
  const n = k.lambda.length
  if (n < 3) throw new PhysicsError('target', 'the cubic-scalar diagram sum needs at least three legs')
  if (k.lambdaTilde.length !== n) throw new PhysicsError('target', 'the angle and square spinor lists have different lengths')
  const m = n - 1
  const full = (1 << m) - 1
  const J: T[] = new Array(full + 1)
  const mom: [T, T, T, T][] = new Array(full + 1)
  for (let S = 1; S <= full; S++) {
    const low = S & -S
    if (S === low) {
      const a = 31 - Math.clz32(S)
      const l = k.lambda[a]!, lt = k.lambdaTilde[a]!
      mom[S] = [F.mul(l[0], lt[0]), F.mul(l[0], lt[1]), F.mul(l[1], lt[0]), F.mul(l[1], lt[1])]
      J[S] = F.one
      continue
    }
    const P = mom[low]!, Q = mom[S ^ low]!
    mom[S] = [F.add(P[0], Q[0]), F.add(P[1], Q[1]), F.add(P[2], Q[2]), F.add(P[3], Q[3])]
    let s = F.zero
    const rest = S ^ low
    // A = low ∪ B for every B ⊂ rest with B ≠ rest
    for (let B = (rest - 1) & rest; ; B = (B - 1) & rest) {
      s = F.add(s, F.mul(J[low | B]!, J[rest ^ B]!))
      if (B === 0) break
    }
    if (S === full) return s
    const M = mom[S]!
    const p2 = F.sub(F.mul(M[0], M[3]), F.mul(M[1], M[2]))
    J[S] = F.div(s, p2, `the propagator of the legs ${Array.from({ length: m }, (_, t) => t).filter((t) => S & (1 << t)).map((t) => t + 1).join(',')} vanishes`)
  }
  return F.one // n = 3
}
