// The soft check: one leg s scaled λ_s → √ε λ_s, λ̃_s → √ε λ̃_s along a path ε = 10⁻¹ … 10⁻⁸, and
// the ratio A_n / (S × A_{n−1}) → 1 with the leading (Weinberg) soft factor of its helicity
// (Weinberg, Phys. Rev. 140 (1965) B516). In our conventions (docs/conventions.md "Amplitudes"),
// derived from Parke–Taylor and its conjugate with (−1)ⁿ, for a gluon between legs a and b:
//   S⁺ = ⟨ab⟩ / (⟨as⟩⟨sb⟩),   S⁻ = −[ab] / ([as][sb]);
// for a graviton (reference legs x, y, any two hard legs; the sign fixed by KLT's
// M₄ = −s12 A(1234) A(1243), i.e. −1 relative to the mostly-plus textbook form):
//   S⁺ = Σ_a [as]⟨ax⟩⟨ay⟩ / (⟨sa⟩⟨sx⟩⟨sy⟩),   S⁻ = Σ_a ⟨as⟩[ax][ay] / ([sa][sx][sy]).
// The amplitudes are BCFW results in double-double (the point is ill-conditioned by design).
// Scaling both spinors by √ε is the holomorphic scaling (λ̃_s → ε λ̃_s for s⁺, λ_s → ε λ_s for s⁻)
// followed by a little-group rescaling, under which the ratio is invariant; the subleading soft
// term is one power of ε below the leading one, so |ratio − 1| falls like ε (measured: slopes
// 1.00–1.08 for gluons and gravitons at n = 5, 6; MHV with a soft plus gluon is exact).
// Gravitons also have the subleading factor S⁽¹⁾ of Cachazo & Strominger (arXiv:1404.4091), a first-
// order operator on A_{n−1}; with it |ratio − 1| falls like ε² (derivation and signs: docs/engine.md
// "Subleading soft graviton").
import seedrandom from 'seedrandom'
import { ddField as D, ddOf, type DD } from '../double-double'
import { randomPoint, toDoubleDouble } from '../kinematics'
import { angleOf, squareOf, type Kin, type Spinor } from '../spinors'
import { PhysicsError } from '../errors'
import type { Process } from '../theories'
import { DEFAULT_PATH, amplitude, rateOf, scaleSpinor, solveOn } from './common'

export interface PathRow {
  /** ε (soft) or δ (collinear). */
  x: number
  ratio: [number, number]
  /** |ratio − 1|. */
  deviation: number
}

export interface LimitResult {
  rows: PathRow[]
  /** Fitted exponent r of |ratio − 1| ~ x^r (null when at rounding level throughout). */
  rate: number | null
  expectedRate: number
  /** The ratio tends to 1 at the expected rate (or sits at rounding level). */
  holds: boolean
}

/** Seeded complex 2-spinors (the soft leg's direction, the collinear offset). */
export function seededSpinors(seed: string, count: number): Spinor<DD>[] {
  const rng = seedrandom(`polewright:limit:${seed}`)
  const u = () => ddOf(2 * rng() - 1, 2 * rng() - 1)
  return Array.from({ length: count }, () => [u(), u()] as Spinor<DD>)
}

const ang = (k: Kin<DD>, a: number, b: number) => angleOf(D, k.lambda[a]!, k.lambda[b]!)
const sq = (k: Kin<DD>, a: number, b: number) => squareOf(D, k.lambdaTilde[a]!, k.lambdaTilde[b]!)

/** The leading soft factor of leg s at the point k (0-based legs). */
export function softFactor(p: Process, k: Kin<DD>, s: number, plus: boolean): DD {
  const n = k.lambda.length
  if (p.theory === 'gluon') {
    const a = (s - 1 + n) % n
    const b = (s + 1) % n
    return plus ? D.div(ang(k, a, b), D.mul(ang(k, a, s), ang(k, s, b))) : D.neg(D.div(sq(k, a, b), D.mul(sq(k, a, s), sq(k, s, b))))
  }
  const hard = Array.from({ length: n }, (_, t) => t).filter((t) => t !== s)
  const [x, y] = [hard[0]!, hard[1]!]
  let S = D.zero
  for (const a of hard) {
    if (a === x || a === y) continue // ⟨xx⟩ = 0: those terms vanish
    S = D.add(S, plus
      ? D.div(D.mul(D.mul(sq(k, a, s), ang(k, a, x)), ang(k, a, y)), D.mul(D.mul(ang(k, s, a), ang(k, s, x)), ang(k, s, y)))
      : D.div(D.mul(D.mul(ang(k, a, s), sq(k, a, x)), sq(k, a, y)), D.mul(D.mul(sq(k, s, a), sq(k, s, x)), sq(k, s, y))))
  }
  return S
}

