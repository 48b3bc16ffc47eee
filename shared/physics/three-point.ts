// Three-point amplitudes by little-group scaling (docs/conventions.md "Amplitudes and normalisations"):
//   angle  (h1+h2+h3 < 0): ⟨12⟩^(h3−h1−h2) ⟨23⟩^(h1−h2−h3) ⟨31⟩^(h2−h3−h1)
//   square (h1+h2+h3 > 0): σ [12]^(h1+h2−h3) [23]^(h2+h3−h1) [31]^(h3+h1−h2)
// σ = −1 for gluons, (−1)^s for spin s (gravitons: σ² = +1), the cubic scalar A3 = 1.
import { SingularError, negligible, spinorSize, type Field } from './field'
import { PhysicsError } from './errors'
import { angleOf, squareOf, type Kin, type Spinor } from './spinors'
import type { Process } from './theories'
import { GLUON_PDG } from './quarks'

export type VertexKind = 'angle' | 'square'

/** The sign σ of the square vertex: (−1)^s (gluons −1, gravitons +1). */
export function sigmaOf(p: Process): number {
  return p.s % 2 === 0 ? 1 : -1
}

function exponent(x: number): number {
  if (!Number.isInteger(x)) throw new PhysicsError('helicities', `the three-point exponent ${x} is not an integer`)
  return x
}

/**
 * The bracket of spinors x, y to the power e; a bracket in a denominator that vanishes (in floats:
 * below the field's tolerance of |x||y|) is a singular point, named.
 */
function powBracket<T>(F: Field<T>, x: Spinor<T>, y: Spinor<T>, e: number, kind: 'angle' | 'square', name: string): T {
  const b = kind === 'angle' ? angleOf(F, x, y) : squareOf(F, x, y)
  if (e < 0 && (F.zeroTolerance === undefined ? F.isZero(b) : negligible(F, b, spinorSize(F, x) * spinorSize(F, y)))) throw new SingularError(`the bracket ${name} of a three-point block vanishes`)
  return F.pow(b, exponent(e))
}

/**
 * The little-group formula for any helicities (integer or half-integer, as long as the bracket
 * exponents are integers), of the given kind, times a coupling.
 */
export function threePointFormula<T>(F: Field<T>, k: Kin<T>, h: readonly number[], kind: VertexKind, sigma: number, coupling?: T): T {
  const [h1, h2, h3] = h as [number, number, number]
  const [a, b, c] = [0, 1, 2]
  let v: T
  if (kind === 'angle') {
    const L = k.lambda
    v = F.mul(
      F.mul(powBracket(F, L[a]!, L[b]!, h3 - h1 - h2, kind, '⟨12⟩'), powBracket(F, L[b]!, L[c]!, h1 - h2 - h3, kind, '⟨23⟩')),
      powBracket(F, L[c]!, L[a]!, h2 - h3 - h1, kind, '⟨31⟩'),
    )
  }
  else {
    const L = k.lambdaTilde
    v = F.mul(
      F.mul(powBracket(F, L[a]!, L[b]!, h1 + h2 - h3, kind, '[12]'), powBracket(F, L[b]!, L[c]!, h2 + h3 - h1, kind, '[23]')),
      powBracket(F, L[c]!, L[a]!, h3 + h1 - h2, kind, '[31]'),
    )
    if (sigma < 0) v = F.neg(v)
  }
  return coupling === undefined ? v : F.mul(coupling, v)
}

/**
 * Whether a block of this kind can be non-zero, from the helicities alone: the angle vertex needs
 * Σh < 0, the square vertex Σh > 0 (Σh = 0 only for scalars, which couple on both kinds); pure
 * gluon, graviton and spin-s theories have no (−−−) or (+++) vertex.
 */
export function threePointSurvives(p: Process, h: readonly number[], kind: VertexKind, pdg?: readonly number[]): boolean {
  const sum = h[0]! + h[1]! + h[2]!
  if (pdg && quarkVertex(pdg, h) === null) return false
  if (p.s === 0) return sum === 0
  if ((h[0]! > 0 && h[1]! > 0 && h[2]! > 0) || (h[0]! < 0 && h[1]! < 0 && h[2]! < 0)) return false
  return kind === 'angle' ? sum < 0 : sum > 0
}

/**
 * A3 of the theory at a BCFW pole. The kind is fixed by the structure of the shift (the side
 * holding î is an angle vertex, the side holding ĵ a square vertex), never by a float threshold;
 * the other kind vanishes there identically.
 */
export function threePoint<T>(F: Field<T>, p: Process, k: Kin<T>, h: readonly number[], kind: VertexKind, coupling?: T, pdg?: readonly number[]): T {
  if (!threePointSurvives(p, h, kind, pdg)) return F.zero
  if (p.s === 0) return coupling ?? F.one
  if (pdg && quarkVertex(pdg, h) === 'quark') return threePointFormula(F, k, h, kind, QUARK_SIGMA[kind], coupling)
  return threePointFormula(F, k, h, kind, sigmaOf(p), coupling)
}

/**
 * The vertices of massless QCD among three legs with PDG codes: three gluons, or q̄_f q_f g with
 * opposite helicities on the quark line (a vector coupling conserves helicity); null when none.
 */
export function quarkVertex(pdg: readonly number[], h: readonly number[]): 'gluon' | 'quark' | null {
  const g = (pdg[0] === GLUON_PDG ? 1 : 0) + (pdg[1] === GLUON_PDG ? 1 : 0) + (pdg[2] === GLUON_PDG ? 1 : 0)
  if (g === 3) return 'gluon'
  if (g !== 1) return null
  // the two quark legs (no arrays: this runs for every three-point side)
  const a = pdg[0] === GLUON_PDG ? 1 : 0
  const b = pdg[2] === GLUON_PDG ? 1 : 2
  if (pdg[a]! !== -pdg[b]!) return null
  return h[a] === -h[b]! ? 'quark' : null
}

/**
 * The sign of the q̄qg block per kind: +1 for both, unlike the gluon square vertex. Read off the
 * quark-line Berends–Giele current at three-point kinematics (docs/conventions.md "Quarks";
 * "q̄qg blocks" in physics/quarks-bcfw.test.ts).
 */
export const QUARK_SIGMA: Record<VertexKind, number> = { angle: 1, square: 1 }

/**
 * Bose symmetry of the block: (A3 of gluons)^s picks up (−1)^s under exchange of two identical
 * legs, so a single species of odd spin is antisymmetric (Benincasa & Cachazo, arXiv:0705.4305).
 * Colour-ordered gluons are exempt: their antisymmetry is carried by the structure constants.
 */
export function boseSymmetry(p: Process): 'symmetric' | 'antisymmetric' | 'colour-ordered' {
  if (p.colourOrdered) return 'colour-ordered'
  return p.s % 2 === 1 ? 'antisymmetric' : 'symmetric'
}
