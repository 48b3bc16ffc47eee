// Berends–Giele recursion with any number of massless quark lines of different flavours
// (Berends & Giele, Nucl. Phys. B306 (1988) 759), independent of BCFW: colour-ordered Feynman
// rules over intervals of the colour order. An interval's current is a gluon current when its quark
// lines are complete, a fermion current when exactly one line end is open, and absent otherwise.
// Vertices as in quark-line.ts (docs/conventions.md "Quarks"): the quark–gluon vertex (1/√2)γ^μ
// with sign +1 when the gluon sits between q̄ and q in the cyclic order at the vertex, −1 between q
// and q̄; quark propagator p̸/p² with p the momentum along the fermion arrow (from the q̄ end to the q end); gluon vertices of
// berends-giele.ts; a gluon emitted by a quark pair is (1/√2)·sign·⟨u|γ^μ|v]/P².
// Every line is written as one chain ⟨m| … |p] from its end m of helicity −½ to its end p of +½
// (whichever of q, q̄ they are), so a fermion current is an angle bra grown from m or a square ket
// grown from p. Currents are rescaled like the gluon ones (J′ = J/√2), so exact mode stays rational.
import type { Field } from '../field'
import type { Kin, Spinor } from '../spinors'
import { PhysicsError } from '../errors'
import { GLUON_PDG } from '../quarks'
import { polarizations, tdot, withDoubleDouble, type BerendsGieleOptions, type Quad } from './berends-giele'
import { checkTargetPoint } from './parke-taylor'

/**
 * The sign of each line relative to its Feynman chain: −1 when q̄ has helicity −½. It makes one
 * line agree with quark-line.ts, whose values do not change when q and q̄ trade places (swapping
 * them flips every vertex and propagator sign of the chain); several lines take the product of
 * these signs (docs/conventions.md "Two quark lines").
 */
export function lineSign(helicities: readonly number[], lines: readonly [number, number][]): number {
  let s = 1
  for (const [bar] of lines) if (helicities[bar]! < 0) s = -s
  return s
}

/** The quark lines of a leg list (PDG codes) as [q̄, q] positions; null when a flavour is unpaired or repeated. */
export function quarkLines(pdg: readonly number[]): [number, number][] | null {
  const pos = new Map<number, number>()
  for (let t = 0; t < pdg.length; t++) {
    const c = pdg[t]!
    if (c === GLUON_PDG) continue
    if (pos.has(c)) return null
    pos.set(c, t)
  }
  const out: [number, number][] = []
  for (const [c, t] of pos) {
    if (!pos.has(-c)) return null
    if (c < 0) out.push([t, pos.get(-c)!])
  }
  return out
}

interface GluonCur<T> { g: true; J: Quad<T>; pj: T }
/** A fermion current grown from the line end `end` (rotated position): an angle bra (left) or a square ket. */
interface FermionCur<T> { g: false; end: number; left: boolean; s: Spinor<T> }
type Cur<T> = GluonCur<T> | FermionCur<T>

/**
 * The colour-ordered amplitude with quark lines of different flavours (each flavour once as q
 * and once as q̄) and gluons, legs in the given cyclic order; helicities ±1 for gluons, ±1/2 on
 * quark legs. `closeOn`: the line whose q closes the recursion (any gives the same value; tests).
 */
export function quarkLinesBerendsGiele<T>(F: Field<T>, k: Kin<T>, helicities: number[], pdg: readonly number[], opts?: BerendsGieleOptions & { closeOn?: number }): T {
  const n = helicities.length
  checkTargetPoint(k, n, 'Berends–Giele with quark lines')
  const lines = quarkLines(pdg)
  if (!lines || lines.length === 0) throw new PhysicsError('species', 'the quark-lines Berends–Giele target takes quark lines of different flavours (each q_f with its qbar_f)')
  for (const [a, b] of lines) if (helicities[a] === helicities[b]) return F.zero
  return withDoubleDouble(F, k, opts?.precision, (G, kk) => {
    const v = linesRecursion(G, kk, helicities, pdg, lines[opts?.closeOn ?? 0]![1], opts)
    return lineSign(helicities, lines) > 0 ? v : G.neg(v)
  })
}

