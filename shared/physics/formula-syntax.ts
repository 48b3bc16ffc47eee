// The formula language's own table: what the compiler (formula.ts) reads, with an example per
// form. The compiler normalises typed characters through FORMULA_ALIASES, and the syntax
// reference in the editor and on the help page is drawn from FORMULA_SYNTAX; a unit test compiles
// every example and compares its LaTeX, so the reference cannot drift from the compiler.
// No mathjs here: the pages import this file without the parser.

/** Characters a user may type (or paste) for an ASCII character of the grammar; one for one, so positions stay. */
export const FORMULA_ALIASES: ReadonlyArray<{ ascii: string, typed: readonly string[], what: string }> = [
  { ascii: '<', typed: ['⟨', '〈', '〈'], what: 'opening angle bracket' },
  { ascii: '>', typed: ['⟩', '〉', '〉'], what: 'closing angle bracket' },
  { ascii: '-', typed: ['−'], what: 'minus' },
  { ascii: '*', typed: ['·', '×'], what: 'times' },
]

const ALIAS = new Map(FORMULA_ALIASES.flatMap(a => a.typed.map(t => [t, a.ascii] as const)))

/** The formula with every typed alias replaced by its ASCII character (same length, same positions). */
export function normaliseFormula(src: string): string {
  let out = ''
  for (let k = 0; k < src.length; k++) out += ALIAS.get(src[k]!) ?? src[k]!
  return out
}

export interface FormulaSyntaxRow {
  /** The form as the user types it. */
  form: string
  /** Other spellings the compiler accepts for it. */
  also: string[]
  meaning: string
  /** An example for EXAMPLE_LEGS legs, and its LaTeX as the compiler renders it. */
  example: string
  tex: string
}

/** The number of legs the examples are written for. */
export const FORMULA_EXAMPLE_LEGS = 5

export const FORMULA_SYNTAX: readonly FormulaSyntaxRow[] = [
  {
    form: '<i j>', also: ['<ij> (legs up to 9)', '<i,j>', '⟨i j⟩', '⟨ij⟩'],
    meaning: 'angle bracket of legs i and j',
    example: '⟨12⟩', tex: '\\langle 1\\,2\\rangle',
  },
  {
    form: '[i j]', also: ['[ij] (legs up to 9)', '[i,j]'],
    meaning: 'square bracket of legs i and j',
    example: '[3 4]', tex: '[3\\,4]',
  },
  {
    form: 's(i,j,…)', also: ['s(ijk) (legs up to 9)'],
    meaning: 'Mandelstam invariant (p_i + p_j + …)², s(i,j) = ⟨ij⟩[ji]',
    example: 's(1,2,3)', tex: 's_{123}',
  },
  {
    form: '<i|P|j]', also: ['[j|P|i>', '⟨i|P|j]'],
    meaning: 'sandwich ⟨i|P|j] = Σ over l in P of ⟨il⟩[lj], P a sum of legs k+l+…',
    example: '<1|2+3|4]', tex: '\\langle 1|2+3|4]',
  },
  {
    form: 'A(σ1,…,σn)', also: ['A(σ1σ2…) (legs up to 9)'],
    meaning: 'the amplitude of the same process with its legs in the order σ, every leg once (BCFW, default shift)',
    example: 'A(2,1,3,4,5)', tex: 'A(2,1,3,4,5)',
  },
  {
    form: '+ − * / ^k ( )', also: ['juxtaposition multiplies', '· and × for *'],
    meaning: 'arithmetic; exponents are integers, |k| ≤ 64',
    example: '⟨12⟩^4/(⟨12⟩⟨23⟩⟨34⟩⟨45⟩⟨51⟩)',
    tex: '\\frac{{\\langle 1\\,2\\rangle}^{4}}{\\langle 1\\,2\\rangle~\\langle 2\\,3\\rangle~\\langle 3\\,4\\rangle~\\langle 4\\,5\\rangle~\\langle 5\\,1\\rangle}',
  },
  {
    form: '2, 0.5, 1e-3', also: [],
    meaning: 'numbers; decimals stay exact in exact arithmetic',
    example: '1/2 s(1,2)', tex: '\\frac{1}{2}~s_{12}',
  },
]
