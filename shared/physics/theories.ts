// The theories the engine knows, their limits, helicities, valid shifts (CONVENTIONS.md "BCFW")
// and the default-shift rule. Data here is what the catalogue lists.
import { PhysicsError } from './errors'
import type { Arithmetic } from './field'

export type TheoryName = 'gluon' | 'graviton' | 'scalar-cubic' | 'spin'

export interface TheoryInfo {
  name: TheoryName
  label: string
  /** Colour-ordered: channels are cyclically consecutive sets; else every subset. */
  colourOrdered: boolean
  /** Largest n accepted, per arithmetic (API.md "Limits"). */
  limits: Record<Arithmetic, number>
  minLegs: number
}

export const THEORIES: Record<TheoryName, TheoryInfo> = {
  gluon: { name: 'gluon', label: 'gluons (colour-ordered)', colourOrdered: true, limits: { float: 12, exact: 9 }, minLegs: 4 },
  graviton: { name: 'graviton', label: 'gravitons', colourOrdered: false, limits: { float: 7, exact: 6 }, minLegs: 4 },
  'scalar-cubic': { name: 'scalar-cubic', label: 'cubic scalar (colour-ordered)', colourOrdered: true, limits: { float: 8, exact: 8 }, minLegs: 4 },
  spin: { name: 'spin', label: 'single species of spin s', colourOrdered: false, limits: { float: 7, exact: 6 }, minLegs: 4 },
}

/** Largest spin s offered for theory `spin` (the bracket powers grow like 3s). */
export const MAX_SPIN = 12

/** Limits as a flat list for the catalogue; spin s ≠ 2 is offered at n = 4 only. */
export const LIMITS = Object.values(THEORIES).map((t) => ({ theory: t.name, float: t.limits.float, exact: t.limits.exact, note: t.name === 'spin' ? 'spin ≠ 2: n = 4 only' : undefined }))

/** A process: theory plus the spin s its particles carry (gluon 1, graviton 2, scalar 0). */
export interface Process {
  theory: TheoryName
  /** |h| of every leg. */
  s: number
  colourOrdered: boolean
}

export function processOf(theory: TheoryName, spin?: number): Process {
  const info = THEORIES[theory]
  const s = theory === 'gluon' ? 1 : theory === 'graviton' ? 2 : theory === 'scalar-cubic' ? 0 : (spin as number)
  return { theory, s, colourOrdered: info.colourOrdered }
}

const SPECIES: Record<Exclude<TheoryName, 'spin'>, string> = { gluon: 'a gluon has helicity ±1', graviton: 'a graviton has helicity ±2', 'scalar-cubic': 'a scalar has helicity 0' }

/** Checks the process before any work (422s name the field), returns warnings. */
export function validateProcess(theory: TheoryName, helicities: number[], arithmetic: Arithmetic, spin?: number): { process: Process; warnings: string[] } {
  const warnings: string[] = []
  const n = helicities.length
  const info = THEORIES[theory]
  if (theory === 'spin') {
    if (spin === undefined) throw new PhysicsError('spin', 'theory spin needs the spin s of its particles')
    if (!Number.isInteger(spin)) {
      if (Number.isInteger(2 * spin))
        throw new PhysicsError('spin', `half-integer spin ${2 * spin}/2 is refused: the three-point exponents would be half-integers, and no cubic vertex of three identical fermions exists`)
      throw new PhysicsError('spin', `spin must be an integer, got ${spin}`)
    }
    if (spin < 0) throw new PhysicsError('spin', `spin must be non-negative, got ${spin}`)
    if (spin > MAX_SPIN) throw new PhysicsError('spin', `spin ${spin} exceeds the limit of ${MAX_SPIN}`)
    if (spin !== 2 && n !== 4) throw new PhysicsError('helicities', `for spin ${spin} only n = 4 (the four-particle test) is offered, got n = ${n}`)
    if (spin % 2 === 1)
      warnings.push(`spin ${spin}: the three-point block is antisymmetric under exchange of two identical legs; Bose symmetry would force its coupling to vanish without structure constants (evaluated as written)`)
  } else if (spin !== undefined) {
    warnings.push(`spin: ignored for theory ${theory}`)
  }
  if (n < info.minLegs) throw new PhysicsError('helicities', `at least ${info.minLegs} legs are needed for on-shell recursion, got ${n}`)
  const limit = info.limits[arithmetic]
  if (n > limit) throw new PhysicsError('helicities', `${n} legs exceed the limit of ${limit} for ${info.label} in ${arithmetic} arithmetic`)
  const process = processOf(theory, spin)
  helicities.forEach((h, i) => {
    if (Math.abs(h) !== process.s || (process.s === 0 && h !== 0)) {
      const what = theory === 'spin' ? `a spin-${process.s} particle has helicity ${process.s === 0 ? '0' : `±${process.s}`}` : SPECIES[theory]
      throw new PhysicsError(`helicities[${i}]`, `${what}, got ${h}`)
    }
  })
  return { process, warnings }
}

