// Berends–Giele off-shell recursion for colour-ordered gluon amplitudes (Berends & Giele,
// Nucl. Phys. B306 (1988) 759) with the colour-ordered Feynman vertices of docs/conventions.md:
//   V3 = (1/√2)[(J_P·J_Q)(P−Q) + J_Q ((P+2Q)·J_P) − J_P ((2P+Q)·J_Q)]
//   V4 = J2 (J1·J3) − ½[J1 (J2·J3) + J3 (J1·J2)]
//   J(a..b) = [Σ V3 + Σ V4] / P²_{a..b},  J(k) = ε_k,  A(1..n) = ε_n · [P² J(1..n−1)].
// We carry the rescaled current J′ = J/√2 (CONVENTIONS "Numerical advice") in both arithmetics,
// so no √2 ever appears and exact mode stays rational:
//   ε′⁺(k;q) = λ_q λ̃_kᵀ/⟨qk⟩,  ε′⁻(k;q) = λ_k λ̃_qᵀ/[kq],  V3′ = √2 V3,  V4′ = 2 V4,
//   A = 2 ε′_n · [P² J′(1..n−1)].
// Internally every product is the doubled Minkowski product t(v,w) = 2 v·w, and the sum of
// vertices S = Σ V3″ + Σ V4″ with V3″ = 2 V3′ (in t-form) and V4″ = 2 V4′, so J′ = S / (2P²).
// Currents are 2×2 bispinors stored as [J00, J01, J10, J11]; J(a..b) is memoized in a table over
// intervals, V4's adjacent-pair products are reused, so the cost is O(n⁴) field operations.
import seedrandom from 'seedrandom'
import { Complex, complexField } from '../field'
import { ddField, ddOf, type DD } from '../double-double'
import type { Field } from '../field'
import type { Kin, Spinor } from '../spinors'
import { PhysicsError } from '../errors'
import { checkTargetPoint } from './parke-taylor'
import { angleOf } from '../spinors'
import { solveLastTwo } from '../kinematics'

export type Quad<T> = [T, T, T, T]

export interface BerendsGieleOptions {
  /**
   * Reference spinors of the polarization vectors. Omitted: a leg choice (each + leg takes λ of the
   * first − leg as λ_q, each − leg takes λ̃ of the first + leg as λ̃_q). A number: a seed for
   * integer reference spinors drawn independently for every leg. The amplitude does not depend
   * on the choice; the tests check that.
   */
  reference?: number
  /**
   * Float arithmetic of the recursion. The Feynman-diagram sum cancels strongly where the
   * amplitude is accidentally small (e.g. a small ⟨ij⟩ of the two minus legs): in plain doubles the
   * relative error then reached 3e-6 at n = 12 (measured, DEVELOPERS.md). So with complexField the
   * recursion runs by default in double-double complex arithmetic (≈ 32 digits) and rounds once at
   * the end; 'double' runs it in complexField itself. Exact fields ignore this.
   */
  precision?: 'double' | 'double-double'
}

function checkGluons<T>(k: Kin<T>, helicities: readonly number[]): void {
  const n = helicities.length
  checkTargetPoint(k, n, 'Berends–Giele')
  for (let a = 0; a < n; a++) {
    const h = helicities[a]
    if (h !== 1 && h !== -1) throw new PhysicsError(`helicities[${a}]`, `a gluon has helicity ±1`)
  }
}

// Small integer spinors tried in turn when a leg choice is impossible (all legs of one helicity).
const FALLBACK: ReadonlyArray<[number, number]> = [[1, 2], [2, -1], [1, 3], [3, 1], [1, -3], [2, 5], [5, -2], [1, 7]]

function sqOf<T>(F: Field<T>, a: Spinor<T>, b: Spinor<T>): T {
  return F.sub(F.mul(a[1], b[0]), F.mul(a[0], b[1]))
}
function angOf<T>(F: Field<T>, a: Spinor<T>, b: Spinor<T>): T {
  return F.sub(F.mul(a[0], b[1]), F.mul(a[1], b[0]))
}

// In floats a reference spinor nearly parallel to the leg's (e.g. the leg choice at three-point
// kinematics, where all square brackets vanish) would divide by rounding noise: skip it. Any
// accepted choice gives the same amplitude, so this threshold never changes a result.
function tooSmall<T>(F: Field<T>, bracket: T, q: Spinor<T>, s: Spinor<T>): boolean {
  if (F.kind !== 'float') return false
  const scale = Math.hypot(F.abs(q[0]), F.abs(q[1])) * Math.hypot(F.abs(s[0]), F.abs(s[1]))
  return F.abs(bracket) < 1e-6 * scale
}

