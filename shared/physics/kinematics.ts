// Phase-space points in spinor form (docs/conventions.md "Momenta and spinors"): spinors of real
// massless momenta, seeded complex and exact rational points, physical points by RAMBO, and the
// validation of user-given momenta and spinors.
import seedrandom from 'seedrandom'
import { Complex, Fraction, complexField, parseRational, rationalField, type Field } from './field'
import { angleOf, bispinorAdd, bispinorZero, det, momentumSum, outer, type Bispinor, type Kin, type Spinor } from './spinors'
import { PhysicsError, fmtSize } from './errors'
import { ddField, ddOf, type DD } from './double-double'

export type Momentum = [number, number, number, number]

/** Relative tolerance for given momenta and spinors (docs/api.md: 1e-8 of the point's scale). */
export const INPUT_TOLERANCE = 1e-8
/** Seeded points are redrawn until min |s_S| ≥ this fraction of max |s_ij| (docs/api.md). */
export const CONDITION_THRESHOLD = 1e-3

const C = (re: number, im = 0) => new Complex(re, im)

/**
 * Spinors of a real massless momentum, docs/conventions.md: for p0 > 0 and p+ = p0 + p3 ≥ 1e-10 p0,
 * λ = (√p+, (p1 + i p2)/√p+), λ̃ = (√p+, (p1 − i p2)/√p+); along −z (p− = p0 − p3)
 * λ = ((p1 − i p2)/√p−, √p−), λ̃ = ((p1 + i p2)/√p−, √p−); for p0 < 0, λ(p) = λ(−p), λ̃(p) = −λ̃(−p).
 */
export function spinorsOfMomentum(p: Momentum): { lambda: Spinor<Complex>; lambdaTilde: Spinor<Complex> } {
  const [p0, p1, p2, p3] = p
  if (p0 < 0) {
    const s = spinorsOfMomentum([-p0, -p1, -p2, -p3])
    return { lambda: s.lambda, lambdaTilde: [s.lambdaTilde[0].neg(), s.lambdaTilde[1].neg()] }
  }
  // p0 + p3 cancels for momenta near −z: there p+ = p⊥² / p− (p+ p− = p⊥² on shell), which keeps
  // every digit, so λ λ̃ᵀ reproduces p to rounding.
  const pt = Math.hypot(p1, p2)
  const pp = p3 >= 0 ? p0 + p3 : pt * (pt / (p0 - p3)) // (no overflow at large scales)
  if (pp >= 1e-10 * p0) {
    const r = Math.sqrt(pp)
    return { lambda: [C(r), C(p1 / r, p2 / r)], lambdaTilde: [C(r), C(p1 / r, -p2 / r)] }
  }
  const r = Math.sqrt(p0 - p3)
  return { lambda: [C(p1 / r, -p2 / r), C(r)], lambdaTilde: [C(p1 / r, p2 / r), C(r)] }
}

/** p^μ from a bispinor: p0 = (P00+P11)/2, p3 = (P00−P11)/2, p1 = (P01+P10)/2, p2 = (P10−P01)/(2i). */
export function momentumOfBispinor(P: Bispinor<Complex>): [Complex, Complex, Complex, Complex] {
  const half = 0.5
  return [
    P[0][0].add(P[1][1]).mul(half),
    P[0][1].add(P[1][0]).mul(half),
    P[1][0].sub(P[0][1]).div(C(0, 2)),
    P[0][0].sub(P[1][1]).mul(half),
  ]
}

/**
 * Restores exact momentum conservation by solving λ_a λ̃_aᵀ + λ_b λ̃_bᵀ = −Σ_{k≠a,b} λ_k λ̃_kᵀ for
 * the square spinors of the last two legs a = n−2, b = n−1 (0-based), column by column.
 */
