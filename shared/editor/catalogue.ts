// The parts of GET /api/catalogue the editor reads (the route returns more).
import { THEORIES, type TheoryName } from '../physics/theories'

export interface CatalogueTheory {
  name: TheoryName
  label: string
  colourOrdered: boolean
  helicities: number[] | null
  needsSpin: boolean
  minLegs: number
  limits: { float: number, exact: number }
  targets: string[]
}

/** The theories from the registry, for the editor before the catalogue has loaded. */
export const FALLBACK_THEORIES: CatalogueTheory[] = Object.values(THEORIES).map(t => ({
  name: t.name,
  label: t.label,
  colourOrdered: t.colourOrdered,
  helicities: t.species[0]!.spin === null ? null : t.species[0]!.spin === 0 ? [0] : [-t.species[0]!.spin, t.species[0]!.spin],
  needsSpin: t.needsSpin,
  minLegs: t.minLegs,
  limits: { float: t.limits.float, exact: t.limits.exact },
  targets: [],
}))

export interface Catalogue {
  engine: { version: string }
  theories: CatalogueTheory[]
  targets: { name: string, label: string, theories: string[], description: string, source: string }[]
  kinematics: { kind: string, label?: string, description?: string }[]
  arithmetics: { name: 'float' | 'exact', description: string, tolerance: Record<string, number> | null }[]
  formula?: { example: string, maxLength: number }
  shifts?: { notation: string, defaultRule: string }
}

/** The float tolerance the catalogue states for n legs (the largest listed beyond its table). */
export function toleranceFor(c: Catalogue | null | undefined, n: number): number | null {
  const t = c?.arithmetics.find(a => a.name === 'float')?.tolerance
  if (!t) return null
  if (t[String(n)] !== undefined) return t[String(n)]!
  const keys = Object.keys(t).map(Number).sort((a, b) => a - b)
  const k = keys.filter(x => x <= n).at(-1) ?? keys[0]
  return k === undefined ? null : t[String(k)]!
}
