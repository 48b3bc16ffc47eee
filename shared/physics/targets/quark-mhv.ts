// MHV closed forms with one massless quark line (Mangano & Parke, Phys. Rept. 200 (1991) 301;
// Dixon, hep-ph/9601359), for q̄ at leg a, q at leg b, legs in the given cyclic order:
//   q̄⁻ q⁺, gluon i⁻, other gluons +:  −⟨a i⟩³⟨b i⟩ / (⟨12⟩⟨23⟩…⟨n1⟩)
//   q̄⁺ q⁻, gluon i⁻:                  −⟨b i⟩³⟨a i⟩ / (⟨12⟩…⟨n1⟩)
// and their parity conjugates (one gluon i⁺, the end of + helicity cubed) with [ ] brackets,
// (−1)ⁿ as for Parke–Taylor and no further sign, wherever the quarks sit in the colour order. The signs are those of our conventions (docs/conventions.md "Quarks"), fixed by
// the quark-line Berends–Giele current; the papers fix them in theirs.
import type { Field } from '../field'
import type { Kin } from '../spinors'
import { PhysicsError } from '../errors'
import { GLUON_PDG } from '../quarks'
import { quarkLine } from './quark-line'
import { parkeTaylorAntiMhv, parkeTaylorMhv } from './parke-taylor'

export interface QuarkMhvClass {
  kind: 'mhv' | 'anti-mhv' | 'other'
  qbar: number
  q: number
  /** The gluon of the odd helicity. */
  g: number
}

/** MHV (one gluon −, the rest +) or anti-MHV (one gluon +) with one quark line of opposite end helicities. */
export function classifyQuarkMhv(h: readonly number[], pdg: readonly number[]): QuarkMhvClass {
  const line = quarkLine(pdg)
  const none: QuarkMhvClass = { kind: 'other', qbar: -1, q: -1, g: -1 }
  if (!line || h[line[0]] === h[line[1]]) return none
  let minus = -1
  let plus = -1
  let nm = 0
  let np = 0
  for (let t = 0; t < h.length; t++) {
    if (pdg[t] !== GLUON_PDG) continue
    if (h[t]! < 0) [minus, nm] = [t, nm + 1]
    else [plus, np] = [t, np + 1]
  }
  if (nm === 1) return { kind: 'mhv', qbar: line[0], q: line[1], g: minus }
  if (np === 1) return { kind: 'anti-mhv', qbar: line[0], q: line[1], g: plus }
  return none
}

/** The closed form, or null when the helicities are neither class. */
export function quarkMhvValue<T>(F: Field<T>, k: Kin<T>, h: readonly number[], pdg: readonly number[]): T | null {
  const c = classifyQuarkMhv(h, pdg)
  if (c.kind === 'other') return null
  const mhv = c.kind === 'mhv'
  // the quark end whose helicity matches the odd gluon's sign carries the cube
  const barOdd = mhv ? h[c.qbar]! < 0 : h[c.qbar]! > 0
  const [cube, single] = barOdd ? [c.qbar, c.q] : [c.q, c.qbar]
  // Parke–Taylor with minus legs (g, cube) times ⟨single g⟩/⟨cube g⟩ (a supersymmetric Ward identity)
  const L = mhv ? k.lambda : k.lambdaTilde
  const br = (x: number, y: number) => {
    const a = L[x]!, b = L[y]!
    return mhv ? F.sub(F.mul(a[0], b[1]), F.mul(a[1], b[0])) : F.sub(F.mul(a[1], b[0]), F.mul(a[0], b[1]))
  }
  const pt = mhv ? parkeTaylorMhv(F, k, c.g, cube) : parkeTaylorAntiMhv(F, k, c.g, cube)
  const v = F.div(F.mul(pt, br(single, c.g)), br(cube, c.g), 'a bracket of the quark MHV form vanishes')
  return quarkMhvSign(c, barOdd) < 0 ? F.neg(v) : v
}

/** The sign of the closed form in our conventions (see the header). */
export function quarkMhvSign(c: QuarkMhvClass, barOdd: boolean): number {
  void barOdd // measured: the sign depends on neither the quark positions nor which end carries the cube
  return c.kind === 'mhv' ? -1 : 1
}