export function solveLastTwo<T>(F: Field<T>, k: Kin<T>): Kin<T> {
  const n = k.lambda.length
  const a = n - 2
  const b = n - 1
  const rest = Array.from({ length: n - 2 }, (_, i) => i)
  const Q = momentumSum(F, k, rest)
  const la = k.lambda[a]!
  const lb = k.lambda[b]!
  const D = angleOf(F, la, lb)
  const what = `⟨${a + 1} ${b + 1}⟩ (legs ${a + 1} and ${b + 1} are collinear)`
  const x: T[] = []
  const y: T[] = []
  for (const c of [0, 1]) {
    // la[0] x + lb[0] y = −Q0c ; la[1] x + lb[1] y = −Q1c
    x.push(F.div(F.sub(F.mul(Q[1][c]!, lb[0]), F.mul(Q[0][c]!, lb[1])), D, what))
    y.push(F.div(F.sub(F.mul(Q[0][c]!, la[1]), F.mul(Q[1][c]!, la[0])), D, what))
  }
  const lambdaTilde = k.lambdaTilde.slice()
  lambdaTilde[a] = [x[0]!, x[1]!]
  lambdaTilde[b] = [y[0]!, y[1]!]
  return { lambda: k.lambda.slice(), lambdaTilde }
}

/** min |s_S| over pairs and consecutive sets, divided by max |s_ij|. */
export function conditionRatio<T>(F: Field<T>, k: Kin<T>): number {
  // Remembered points are asked again by every evaluation at them (a point's numbers fix its field).
  let r = conditionRatios.get(k)
  if (r === undefined) conditionRatios.set(k, (r = computeConditionRatio(F, k)))
  return r
}
const conditionRatios = new WeakMap<object, number>()

function computeConditionRatio<T>(F: Field<T>, k: Kin<T>): number {
  // All pairs and the cyclically consecutive sets of 3..n−3 legs (one of each complementary pair
  // suffices), each summed leg by leg from zero as momentumSum does (so the same numbers), but every
  // leg's momentum formed once and a consecutive set grown from the one a leg shorter.
  const n = k.lambda.length
  const p = k.lambda.map((l, i) => outer(F, l, k.lambdaTilde[i]!))
  const zero = bispinorZero(F)
  let maxPair = 0
  let min = Infinity
  for (let i = 0; i < n; i++) {
    const Pi = bispinorAdd(F, zero, p[i]!)
    for (let j = i + 1; j < n; j++) {
      const s = F.abs(det(F, bispinorAdd(F, Pi, p[j]!)))
      maxPair = Math.max(maxPair, s)
      min = Math.min(min, s)
    }
  }
  if (n >= 6) {
    for (let a = 0; a < n; a++) {
      let P = bispinorAdd(F, bispinorAdd(F, bispinorAdd(F, zero, p[a]!), p[(a + 1) % n]!), p[(a + 2) % n]!)
      for (let m = 3; m <= n - 3; m++) {
        if (m > 3) P = bispinorAdd(F, P, p[(a + m - 1) % n]!)
        min = Math.min(min, F.abs(det(F, P)))
      }
    }
  }
  return maxPair === 0 ? 0 : min / maxPair
}

type Rng = () => number
const rngOf = (seed: number | string): Rng => seedrandom(`polewright:${String(seed)}`)

function drawUntilConditioned<T>(F: Field<T>, n: number, draw: () => Kin<T>, seed: number | string): Kin<T> {
  for (let attempt = 0; attempt < 10000; attempt++) {
    let k: Kin<T>
    try {
      k = solveLastTwo(F, draw())
    }
    catch {
      continue
    }
    if (conditionRatio(F, k) >= CONDITION_THRESHOLD) return k
  }
  throw new PhysicsError('kinematics.seed', `no well-conditioned point found for seed ${String(seed)} at n = ${n}`)
}

/** A seeded complex point: λ for every leg and λ̃ for n−2 legs drawn, the last two λ̃ solved. */
export function randomPoint(n: number, seed: number | string): Kin<Complex> {
  return remembered(`random:${n}:${String(seed)}`, () => drawRandomPoint(n, seed))
}

function drawRandomPoint(n: number, seed: number | string): Kin<Complex> {
  const rng = rngOf(seed)
  const u = () => C(2 * rng() - 1, 2 * rng() - 1)
  const draw = (): Kin<Complex> => ({
    lambda: Array.from({ length: n }, () => [u(), u()] as Spinor<Complex>),
    lambdaTilde: Array.from({ length: n }, (_, i) => (i < n - 2 ? [u(), u()] : [C(0), C(0)]) as Spinor<Complex>),
  })
  return drawUntilConditioned(complexField, n, draw, seed)
}

