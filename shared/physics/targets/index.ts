// The target registry: the independent results a BCFW value is compared with, each entry with
// its own `applies` and `evaluate`. `auto`, the zod enum and the catalogue derive from it; adding
// a target is a module plus an entry here (DEVELOPERS.md "Adding a target").
import type { Field } from '../field'
import type { Kin } from '../spinors'
import { PhysicsError } from '../errors'
import { parkeTaylor, classifyGluon } from './parke-taylor'
import { berendsGiele } from './berends-giele'
import { hodges, classifyGraviton } from './hodges'
import { KLT_MAX_N, klt } from './klt'
import { cubicScalarFeynman } from './cubic-scalar'
import { quarkLine, quarkLineBerendsGiele } from './quark-line'
import { classifyQuarkMhv, classifyTwoLineMhv, quarkMhv, twoLineMhvValue } from './quark-mhv'
import { quarkLines, quarkLinesBerendsGiele } from './quark-lines'
import { GLUON_PDG } from '../quarks'

import { THEORY_NAMES, type TheoryName } from '../theories'

export type TargetTheory = TheoryName

/** One independent target: what it is, where it applies and how to evaluate it. */
export interface Target<N extends string = string> {
  name: N
  label: string
  theories: TargetTheory[]
  /** Where it applies and what it computes, in one or two sentences. */
  description: string
  /** The published source of the formula or algorithm. */
  source: string
  /** |h| of the particles it takes (helicities are checked against it before `evaluate`). */
  spin: number
  /** Applies to this process (n ≥ 3, every |h| = spin already checked; quarks: |h| = 1/2 on quark legs). */
  applies(theory: TargetTheory, helicities: readonly number[], spin?: number, pdg?: readonly number[]): boolean
  /** The target's value at a point (0-based legs; pdg: the species of theory qcd). */
  evaluate<T>(F: Field<T>, k: Kin<T>, helicities: number[], pdg?: readonly number[]): T
  /** Takes quark legs (|h| = 1/2 where pdg names a quark). */
  quarks?: boolean
}

/** Keeps the names as a literal union (TargetName) while the entries stay in one list. */
function defineTargets<const N extends string>(list: Target<N>[]): Target<N>[] {
  return list
}

/** Gluons, or a qcd process without quarks. */
function gluonsOnly(theory: TargetTheory, pdg?: readonly number[]): boolean {
  return theory === 'gluon' || (theory === 'qcd' && (!pdg || pdg.every((c) => c === GLUON_PDG)))
}

/** Gravitons and a spin-2 species are one theory here. */
function gravityLike(theory: TargetTheory, spin?: number): boolean {
  return theory === 'graviton' || (theory === 'spin' && spin === 2)
}

/**
 * The registry, preferred target first: `auto` picks the first entry that applies (quark MHV →
 * quark-mhv, other one-line quark processes → berends-giele-quark, two-line MHV →
 * quark-pairs-mhv, other two-line processes → berends-giele-quark-lines, gluon MHV/anti-MHV → parke-taylor, other gluons → berends-giele, graviton MHV → hodges, other
 * gravitons at n ≤ 6 → klt, cubic scalar → feynman).
 */
