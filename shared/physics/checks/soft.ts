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

/** Judges a path: |ratio − 1| small at the end and falling at (at least about) the expected rate. */
export function judge(rows: PathRow[], expectedRate: number): { rate: number | null; holds: boolean } {
  const floor = 1e-20
  const rate = rateOf(rows.map((r) => r.x), rows.map((r) => r.deviation), floor)
  const last = rows[rows.length - 1]!.deviation
  const holds = last < 1e-2 && (rate === null ? last <= floor : rate > expectedRate - 0.25)
  return { rate, holds }
}

export interface SoftOptions {
  seed?: number | string
  path?: number[]
}

/** The soft check of leg s (0-based) of the process with helicities h (gluons, gravitons; n ≥ 5). */
export function softCheck(p: Process, h: number[], s: number, opts: SoftOptions = {}): LimitResult {
  const n = h.length
  if (p.theory !== 'gluon' && p.theory !== 'graviton') throw new PhysicsError('theory', `the soft check applies to gluons and gravitons, not ${p.theory}`)
  if (n < 5) throw new PhysicsError('helicities', `the soft check needs n ≥ 5 (A_{n−1} with at least four legs), got n = ${n}`)
  if (!Number.isInteger(s) || s < 0 || s >= n) throw new PhysicsError('soft', `leg ${s + 1} does not exist (legs are 1..${n})`)
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
    const S = softFactor(p, k, s, h[s]! > 0)
    const ratio = D.div(amplitude(D, p, k, h), D.mul(S, aHard))
    rows.push({ x: eps, ratio: wireOf(ratio), deviation: D.abs(D.sub(ratio, D.one)) })
  }
  return { rows, ...judge(rows, 1), expectedRate: 1 }
}