/** The rescaled polarizations ε′ of every leg, with the reference spinors of `opts`. */
export function polarizations<T>(F: Field<T>, k: Kin<T>, helicities: readonly number[], opts?: BerendsGieleOptions): Quad<T>[] {
  const n = helicities.length
  const firstMinus = helicities.indexOf(-1)
  const firstPlus = helicities.indexOf(1)
  const rng = opts?.reference !== undefined ? seedrandom(`berends-giele-reference-${opts.reference}`) : null
  const small = (): number => {
    const v = Math.floor(rng!() * 13) - 6
    return v === 0 ? 7 : v
  }
  const eps: Quad<T>[] = []
  for (let a = 0; a < n; a++) {
    const l = k.lambda[a]!
    const lt = k.lambdaTilde[a]!
    const candidates: Array<() => Spinor<T>> = []
    if (rng) {
      for (let tries = 0; tries < 16; tries++) {
        const x = small(), y = small()
        candidates.push(() => [F.fromInt(x), F.fromInt(y)])
      }
    }
    else {
      const other = helicities[a] === 1 ? firstMinus : firstPlus
      if (other >= 0) candidates.push(() => (helicities[a] === 1 ? k.lambda[other]! : k.lambdaTilde[other]!))
    }
    for (const [x, y] of FALLBACK) candidates.push(() => [F.fromInt(x), F.fromInt(y)])
    let done = false
    for (const make of candidates) {
      const q = make()
      if (helicities[a] === 1) {
        const qk = angOf(F, q, l)
        if (F.isZero(qk) || tooSmall(F, qk, q, l)) continue
        eps.push([F.div(F.mul(q[0], lt[0]), qk), F.div(F.mul(q[0], lt[1]), qk), F.div(F.mul(q[1], lt[0]), qk), F.div(F.mul(q[1], lt[1]), qk)])
      }
      else {
        const kq = sqOf(F, lt, q)
        if (F.isZero(kq) || tooSmall(F, kq, q, lt)) continue
        eps.push([F.div(F.mul(l[0], q[0]), kq), F.div(F.mul(l[0], q[1]), kq), F.div(F.mul(l[1], q[0]), kq), F.div(F.mul(l[1], q[1]), kq)])
      }
      done = true
      break
    }
    if (!done) throw new PhysicsError('target', `no reference spinor found for leg ${a + 1}`)
  }
  return eps
}

/** t(v,w) = 2 v·w = V00 W11 + V11 W00 − V01 W10 − V10 W01. */
export function tdot<T>(F: Field<T>, v: Quad<T>, w: Quad<T>): T {
  return F.sub(F.add(F.mul(v[0], w[3]), F.mul(v[3], w[0])), F.add(F.mul(v[1], w[2]), F.mul(v[2], w[1])))
}

/** acc += c·v, in place. */
function axpy<T>(F: Field<T>, acc: Quad<T>, c: T, v: Quad<T>): void {
  acc[0] = F.add(acc[0], F.mul(c, v[0]))
  acc[1] = F.add(acc[1], F.mul(c, v[1]))
  acc[2] = F.add(acc[2], F.mul(c, v[2]))
  acc[3] = F.add(acc[3], F.mul(c, v[3]))
}

/**
 * The colour-ordered tree amplitude A(1..n) of gluons with helicities ±1 (0-based legs in the
 * given order), by Berends–Giele recursion.
 */
export function berendsGiele<T>(F: Field<T>, k: Kin<T>, helicities: number[], opts?: BerendsGieleOptions): T {
  checkGluons(k, helicities)
  return withDoubleDouble(F, k, opts?.precision, (G, kk) => recursion(G, kk, helicities, opts))
}

/**
 * Runs an off-shell recursion in double-double when F is the complex double field (unless
 * 'double' is asked), else in F itself.
 */
export function withDoubleDouble<T>(F: Field<T>, k: Kin<T>, precision: 'double' | 'double-double' | undefined, run: <U>(G: Field<U>, k: Kin<U>) => U): T {
  if ((F as unknown) === complexField && precision !== 'double') {
    const n = k.lambda.length
    // T is Complex here (F is complexField): TypeScript cannot narrow a type parameter by a value.
    const kc = k as unknown as Kin<Complex>
    const toDD = (s: Spinor<Complex>): Spinor<DD> => [ddOf(s[0].re, s[0].im), ddOf(s[1].re, s[1].im)]
    let kd: Kin<DD> = { lambda: kc.lambda.map(toDD), lambdaTilde: kc.lambdaTilde.map(toDD) }
    // Off the momentum-conserving surface the recursion depends on the gauge; double input
    // conserves only to rounding. Re-solving the last two λ̃ in double-double moves the point by
    // rounding size onto the surface (to ~1e-32), as the engine does for given momenta.
    if (!ddField.isZero(angleOf(ddField, kd.lambda[n - 2]!, kd.lambda[n - 1]!))) kd = solveLastTwo(ddField, kd)
    const v = run(ddField, kd)
    return new Complex(v.rh + v.rl, v.ih + v.il) as unknown as T
  }
  return run(F, k)
}

function recursion<T>(F: Field<T>, k: Kin<T>, helicities: number[], opts?: BerendsGieleOptions): T {
  const n = helicities.length
  const eps = polarizations(F, k, helicities, opts)
  const { top } = gluonCurrents(F, k, eps, n - 1, true)
  // A = 2 ε′_n · [P² J′] = 2 ε′_n · (S/2) = t(ε′_n, S)/2.
  return F.div(tdot(F, eps[n - 1]!, top), F.fromInt(2))
}