export const TARGETS = defineTargets([
  {
    name: 'quark-mhv',
    label: 'Quark MHV (Mangano–Parke)',
    theories: ['qcd'],
    description: 'Closed form of the MHV amplitude with one massless quark line and gluons, −⟨q̄ i⟩³⟨q i⟩/(⟨12⟩…⟨n1⟩) for q̄⁻ and gluon i⁻ (the quark ends swapped for q̄⁺), and its parity conjugate.',
    source: 'M. Mangano, S. Parke, Phys. Rept. 200 (1991) 301; L. Dixon, hep-ph/9601359',
    spin: 1,
    quarks: true,
    applies: (theory, h, _s, pdg) => theory === 'qcd' && !!pdg && classifyQuarkMhv(h, pdg).kind !== 'other',
    evaluate: (F, k, h, pdg) => quarkMhv(F, k, h, pdg!),
  },
  {
    name: 'berends-giele-quark',
    label: 'Berends–Giele with a quark line',
    theories: ['qcd'],
    description: 'Off-shell recursion of colour-ordered Feynman rules with one massless quark line (quark–gluon vertex, quark propagator) and the gluon currents of Berends–Giele; every helicity configuration.',
    source: 'F. A. Berends, W. T. Giele, Nucl. Phys. B306 (1988) 759',
    spin: 1,
    quarks: true,
    applies: (theory, _h, _s, pdg) => theory === 'qcd' && !!pdg && quarkLine(pdg) !== null,
    evaluate: (F, k, h, pdg) => quarkLineBerendsGiele(F, k, h, pdg!),
  },
  {
    name: 'quark-pairs-mhv',
    label: 'Two quark pairs MHV (N = 1 form)',
    theories: ['qcd'],
    description: 'Closed form with two quark lines of different flavours, every gluon + (or every gluon −): ⟨m₁m₂⟩³⟨p₁p₂⟩/(⟨12⟩…⟨n1⟩) and its parity conjugate, where the two +½ ends are neighbours among the quark legs (the four-gluino component of the N = 4 MHV superamplitude).',
    source: 'V. P. Nair, Phys. Lett. B214 (1988) 215; L. Dixon, J. Henn, J. Plefka, T. Schuster, arXiv:1010.3991',
    spin: 1,
    quarks: true,
    applies: (theory, h, _s, pdg) => theory === 'qcd' && !!pdg && classifyTwoLineMhv(h, pdg) !== null,
    evaluate: (F, k, h, pdg) => {
      const v = twoLineMhvValue(F, k, h, pdg!)
      if (v === null) throw new PhysicsError('target', 'the two-quark-pair MHV form applies to two lines of different flavours, every gluon of one helicity, the + ends neighbours among the quarks')
      return v
    },
  },
  {
    name: 'berends-giele-quark-lines',
    label: 'Berends–Giele with two quark lines',
    theories: ['qcd'],
    description: 'Off-shell recursion of colour-ordered Feynman rules with two massless quark lines of different flavours and gluons: quark and gluon currents over intervals of the colour order, a gluon current from each quark pair; every helicity configuration.',
    source: 'F. A. Berends, W. T. Giele, Nucl. Phys. B306 (1988) 759',
    spin: 1,
    quarks: true,
    applies: (theory, _h, _s, pdg) => theory === 'qcd' && !!pdg && quarkLines(pdg)?.length === 2,
    evaluate: (F, k, h, pdg) => quarkLinesBerendsGiele(F, k, h, pdg!),
  },
  {
    name: 'parke-taylor',
    label: 'Parke–Taylor',
    theories: ['gluon', 'qcd'],
    description: 'Closed form of the MHV gluon amplitude, ⟨ij⟩⁴/(⟨12⟩…⟨n1⟩), and its parity conjugate (−1)ⁿ[ij]⁴/([12]…[n1]).',
    source: 'S. Parke, T. Taylor, Phys. Rev. Lett. 56 (1986) 2459',
    spin: 1,
    applies: (theory, h, _s, pdg) => gluonsOnly(theory, pdg) && classifyGluon(h).kind !== 'other',
    evaluate: (F, k, h) => parkeTaylor(F, k, h),
  },
  {
    name: 'berends-giele',
    label: 'Berends–Giele',
    theories: ['gluon', 'qcd'],
    description: 'Off-shell recursion of colour-ordered Feynman rules (three- and four-gluon vertices) with polarization vectors built from spinors; every helicity configuration.',
    source: 'F. A. Berends, W. T. Giele, Nucl. Phys. B306 (1988) 759',
    spin: 1,
    applies: (theory, _h, _s, pdg) => gluonsOnly(theory, pdg),
    evaluate: (F, k, h) => berendsGiele(F, k, h),
  },
  {
    name: 'hodges',
    label: 'Hodges determinant',
    theories: ['graviton', 'spin'],
    description: 'MHV graviton amplitude as a reduced determinant of the matrix Φ, and its parity conjugate; any n.',
    source: 'A. Hodges, arXiv:1204.1930',
    spin: 2,
    applies: (theory, h, spin) => gravityLike(theory, spin) && classifyGraviton(h).kind !== 'other',
    evaluate: (F, k, h) => hodges(F, k, h),
  },
  {
    name: 'klt',
    label: 'KLT relations',
    theories: ['graviton', 'spin'],
    description: 'Graviton amplitudes as sums of products of colour-ordered gluon amplitudes (from Berends–Giele) weighted by Mandelstam invariants; n = 3..7 (n = 7 by the momentum kernel), every helicity configuration.',
    source: 'H. Kawai, D. Lewellen, S.-H. Tye, Nucl. Phys. B269 (1986) 1; Z. Bern, L. Dixon, M. Perelstein, J. Rozowsky, Nucl. Phys. B546 (1999) 423',
    spin: 2,
    applies: (theory, h, spin) => gravityLike(theory, spin) && h.length <= KLT_MAX_N,
    evaluate: (F, k, h) => klt(F, k, h),
  },
  {
    name: 'feynman',
    label: 'Feynman diagrams',
    theories: ['scalar-cubic'],
    description: 'Sum of all planar cubic tree diagrams with propagators 1/P² (Catalan-many), by a memoized recursion over intervals.',
    source: 'planar cubic Feynman rules (common practice); diagram count: Catalan number C_{n−2}',
    spin: 0,
    applies: (theory) => theory === 'scalar-cubic',
    evaluate: (F, k) => cubicScalarFeynman(F, k),
  },
])

