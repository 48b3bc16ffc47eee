// The theory registry: every fact about a theory lives in its entry here — its particle species,
// limits, the valid-shift rule and falloff table (docs/conventions.md "Falloff"), the default
// shift and the vanishing classes. The zod enums, the catalogue, the batch runner and the editor
// derive from it; adding a theory is adding an entry (DEVELOPERS.md "Adding a theory").
import { PhysicsError } from './errors'
import type { Arithmetic } from './field'
import { QCD_SPECIES, qcdDefaultShift, qcdFalloff, qcdVanishes, checkQcdSpecies, pdgOfSpecies, speciesOfPdg } from './quarks'

/** The theory names, in catalogue order (a tuple so zod can build its enum from it). */
export const THEORY_NAMES = ['gluon', 'graviton', 'scalar-cubic', 'spin', 'qcd'] as const
export type TheoryName = (typeof THEORY_NAMES)[number]

/** A particle species a theory's legs may carry. */
export interface Species {
  name: string
  /** |h| of the species; null for the `spin` theory, whose spin the request gives. */
  spin: number | null
  /** Carries colour: channels of amplitudes with it are cyclically consecutive sets. */
  colourOrdered: boolean
  /** Particle code of the species in point files (PDG numbering), null when none is standard. */
  pdg: number | null
  /** LaTeX letter for the species in exports. */
  latex: string
}

/** One external leg: its species (a name from the theory's `species`) and helicity. */
export interface Leg {
  species: string
  h: number
}

/** Largest n per use: evaluation in float and in exact arithmetic, exact falloff measurement. */
export interface Limits {
  float: number
  exact: number
  /** Largest n for which POST /api/shifts measures every exponent (`measure: true`). */
  measure: number
}

export interface TheoryInfo {
  name: TheoryName
  label: string
  /** The particles in words, as a sentence names them ("gluons"). */
  particles: string
  /** LaTeX letter of the amplitude in exports (A_n, M_n for gravity). */
  amplitudeLatex: string
  species: Species[]
  /** Colour-ordered: channels are cyclically consecutive sets; else every subset. */
  colourOrdered: boolean
  limits: Limits
  minLegs: number
  /** The request must give `spin` (the species' |h|). */
  needsSpin: boolean
  /** The allowed helicities, in words, for the catalogue. */
  helicityRule: string
  /** Large-z exponent of A(z) under [i,j⟩ (0-based; common practice, measured); null: no entry. */
  falloff(legs: readonly Leg[], i: number, j: number): number | null
  /** The [i,j⟩ shift has no boundary term by the table. */
  validShift(legs: readonly Leg[], i: number, j: number): boolean
  /** The shift used when the request names none (0-based). */
  defaultShift(legs: readonly Leg[]): [number, number]
  /** The amplitude vanishes identically at tree level. */
  vanishes(legs: readonly Leg[], s: number): boolean
}

function adjacent(n: number, i: number, j: number): boolean {
  return (i - j + n) % n === 1 || (j - i + n) % n === 1
}

/** [+,−⟩ is the shift with a boundary term for gluons and gravitons. */
const plusMinus = (legs: readonly Leg[], i: number, j: number) => legs[i]!.h > 0 && legs[j]!.h < 0

/**
 * Fewer than two minus or fewer than two plus helicities at n ≥ 4: zero by the supersymmetric
 * Ward identities (common practice).
 */
function helicityVanishing(legs: readonly Leg[]): boolean {
  if (legs.length < 4) return false
  let minus = 0
  for (const l of legs) if (l.h < 0) minus++
  return minus < 2 || legs.length - minus < 2
}

/** [i, i+1⟩ with i the first negative-helicity leg, an [−,±⟩ shift ([1,2⟩ with none). */
function firstMinusShift(legs: readonly Leg[]): [number, number] {
  const i = legs.findIndex((l) => l.h < 0)
  return i < 0 ? [0, 1] : [i, (i + 1) % legs.length]
}

