// Invariants of a stored point: s_ij = (p_i + p_j)² = det(P_i + P_j) (docs/conventions.md: det P = p²),
// and the smallest |s_ij| relative to the largest, which shows how near a soft or collinear region
// a point lies. For a 2 → n physical point the largest |s_ij| is s itself (s_12).
import { Complex, complexField as F } from '../physics/field'
import { spinorsOfMomentum } from '../physics/kinematics'
import { det, momentumSum, type Kin, type Spinor } from '../physics/spinors'
import type { PointData, WireC, WireSpinor } from './types'

const spinorOf = (s: WireSpinor): Spinor<Complex> => [new Complex(s[0][0], s[0][1]), new Complex(s[1][0], s[1][1])]

/** The point's spinors (of the momenta as given, without restoring conservation). */
export function kinOf(d: PointData): Kin<Complex> {
  if (d.momenta) {
    const s = d.momenta.map(spinorsOfMomentum)
    return { lambda: s.map(x => x.lambda), lambdaTilde: s.map(x => x.lambdaTilde) }
  }
  return { lambda: d.lambda!.map(spinorOf), lambdaTilde: d.lambdaTilde!.map(spinorOf) }
}

/** s_ij for i < j as an n × n matrix of [re, im] (zero on the diagonal, symmetric). */
export function invariantMatrix(k: Kin<Complex>): WireC[][] {
  const n = k.lambda.length
  const m: WireC[][] = Array.from({ length: n }, () => Array.from({ length: n }, () => [0, 0] as WireC))
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      const s = det(F, momentumSum(F, k, [i, j]))
      m[i]![j] = [s.re, s.im]
      m[j]![i] = [s.re, s.im]
    }
  }
  return m
}

/** min |s_ij| / max |s_ij| over pairs i < j (0 when every s_ij vanishes). */
export function minInvariantRatio(k: Kin<Complex>): number {
  const n = k.lambda.length
  let min = Infinity
  let max = 0
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      const a = F.abs(det(F, momentumSum(F, k, [i, j])))
      if (a < min) min = a
      if (a > max) max = a
    }
  }
  return max === 0 ? 0 : min / max
}
