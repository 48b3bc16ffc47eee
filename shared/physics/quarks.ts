// Massless QCD: gluons and quarks of six flavours, colour-ordered primitive amplitudes
// (docs/conventions.md "Quarks"). Legs carry PDG codes: 21 gluon, f = 1..6 a quark of flavour f,
// −f its antiquark. Everything a theory entry needs for several species lives here.
import { PhysicsError } from './errors'
import type { Leg, Species } from './theories'

export const GLUON_PDG = 21
export const MAX_FLAVOUR = 6
/** Quark lines a process may hold (one per flavour). */
export const MAX_QUARK_LINES = 2

const FLAVOURS = Array.from({ length: MAX_FLAVOUR }, (_, t) => t + 1)

/** The species of the qcd theory, gluon first (its spin is the process's `s`). */
export const QCD_SPECIES: Species[] = [
  { name: 'g', spin: 1, colourOrdered: true, pdg: GLUON_PDG, latex: 'g' },
  ...FLAVOURS.map((f) => ({ name: `q${f}`, spin: 1 / 2, colourOrdered: true, pdg: f, latex: `q_{${f}}` })),
  ...FLAVOURS.map((f) => ({ name: `qbar${f}`, spin: 1 / 2, colourOrdered: true, pdg: -f, latex: `\\bar q_{${f}}` })),
]

const BY_NAME = new Map(QCD_SPECIES.map((s) => [s.name, s]))
const BY_PDG = new Map(QCD_SPECIES.map((s) => [s.pdg!, s.name]))
// single-species theories keep their names (a gluon leg of theory gluon is "gluon")
BY_NAME.set('gluon', { ...QCD_SPECIES[0]!, name: 'gluon' })

/** PDG code of a species name (gluon names of both theories give 21). */
export function pdgOfSpecies(name: string): number {
  const s = BY_NAME.get(name)
  if (!s) throw new PhysicsError('species', `unknown species ${name}`)
  return s.pdg!
}

export function speciesOfPdg(code: number): string {
  const s = BY_PDG.get(code)
  if (!s) throw new PhysicsError('species', `no species has the particle code ${code}`)
  return s
}

export const isQuarkCode = (c: number) => c !== GLUON_PDG && Math.abs(c) >= 1 && Math.abs(c) <= MAX_FLAVOUR

/** Checks the species and helicities of a qcd process (422s name the field); returns warnings. */
export function checkQcdSpecies(legs: readonly Leg[]): string[] {
  const seen = new Map<number, number>()
  legs.forEach((l, t) => {
    const s = BY_NAME.get(l.species)
    if (!s || l.species === 'gluon') throw new PhysicsError(`species[${t}]`, `unknown species ${l.species} (g, q1..q6, qbar1..qbar6)`)
    if (Math.abs(l.h) !== s.spin) throw new PhysicsError(`helicities[${t}]`, `a ${s.spin === 1 ? 'gluon' : 'quark'} has helicity ${s.spin === 1 ? '±1' : '±1/2'}, got ${l.h}`)
    if (s.pdg !== GLUON_PDG) {
      if (seen.has(s.pdg!)) throw new PhysicsError(`species[${t}]`, `${l.species} appears twice; each flavour forms at most one quark line (two lines of one flavour: the difference of two requests with the quarks' flavours swapped)`)
      seen.set(s.pdg!, t)
    }
  })
  for (const [c, t] of seen) if (!seen.has(-c)) throw new PhysicsError(`species[${t}]`, `${speciesOfPdg(c)} has no partner ${speciesOfPdg(-c)}: a quark line needs both ends`)
  if (seen.size > 2 * MAX_QUARK_LINES) throw new PhysicsError('species', `at most ${MAX_QUARK_LINES} quark lines are offered, got ${seen.size / 2}`)
  const warnings: string[] = []
  for (const [c, t] of seen) if (c > 0 && legs[seen.get(-c)!]!.h === legs[t]!.h) warnings.push(`the quark line of flavour ${c} has equal helicities at both ends, so the amplitude vanishes (helicity is conserved along a massless quark line)`)
  if (linesCross(legs.map(codeOf))) warnings.push('the two quark lines cross in the colour order (their ends alternate: flavours a, b, a, b around the cycle), so the colour-ordered amplitude vanishes: no planar diagram has them')
  return warnings
}

const codeOf = (l: Leg) => pdgOfSpecies(l.species)

/** Two quark lines whose ends interleave in the cyclic order (1, 2, 1, 2): no planar diagram. */
export function linesCross(pdg: readonly number[]): boolean {
  let a = 0, b = 0, c = 0, count = 0
  for (const x of pdg) {
    if (!isQuarkCode(x)) continue
    if (count === 0) a = Math.abs(x)
    else if (count === 2) c = Math.abs(x)
    else if (count === 1) b = Math.abs(x)
    count++
  }
  return count === 4 && a === c && a !== b
}

/**
 * The two quarks' flavours swapped (antiquarks kept): with two lines of one flavour the amplitude
 * is A(pdg) − A(exchangedFlavours(pdg)), each term an amplitude of two different flavours
 * (docs/conventions.md "Two quark lines").
 */