/**
 * A seeded exact point: real rationals p/q (|p| ≤ 20, 1 ≤ q ≤ 6), split signature, last two λ̃
 * solved. With |p| ≤ 9, q ≤ 4 about 3 in 1000 (point, shift) pairs at n = 6, 7 met an exact
 * spurious zero of some BCFW term; with this range none of 10 800 did (measured). A smaller
 * `range` gives smaller numbers (faster exact arithmetic) where a retry is cheap.
 */
export function rationalPoint(n: number, seed: number | string, range: { numerator: number; denominator: number } = { numerator: 20, denominator: 6 }): Kin<Fraction> {
  return remembered(`rational:${n}:${range.numerator}:${range.denominator}:${String(seed)}`, () => drawRationalPoint(n, seed, range))
}

// Seeded points are deterministic and cost more than a small evaluation (conditioning checks
// every channel; exactly, for rational points), so the last few hundred are remembered. Callers
// copy before changing a point (solveLastTwo, the shifts), and numbers are immutable.
const points = new Map<string, Kin<unknown>>()
function remembered<T>(key: string, draw: () => Kin<T>): Kin<T> {
  let k = points.get(key) as Kin<T> | undefined
  if (k) {
    points.delete(key)
    points.set(key, k)
    return k
  }
  k = draw()
  if (points.size >= 256) points.delete(points.keys().next().value!)
  points.set(key, k)
  return k
}

function drawRationalPoint(n: number, seed: number | string, range: { numerator: number; denominator: number }): Kin<Fraction> {
  const rng = rngOf(`rational:${String(seed)}`)
  const { numerator: pm, denominator: qm } = range
  const r = () => new Fraction(Math.floor(rng() * (2 * pm + 1)) - pm, 1 + Math.floor(rng() * qm))
  const draw = (): Kin<Fraction> => ({
    lambda: Array.from({ length: n }, () => [r(), r()] as Spinor<Fraction>),
    lambdaTilde: Array.from({ length: n }, (_, i) => (i < n - 2 ? [r(), r()] : [new Fraction(0), new Fraction(0)]) as Spinor<Fraction>),
  })
  return drawUntilConditioned(rationalField, n, draw, seed)
}

/**
 * n − 2 massless outgoing momenta of total (√s, 0, 0, 0) by RAMBO (Kleiss, Stirling, Ellis,
 * Comput. Phys. Commun. 40 (1986) 359), uniform in phase space.
 */
export function rambo(m: number, energy: number, rng: Rng): Momentum[] {
  const q: Momentum[] = []
  for (let i = 0; i < m; i++) {
    const c = 2 * rng() - 1
    const s = Math.sqrt(1 - c * c)
    const f = 2 * Math.PI * rng()
    const e = -Math.log(rng() * rng() || Number.MIN_VALUE)
    q.push([e, e * s * Math.cos(f), e * s * Math.sin(f), e * c])
  }
  const Q = q.reduce((a, v) => [a[0] + v[0], a[1] + v[1], a[2] + v[2], a[3] + v[3]] as Momentum, [0, 0, 0, 0] as Momentum)
  const M = Math.sqrt(Q[0] * Q[0] - Q[1] * Q[1] - Q[2] * Q[2] - Q[3] * Q[3])
  const b = [-Q[1] / M, -Q[2] / M, -Q[3] / M]
  const x = energy / M
  const g = Q[0] / M
  const a = 1 / (1 + g)
  return q.map((v) => {
    const bq = b[0]! * v[1] + b[1]! * v[2] + b[2]! * v[3]
    return [
      x * (g * v[0] + bq),
      x * (v[1] + b[0]! * v[0] + a * bq * b[0]!),
      x * (v[2] + b[1]! * v[0] + a * bq * b[1]!),
      x * (v[3] + b[2]! * v[0] + a * bq * b[2]!),
    ] as Momentum
  })
}

/** The momenta of a physical point: legs 1, 2 incoming along ±z with √s = energy, crossed to outgoing. */
export function physicalMomenta(n: number, seed: number | string, energy = 1, attempt = 0): Momentum[] {
  const rng = rngOf(`physical:${String(seed)}:${attempt}`)
  const half = energy / 2
  return [[-half, 0, 0, -half], [-half, 0, 0, half], ...rambo(n - 2, energy, rng)]
}

