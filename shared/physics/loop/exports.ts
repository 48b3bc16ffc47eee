// Exports of a loop-cut result, as the tree exports do (shared/editor/exports.ts): CSV with a
// '#' provenance line, full values (exact fractions as they are), every cell through the OWASP
// leading-quote rule; JSON as the whole response with a format name, version and the request.
import { neutraliseCell } from '../../csv-safe'
import type { LoopCutRequest, LoopCutResponse } from '../../schemas/loop-cuts'

type Wire = [number, number] | [string, string]

const csvCell = (raw: string) => {
  const s = neutraliseCell(raw)
  return /[",\n\r]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s
}
const part = (c: Wire | null | undefined, k: 0 | 1) => (c ? String(c[k]) : '')
const half = (h: number) => (Number.isInteger(h) ? String(h) : `${h < 0 ? '-' : ''}${Math.abs(h * 2)}/2`)
const corners = (cs: number[][]) => cs.map((c) => `{${c.join(' ')}}`).join(' ')

export const LOOP_CSV_HEAD = ['row', 'box', 'corners', 'kind', 'states', 'solution', 'helicities', 'multiplicity', 'value_re', 'value_im', 'target_re', 'target_im', 'deviation', 'verdict'] as const

/** One row per term (solution, line helicities h₁..h₄, multiplicity, value), one per box total, then the infrared rows and the sum. */
export function loopCutsCsv(r: LoopCutResponse): string {
  const rows: string[][] = []
  r.boxes.forEach((b, i) => {
    for (const t of b.terms) rows.push(['term', String(i + 1), corners(b.corners), b.kind, b.states, String(t.solution), `(${t.helicities.map(half).join(' ')})`, String(t.multiplicity), part(t.value, 0), part(t.value, 1), '', '', '', ''])
    rows.push(['box', String(i + 1), corners(b.corners), b.kind, b.states, '', '', '', part(b.value, 0), part(b.value, 1), part(b.target, 0), part(b.target, 1), b.deviation === null ? '' : String(b.deviation), b.verdict])
  })
  if (r.sum) rows.push(['sum', '', '', '', '', '', '', '', part(r.sum, 0), part(r.sum, 1), part(r.targetSum, 0), part(r.targetSum, 1), '', ''])
  for (const x of r.infrared?.rows ?? []) rows.push(['infrared', '', x.invariant, '', '', '', '', '', part(x.value, 0), part(x.value, 1), part(x.target, 0), part(x.target, 1), String(x.deviation), x.verdict])
  const meta = `# loop cuts, helicities (${r.helicities.join(' ')}), ${r.arithmetic} arithmetic, corners ${r.corners}, states ${r.states}, tree ${part(r.tree, 0)} ${part(r.tree, 1)}, verdict ${r.verdict}`
  return [meta, LOOP_CSV_HEAD.join(','), ...rows.map((row) => row.map(csvCell).join(','))].join('\n') + '\n'
}

/** The JSON export: the response itself, named and versioned, with the request that made it. */
export function loopCutsJson(r: LoopCutResponse, request?: Partial<LoopCutRequest>): string {
  return JSON.stringify({ format: 'polewright-loop-cuts', formatVersion: 1, request: request ?? null, result: r }, null, 2) + '\n'
}