/**
 * The currents J′ of every interval a..b of the first m legs of k (index a*m+b), from their
 * polarizations; with `openTop` the full interval keeps its vertex sum S (= 2P²J′) undivided,
 * returned as `top`.
 */
export function gluonCurrents<T>(F: Field<T>, k: Kin<T>, eps: readonly Quad<T>[], m: number, openTop = false): { cur: Quad<T>[]; mom: Quad<T>[]; top: Quad<T> } {
  const Z = F.zero
  const two = F.fromInt(2)

  // Momenta of the legs as quads, and of every interval (0-based legs a..b, index a*m+b).
  const mom: Quad<T>[] = new Array(m * m)
  const cur: Quad<T>[] = new Array(m * m)
  const pj: T[] = new Array(m * m) // t(P, J) of each interval
  for (let a = 0; a < m; a++) {
    const l = k.lambda[a]!, lt = k.lambdaTilde[a]!
    const p: Quad<T> = [F.mul(l[0], lt[0]), F.mul(l[0], lt[1]), F.mul(l[1], lt[0]), F.mul(l[1], lt[1])]
    mom[a * m + a] = p
    cur[a * m + a] = eps[a]!
    pj[a * m + a] = tdot(F, p, eps[a]!)
    for (let b = a + 1; b < m; b++) {
      const q = mom[a * m + b - 1]!
      const l2 = k.lambda[b]!, lt2 = k.lambdaTilde[b]!
      mom[a * m + b] = [
        F.add(q[0], F.mul(l2[0], lt2[0])), F.add(q[1], F.mul(l2[0], lt2[1])),
        F.add(q[2], F.mul(l2[1], lt2[0])), F.add(q[3], F.mul(l2[1], lt2[1])),
      ]
    }
  }
  // adj[(a*m + c)*m + b] = t(J(a..c), J(c+1..b)): reused by V4 of every larger interval.
  const adj: T[] = new Array(m * m * m)
  let top: Quad<T> = [Z, Z, Z, Z]

  for (let len = 2; len <= m; len++) {
    for (let a = 0; a + len - 1 < m; a++) {
      const b = a + len - 1
      const S: Quad<T> = [Z, Z, Z, Z]
      // Three-point vertices: split a..c | c+1..b.
      for (let c = a; c < b; c++) {
        const L = a * m + c, R = (c + 1) * m + b
        const JL = cur[L]!, JR = cur[R]!, PL = mom[L]!, PR = mom[R]!
        const t = tdot(F, JL, JR)
        adj[L * m + b] = t
        // V3″ = t (P_L − P_R) + J_R (t(P_L,J_L) + 2 t(P_R,J_L)) − J_L (2 t(P_L,J_R) + t(P_R,J_R))
        const cR = F.add(pj[L]!, F.mul(two, tdot(F, PR, JL)))
        const cL = F.neg(F.add(F.mul(two, tdot(F, PL, JR)), pj[R]!))
        for (let x = 0; x < 4; x++) {
          S[x] = F.add(S[x]!, F.add(F.mul(t, F.sub(PL[x]!, PR[x]!)), F.add(F.mul(cR, JR[x]!), F.mul(cL, JL[x]!))))
        }
      }
      // Four-point vertices: a..c1 | c1+1..c2 | c2+1..b, V4″ = 2 J2 t13 − J1 t23 − J3 t12.
      if (len >= 3) {
        const c3: T[] = new Array(b + 1).fill(Z) // Σ_{c1<c2} t12, per c2
        for (let c1 = a; c1 <= b - 2; c1++) {
          const J1 = cur[a * m + c1]!
          let c1coef = Z
          for (let c2 = c1 + 1; c2 <= b - 1; c2++) {
            const J2 = cur[(c1 + 1) * m + c2]!
            const J3 = cur[(c2 + 1) * m + b]!
            const t13 = tdot(F, J1, J3)
            axpy(F, S, F.add(t13, t13), J2)
            c1coef = F.add(c1coef, adj[((c1 + 1) * m + c2) * m + b]!)
            c3[c2] = F.add(c3[c2]!, adj[(a * m + c1) * m + c2]!)
          }
          axpy(F, S, F.neg(c1coef), J1)
        }
        for (let c2 = a + 1; c2 <= b - 1; c2++) axpy(F, S, F.neg(c3[c2]!), cur[(c2 + 1) * m + b]!)
      }
      if (len === m && openTop) {
        top = S
        break
      }
      // J′ = S / (2 P²)
      const P = mom[a * m + b]!
      const p2 = F.sub(F.mul(P[0], P[3]), F.mul(P[1], P[2]))
      const inv = F.div(F.one, F.add(p2, p2), `the propagator of legs ${a + 1}..${b + 1} vanishes`)
      const J: Quad<T> = [F.mul(S[0], inv), F.mul(S[1], inv), F.mul(S[2], inv), F.mul(S[3], inv)]
      cur[a * m + b] = J
      pj[a * m + b] = tdot(F, P, J)
    }
  }
  return { cur, mom, top }
}