/** Two hard legs to re-solve conservation on: the last two that are not the given ones. */
export function recoilLegs(n: number, avoid: number[]): [number, number] {
  const c = Array.from({ length: n }, (_, t) => n - 1 - t).filter((t) => !avoid.includes(t))
  return [c[1]!, c[0]!]
}

export function wireOf(v: DD): [number, number] {
  return D.toWire(v) as [number, number]
}

/** A path holds when its last |ratio − 1| is below LAST_MAX and its fitted rate above expected − RATE_SLACK. */
export const LAST_MAX = 1e-2
export const RATE_SLACK = 0.25

/**
 * Judges a path: |ratio − 1| small at the end and falling at (at least about) the expected rate.
 * Deviations at or below the rounding floor (a number, or one per x) are left out of the fit.
 */
export function judge(rows: PathRow[], expectedRate: number, floor: number | ((x: number) => number) = 1e-20): { rate: number | null; holds: boolean } {
  const floorAt = typeof floor === 'number' ? () => floor : floor
  const above = rows.filter((r) => r.deviation > floorAt(r.x))
  const rate = rateOf(above.map((r) => r.x), above.map((r) => r.deviation), 0)
  const lastRow = rows[rows.length - 1]!
  const last = lastRow.deviation
  const holds = last < LAST_MAX && (rate === null ? last <= floorAt(lastRow.x) : rate > expectedRate - RATE_SLACK)
  return { rate, holds }
}

/**
 * Rounding floor of the subleading ratio: A_n in double-double at the nearly soft point loses about
 * 1/ε² of its 32 digits (measured: ≈ 5·10⁻³⁰/ε² at n = 5, 1.5·10⁻²⁹/ε² at n = 6), kept with a margin.
 */
export const subleadingFloor = (eps: number) => Math.max(1e-20, 1e-27 / (eps * eps))

export interface SoftOptions {
  seed?: number | string
  path?: number[]
  /** 'subleading' adds S⁽¹⁾ (gravitons only). */
  order?: 'leading' | 'subleading'
}

/**
 * The coefficients u_a of the subleading operator S⁽¹⁾ = Σ_a u_a λ̃_s·∂/∂λ̃_a (s⁺) or
 * Σ_a u_a λ_s·∂/∂λ_a (s⁻) at the point k, indexed by the n-point legs (u_s = 0):
 *   s⁺: u_a = ½ [as]/⟨sa⟩ (⟨ax⟩/⟨sx⟩ + ⟨ay⟩/⟨sy⟩),   s⁻: its conjugate ½ ⟨as⟩/[sa] ([ax]/[sx] + [ay]/[sy]),
 * the same reference legs x, y as softFactor. The sign is fixed by Σ_a u_a λ_a = S⁽⁰⁾ λ_s (s⁺), which makes
 * S⁽⁰⁾ + S⁽¹⁾ blind to how A_{n−1} is continued off momentum conservation (docs/engine.md).
 */
export function subleadingCoefficients(k: Kin<DD>, s: number, plus: boolean): DD[] {
  const n = k.lambda.length
  const hard = Array.from({ length: n }, (_, t) => t).filter((t) => t !== s)
  const [x, y] = [hard[0]!, hard[1]!]
  const half = ddOf(0.5, 0)
  return Array.from({ length: n }, (_, a) => {
    if (a === s) return D.zero
    const br = plus ? ang : sq
    const other = plus ? sq : ang
    const inner = D.add(D.div(br(k, a, x), br(k, s, x)), D.div(br(k, a, y), br(k, s, y)))
    return D.mul(half, D.mul(D.div(other(k, a, s), br(k, s, a)), inner))
  })
}

/**
 * S⁽¹⁾ A_{n−1}: the derivative of t ↦ A_{n−1}(hard point moved along V) at t = 0, where V moves λ̃_a by
 * u_a λ̃_s (s⁺) or λ_a by u_a λ_s (s⁻). Off conservation A_{n−1} is continued by re-solving the λ̃ of the
 * two recoil legs (the continuation that gives back the hard point at t = 0); a five-point central
 * difference in double-double (step 10⁻⁸ of |V|; measured error ~10⁻²⁵ where S⁽⁰⁾ + S⁽¹⁾ is exact).
 */