const gravityFalloff = (legs: readonly Leg[], i: number, j: number) => (plusMinus(legs, i, j) ? 6 : -2)

export const THEORIES: Record<TheoryName, TheoryInfo> = {
  'gluon': {
    name: 'gluon',
    amplitudeLatex: 'A',
    particles: 'gluons',
    label: 'gluons (colour-ordered)',
    species: [{ name: 'gluon', spin: 1, colourOrdered: true, pdg: 21, latex: 'g' }],
    colourOrdered: true,
    limits: { float: 12, exact: 9, measure: 7 },
    minLegs: 4,
    needsSpin: false,
    helicityRule: '±1',
    falloff: (legs, i, j) => {
      const bad = plusMinus(legs, i, j)
      return adjacent(legs.length, i, j) ? (bad ? 3 : -1) : bad ? 2 : -2
    },
    validShift: (legs, i, j) => !plusMinus(legs, i, j),
    defaultShift: firstMinusShift,
    vanishes: helicityVanishing,
  },
  'graviton': {
    name: 'graviton',
    amplitudeLatex: 'M',
    particles: 'gravitons',
    label: 'gravitons',
    species: [{ name: 'graviton', spin: 2, colourOrdered: false, pdg: 39, latex: 'h' }],
    colourOrdered: false,
    limits: { float: 7, exact: 6, measure: 6 },
    minLegs: 4,
    needsSpin: false,
    helicityRule: '±2',
    falloff: gravityFalloff,
    validShift: (legs, i, j) => !plusMinus(legs, i, j),
    defaultShift: firstMinusShift,
    vanishes: helicityVanishing,
  },
  'scalar-cubic': {
    name: 'scalar-cubic',
    amplitudeLatex: 'A',
    particles: 'cubic scalars',
    label: 'cubic scalar (colour-ordered)',
    species: [{ name: 'scalar', spin: 0, colourOrdered: true, pdg: null, latex: '\\phi' }],
    colourOrdered: true,
    limits: { float: 8, exact: 8, measure: 8 },
    minLegs: 4,
    needsSpin: false,
    helicityRule: '0',
    falloff: (legs, i, j) => (adjacent(legs.length, i, j) ? 0 : -2),
    validShift: (legs, i, j) => !adjacent(legs.length, i, j),
    defaultShift: () => [0, 2], // [1,3⟩: non-adjacent for n ≥ 4
    vanishes: () => false,
  },
  'spin': {
    name: 'spin',
    amplitudeLatex: 'A',
    particles: 'this spin-s species',
    label: 'single species of spin s',
    species: [{ name: 'spin', spin: null, colourOrdered: false, pdg: null, latex: '\\varphi' }],
    colourOrdered: false,
    limits: { float: 7, exact: 6, measure: 6 },
    minLegs: 4,
    needsSpin: true,
    helicityRule: '±s (integer s given as `spin`; s ≠ 2 only at n = 4)',
    // Spin 2 is the graviton; the table has no entry for any other s.
    // spin 0 (one scalar species, every channel): some diagram never sees the shift, A(z) → constant
    falloff: (legs, i, j) => (Math.abs(legs[0]!.h) === 2 ? gravityFalloff(legs, i, j) : legs[0]!.h === 0 ? 0 : null),
    validShift: (legs, i, j) => legs[0]!.h !== 0 && !plusMinus(legs, i, j),
    defaultShift: firstMinusShift,
    vanishes: (legs, s) => s === 2 && helicityVanishing(legs),
  },
  'qcd': {
    name: 'qcd',
    amplitudeLatex: 'A',
    particles: 'gluons and massless quarks',
    label: 'QCD: gluons and massless quarks (colour-ordered)',
    species: QCD_SPECIES,
    colourOrdered: true,
    limits: { float: 10, exact: 8, measure: 7 },
    minLegs: 4,
    needsSpin: false,
    helicityRule: 'gluons ±1, quarks and antiquarks ±1/2; each quark line q_f, qbar_f once per flavour, at most two lines',
    falloff: qcdFalloff,
    validShift: (legs, i, j) => (qcdFalloff(legs, i, j) ?? 0) < 0,
    defaultShift: qcdDefaultShift,
    vanishes: qcdVanishes,
  },
}