export function exchangedFlavours(pdg: readonly number[]): number[] {
  const qs = pdg.flatMap((c, t) => (isQuarkCode(c) && c > 0 ? [t] : []))
  if (qs.length !== 2) throw new PhysicsError('species', 'exchanging flavours needs exactly two quarks')
  const out = pdg.slice()
  out[qs[0]!] = pdg[qs[1]!]!
  out[qs[1]!] = pdg[qs[0]!]!
  return out
}

/** The same-flavour amplitude from the two different-flavour ones (`amplitude` of a leg list's codes). */
export function sameFlavourValue<T>(sub: (a: T, b: T) => T, amplitude: (pdg: number[]) => T, pdg: readonly number[]): T {
  return sub(amplitude(pdg.slice()), amplitude(exchangedFlavours(pdg)))
}

/**
 * Zero at tree level: a quark line with equal helicities at its two (outgoing) ends, n ≥ 4 with
 * fewer than two negative or two positive helicities (supersymmetric Ward identities, common
 * practice), or two quark lines crossing in the colour order.
 */
export function qcdVanishes(legs: readonly Leg[]): boolean {
  const n = legs.length
  const hOf = new Map<number, number>()
  let minus = 0
  for (const l of legs) {
    const c = codeOf(l)
    if (c !== GLUON_PDG) {
      const other = hOf.get(-c)
      if (other !== undefined && other === l.h) return true
      hOf.set(c, l.h)
    }
    if (l.h < 0) minus++
  }
  return (n >= 4 && (minus < 2 || n - minus < 2)) || linesCross(legs.map(codeOf))
}

function adjacent(n: number, i: number, j: number): boolean {
  return (i - j + n) % n === 1 || (j - i + n) % n === 1
}

/**
 * The rise above the gluon base (−1 adjacent, −2 not) of A(z) under [i,j⟩, by the helicity type of
 * leg i (λ̃ shifted) and leg j (λ shifted): g± a gluon, f± a quark or antiquark (the same for both).
 * Measured by the exact probe with the quark-line Berends–Giele current as A(z) at n = 5, 6, for
 * every position of the line (docs/conventions.md "Falloff"). Two quarks of different lines:
 * TWO_LINE_EXPONENT.
 */
export const QCD_FALLOFF_RISE: Record<string, number> = {
  'g-g-': 0, 'g-g+': 0, 'g-f-': 0, 'g-f+': 0,
  'g+g+': 0, 'g+g-': 4, 'g+f+': 1, 'g+f-': 3,
  'f+g+': 0, 'f+g-': 3, 'f+f-': 3,
  'f-g+': 0, 'f-g-': 1, 'f-f+': 1,
}

/**
 * Shifts of two quarks of different lines: +1 for [f+, f−⟩ and −1 for the other three types,
 * adjacent or not. Measured by the exact probe with A(z) from the quark-lines Berends–Giele
 * current at n = 4, 5, 6: the largest exponent seen per type (some positions fall off faster,
 * so for two lines the entry is a bound; validity, its sign, is exact).
 */
export const TWO_LINE_EXPONENT: Record<'f+f-' | 'other', number> = { 'f+f-': 1, 'other': -1 }

const typeOf = (l: Leg) => `${isQuarkCode(codeOf(l)) ? 'f' : 'g'}${l.h > 0 ? '+' : '-'}`

/** Two quark legs of different lines. */
function otherLines(legs: readonly Leg[], i: number, j: number): boolean {
  const a = codeOf(legs[i]!)
  const b = codeOf(legs[j]!)
  return isQuarkCode(a) && isQuarkCode(b) && Math.abs(a) !== Math.abs(b)
}

/** Large-z exponent of A(z) under [i,j⟩ (0-based) by the measured table; null where it has none. */
export function qcdFalloff(legs: readonly Leg[], i: number, j: number): number | null {
  const key = typeOf(legs[i]!) + typeOf(legs[j]!)
  if (otherLines(legs, i, j)) return key === 'f+f-' ? TWO_LINE_EXPONENT['f+f-'] : TWO_LINE_EXPONENT.other
  const rise = QCD_FALLOFF_RISE[key]
  if (rise === undefined) return null
  return (adjacent(legs.length, i, j) ? -1 : -2) + rise
}

/**
 * [i, i+1⟩ from the first negative leg when valid, else the first valid adjacent, else any valid
 * pair; pairs of quarks of two lines come last (kept from when their entries were measured at
 * n = 4 only: the default shifts stay what they were).
 */
export function qcdDefaultShift(legs: readonly Leg[]): [number, number] {
  const n = legs.length
  const valid = (i: number, j: number) => (qcdFalloff(legs, i, j) ?? 0) < 0
  let late: [number, number] | null = null
  const ok = (i: number, j: number) => {
    if (!valid(i, j)) return false
    if (!otherLines(legs, i, j)) return true
    late ??= [i, j]
    return false
  }
  const m = legs.findIndex((l) => l.h < 0)
  if (m >= 0 && ok(m, (m + 1) % n)) return [m, (m + 1) % n]
  for (let a = 0; a < n; a++) for (const [i, j] of [[a, (a + 1) % n], [(a + 1) % n, a]] as [number, number][]) if (ok(i, j)) return [i, j]
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) if (i !== j && ok(i, j)) return [i, j]
  return late ?? [0, 1]
}
