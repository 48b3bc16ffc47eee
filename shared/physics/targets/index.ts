// The independent targets a BCFW result is compared with: which apply to a process, which one
// `auto` picks, how to evaluate one, and the catalogue entries.
import type { Field } from '../field'
import type { Kin } from '../spinors'
import { PhysicsError } from '../errors'
import { parkeTaylor, classifyGluon } from './parke-taylor'
import { berendsGiele } from './berends-giele'
import { hodges, classifyGraviton } from './hodges'
import { KLT_MAX_N, klt } from './klt'
import { cubicScalarFeynman } from './cubic-scalar'

export type TargetName = 'parke-taylor' | 'berends-giele' | 'hodges' | 'klt' | 'feynman'
export type TargetTheory = 'gluon' | 'graviton' | 'scalar-cubic' | 'spin'

export interface TargetInfo {
  name: TargetName
  label: string
  theories: TargetTheory[]
  /** Where it applies and what it computes, in one or two sentences. */
  description: string
  /** The published source of the formula or algorithm. */
  source: string
}

export const TARGETS: TargetInfo[] = [
  {
    name: 'parke-taylor',
    label: 'Parke–Taylor',
    theories: ['gluon'],
    description: 'Closed form of the MHV gluon amplitude, ⟨ij⟩⁴/(⟨12⟩…⟨n1⟩), and its parity conjugate (−1)ⁿ[ij]⁴/([12]…[n1]).',
    source: 'S. Parke, T. Taylor, Phys. Rev. Lett. 56 (1986) 2459',
  },
  {
    name: 'berends-giele',
    label: 'Berends–Giele',
    theories: ['gluon'],
    description: 'Off-shell recursion of colour-ordered Feynman rules (three- and four-gluon vertices) with polarization vectors built from spinors; every helicity configuration.',
    source: 'F. A. Berends, W. T. Giele, Nucl. Phys. B306 (1988) 759',
  },
  {
    name: 'hodges',
    label: 'Hodges determinant',
    theories: ['graviton', 'spin'],
    description: 'MHV graviton amplitude as a reduced determinant of the matrix Φ, and its parity conjugate; any n.',
    source: 'A. Hodges, arXiv:1204.1930',
  },
  {
    name: 'klt',
    label: 'KLT relations',
    theories: ['graviton', 'spin'],
    description: 'Graviton amplitudes as sums of products of colour-ordered gluon amplitudes (from Berends–Giele) weighted by Mandelstam invariants; n = 3..7 (n = 7 by the momentum kernel), every helicity configuration.',
    source: 'H. Kawai, D. Lewellen, S.-H. Tye, Nucl. Phys. B269 (1986) 1; Z. Bern, L. Dixon, M. Perelstein, J. Rozowsky, Nucl. Phys. B546 (1999) 423',
  },
  {
    name: 'feynman',
    label: 'Feynman diagrams',
    theories: ['scalar-cubic'],
    description: 'Sum of all planar cubic tree diagrams with propagators 1/P² (Catalan-many), by a memoized recursion over intervals.',
    source: 'planar cubic Feynman rules (common practice); diagram count: Catalan number C_{n−2}',
  },
]

/** Gravitons and a spin-2 species are one theory here. */
function gravityLike(theory: TargetTheory, spin?: number): boolean {
  return theory === 'graviton' || (theory === 'spin' && spin === 2)
}

/** The targets that apply to a process, the preferred one first. */
export function applicableTargets(theory: TargetTheory, helicities: number[], spin?: number): TargetName[] {
  const n = helicities.length
  if (n < 3) return []
  if (theory === 'gluon') {
    if (helicities.some((h) => h !== 1 && h !== -1)) return []
    const c = classifyGluon(helicities).kind
    return c === 'other' ? ['berends-giele'] : ['parke-taylor', 'berends-giele']
  }
  if (gravityLike(theory, spin)) {
    if (helicities.some((h) => h !== 2 && h !== -2)) return []
    const c = classifyGraviton(helicities).kind
    const out: TargetName[] = []
    if (c !== 'other') out.push('hodges')
    if (n <= KLT_MAX_N) out.push('klt')
    return out
  }
  if (theory === 'scalar-cubic') return helicities.every((h) => h === 0) ? ['feynman'] : []
  return [] // a single species of spin s ≠ 2 has no independent target
}

/**
 * The best independent target: gluon MHV/anti-MHV → parke-taylor, other gluons → berends-giele,
 * graviton MHV → hodges, other gravitons at n ≤ 7 → klt, cubic scalar → feynman; null if none.
 */
export function autoTarget(theory: TargetTheory, helicities: number[], spin?: number): TargetName | null {
  return applicableTargets(theory, helicities, spin)[0] ?? null
}

function countNeg(helicities: readonly number[]): number {
  let m = 0
  for (const h of helicities) if (h < 0) m++
  return m
}

/**
 * Evaluates a target at a point (0-based legs). Classes that vanish identically at tree level
 * (gluons or gravitons, n ≥ 4, fewer than two minus or two plus helicities) give exactly zero.
 */
export function evaluateTarget<T>(name: TargetName, F: Field<T>, k: Kin<T>, helicities: number[]): T {
  const n = helicities.length
  const spin = name === 'feynman' ? 0 : name === 'parke-taylor' || name === 'berends-giele' ? 1 : 2
  if (helicities.some((h) => Math.abs(h) !== spin)) {
    const what = spin === 0 ? 'scalars (helicity 0)' : spin === 1 ? 'gluons (helicity ±1)' : 'gravitons (helicity ±2)'
    throw new PhysicsError('target', `${name} applies to ${what} only`)
  }
  if (spin > 0 && n >= 4) {
    const m = countNeg(helicities)
    if (m < 2 || n - m < 2) return F.zero
  }
  switch (name) {
    case 'parke-taylor':
      return parkeTaylor(F, k, helicities)
    case 'berends-giele':
      return berendsGiele(F, k, helicities)
    case 'hodges':
      return hodges(F, k, helicities)
    case 'klt':
      return klt(F, k, helicities)
    case 'feynman':
      return cubicScalarFeynman(F, k)
  }
}

export { parkeTaylor, berendsGiele, hodges, klt, cubicScalarFeynman }
