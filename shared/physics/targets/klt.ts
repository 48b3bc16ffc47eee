// Graviton tree amplitudes from colour-ordered gluon amplitudes by the KLT relations (Kawai,
// Lewellen, Tye, Nucl. Phys. B269 (1986) 1; field-theory form of Bern, Dixon, Perelstein,
// Rozowsky, Nucl. Phys. B546 (1999) 423), exactly as written in docs/conventions.md (labels 1-based):
//   M_3 = A(123)²  (the three-point amplitude is the square of the gluon one)
//   M_4 = −s12 A(1234) A(1243)
//   M_5 = s12 s34 A(12345) A(21435) + s13 s24 A(13245) A(31425)
//   M_6 = −s12 s45 A(123456)[s35 A(215346) + (s34+s35) A(215436)] + permutations of (2,3,4)
// Each graviton of helicity ±2 is a pair of gluons of helicity ±1; the gluon amplitudes come from
// Berends–Giele at the permuted orders (any helicities, NMHV included).
import type { Field } from '../field'
import type { Kin } from '../spinors'
import { PhysicsError } from '../errors'
import { berendsGiele } from './berends-giele'
import { checkTargetPoint } from './parke-taylor'

const PERMS_234: ReadonlyArray<readonly [number, number, number]> = [
  [2, 3, 4], [2, 4, 3], [3, 2, 4], [3, 4, 2], [4, 2, 3], [4, 3, 2],
]

/** Largest n the KLT target covers: the momentum-kernel sum has ((n−3)!)² terms (576 at n = 7). */
export const KLT_MAX_N = 7

/** The graviton amplitude M_n (n = 3..7; helicities ±2, 0-based legs) by KLT. */
export function klt<T>(F: Field<T>, k: Kin<T>, helicities: number[]): T {
  const n = helicities.length
  if (n < 3 || n > KLT_MAX_N) throw new PhysicsError('target', `the KLT target covers 3 to ${KLT_MAX_N} gravitons, not ${n}`)
  if (n === 7) return kltKernel(F, k, helicities)
  checkTargetPoint(k, n, 'KLT')
  const gluonH = helicities.map((h, a) => {
    if (h !== 2 && h !== -2) throw new PhysicsError(`helicities[${a}]`, 'a graviton has helicity ±2')
    return h / 2
  })
  // A(order) with 1-based labels: relabel the point and the helicities, then Berends–Giele.
  const A = (...order: number[]): T => {
    const idx = order.map((l) => l - 1)
    return berendsGiele(
      F,
      { lambda: idx.map((i) => k.lambda[i]!), lambdaTilde: idx.map((i) => k.lambdaTilde[i]!) },
      idx.map((i) => gluonH[i]!),
    )
  }
  // s_ij = ⟨ij⟩[ji] (1-based labels).
  const s = (i: number, j: number): T => {
    const a = k.lambda[i - 1]!, b = k.lambda[j - 1]!
    const ta = k.lambdaTilde[i - 1]!, tb = k.lambdaTilde[j - 1]!
    const ang = F.sub(F.mul(a[0], b[1]), F.mul(a[1], b[0]))
    const sq = F.sub(F.mul(tb[1], ta[0]), F.mul(tb[0], ta[1]))
    return F.mul(ang, sq)
  }
  switch (n) {
    case 3: {
      const a = A(1, 2, 3)
      return F.mul(a, a)
    }
    case 4:
      return F.neg(F.mul(F.mul(s(1, 2), A(1, 2, 3, 4)), A(1, 2, 4, 3)))
    case 5:
      return F.add(
        F.mul(F.mul(s(1, 2), s(3, 4)), F.mul(A(1, 2, 3, 4, 5), A(2, 1, 4, 3, 5))),
        F.mul(F.mul(s(1, 3), s(2, 4)), F.mul(A(1, 3, 2, 4, 5), A(3, 1, 4, 2, 5))),
      )
    default: {
      let total = F.zero
      for (const [b2, b3, b4] of PERMS_234) {
        // The CONVENTIONS term with labels 2, 3, 4 replaced by b2, b3, b4.
        const bracket = F.add(
          F.mul(s(b3, 5), A(b2, 1, 5, b3, b4, 6)),
          F.mul(F.add(s(b3, b4), s(b3, 5)), A(b2, 1, 5, b4, b3, 6)),
        )
        const term = F.mul(F.mul(F.mul(s(1, b2), s(b4, 5)), A(1, b2, b3, b4, 5, 6)), bracket)
        total = F.sub(total, term)
      }
      return total
    }
  }
}