/** A seeded physical point (RAMBO), redrawn until well-conditioned. */
export function physicalPoint(n: number, seed: number | string, energy = 1): Kin<Complex> {
  if (!(energy > 0)) throw new PhysicsError('kinematics.energy', `the energy must be positive, got ${energy}`)
  return remembered(`physical:${n}:${energy}:${String(seed)}`, () => drawPhysicalPoint(n, seed, energy))
}

function drawPhysicalPoint(n: number, seed: number | string, energy: number): Kin<Complex> {
  for (let attempt = 0; attempt < 10000; attempt++) {
    const k = solveLastTwo(complexField, kinOfMomenta(physicalMomenta(n, seed, energy, attempt)))
    if (conditionRatio(complexField, k) >= CONDITION_THRESHOLD) return k
  }
  throw new PhysicsError('kinematics.seed', `no well-conditioned physical point found for seed ${String(seed)} at n = ${n}`)
}

function kinOfMomenta(ps: Momentum[]): Kin<Complex> {
  const s = ps.map(spinorsOfMomentum)
  return { lambda: s.map((x) => x.lambda), lambdaTilde: s.map((x) => x.lambdaTilde) }
}

export interface BuiltPoint<T> {
  kin: Kin<T>
  warnings: string[]
}

function restoreWithWarning(k: Kin<Complex>): BuiltPoint<Complex> {
  const n = k.lambda.length
  let fixed: Kin<Complex>
  try {
    fixed = solveLastTwo(complexField, k)
  }
  catch {
    throw new PhysicsError('kinematics', `legs ${n - 1} and ${n} are collinear (⟨${n - 1} ${n}⟩ = 0), so momentum conservation cannot be restored`)
  }
  let change = 0
  let size = 0
  for (const i of [n - 2, n - 1]) {
    for (const c of [0, 1]) {
      change = Math.max(change, fixed.lambdaTilde[i]![c]!.sub(k.lambdaTilde[i]![c]!).abs())
      size = Math.max(size, k.lambdaTilde[i]![c]!.abs())
    }
  }
  return {
    kin: fixed,
    warnings: [`kinematics: exact momentum conservation restored by re-solving the square spinors of legs ${n - 1} and ${n} (relative change ${fmtSize(size ? change / size : change)})`],
  }
}

function frob(P: Bispinor<Complex>): number {
  return Math.sqrt(P[0][0].abs() ** 2 + P[0][1].abs() ** 2 + P[1][0].abs() ** 2 + P[1][1].abs() ** 2)
}

/** Given real momenta (all outgoing): validated to 1e-8 of the largest energy, then made exactly conserving. */
export function pointFromMomenta(momenta: Momentum[]): BuiltPoint<Complex> {
  const scale = Math.max(0, ...momenta.map((p) => Math.abs(p[0])))
  if (scale === 0) throw new PhysicsError('kinematics', 'every momentum is zero')
  momenta.forEach((p, i) => {
    if (p[0] === 0) throw new PhysicsError('kinematics', `leg ${i + 1} has zero energy`)
    const m2 = p[0] * p[0] - p[1] * p[1] - p[2] * p[2] - p[3] * p[3]
    if (Math.abs(m2) > INPUT_TOLERANCE * scale * scale) throw new PhysicsError('kinematics', `leg ${i + 1} is not massless: p² = ${fmtSize(m2)}`)
  })
  const sum = [0, 1, 2, 3].map((m) => momenta.reduce((a, p) => a + p[m]!, 0))
  const viol = Math.hypot(...sum) / scale
  if (viol > INPUT_TOLERANCE) throw new PhysicsError('kinematics', `momentum is not conserved: |Σp| = ${fmtSize(viol)} relative to the largest energy`)
  return restoreWithWarning(kinOfMomenta(momenta))
}