export function subleadingTerm(p: Process, hard: Kin<DD>, hardH: number[], k: Kin<DD>, s: number, plus: boolean, recoil: [number, number]): DD {
  const u = subleadingCoefficients(k, s, plus)
  const dir = plus ? k.lambdaTilde[s]! : k.lambda[s]!
  const toHard = (a: number) => (a < s ? a : a - 1)
  const V = hard.lambda.map((_, ah) => scaleSpinor(D, u[ah < s ? ah : ah + 1]!, dir))
  const size = Math.max(...V.map((v) => Math.max(D.abs(v[0]), D.abs(v[1]))))
  if (size === 0) return D.zero
  const h = 1e-8 / size
  const at = (t: number) => {
    const c = ddOf(t, 0)
    const moved = V.map((v, ah) => {
      const base = plus ? hard.lambdaTilde[ah]! : hard.lambda[ah]!
      return [D.add(base[0], D.mul(c, v[0])), D.add(base[1], D.mul(c, v[1]))] as Spinor<DD>
    })
    const q: Kin<DD> = plus ? { lambda: hard.lambda, lambdaTilde: moved } : { lambda: moved, lambdaTilde: hard.lambdaTilde }
    return amplitude(D, p, solveOn(D, q, toHard(recoil[0]), toHard(recoil[1])), hardH)
  }
  const num = D.add(D.sub(D.mul(ddOf(8, 0), D.sub(at(h), at(-h))), at(2 * h)), at(-2 * h))
  return D.div(num, ddOf(12 * h, 0))
}

/** The soft check of leg s (0-based) of the process with helicities h (gluons, gravitons; n ≥ 5). */
export function softCheck(p: Process, h: number[], s: number, opts: SoftOptions = {}): LimitResult {
  const n = h.length
  if (p.theory !== 'gluon' && p.theory !== 'graviton') throw new PhysicsError('theory', `the soft check applies to gluons and gravitons, not ${p.theory}`)
  if (n < 5) throw new PhysicsError('helicities', `the soft check needs n ≥ 5 (A_{n−1} with at least four legs), got n = ${n}`)
  if (!Number.isInteger(s) || s < 0 || s >= n) throw new PhysicsError('soft', `leg ${s + 1} does not exist (legs are 1..${n})`)
  const subleading = opts.order === 'subleading'
  if (subleading && p.theory !== 'graviton') throw new PhysicsError('order', 'the subleading soft factor is offered for gravitons only')
  const hardH = h.filter((_, t) => t !== s)
  const seed = String(opts.seed ?? 1)
  const hard = toDoubleDouble(randomPoint(n - 1, `soft:${seed}`))
  const aHard = amplitude(D, p, hard, hardH)
  if (D.isZero(aHard)) throw new PhysicsError('helicities', `A_${n - 1} with helicities [${hardH.join(', ')}] vanishes identically: the soft limit has nothing to compare with`)
  const [ls, lts] = seededSpinors(`soft:${seed}`, 2) as [Spinor<DD>, Spinor<DD>]
  const [ra, rb] = recoilLegs(n, [s])
  const rows: PathRow[] = []
  for (const eps of opts.path ?? DEFAULT_PATH) {
    const r = ddOf(Math.sqrt(eps), 0)
    const lambda = [...hard.lambda]
    const lambdaTilde = [...hard.lambdaTilde]
    lambda.splice(s, 0, scaleSpinor(D, r, ls))
    lambdaTilde.splice(s, 0, scaleSpinor(D, r, lts))
    const k = solveOn(D, { lambda, lambdaTilde }, ra, rb)
    const plus = h[s]! > 0
    const S = softFactor(p, k, s, plus)
    let soft = D.mul(S, aHard)
    if (subleading) soft = D.add(soft, subleadingTerm(p, hard, hardH, k, s, plus, [ra, rb]))
    const ratio = D.div(amplitude(D, p, k, h), soft)
    rows.push({ x: eps, ratio: wireOf(ratio), deviation: D.abs(D.sub(ratio, D.one)) })
  }
  const expected = subleading ? 2 : 1
  return { rows, ...judge(rows, expected, subleading ? subleadingFloor : 1e-20), expectedRate: expected }
}
