// The exports of a loop-cut diagram's check (the editor's results drawer): the CSV read back by
// papaparse has one row per term, ring, box and the sum, with the tolerance and verdict arithmetic;
// a ring's value is ½ Σ of its terms over both cut solutions (the quadruple cut of Britto, Cachazo,
// Feng, hep-th/0412103), summed with fraction.js; the box agrees with the N = 4 coefficient −st A_tree
// (Bern, Dixon, Dunbar, Kosower, hep-ph/9403226); cells go through the CSV-injection rule.
import { describe, expect, it } from 'vitest'
import Papa from 'papaparse'
import Fraction from 'fraction.js'
import { boxRings, validateLoopCut } from '#shared/editor/loop-cut'
import { checkLoopCutDrawing, compileRings, type LoopCutDrawingResult } from '#shared/editor/loop-cut-check'
import { LOOP_DRAWING_CSV_HEAD, loopDrawingCsv, loopDrawingJson } from '#shared/physics/loop/exports'

function drawn(h: number[], arithmetic: 'float' | 'exact'): LoopCutDrawingResult {
  const p = { theory: 'gluon' as const, helicities: h }
  const g = boxRings(p)
  const v = validateLoopCut(g.nodes, g.edges, p)
  return checkLoopCutDrawing({ helicities: h, arithmetic, kinematics: { kind: arithmetic === 'exact' ? 'rational' : 'random', seed: 2 } }, compileRings(v.rings))
}
function read(csv: string) {
  const [meta, ...rest] = csv.split('\n')
  const parsed = Papa.parse<Record<string, string>>(rest.join('\n'), { header: true, skipEmptyLines: true })
  expect(parsed.errors).toEqual([])
  return { meta: meta!, fields: parsed.meta.fields, rows: parsed.data }
}

describe('loopDrawingCsv', () => {
  it('four gluons −−++, exact: terms, the ring as ½ Σ of them, the box equal to its target', () => {
    const r = drawn([-1, -1, 1, 1], 'exact')
    const { meta, fields, rows } = read(loopDrawingCsv(r))
    expect(meta).toMatch(/^# loop-cut check of the drawn rings, helicities \(-1 -1 1 1\), exact arithmetic \(agreement is equality\), .*verdict agrees$/)
    expect(fields).toEqual([...LOOP_DRAWING_CSV_HEAD])
    const terms = rows.filter(x => x.row === 'term')
    const ring = rows.find(x => x.row === 'ring')!
    const box = rows.find(x => x.row === 'box')!
    expect(terms.length).toBe(r.rings[0]!.terms.length)
    expect(terms.length).toBeGreaterThan(0)
    for (const t of terms) {
      expect(t.solution).toMatch(/^[12]$/)
      expect(t.helicities).toMatch(/^\((-?\d+(\/2)? ){3}-?\d+(\/2)?\)$/)
      expect(t.lines).toBe('(open open open open)')
    }
    const half = terms.reduce((acc, t) => acc.add(new Fraction(t.value_re!)), new Fraction(0)).div(2)
    expect(half.equals(new Fraction(ring.value_re!))).toBe(true)
    expect(ring.note).toBe('open')
    expect(box).toMatchObject({ box: '1', ring: '1', corners: '{1} {2} {3} {4}', kind: 'zero-mass', tolerance: 'exact', verdict: 'agrees', target_rule: '−st A_tree', deviation: '0' })
    expect(new Fraction(box.value_re!).equals(new Fraction(box.target_re!))).toBe(true)
    expect(new Fraction(box.value_re!).equals(new Fraction(ring.value_re!))).toBe(true)
    const sum = rows.find(x => x.row === 'sum')!
    expect(sum).toMatchObject({ value_re: box.value_re, target_re: box.target_re, verdict: 'agrees', tolerance: 'exact' })
  })

  it('five gluons, float: every box within the tolerance it names; a box not drawn gets its row', () => {
    const full = drawn([-1, -1, 1, 1, 1], 'float')
    const r: LoopCutDrawingResult = { ...full, boxes: full.boxes.slice(1), rings: full.rings.filter(x => x.box !== 1), missing: [1] }
    const { meta, rows } = read(loopDrawingCsv(r))
    expect(meta).toContain(`float arithmetic (agrees when the relative deviation is <= ${full.tolerance})`)
    const boxes = rows.filter(x => x.row === 'box')
    expect(boxes.map(b => b.box)).toEqual(['2', '3', '4', '5'])
    for (const b of boxes) {
      expect(Number(b.deviation)).toBeLessThanOrEqual(Number(b.tolerance))
      expect(b).toMatchObject({ kind: 'one-mass', verdict: 'agrees', target_rule: '−½ st A_tree' })
    }
    expect(rows.filter(x => x.row === 'not drawn')).toEqual([expect.objectContaining({ box: '1', note: 'not in the sum' })])
  })

  it('a cell that would start a spreadsheet formula is neutralised; quotes and commas survive', () => {
    const r = drawn([-1, -1, 1, 1], 'float')
    const bad: LoopCutDrawingResult = { ...r, boxes: [{ ...r.boxes[0]!, note: '=HYPERLINK("http://x.test","a, b")' }] }
    const csv = loopDrawingCsv(bad)
    expect(csv).toContain('"\'=HYPERLINK(""http://x.test"",""a, b"")"')
    const box = read(csv).rows.find(x => x.row === 'box')!
    expect(box.note).toBe('\'=HYPERLINK("http://x.test","a, b")')
  })
})

describe('loopDrawingJson', () => {
  it('names its format and keeps the request and the whole result', () => {
    const r = drawn([-1, -1, 1, 1], 'exact')
    const request = { diagram: { id: 4, title: 'Box', version: 2 }, arithmetic: 'exact' }
    const back = JSON.parse(loopDrawingJson(r, request))
    expect(back).toEqual({ format: 'polewright-loop-cut-check', formatVersion: 1, request, result: JSON.parse(JSON.stringify(r)) })
  })
})
