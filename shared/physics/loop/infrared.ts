// The infrared conditions on the N = 4 box coefficients (any helicities). The one-loop N = 4
// amplitude is Σ b F over boxes, F the box functions of Bern, Dixon, Dunbar, Kosower
// (hep-ph/9403226), and its poles are those of −(1/ε²) Σ_i (−s_{i,i+1})^(−ε) A_tree (their "V_n").
// F's poles, from memory and checked against the MHV boxes at 4..8 points (tests): 1/ε² with
// −½ per soft line (a line between two massless corners), 1/ε with ½ ln(−s) of each soft line's
// channel plus ½ [ln(−(K_a+K_b)²) − ln(−K_b²)] per massless corner a and massive neighbour b.
// In our normalisation (docs/engine.md "Quadruple cuts") b = −2c/Δ, Δ = st − K_{a−1}²K_{a+1}² at
// a massless corner a (st for zero-, one-mass and two-mass-hard boxes). Matching the coefficient of
// 1/ε² and of each independent ln(−X) gives linear conditions on the c's.
import type { Field } from '../field'
import { det, momentumSum, type Kin } from '../spinors'
import type { Box } from './boxes'

export interface InfraredRow<T> {
  /** 'leading' for the 1/ε² pole, else the invariant's legs (0-based, the canonical side). */
  legs: number[] | 'leading'
  value: T
  target: T
  /** The largest |term| of the sum (the scale of a zero target). */
  scale: number
}

/** The canonical side of a cyclic set of legs: the shorter one, at a tie the one holding leg 0. */
function canonical(n: number, legs: readonly number[]): number[] {
  const s = [...legs].sort((a, b) => a - b)
  const rest = Array.from({ length: n }, (_, i) => i).filter((i) => !s.includes(i))
  if (s.length < rest.length) return s
  if (rest.length < s.length) return rest
  return s.includes(0) ? s : rest
}

/** The conditions for boxes with known coefficients c (null: unknown, the whole set is then incomplete). */
export function infraredRows<T>(F: Field<T>, k: Kin<T>, boxes: readonly Box[], c: readonly (T | null)[], tree: T): InfraredRow<T>[] | null {
  if (c.some((x) => x === null)) return null
  const n = k.lambda.length
  const inv = (legs: number[]) => det(F, momentumSum(F, k, legs))
  const rows = new Map<string, InfraredRow<T>>()
  const add = (legs: number[] | 'leading', v: T) => {
    const key = legs === 'leading' ? 'leading' : legs.join(',')
    const r = rows.get(key)
    if (r) { r.value = F.add(r.value, v); r.scale = Math.max(r.scale, F.abs(v)) }
    else rows.set(key, { legs, value: v, target: F.zero, scale: F.abs(v) })
  }
  add('leading', F.zero)
  for (let i = 0; i < n; i++) add(canonical(n, [i, (i + 1) % n]), F.zero)
  boxes.forEach((box, idx) => {
    const K = box.corners
    const massless = K.map((x) => x.length === 1)
    if (!massless.some(Boolean)) return
    const s = inv([...K[0]!, ...K[1]!])
    const t = inv([...K[1]!, ...K[2]!])
    const a = massless.indexOf(true)
    const mPrev = massless[(a + 3) % 4] ? F.zero : inv(K[(a + 3) % 4]!)
    const mNext = massless[(a + 1) % 4] ? F.zero : inv(K[(a + 1) % 4]!)
    const delta = F.sub(F.mul(s, t), F.mul(mPrev, mNext))
    const b = F.div(F.mul(F.fromInt(-2), c[idx]!), delta, 'a vanishing Gram determinant of a box')
    const half = F.div(b, F.fromInt(2))
    let soft = 0
    for (let q = 0; q < 4; q++) {
      const r = (q + 1) % 4
      if (massless[q] && massless[r]) {
        soft++
        add(canonical(n, [...K[q]!, ...K[r]!]), half)
      }
      if (!massless[q]) continue
      for (const nb of [(q + 3) % 4, r]) {
        if (massless[nb]) continue
        add(canonical(n, [...K[q]!, ...K[nb]!]), half)
        add(canonical(n, K[nb]!), F.neg(half))
      }
    }
    add('leading', F.mul(F.fromInt(-soft), half))
  })
  rows.get('leading')!.target = F.mul(F.fromInt(-n), tree)
  for (let i = 0; i < n; i++) {
    const r = rows.get(canonical(n, [i, (i + 1) % n]).join(','))!
    r.target = F.add(r.target, tree)
  }
  return [...rows.values()]
}
