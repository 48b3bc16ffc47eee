// Exports of a loop-cut result and of a loop-cut diagram's check, as the tree exports do
// (shared/editor/exports.ts): CSV with a '#' provenance line, full values (exact fractions as they are), every cell through the OWASP
// leading-quote rule; JSON as the whole response with a format name, version and the request.
import { neutraliseCell } from '../../csv-safe'
import type { LoopCutRequest, LoopCutResponse } from '../../schemas/loop-cuts'
import type { LoopCutDrawingResult } from '../../editor/loop-cut-check'

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

// A loop-cut diagram's check (the drawn rings, shared/editor/loop-cut-check.ts), for the editor's
// results drawer: the same cells and provenance line as the box table above.
export const LOOP_DRAWING_CSV_HEAD = ['row', 'box', 'ring', 'corners', 'kind', 'lines', 'solution', 'helicities', 'value_re', 'value_im', 'target_re', 'target_im', 'deviation', 'tolerance', 'verdict', 'target_rule', 'note'] as const

const lines = (hs: (number | null)[]) => `(${hs.map(h => (h === null ? 'open' : half(h))).join(' ')})`

/** Per drawn ring its terms (solution, h₁..h₄, value) and its ½ Σ; per drawn box its value against the target; then the sum. */
export function loopDrawingCsv(r: LoopCutDrawingResult): string {
  // float: agreement is a relative deviation at most the tolerance; exact: equality
  const tol = r.arithmetic === 'exact' ? 'exact' : String(r.tolerance ?? '')
  const rows: string[][] = []
  for (const b of r.boxes) {
    for (const g of r.rings.filter(x => x.box === b.box)) {
      for (const t of g.terms) rows.push(['term', String(b.box), String(g.ring), corners(b.corners), b.kind, lines(g.helicities), String(t.solution), `(${t.helicities.map(half).join(' ')})`, part(t.value, 0), part(t.value, 1), '', '', '', '', '', '', ''])
      rows.push(['ring', String(b.box), String(g.ring), corners(b.corners), b.kind, lines(g.helicities), '', '', part(g.value, 0), part(g.value, 1), '', '', '', '', '', '', g.summed])
    }
    rows.push(['box', String(b.box), b.rings.join(' '), corners(b.corners), b.kind, '', '', '', part(b.value, 0), part(b.value, 1), part(b.target, 0), part(b.target, 1), b.deviation === null ? '' : String(b.deviation), tol, b.verdict, b.targetRule ?? '', b.note ?? ''])
  }
  for (const m of r.missing) rows.push(['not drawn', String(m), '', '', '', '', '', '', '', '', '', '', '', '', '', '', 'not in the sum'])
  if (r.sum) rows.push(['sum', '', '', '', '', '', '', '', part(r.sum, 0), part(r.sum, 1), part(r.targetSum, 0), part(r.targetSum, 1), r.deviation === null ? '' : String(r.deviation), tol, r.verdict, '', ''])
  const rule = r.arithmetic === 'exact' ? 'agreement is equality' : `agrees when the relative deviation is <= ${tol}`
  const meta = `# loop-cut check of the drawn rings, helicities (${r.helicities.join(' ')}), ${r.arithmetic} arithmetic (${rule}), tree ${part(r.tree, 0)} ${part(r.tree, 1)}, verdict ${r.verdict}`
  return [meta, LOOP_DRAWING_CSV_HEAD.join(','), ...rows.map(row => row.map(csvCell).join(','))].join('\n') + '\n'
}

/** The JSON export of a drawn check: the result, named and versioned, with what it was run on. */
export function loopDrawingJson(r: LoopCutDrawingResult, request?: Record<string, unknown>): string {
  return JSON.stringify({ format: 'polewright-loop-cut-check', formatVersion: 1, request: request ?? null, result: r }, null, 2) + '\n'
}