/** The target: the closed form, zero for the vanishing classes. */
export function quarkMhv<T>(F: Field<T>, k: Kin<T>, h: number[], pdg: readonly number[]): T {
  const v = quarkMhvValue(F, k, h, pdg)
  if (v === null) throw new PhysicsError('target', 'the quark MHV form applies to one quark line with exactly one gluon of each odd helicity (MHV or its conjugate)')
  return v
}

/**
 * Two quark lines of different flavours, MHV (every gluon +) or its conjugate (every gluon −, n > 4),
 * with the two +½ ends neighbours among the four quark legs (cyclically) and the lines not crossing:
 *   MHV ⟨m₁m₂⟩³⟨p₁p₂⟩/(⟨12⟩…⟨n1⟩), conjugate (−1)ⁿ[p₁p₂]³[m₁m₂]/([12]…[n1]),
 * m the ends of helicity −½, p of +½. This is the four-gluino component of the N = 4 MHV
 * superamplitude with one gluino species (Nair, Phys. Lett. B214 (1988) 215), where the other
 * fermion pairing of N = 1 crosses; its sign in our conventions (docs/conventions.md "Two quark
 * lines") is +1, measured against the quark-lines Berends–Giele current. Null where it does not apply.
 */
export function twoLineMhvValue<T>(F: Field<T>, k: Kin<T>, h: readonly number[], pdg: readonly number[]): T | null {
  const c = classifyTwoLineMhv(h, pdg)
  if (!c) return null
  const n = h.length
  const { mhv, m1, p1, m2, p2 } = c
  const L = mhv ? k.lambda : k.lambdaTilde
  const br = (x: number, y: number) => {
    const a = L[x]!, b = L[y]!
    return mhv ? F.sub(F.mul(a[0], b[1]), F.mul(a[1], b[0])) : F.sub(F.mul(a[1], b[0]), F.mul(a[0], b[1]))
  }
  let den = F.one
  for (let t = 0; t < n; t++) den = F.mul(den, br(t, (t + 1) % n))
  const cube = mhv ? br(m1, m2) : br(p1, p2)
  const v = F.div(F.mul(F.mul(cube, F.mul(cube, cube)), mhv ? br(p1, p2) : br(m1, m2)), den, 'an adjacent bracket of the two-line MHV form vanishes')
  return !mhv && n % 2 ? F.neg(v) : v
}

/** Where the two-line form applies: the class and the line ends m (−½) and p (+½); null elsewhere. */
export function classifyTwoLineMhv(h: readonly number[], pdg: readonly number[]): { mhv: boolean; m1: number; p1: number; m2: number; p2: number } | null {
  const n = h.length
  const q: number[] = []
  let minusGluons = 0
  for (let t = 0; t < n; t++) {
    if (pdg[t] === GLUON_PDG) {
      if (h[t]! < 0) minusGluons++
    }
    else q.push(t)
  }
  if (q.length !== 4) return null
  const mhv = minusGluons === 0
  if (!mhv && (n === 4 || minusGluons !== n - 4)) return null
  const c = q.map((t) => pdg[t]!)
  const plus = q.map((t) => h[t]! > 0)
  // not crossing (flavours a, b, a, b), + ends neighbours (signs not alternating)
  if (Math.abs(c[0]!) === Math.abs(c[2]!) || plus[0] === plus[2]) return null
  const f1 = Math.abs(c[0]!)
  const f2 = Math.abs(c[1]!) === f1 ? Math.abs(c[2]!) : Math.abs(c[1]!)
  const end = (f: number, pl: boolean) => {
    const x = [0, 1, 2, 3].filter((y) => Math.abs(c[y]!) === f && plus[y] === pl)
    return x.length === 1 ? q[x[0]!]! : -1
  }
  const r = { mhv, m1: end(f1, false), p1: end(f1, true), m2: end(f2, false), p2: end(f2, true) }
  // each line a q and a q̄ of opposite helicities
  if (r.m1 < 0 || r.p1 < 0 || r.m2 < 0 || r.p2 < 0 || pdg[r.m1] !== -pdg[r.p1]! || pdg[r.m2] !== -pdg[r.p2]!) return null
  return r
}
