// The parts of GET /api/catalogue the editor reads (the route returns more).
export interface CatalogueTheory {
  name: 'gluon' | 'graviton' | 'scalar-cubic' | 'spin'
  label: string
  colourOrdered: boolean
  helicities: number[] | null
  needsSpin: boolean
  minLegs: number
  limits: { float: number, exact: number }
  targets: string[]
}

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
