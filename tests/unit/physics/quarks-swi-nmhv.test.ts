// Supersymmetric Ward identities beyond MHV (Grisaru, Pendleton, van Nieuwenhuizen, Phys. Rev.
// D15 (1977) 996; Parke, Taylor, Phys. Lett. B157 (1985) 81; Dixon, hep-ph/9601359 §5). At tree
// level a quark line is a gluino line of N = 1 super-Yang–Mills. The supercharge Q(η) of a
// Grassmann reference spinor annihilates the vacuum, so ⟨0|[Q(η), Λ_a Π g_k]|0⟩ = 0, and on the
// multiplet [Q, Λ⁻_k] ∝ [ηk] g⁻_k, [Q, g⁺_k] ∝ [ηk] Λ⁺_k, [Q, Λ⁺_k] ∝ ⟨ηk⟩ g⁺_k, [Q, g⁻_k] ∝ ⟨ηk⟩ Λ⁻_k.
// With one gluino (leg a) among gluons, the terms where Q hits a gluon of the wrong helicity vanish
// (a line needs opposite end helicities), leaving, for a gluon amplitude A_g and quark-line
// amplitudes A_q(a, k) whose line ends are a and k (either being q or q̄):
//   (1) a of helicity −:  [η a] A_g = Σ_{k: h_k = +} [η k] A_q(a⁻ k⁺)
//   (2) a of helicity +:  ⟨η a⟩ A_g = −Σ_{k: h_k = −} ⟨η k⟩ A_q(a⁺ k⁻)
// The signs, which in an operator formalism come from moving the Grassmann θ past the fermions,
// are those of our conventions (docs/conventions.md "Quarks"), fixed once by the MHV identities of
// physics/quarks-swi.test.ts (with momentum conservation Σ_k [ηk]⟨k i⟩ = 0 they give exactly these
// signs); here they are checked on NMHV and N²MHV amplitudes, where no closed form enters. With
// |η] = |a] (or |η⟩ = |a⟩) the left side drops: the weighted sum of quark amplitudes vanishes.
import { describe, expect, it } from 'vitest'
import { complexField as C, rationalField as Q, Fraction, type Field } from '#shared/physics/field'
import { randomPoint, rationalPoint } from '#shared/physics/kinematics'
import { angleOf, squareOf, type Kin, type Spinor } from '#shared/physics/spinors'
import { bcfw } from '#shared/physics/bcfw'
import { defaultShift, type Process } from '#shared/physics/theories'
import { QCD } from './quarks-helpers'

const GLUON: Process = { theory: 'gluon', s: 1, colourOrdered: true }

/** Gluon helicities with `minus` negative legs among n: every assignment. */
function gluonAssignments(n: number, minus: number): number[][] {
  const out: number[][] = []
  for (let m = 0; m < 1 << n; m++) {
    const h = Array.from({ length: n }, (_, t) => ((m >> t) & 1 ? -1 : 1))
    if (h.filter((x) => x < 0).length === minus) out.push(h)
  }
  return out
}

/** The quark-line amplitude with the line ends at a and k (q̄ at the lower position), by BCFW. */
function quarkAmp<T>(F: Field<T>, k: Kin<T>, hg: number[], a: number, kk: number): T {
  const h = hg.map((x, t) => (t === a || t === kk ? x / 2 : x))
  const pdg = hg.map((_, t) => (t === Math.min(a, kk) ? -1 : t === Math.max(a, kk) ? 1 : 21))
  return bcfw(F, QCD, k, h, defaultShift(QCD, h, pdg), { pdg }).value
}

interface Identity<T> {
  lhs: T
  terms: T[]
}

/** Both sides of identity (1) (a minus) or (2) (a plus) for the reference spinor η. */
function identity<T>(F: Field<T>, k: Kin<T>, hg: number[], a: number, eta: Spinor<T>): Identity<T> {
  const minus = hg[a]! < 0
  const br = (t: number) => (minus ? squareOf(F, eta, k.lambdaTilde[t]!) : angleOf(F, eta, k.lambda[t]!))
  const ag = bcfw(F, GLUON, k, hg, defaultShift(GLUON, hg)).value
  const terms: T[] = []
  for (let t = 0; t < hg.length; t++) {
    if (t === a || hg[t] === hg[a]) continue
    const v = F.mul(br(t), quarkAmp(F, k, hg, a, t))
    terms.push(minus ? v : F.neg(v))
  }
  return { lhs: F.mul(br(a), ag), terms }
}