/**
 * Tree-level vanishing classes (gluons, gravitons; n ≥ 4, fewer than two minus or fewer than two
 * plus helicities) — zero by the supersymmetric Ward identities (common practice).
 */
export function vanishes(p: Process, helicities: readonly number[]): boolean {
  if (p.theory !== 'gluon' && p.theory !== 'graviton' && !(p.theory === 'spin' && p.s === 2)) return false
  if (helicities.length < 4) return false
  let minus = 0
  for (const h of helicities) if (h < 0) minus++
  return minus < 2 || helicities.length - minus < 2
}

function adjacent(n: number, i: number, j: number): boolean {
  return (i - j + n) % n === 1 || (j - i + n) % n === 1
}

/** Validity of the [i,j⟩ shift (0-based) from the table in CONVENTIONS.md. */
export function isValidShift(p: Process, helicities: readonly number[], i: number, j: number): boolean {
  if (p.theory === 'scalar-cubic') return !adjacent(helicities.length, i, j)
  // one scalar species, every channel: some diagram never sees the shift, A(z) → constant
  if (p.s === 0) return false
  return !(helicities[i]! > 0 && helicities[j]! < 0)
}

/**
 * Large-z exponent of A(z) under [i,j⟩ by CONVENTIONS.md's table (common practice, measured);
 * null where the table has no entry (spin s ≠ 2).
 */
export function tableExponent(p: Process, helicities: readonly number[], i: number, j: number): number | null {
  const n = helicities.length
  const bad = helicities[i]! > 0 && helicities[j]! < 0
  if (p.theory === 'scalar-cubic') return adjacent(n, i, j) ? 0 : -2
  if (p.theory === 'gluon') return adjacent(n, i, j) ? (bad ? 3 : -1) : bad ? 2 : -2
  if (p.s === 2) return bad ? 6 : -2
  if (p.s === 0) return 0
  return null
}

/**
 * The default-shift rule (0-based): gluons, gravitons and spin s (the graviton rule) shift
 * [i, i+1⟩ with i the first negative-helicity leg — an [−,±⟩ shift, valid by the table (with no
 * negative leg, [1,2⟩); the cubic scalar shifts [1,3⟩ (non-adjacent for n ≥ 4).
 */
export function defaultShift(p: Process, helicities: readonly number[]): [number, number] {
  const n = helicities.length
  if (p.theory === 'scalar-cubic') return [0, 2]
  const i = helicities.findIndex((h) => h < 0)
  if (i < 0) return [0, 1]
  return [i, (i + 1) % n]
}

/** Checks a user's 1-based shift, returns it 0-based. */
export function checkShift(shift: [number, number], n: number): [number, number] {
  for (const l of shift) {
    if (!Number.isInteger(l) || l < 1 || l > n) throw new PhysicsError('shift', `leg ${l} does not exist (legs are 1..${n})`)
  }
  if (shift[0] === shift[1]) throw new PhysicsError('shift', `the two shifted legs must differ, got [${shift[0]}, ${shift[1]}]`)
  return [shift[0] - 1, shift[1] - 1]
}