function permutations(xs: number[]): number[][] {
  if (xs.length <= 1) return [xs.slice()]
  return xs.flatMap((x, t) => permutations([...xs.slice(0, t), ...xs.slice(t + 1)]).map((r) => [x, ...r]))
}

/**
 * KLT for any n by the momentum kernel (the general-n form of Bern, Dixon, Perelstein, Rozowsky,
 * Nucl. Phys. B546 (1999) 423, written with the kernel of Bjerrum-Bohr, Damgaard, Søndergaard,
 * Vanhove, arXiv:1010.3933), labels 1-based:
 *   M_n = (−1)^(n+1) Σ_{σ, τ ∈ S_{n−3}} A(n−1, n, τ, 1) S[τ | σ]_1 A(1, σ, n−1, n),
 *   S[i_1…i_k | j_1…j_k]_1 = Π_t (s_{1 i_t} + Σ_{q>t} θ(i_t, i_q) s_{i_t i_q}),
 * θ = 1 when i_t and i_q come in the opposite order in j. At n = 4 this is −s12 A(1234) A(1243), our
 * convention (every i stripped, the overall −1 of docs/conventions.md "Amplitudes" included);
 * the tests check it against the n = 4, 5, 6 forms above for every helicity and against Hodges.
 */
export function kltKernel<T>(F: Field<T>, k: Kin<T>, helicities: number[]): T {
  const n = helicities.length
  checkTargetPoint(k, n, 'KLT')
  const gluonH = helicities.map((h, a) => {
    if (h !== 2 && h !== -2) throw new PhysicsError(`helicities[${a}]`, 'a graviton has helicity ±2')
    return h / 2
  })
  const memo = new Map<string, T>()
  const A = (order: number[]): T => {
    const key = order.join(',')
    let v = memo.get(key)
    if (v === undefined) {
      const idx = order.map((l) => l - 1)
      v = berendsGiele(F, { lambda: idx.map((i) => k.lambda[i]!), lambdaTilde: idx.map((i) => k.lambdaTilde[i]!) }, idx.map((i) => gluonH[i]!))
      memo.set(key, v)
    }
    return v
  }
  const sij = (i: number, j: number): T => {
    const a = k.lambda[i - 1]!, b = k.lambda[j - 1]!
    const ta = k.lambdaTilde[i - 1]!, tb = k.lambdaTilde[j - 1]!
    return F.mul(F.sub(F.mul(a[0], b[1]), F.mul(a[1], b[0])), F.sub(F.mul(tb[1], ta[0]), F.mul(tb[0], ta[1])))
  }
  const perms = permutations(Array.from({ length: n - 3 }, (_, t) => t + 2))
  const kernel = (I: number[], J: number[]): T => {
    const pos = new Map(J.map((x, t) => [x, t]))
    let prod = F.one
    for (let t = 0; t < I.length; t++) {
      let f = sij(1, I[t]!)
      for (let q = t + 1; q < I.length; q++) if (pos.get(I[t]!)! > pos.get(I[q]!)!) f = F.add(f, sij(I[t]!, I[q]!))
      prod = F.mul(prod, f)
    }
    return prod
  }
  let total = F.zero
  for (const sigma of perms) {
    const right = A([1, ...sigma, n - 1, n])
    if (F.isZero(right)) continue
    let inner = F.zero
    for (const tau of perms) inner = F.add(inner, F.mul(A([n - 1, n, ...tau, 1]), kernel(tau, sigma)))
    total = F.add(total, F.mul(inner, right))
  }
  return n % 2 === 0 ? F.neg(total) : total
}