const residual = <T>(F: Field<T>, id: Identity<T>, drop = -1) => id.terms.reduce((s, x, t) => (t === drop ? s : F.sub(s, x)), id.lhs)
const scale = <T>(F: Field<T>, id: Identity<T>) => id.terms.reduce((s, x) => s + F.abs(x), F.abs(id.lhs))

const fr = (x: number) => new Fraction(BigInt(x))

describe('N = 1 Ward identities between quark and gluon amplitudes beyond MHV', () => {
  for (const [n, minus] of [[6, 3], [7, 3], [8, 4]] as [number, number][]) {
    const cls = minus === 3 ? 'NMHV' : 'N²MHV'
    it(`exact, n = ${n} ${cls}: (1) and (2) hold exactly for every assignment${n === 8 ? ' (sampled)' : ''} and every leg a, and fail without any one term`, () => {
      const k = rationalPoint(n, `swi-nmhv-${n}`)
      const eta: Spinor<Fraction> = [fr(3), fr(-7)]
      let checked = 0
      const cases = gluonAssignments(n, minus)
      for (const hg of n === 8 ? cases.filter((_, t) => t % 9 === 0) : cases) {
        for (let a = 0; a < n; a++) {
          if (n === 8 && a % 3) continue
          const id = identity(Q, k, hg, a, eta)
          expect(Q.isZero(residual(Q, id)), `${hg} a = ${a + 1}`).toBe(true)
          id.terms.forEach((x, t) => {
            if (!Q.isZero(x)) expect(Q.isZero(residual(Q, id, t)), `${hg} a = ${a + 1} without term ${t}`).toBe(false)
          })
          checked++
        }
      }
      expect(checked).toBeGreaterThan(n === 8 ? 20 : 100)
    })
  }
  for (const n of [6, 7]) {
    it(`float, n = ${n} NMHV: relative residual ≤ 1e-12 at random points and η; dropping a term is caught`, () => {
      let checked = 0
      for (const seed of [1, 2, 3]) {
        const k = randomPoint(n, `swi-float-${n}-${seed}`)
        const eta: Spinor<ReturnType<typeof C.fromInt>> = [k.lambda[0]![0].add(k.lambdaTilde[1]![1]), k.lambda[1]![1].sub(k.lambdaTilde[2]![0])]
        for (const hg of gluonAssignments(n, 3).filter((_, t) => t % 4 === seed)) {
          for (let a = 0; a < n; a++) {
            const id = identity(C, k, hg, a, eta)
            const s = scale(C, id)
            expect(C.abs(residual(C, id)) / s, `${hg} a = ${a + 1}`).toBeLessThan(1e-12)
            id.terms.forEach((x, t) => {
              if (C.abs(x) > 1e-6 * s) expect(C.abs(residual(C, id, t)) / s, `${hg} a = ${a + 1} without term ${t}`).toBeGreaterThan(1e-6)
            })
            checked++
          }
        }
      }
      expect(checked).toBeGreaterThan(50)
    })
  }
  it('with |η] = |a] the weighted sum of quark amplitudes vanishes (n = 6, 7, exact)', () => {
    for (const n of [6, 7]) {
      const k = rationalPoint(n, `swi-nmhv-${n}`)
      for (const hg of gluonAssignments(n, 3)) {
        const a = hg.indexOf(-1)
        const id = identity(Q, k, hg, a, k.lambdaTilde[a]!)
        expect(Q.isZero(id.lhs)).toBe(true)
        expect(Q.isZero(residual(Q, id)), `${hg}`).toBe(true)
        expect(id.terms.some((x) => !Q.isZero(x))).toBe(true)
      }
    }
  })
  it('a quark-line amplitude does not change when q and q̄ trade places (n = 6, 7 NMHV, exact)', () => {
    for (const n of [6, 7]) {
      const k = rationalPoint(n, `swi-nmhv-${n}`)
      for (const hg of gluonAssignments(n, 3).filter((_, t) => t % 3 === 0)) {
        const a = hg.indexOf(-1)
        const b = hg.indexOf(1)
        const h = hg.map((x, t) => (t === a || t === b ? x / 2 : x))
        const one = h.map((_, t) => (t === a ? -1 : t === b ? 1 : 21))
        const other = h.map((_, t) => (t === a ? 1 : t === b ? -1 : 21))
        const v = bcfw(Q, QCD, k, h, defaultShift(QCD, h, one), { pdg: one }).value
        expect(Q.equals(v, bcfw(Q, QCD, k, h, defaultShift(QCD, h, other), { pdg: other }).value), `${hg}`).toBe(true)
      }
    }
  })
})
