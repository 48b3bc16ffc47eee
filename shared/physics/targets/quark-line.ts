// Berends–Giele recursion with one massless quark line (Berends & Giele, Nucl. Phys. B306 (1988)
// 759), independent of BCFW: colour-ordered Feynman rules, the quark–gluon vertex (1/√2)γ^μ with
// sign +1 for a gluon between q̄ and q in the colour order and −1 for one between q and q̄, the
// quark propagator p̸/p², gluon currents from berends-giele.ts (docs/conventions.md "Quarks").
// In two-component form a line is a chain of bispinors between the external spinors: with the
// rescaled gluon currents J′ = J/√2 the vertex is just J′ (the √2 cancels, exact mode stays rational).
//   q̄⁺ … q⁻:  ⟨q| J′ P J′ … J′ |q̄]      q̄⁻ … q⁺:  [q| J′ P J′ … J′ |q̄⟩
import type { Field } from '../field'
import type { Kin, Spinor } from '../spinors'
import { PhysicsError } from '../errors'
import { GLUON_PDG } from '../quarks'
import { gluonCurrents, polarizations, withDoubleDouble, type BerendsGieleOptions, type Quad } from './berends-giele'
import { checkTargetPoint } from './parke-taylor'

/** ⟨x|M| as a square spinor s with [s y] = ⟨x|M|y] (M as [M00, M01, M10, M11]). */
function angleThrough<T>(F: Field<T>, M: Quad<T>, x: Spinor<T>): Spinor<T> {
  return [F.sub(F.mul(M[2], x[0]), F.mul(M[0], x[1])), F.sub(F.mul(M[3], x[0]), F.mul(M[1], x[1]))]
}

/** M|y] as an angle spinor a with ⟨x a⟩ = ⟨x|M|y]. */
function squareThrough<T>(F: Field<T>, M: Quad<T>, y: Spinor<T>): Spinor<T> {
  return [F.sub(F.mul(y[0], M[1]), F.mul(y[1], M[0])), F.sub(F.mul(y[0], M[3]), F.mul(y[1], M[2]))]
}

/**
 * Sign of the quark propagator relative to the gluon one, fixed by gauge invariance (the
 * amplitude must not depend on the reference spinors; "gauge invariance" in
 * physics/quarks-berends-giele.test.ts).
 */
export const QUARK_PROPAGATOR_SIGN = 1

/** The one quark line of a leg list (PDG codes), as positions [q̄, q]; null when none or more. */
export function quarkLine(pdg: readonly number[]): [number, number] | null {
  // a loop, no arrays: the engine asks this of every quark sub-amplitude
  let bar = -1
  let q = -1
  for (let t = 0; t < pdg.length; t++) {
    const c = pdg[t]!
    if (c === GLUON_PDG) continue
    if (c < 0 && bar < 0) bar = t
    else if (c > 0 && q < 0) q = t
    else return null
  }
  return bar >= 0 && q >= 0 && pdg[bar] === -pdg[q]! ? [bar, q] : null
}

/**
 * The colour-ordered amplitude A(1..n) with one quark line (legs in the given cyclic order,
 * helicities ±1 for gluons and ±1/2 for the quark line), by the off-shell recursion.
 */
export function quarkLineBerendsGiele<T>(F: Field<T>, k: Kin<T>, helicities: number[], pdg: readonly number[], opts?: BerendsGieleOptions): T {
  const n = helicities.length
  checkTargetPoint(k, n, 'Berends–Giele with a quark line')
  const line = quarkLine(pdg)
  if (!line) throw new PhysicsError('species', 'the quark-line Berends–Giele target takes exactly one quark line (q_f and qbar_f)')
  const [a, b] = line
  if (helicities[a] === helicities[b]) return F.zero
  return withDoubleDouble(F, k, opts?.precision, (G, kk) => lineRecursion(G, kk, helicities, a, b, opts))
}