/** Given complex spinors: lengths checked, conservation to 1e-8 of the largest |p|, then restored. */
export function pointFromSpinors(lambda: Spinor<Complex>[], lambdaTilde: Spinor<Complex>[]): BuiltPoint<Complex> {
  const k: Kin<Complex> = { lambda, lambdaTilde }
  const n = lambda.length
  const all = Array.from({ length: n }, (_, i) => i)
  const scale = Math.max(...all.map((i) => frob(momentumSum(complexField, k, [i]))))
  if (!(scale > 0)) throw new PhysicsError('kinematics', 'every momentum is zero')
  const viol = frob(momentumSum(complexField, k, all)) / scale
  if (viol > INPUT_TOLERANCE) throw new PhysicsError('kinematics', `momentum is not conserved: |Σp| = ${fmtSize(viol)} relative to the largest momentum`)
  return restoreWithWarning(k)
}

/** Given exact real spinors ("p/q" strings): conservation must hold exactly. */
export function pointFromExactSpinors(lambda: string[][], lambdaTilde: string[][]): BuiltPoint<Fraction> {
  const parse = (name: string) => (s: string[], i: number) =>
    s.map((x, c) => {
      try {
        return parseRational(x)
      }
      catch {
        throw new PhysicsError(`kinematics.${name}[${i}][${c}]`, `"${x}" is not an integer or p/q`)
      }
    }) as Spinor<Fraction>
  const k: Kin<Fraction> = { lambda: lambda.map(parse('lambda')), lambdaTilde: lambdaTilde.map(parse('lambdaTilde')) }
  const n = k.lambda.length
  const P = momentumSum(rationalField, k, Array.from({ length: n }, (_, i) => i))
  const off = Math.max(...P.flat().map((x) => rationalField.abs(x)))
  if (off !== 0 || P.flat().some((x) => !rationalField.isZero(x))) {
    const scale = Math.max(...Array.from({ length: n }, (_, i) => Math.max(...momentumSum(rationalField, k, [i]).flat().map((x) => rationalField.abs(x)))))
    throw new PhysicsError('kinematics', `momentum is not conserved exactly: |ΣP| = ${fmtSize(scale ? off / scale : off)} relative to the largest momentum`)
  }
  return { kin: k, warnings: [] }
}

/** An exact point as complex doubles. */
export function toFloatKin(k: Kin<Fraction>): Kin<Complex> {
  const f = (s: Spinor<Fraction>): Spinor<Complex> => [C(s[0].valueOf()), C(s[1].valueOf())]
  return { lambda: k.lambda.map(f), lambdaTilde: k.lambdaTilde.map(f) }
}

/** The point in the API's `spinors` (float) or `exact-spinors` (exact, real) format. */
export function kinToWire<T>(F: Field<T>, k: Kin<T>): { lambda: unknown[]; lambdaTilde: unknown[] } {
  if (F.kind === 'float') {
    const f = (s: Spinor<T>) => s.map((x) => F.toWire(x))
    return { lambda: k.lambda.map(f), lambdaTilde: k.lambdaTilde.map(f) }
  }
  const f = (s: Spinor<T>) => s.map((x) => F.toWire(x)[0])
  return { lambda: k.lambda.map(f), lambdaTilde: k.lambdaTilde.map(f) }
}

/**
 * The point in complex double-double (≈ 32 digits), made exactly conserving there by re-solving
 * the last two λ̃ (a move of rounding size). BCFW terms of gravitons and of the cubic scalar
 * cancel strongly at some real points (measured in doubles at split-signature points: relative
 * errors up to 0.9 for 6 gravitons, 5e-6 for 8 scalars, where double-double gives ~1e-15), so
 * float evaluations of every theory but gluons (≤ 1e-11 measured) run in it.
 */
export function toDoubleDouble(k: Kin<Complex>): Kin<DD> {
  const f = (s: Spinor<Complex>): Spinor<DD> => [ddOf(s[0].re, s[0].im), ddOf(s[1].re, s[1].im)]
  const kd: Kin<DD> = { lambda: k.lambda.map(f), lambdaTilde: k.lambdaTilde.map(f) }
  const n = kd.lambda.length
  return ddField.isZero(angleOf(ddField, kd.lambda[n - 2]!, kd.lambda[n - 1]!)) ? kd : solveLastTwo(ddField, kd)
}

/** A double-double rounded to a complex double. */
export function fromDoubleDouble(v: DD): Complex {
  return new Complex(v.rh + v.rl, v.ih + v.il)
}