/** Largest spin s offered for theory `spin` (the bracket powers grow like 3s). */
export const MAX_SPIN = 12

/** Limits as a flat list for the catalogue; spin s ≠ 2 is offered at n = 4 only. */
export const LIMITS = Object.values(THEORIES).map((t) => ({ theory: t.name, float: t.limits.float, exact: t.limits.exact, note: t.name === 'spin' ? 'spin ≠ 2: n = 4 only' : undefined }))

/** Largest n for measured falloff tables, per theory. */
export const MEASURE_LIMITS = Object.fromEntries(THEORY_NAMES.map((t) => [t, THEORIES[t].limits.measure])) as Record<TheoryName, number>

/** The theories whose amplitudes carry a colour order. */
export const COLOUR_ORDERED_THEORIES: ReadonlySet<TheoryName> = new Set(THEORY_NAMES.filter((t) => THEORIES[t].colourOrdered))

export function isColourOrdered(theory: string): boolean {
  return COLOUR_ORDERED_THEORIES.has(theory as TheoryName)
}

/** |h| of a theory's particles (spin: the given s); null when the spin theory has none given. */
export function spinOf(theory: TheoryName, spin?: number): number | null {
  return THEORIES[theory].species[0]!.spin ?? spin ?? null
}

/** The single-species theory whose particles have |h| = s (the `spin` theory for any other s). */
export function theoryOfSpin(s: number): TheoryName {
  return THEORY_NAMES.find((t) => !THEORIES[t].needsSpin && THEORIES[t].species.length === 1 && THEORIES[t].species[0]!.spin === s) ?? 'spin'
}

/** The particle code a theory needs on every leg of a point file, or null when it has none. */
export function pdgOf(theory: TheoryName): number | null {
  const sp = THEORIES[theory].species
  return sp.length === 1 ? sp[0]!.pdg : null
}

/** The legs of a process from its helicities and, for several species, the species per leg (else the first). */
export function legsOf(theory: TheoryName, helicities: readonly number[], species?: readonly string[]): Leg[] {
  const first = THEORIES[theory].species[0]!.name
  return helicities.map((h, t) => ({ species: species?.[t] ?? first, h }))
}

/** A process: theory, the spin s its particles carry (gluon 1, graviton 2, scalar 0), its legs. */
export interface Process {
  theory: TheoryName
  /** |h| of every leg. */
  s: number
  colourOrdered: boolean
  /** Species and helicity per external leg (validateProcess fills them). */
  legs?: Leg[]
  /** Several species (qcd): the PDG code per external leg (21 gluon, ±1..±6 quarks). */
  pdg?: number[]
}

export function processOf(theory: TheoryName, spin?: number, helicities?: readonly number[], species?: readonly string[]): Process {
  const info = THEORIES[theory]
  const s = spinOf(theory, spin) as number
  const legs = helicities ? legsOf(theory, helicities, species) : undefined
  const pdg = legs && info.species.length > 1 ? legs.map((l) => pdgOfSpecies(l.species)) : undefined
  return { theory, s, colourOrdered: info.colourOrdered, ...(legs ? { legs } : {}), ...(pdg ? { pdg } : {}) }
}