function linesRecursion<T>(F: Field<T>, k: Kin<T>, helicities: number[], pdg: readonly number[], closing: number, opts?: BerendsGieleOptions): T {
  const n = helicities.length
  const Z = F.zero
  const two = F.fromInt(2)
  // Rotate so the closing q is last; every interval lies in positions 0..m−1.
  const order = Array.from({ length: n }, (_, t) => (closing + 1 + t) % n)
  const m = n - 1
  const lam = order.map((t) => k.lambda[t]!)
  const lamT = order.map((t) => k.lambdaTilde[t]!)
  const code = order.map((t) => pdg[t]!)
  const hel = order.map((t) => helicities[t]!)
  const partner = code.map((c) => (c === GLUON_PDG ? -1 : code.indexOf(-c)))
  const gl = code.map((c, t) => (c === GLUON_PDG ? t : -1)).filter((t) => t >= 0)
  const epsList = gl.length ? polarizations(F, { lambda: gl.map((t) => lam[t]!), lambdaTilde: gl.map((t) => lamT[t]!) }, gl.map((t) => hel[t]!), opts) : []
  const eps = new Map(gl.map((t, x) => [t, epsList[x]!]))

  const mom: Quad<T>[] = new Array(m * m)
  const cur: (Cur<T> | null)[] = new Array(m * m).fill(null)
  for (let a = 0; a < m; a++) {
    const p: Quad<T> = [F.mul(lam[a]![0], lamT[a]![0]), F.mul(lam[a]![0], lamT[a]![1]), F.mul(lam[a]![1], lamT[a]![0]), F.mul(lam[a]![1], lamT[a]![1])]
    mom[a * m + a] = p
    for (let b = a + 1; b < m; b++) {
      const q = mom[a * m + b - 1]!
      mom[a * m + b] = [F.add(q[0], F.mul(lam[b]![0], lamT[b]![0])), F.add(q[1], F.mul(lam[b]![0], lamT[b]![1])), F.add(q[2], F.mul(lam[b]![1], lamT[b]![0])), F.add(q[3], F.mul(lam[b]![1], lamT[b]![1]))]
    }
    if (code[a] === GLUON_PDG) cur[a * m + a] = { g: true, J: eps.get(a)!, pj: tdot(F, p, eps.get(a)!) }
    else cur[a * m + a] = { g: false, end: a, left: hel[a]! < 0, s: hel[a]! < 0 ? lam[a]! : lamT[a]! }
  }
  // The open line ends of an interval: −1 none, −2 more than one, else the open end.
  const openEnd = (a: number, b: number): number => {
    let e = -1
    for (let t = a; t <= b; t++) {
      const u = partner[t]!
      if (u < 0 || (u >= a && u <= b)) continue
      if (e >= 0) return -2
      e = t
    }
    return e
  }
  // vertex of a gluon current M on a fermion current: bra ⟨r|M → [r'|, ket M|c] → |a⟩
  const vertex = (f: { left: boolean; s: Spinor<T> }, M: Quad<T>): Spinor<T> => {
    const [s0, s1] = f.s
    return f.left
      ? [F.sub(F.mul(s0, M[2]), F.mul(s1, M[0])), F.sub(F.mul(s0, M[3]), F.mul(s1, M[1]))]
      : [F.sub(F.mul(M[1], s0), F.mul(M[0], s1)), F.sub(F.mul(M[3], s0), F.mul(M[2], s1))]
  }
  // propagator P on a vertex sum: [r'|P → ⟨r''|, P|a⟩ → |b]
  const propagate = (left: boolean, s: Spinor<T>, P: Quad<T>): Spinor<T> =>
    left
      ? [F.sub(F.mul(s[1], P[0]), F.mul(s[0], P[1])), F.sub(F.mul(s[1], P[2]), F.mul(s[0], P[3]))]
      : [F.sub(F.mul(P[0], s[1]), F.mul(P[2], s[0])), F.sub(F.mul(P[1], s[1]), F.mul(P[3], s[0]))]

  let top: Spinor<T> | null = null
  for (let len = 2; len <= m; len++) {
    for (let a = 0; a + len - 1 < m; a++) {
      const b = a + len - 1
      const e = openEnd(a, b)
      if (e === -2) continue
      const P = mom[a * m + b]!
      if (e >= 0) {
        // fermion current of the open end e: a gluon current attached on either side
        const left = hel[e]! < 0
        const fromBar = code[e]! < 0
        let S: Spinor<T> = [Z, Z]
        let any = false
        for (let c = a; c < b; c++) {
          const L = cur[a * m + c]
          const R = cur[(c + 1) * m + b]
          if (!L || !R || L.g === R.g) continue
          const f = (L.g ? R : L) as FermionCur<T>
          const g = (L.g ? L : R) as GluonCur<T>
          if (f.end !== e) continue
          // +1 for a gluon between q̄ and q in the cyclic order at the vertex
          const sign = (R.g ? 1 : -1) * (fromBar ? 1 : -1)
          const v = vertex(f, g.J)
          S = sign > 0 ? [F.add(S[0], v[0]), F.add(S[1], v[1])] : [F.sub(S[0], v[0]), F.sub(S[1], v[1])]
          any = true
        }
        if (!any) continue
        if (len === m) {
          top = S
          break
        }
        const p2 = F.sub(F.mul(P[0], P[3]), F.mul(P[1], P[2]))
        // p̸ along the fermion arrow (from q̄ to q): −P of the interval when it holds q̄, +P otherwise
        const sgn = fromBar ? -1 : 1
        const inv = F.div(sgn > 0 ? F.one : F.neg(F.one), p2, `the quark propagator of legs ${order[a]! + 1}..${order[b]! + 1} vanishes`)
        const v = propagate(left, S, P)
        cur[a * m + b] = { g: false, end: e, left, s: [F.mul(v[0], inv), F.mul(v[1], inv)] }
        continue
      }
      // gluon current: three- and four-gluon vertices, and quark pairs of one line
      const S: Quad<T> = [Z, Z, Z, Z]
      let any = false
      for (let c = a; c < b; c++) {
        const L = cur[a * m + c]
        const R = cur[(c + 1) * m + b]
        if (!L || !R) continue
        if (L.g && R.g) {
          const PL = mom[a * m + c]!, PR = mom[(c + 1) * m + b]!
          const t = tdot(F, L.J, R.J)
          const cR = F.add(L.pj, F.mul(two, tdot(F, PR, L.J)))
          const cL = F.neg(F.add(F.mul(two, tdot(F, PL, R.J)), R.pj))
          for (let x = 0; x < 4; x++) S[x] = F.add(S[x]!, F.add(F.mul(t, F.sub(PL[x]!, PR[x]!)), F.add(F.mul(cR, R.J[x]!), F.mul(cL, L.J[x]!))))
          any = true
        }
        else if (!L.g && !R.g) {
          // ⟨r|γ^μ|c] as 2 r⊗c; sign −1 when the left part holds q̄ (gluon between q and q̄)
          const [r, col] = L.left ? [L.s, R.s] : [R.s, L.s]
          const sign = code[L.end]! < 0 ? -1 : 1
          const w: Quad<T> = [F.mul(r[0], col[0]), F.mul(r[0], col[1]), F.mul(r[1], col[0]), F.mul(r[1], col[1])]
          for (let x = 0; x < 4; x++) S[x] = sign > 0 ? F.add(S[x]!, F.mul(two, w[x]!)) : F.sub(S[x]!, F.mul(two, w[x]!))
          any = true
        }
      }
      for (let c1 = a; c1 <= b - 2; c1++) for (let c2 = c1 + 1; c2 <= b - 1; c2++) {
        const J1 = cur[a * m + c1], J2 = cur[(c1 + 1) * m + c2], J3 = cur[(c2 + 1) * m + b]
        if (!J1?.g || !J2?.g || !J3?.g) continue
        // V4″ = 2 J2 t13 − J1 t23 − J3 t12
        const t13 = tdot(F, J1.J, J3.J), t23 = tdot(F, J2.J, J3.J), t12 = tdot(F, J1.J, J2.J)
        for (let x = 0; x < 4; x++) S[x] = F.sub(F.add(S[x]!, F.mul(F.add(t13, t13), J2.J[x]!)), F.add(F.mul(t23, J1.J[x]!), F.mul(t12, J3.J[x]!)))
        any = true
      }
      if (!any) continue
      const p2 = F.sub(F.mul(P[0], P[3]), F.mul(P[1], P[2]))
      const inv = F.div(F.one, F.add(p2, p2), `the propagator of legs ${order[a]! + 1}..${order[b]! + 1} vanishes`)
      const J: Quad<T> = [F.mul(S[0], inv), F.mul(S[1], inv), F.mul(S[2], inv), F.mul(S[3], inv)]
      cur[a * m + b] = { g: true, J, pj: tdot(F, P, J) }
    }
  }
  if (!top) return Z
  // close with the last leg q: [S p] for a bra (q⁺), ⟨m S⟩ for a ket (q⁻)
  return hel[m]! > 0
    ? F.sub(F.mul(top[1], lamT[m]![0]), F.mul(top[0], lamT[m]![1]))
    : F.sub(F.mul(lam[m]![0], top[1]), F.mul(lam[m]![1], top[0]))
}