export type TargetName = (typeof TARGETS)[number]['name']
export const TARGET_NAMES = TARGETS.map((t) => t.name) as [TargetName, ...TargetName[]]

/** What the catalogue lists of a target (no functions: it crosses a worker boundary). */
export type TargetInfo = Pick<Target<TargetName>, 'name' | 'label' | 'theories' | 'description' | 'source'>

export const TARGET_INFO: TargetInfo[] = TARGETS.map(({ name, label, theories, description, source }) => ({ name, label, theories, description, source }))

const byName = new Map(TARGETS.map((t) => [t.name, t]))

/** The targets that apply to a process, the preferred one first. */
export function applicableTargets(theory: TargetTheory, helicities: number[], spin?: number, pdg?: readonly number[]): TargetName[] {
  if (helicities.length < 3 || !THEORY_NAMES.includes(theory)) return []
  return TARGETS.filter((t) => spinsFit(t, helicities, pdg) && t.applies(theory, helicities, spin, pdg)).map((t) => t.name)
}

/** Every |h| is the target's spin, or 1/2 on a quark leg of a target that takes quarks. */
function spinsFit(t: Target, helicities: readonly number[], pdg?: readonly number[]): boolean {
  return helicities.every((h, i) => Math.abs(h) === (t.quarks && pdg && pdg[i] !== GLUON_PDG ? 1 / 2 : t.spin))
}

/** The best independent target (the first that applies); null if none (spin s ≠ 2). */
export function autoTarget(theory: TargetTheory, helicities: number[], spin?: number, pdg?: readonly number[]): TargetName | null {
  return applicableTargets(theory, helicities, spin, pdg)[0] ?? null
}

function countNeg(helicities: readonly number[]): number {
  let m = 0
  for (const h of helicities) if (h < 0) m++
  return m
}

const PARTICLES: Record<number, string> = { 0: 'scalars (helicity 0)', 1: 'gluons (helicity ±1)', 2: 'gravitons (helicity ±2)' }

/**
 * Evaluates a target at a point (0-based legs). Classes that vanish identically at tree level
 * (spin ≥ 1, n ≥ 4, fewer than two minus or two plus helicities) give exactly zero.
 */
export function evaluateTarget<T>(name: TargetName, F: Field<T>, k: Kin<T>, helicities: number[], pdg?: readonly number[]): T {
  const t = byName.get(name)
  if (!t) throw new PhysicsError('target', `unknown target ${name}`)
  const n = helicities.length
  if (!spinsFit(t, helicities, pdg)) throw new PhysicsError('target', `${name} applies to ${t.quarks ? 'gluons (±1) and quarks (±1/2)' : (PARTICLES[t.spin] ?? `spin ${t.spin}`)} only`)
  if (t.spin > 0 && n >= 4) {
    const m = countNeg(helicities)
    if (m < 2 || n - m < 2) return F.zero
  }
  return t.evaluate(F, k, helicities, pdg)
}

export { parkeTaylor, berendsGiele, hodges, klt, cubicScalarFeynman, quarkMhv, quarkLineBerendsGiele, quarkLinesBerendsGiele }
