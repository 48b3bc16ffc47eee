// Identities among colour-ordered gluon amplitudes, each a sum Σ c_t A(σ_t) that must vanish:
//   cyclicity     A(1, 2, …, n) − A(2, …, n, 1)
//   reflection    A(1, 2, …, n) − (−1)ⁿ A(n, …, 2, 1)
//   u1-decoupling Σ over the positions of leg 1 among 2, …, n of A(2, …, 1, …, n)  (photon decoupling)
//   kleiss-kuijf  A(1, α, n, β) − (−1)^|β| Σ_{σ ∈ α ⧢ βᵀ} A(1, σ, n)
//   bcj           Σ_{i=3}^{n} (Σ_{j=3}^{i} s_2j) A(1, 3, …, i, 2, i+1, …, n)  (the fundamental relation)
// Sources: Kleiss & Kuijf, Nucl. Phys. B312 (1989) 616 (cyclicity, reflection, U(1) decoupling and
// their relations); Bern, Carrasco, Johansson, arXiv:0805.3993 (BCJ). Each amplitude is the BCFW
// result at the relabelled point; floats run in double-double, exact mode in rationals.
import type { Field } from '../field'
import type { Kin } from '../spinors'
import { mandelstam } from '../spinors'
import { PhysicsError } from '../errors'
import type { Process } from '../theories'
import { amplitude, permuteKin } from './common'

export const IDENTITIES = ['cyclicity', 'reflection', 'u1-decoupling', 'kleiss-kuijf', 'bcj'] as const
export type IdentityName = (typeof IDENTITIES)[number]

/** One term c · A(order) (0-based legs; c an integer or, for BCJ, a sum of invariants). */
interface TermSpec<T> {
  order: number[]
  coefficient: T
}

export interface IdentityTerm<T> {
  /** 1-based labels in colour order. */
  order: number[]
  coefficient: T
  /** c · A(order). */
  value: T
}

export interface IdentityResult<T> {
  identity: IdentityName
  terms: IdentityTerm<T>[]
  sum: T
  /** |Σ| / max |term| (0 when every term is 0). */
  residual: number
  /** Float: the residual allowed; exact: null (the sum must be exactly 0). */
  tolerance: number | null
  holds: boolean
}

/** Float residual allowed (double-double amplitudes: the sums cancel to ~1e-28 at generic points). */
export const IDENTITY_TOLERANCE = 1e-12

/** All interleavings of a and b keeping the order within each. */
export function shuffles(a: number[], b: number[]): number[][] {
  if (!a.length) return [b.slice()]
  if (!b.length) return [a.slice()]
  return [...shuffles(a.slice(1), b).map((s) => [a[0]!, ...s]), ...shuffles(a, b.slice(1)).map((s) => [b[0]!, ...s])]
}

export interface IdentityOptions {
  /** Kleiss–Kuijf: the legs of α (0-based, from 1..n−2); β is the rest in ascending order. Default: the first half. */
  alpha?: number[]
  /** Leave out term t (the tests use it to show the identity is then caught). */
  drop?: number
}

function specs<T>(F: Field<T>, k: Kin<T>, n: number, identity: IdentityName, opts: IdentityOptions): TermSpec<T>[] {
  const one = F.one
  const minusOne = F.neg(F.one)
  const id = Array.from({ length: n }, (_, t) => t)
  switch (identity) {
    case 'cyclicity':
      return [{ order: id, coefficient: one }, { order: [...id.slice(1), 0], coefficient: minusOne }]
    case 'reflection':
      return [{ order: id, coefficient: one }, { order: id.slice().reverse(), coefficient: n % 2 === 0 ? minusOne : one }]
    case 'u1-decoupling': {
      const rest = id.slice(1)
      return rest.map((_, pos) => {
        const order = rest.slice()
        order.splice(pos, 0, 0)
        return { order, coefficient: one }
      })
    }
    case 'kleiss-kuijf': {
      const middle = id.slice(1, n - 1)
      const alpha = opts.alpha ?? middle.slice(0, Math.ceil(middle.length / 2))
      const bad = alpha.find((x) => !middle.includes(x))
      if (bad !== undefined || new Set(alpha).size !== alpha.length || alpha.length === 0)
        throw new PhysicsError('alpha', `α must be distinct legs among 2..${n - 1}, at least one, got [${alpha.map((x) => x + 1).join(', ')}]`)
      const beta = middle.filter((x) => !alpha.includes(x))
      const sign = beta.length % 2 === 0 ? one : minusOne
      return [
        { order: [0, ...alpha, n - 1, ...beta], coefficient: one },
        ...shuffles(alpha, beta.slice().reverse()).map((s) => ({ order: [0, ...s, n - 1], coefficient: F.neg(sign) })),
      ]
    }
    case 'bcj': {
      const out: TermSpec<T>[] = []
      for (let i = 3; i <= n; i++) {
        let c = F.zero
        for (let j = 3; j <= i; j++) c = F.add(c, mandelstam(F, k, [1, j - 1]))
        const order = [0]
        for (let l = 3; l <= n; l++) {
          order.push(l - 1)
          if (l === i) order.push(1)
        }
        out.push({ order, coefficient: c })
      }
      return out
    }
  }
}

/** Evaluates the identity for gluons with helicities h (labels 1..n) at the point k. */
export function identityCheck<T>(F: Field<T>, p: Process, k: Kin<T>, h: number[], identity: IdentityName, opts: IdentityOptions = {}): IdentityResult<T> {
  const n = h.length
  if (p.theory !== 'gluon') throw new PhysicsError('theory', `the identity checks apply to colour-ordered gluons, not ${p.theory}`)
  if (n < 4) throw new PhysicsError('helicities', `the identity checks need n ≥ 4, got n = ${n}`)
  if (identity === 'kleiss-kuijf' && n < 5) throw new PhysicsError('identity', 'the Kleiss–Kuijf relations need n ≥ 5 (at n = 4 they are reflection and U(1) decoupling)')
  const all = specs(F, k, n, identity, opts)
  const used = opts.drop === undefined ? all : all.filter((_, t) => t !== opts.drop)
  const terms: IdentityTerm<T>[] = used.map((s) => ({
    order: s.order.map((x) => x + 1),
    coefficient: s.coefficient,
    value: F.mul(s.coefficient, amplitude(F, p, permuteKin(k, s.order), s.order.map((x) => h[x]!))),
  }))
  let sum = F.zero
  let largest = 0
  for (const t of terms) {
    sum = F.add(sum, t.value)
    largest = Math.max(largest, F.abs(t.value))
  }
  const residual = F.isZero(sum) ? 0 : largest === 0 ? Infinity : F.abs(sum) / largest
  const exact = F.kind === 'exact'
  return { identity, terms, sum, residual, tolerance: exact ? null : IDENTITY_TOLERANCE, holds: exact ? F.isZero(sum) : residual <= IDENTITY_TOLERANCE }
}