/** Checks the process before any work (422s name the field), returns warnings. */
export function validateProcess(theory: TheoryName, helicities: number[], arithmetic: Arithmetic, spin?: number, species?: readonly string[]): { process: Process; warnings: string[] } {
  const warnings: string[] = []
  if (species !== undefined && THEORIES[theory].species.length === 1) {
    const only = THEORIES[theory].species[0]!.name
    const bad = species.findIndex((x) => x !== only)
    if (bad >= 0) throw new PhysicsError(`species[${bad}]`, `theory ${theory} has only the species ${only}, got ${species[bad]}`)
  }
  const n = helicities.length
  const info = THEORIES[theory]
  if (info.needsSpin) {
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
  }
  else if (spin !== undefined) {
    warnings.push(`spin: ignored for theory ${theory}`)
  }
  if (n < info.minLegs) throw new PhysicsError('helicities', `at least ${info.minLegs} legs are needed for on-shell recursion, got ${n}`)
  const limit = info.limits[arithmetic]
  if (n > limit) throw new PhysicsError('helicities', `${n} legs exceed the limit of ${limit} for ${info.label} in ${arithmetic} arithmetic`)
  if (species !== undefined && species.length !== n) throw new PhysicsError('species', `${species.length} species given for ${n} helicities`)
  if (theory === 'qcd') {
    warnings.push(...checkQcdSpecies(legsOf(theory, helicities, species)))
    return { process: processOf(theory, spin, helicities, species), warnings }
  }
  const process = processOf(theory, spin, helicities)
  helicities.forEach((h, i) => {
    if (Math.abs(h) !== process.s || (process.s === 0 && h !== 0)) {
      const name = info.needsSpin ? `spin-${process.s} particle` : info.species[0]!.name
      throw new PhysicsError(`helicities[${i}]`, `a ${name} has helicity ${process.s === 0 ? '0' : `±${process.s}`}, got ${h}`)
    }
  })
  return { process, warnings }
}

// The helpers below take helicities (any sub-amplitude's, not only the process's external legs)
// and, for several species, the PDG codes of the same legs (default: the process's own, when the
// lengths match).
function legsFor(p: Process, helicities: readonly number[], pdg?: readonly number[]): Leg[] {
  const codes = pdg ?? (p.pdg && p.pdg.length === helicities.length ? p.pdg : undefined)
  if (!codes) return legsOf(p.theory, helicities)
  return helicities.map((h, t) => ({ species: speciesOfPdg(codes[t]!), h }))
}

/** Tree-level vanishing by the theory's rule (gluons, gravitons: the helicity classes). */
export function vanishes(p: Process, helicities: readonly number[], pdg?: readonly number[]): boolean {
  return THEORIES[p.theory].vanishes(legsFor(p, helicities, pdg), p.s)
}

/** Validity of the [i,j⟩ shift (0-based) by the falloff table (docs/conventions.md "Falloff"). */
export function isValidShift(p: Process, helicities: readonly number[], i: number, j: number, pdg?: readonly number[]): boolean {
  return THEORIES[p.theory].validShift(legsFor(p, helicities, pdg), i, j)
}

/** Large-z exponent of A(z) under [i,j⟩ by the table; null where it has no entry (spin s ≠ 2). */
export function tableExponent(p: Process, helicities: readonly number[], i: number, j: number, pdg?: readonly number[]): number | null {
  return THEORIES[p.theory].falloff(legsFor(p, helicities, pdg), i, j)
}

/** The default shift (0-based) by the theory's rule. */
export function defaultShift(p: Process, helicities: readonly number[], pdg?: readonly number[]): [number, number] {
  return THEORIES[p.theory].defaultShift(legsFor(p, helicities, pdg))
}

/** Checks a user's 1-based shift, returns it 0-based. */
export function checkShift(shift: [number, number], n: number): [number, number] {
  for (const l of shift) {
    if (!Number.isInteger(l) || l < 1 || l > n) throw new PhysicsError('shift', `leg ${l} does not exist (legs are 1..${n})`)
  }
  if (shift[0] === shift[1]) throw new PhysicsError('shift', `the two shifted legs must differ, got [${shift[0]}, ${shift[1]}]`)
  return [shift[0] - 1, shift[1] - 1]
}