function lineRecursion<T>(F: Field<T>, k: Kin<T>, helicities: number[], qbar: number, q: number, opts?: BerendsGieleOptions): T {
  const n = helicities.length
  // Rotate so q is last: order[t] is the original leg at rotated position t.
  const order = Array.from({ length: n }, (_, t) => (q + 1 + t) % n)
  const aPos = order.indexOf(qbar)
  const lam = order.map((t) => k.lambda[t]!)
  const lamT = order.map((t) => k.lambdaTilde[t]!)
  // Gluons before q̄ (between q and q̄: vertex sign −1) and after it (between q̄ and q: +1).
  const gl = Array.from({ length: aPos }, (_, t) => t)
  const gr = Array.from({ length: n - 2 - aPos }, (_, t) => aPos + 1 + t)
  const gluons = [...gl, ...gr]
  const eps = gluons.length ? polarizations(F, { lambda: gluons.map((t) => lam[t]!), lambdaTilde: gluons.map((t) => lamT[t]!) }, gluons.map((t) => helicities[order[t]!]!), opts) : []
  const sub = (ids: number[], e: Quad<T>[]) =>
    ids.length ? gluonCurrents(F, { lambda: ids.map((t) => lam[t]!), lambdaTilde: ids.map((t) => lamT[t]!) }, e, ids.length) : null
  const left = sub(gl, eps.slice(0, gl.length))
  const right = sub(gr, eps.slice(gl.length))
  const mL = gl.length
  const mR = gr.length
  // J′ of gluons c..e (rotated positions, one side of q̄)
  const J = (c: number, e: number): Quad<T> => (e < aPos ? left!.cur[c * mL + e]! : right!.cur[(c - aPos - 1) * mR + (e - aPos - 1)]!)
  const chainOne = helicities[qbar]! > 0 // q̄⁺: start from |q̄], vertices map square → angle
  const vertex = (M: Quad<T>, s: Spinor<T>) => (chainOne ? squareThrough(F, M, s) : angleThrough(F, M, s))
  const propagate = (M: Quad<T>, s: Spinor<T>) => (chainOne ? angleThrough(F, M, s) : squareThrough(F, M, s))
  const momentum: Quad<T>[] = lam.map((l, t) => [F.mul(l[0], lamT[t]![0]), F.mul(l[0], lamT[t]![1]), F.mul(l[1], lamT[t]![0]), F.mul(l[1], lamT[t]![1])])
  const last = n - 2
  // psi[c*n+d]: the propagated line current of legs c..d (c ≤ aPos ≤ d ≤ n−2); open: before the propagator
  const psi = new Map<number, Spinor<T>>()
  psi.set(aPos * n + aPos, chainOne ? lamT[aPos]! : lam[aPos]!)
  let open: Spinor<T> = [F.zero, F.zero]
  for (let len = 2; len <= n - 1; len++) {
    for (let c = Math.max(0, aPos - len + 1); c <= aPos && c + len - 1 <= last; c++) {
      const d = c + len - 1
      let S: Spinor<T> = [F.zero, F.zero]
      const add = (v: Spinor<T>, sign: number) => {
        S = sign > 0 ? [F.add(S[0], v[0]), F.add(S[1], v[1])] : [F.sub(S[0], v[0]), F.sub(S[1], v[1])]
      }
      for (let e = aPos; e < d; e++) add(vertex(J(e + 1, d), psi.get(c * n + e)!), 1)
      for (let e = c; e < aPos; e++) add(vertex(J(c, e), psi.get((e + 1) * n + d)!), -1)
      if (len === n - 1) {
        open = S
        break
      }
      let P: Quad<T> = [F.zero, F.zero, F.zero, F.zero]
      for (let t = c; t <= d; t++) P = [F.add(P[0], momentum[t]![0]), F.add(P[1], momentum[t]![1]), F.add(P[2], momentum[t]![2]), F.add(P[3], momentum[t]![3])]
      const p2 = F.sub(F.mul(P[0], P[3]), F.mul(P[1], P[2]))
      const inv = F.div(QUARK_PROPAGATOR_SIGN > 0 ? F.one : F.neg(F.one), p2, `the quark propagator of legs ${c + 1}..${d + 1} (rotated) vanishes`)
      const v = propagate(P, S)
      psi.set(c * n + d, [F.mul(v[0], inv), F.mul(v[1], inv)])
    }
  }
  // close with q: ⟨q S⟩ for q⁻ (chain one), [q S] for q⁺
  const lq = lam[n - 1]!
  const ltq = lamT[n - 1]!
  return chainOne ? F.sub(F.mul(lq[0], open[1]), F.mul(lq[1], open[0])) : F.sub(F.mul(ltq[1], open[0]), F.mul(ltq[0], open[1]))
}
