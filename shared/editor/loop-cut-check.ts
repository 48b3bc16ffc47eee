// The check of a loop-cut drawing: the engine's box table of the process (loopCuts, the quadruple
// cut of Britto, Cachazo, Feng, hep-th/0412103, with the N = 4 MHV targets of Bern, Dixon,
// Dunbar, Kosower, hep-ph/9403226), then per drawn ring the terms it stands for — the solutions
// and internal helicities its open or drawn Lines allow — summed per box and compared with the
// box's target. Runs in the evaluation worker.
import { Complex, complexField, parseRational, rationalField, type Field, type Fraction, type WireNumber } from '../physics/field'
import { deviationOf } from '../physics/verdict'
import { loopCuts } from '../physics/loop/index'
import type { LoopCutBox, LoopCutRequestInput, LoopCutResponse } from '../schemas/loop-cuts'
import type { DrawnRing } from './loop-cut'

/** What the route sends the worker per ring (no node ids beyond the ring's own). */
export interface CompiledRing {
  ring: number
  box: number
  /** h_1..h_4 of the lines (engine orientation), null = open (summed). */
  helicities: (number | null)[]
  threePoint: ('angle' | 'square' | null)[]
  nodeIds: string[]
}

export const compileRings = (rings: DrawnRing[]): CompiledRing[] =>
  rings.map(r => ({ ring: r.ring, box: r.box, helicities: r.lines.map(l => l.helicity), threePoint: r.threePoint, nodeIds: r.nodeIds }))

type Verdict = LoopCutBox['verdict']

export interface DrawnRingResult {
  ring: number
  box: number
  corners: number[][]
  kind: LoopCutBox['kind']
  /** 'open': every internal helicity and both cut solutions summed; 'drawn': only the drawn ones; 'partly'. */
  helicities: (number | null)[]
  summed: 'open' | 'drawn' | 'partly'
  /** The engine's terms this ring stands for (solution 1|2, h_1..h_4, value). */
  terms: LoopCutBox['terms']
  /** ½ Σ of its terms. */
  value: WireNumber
  nodeIds: string[]
}

export interface DrawnBoxResult {
  box: number
  corners: number[][]
  kind: LoopCutBox['kind']
  rings: number[]
  /** Σ of the rings drawn for this box. */
  value: WireNumber | null
  /** The engine's coefficient of the whole box (both solutions, every helicity). */
  engineValue: WireNumber | null
  target: WireNumber | null
  targetRule: string | null
  deviation: number | null
  verdict: Verdict
  note?: string
}

/** A stored check's result is a loop cut's box table (else a tree check's response). */
export function isLoopCutResult<T extends object>(r: T): r is Extract<T, { kind: 'loop-cut' }> {
  return 'kind' in r && r.kind === 'loop-cut'
}

export interface LoopCutDrawingResult {
  kind: 'loop-cut'
  n: number
  helicities: number[]
  arithmetic: 'float' | 'exact'
  tree: WireNumber
  rings: DrawnRingResult[]
  boxes: DrawnBoxResult[]
  /** Box numbers (1-based) of the process that are not drawn. */
  missing: number[]
  /** Σ drawn and Σ targets over the drawn boxes that have a target. */
  sum: WireNumber | null
  targetSum: WireNumber | null
  deviation: number | null
  verdict: Verdict
  tolerance: number | null
  counts: LoopCutResponse['counts']
  source: string
  warnings: string[]
  ms: number
}

function fieldOf(arithmetic: 'float' | 'exact'): { F: Field<unknown>, read: (w: WireNumber) => unknown } {
  if (arithmetic === 'exact') return { F: rationalField as Field<unknown>, read: w => parseRational(String(w[0])) as Fraction }
  return { F: complexField as Field<unknown>, read: w => new Complex(Number(w[0]), Number(w[1])) }
}

export function checkLoopCutDrawing(req: LoopCutRequestInput, rings: CompiledRing[]): LoopCutDrawingResult {
  const t0 = performance.now()
  const res = loopCuts(req)
  const { F, read } = fieldOf(res.arithmetic)
  const two = F.fromInt(2)
  const ringResults: DrawnRingResult[] = rings.map((r) => {
    const b = res.boxes[r.box]!
    const terms = b.terms.filter(t => r.helicities.every((h, q) => h === null || h === t.helicities[q]))
    const value = F.div(terms.reduce<unknown>((acc, t) => F.add(acc, read(t.value)), F.zero), two)
    const open = r.helicities.filter(h => h === null).length
    return {
      ring: r.ring, box: r.box + 1, corners: b.corners, kind: b.kind, helicities: r.helicities,
      summed: open === 4 ? 'open' : open === 0 ? 'drawn' : 'partly', terms, value: F.toWire(value), nodeIds: r.nodeIds,
    }
  })
  let sum = F.zero
  let targetSum = F.zero
  let compared = 0
  const drawnBoxes = [...new Set(rings.map(r => r.box))].sort((a, b) => a - b)
  const boxes: DrawnBoxResult[] = drawnBoxes.map((bi) => {
    const b = res.boxes[bi]!
    const mine = ringResults.filter(r => r.box === bi + 1)
    const base = { box: bi + 1, corners: b.corners, kind: b.kind, rings: mine.map(r => r.ring), engineValue: b.value, target: b.target, targetRule: b.targetRule }
    if (b.value === null) return { ...base, value: null, deviation: null, verdict: b.verdict, note: b.note }
    const value = mine.reduce<unknown>((acc, r) => F.add(acc, read(r.value)), F.zero)
    const covered = new Set(mine.flatMap(r => r.terms.map(t => `${t.solution}:${t.helicities.join(',')}`)))
    const left = b.terms.filter(t => !covered.has(`${t.solution}:${t.helicities.join(',')}`))
    const missingNote = left.length ? `the rings of this box leave out ${left.length} of its ${b.terms.length} non-zero terms (${left.map(t => `solution ${t.solution}, h = ${t.helicities.map(h => (h > 0 ? '+' : '−')).join('')}`).join('; ')})` : undefined
    if (b.target === null) return { ...base, value: F.toWire(value), deviation: null, verdict: 'not evaluated' as const, note: [b.note, missingNote].filter(Boolean).join('; ') || undefined }
    const target = read(b.target)
    const deviation = deviationOf(F, value, target, b.terms.map(t => read(t.value)))
    const agrees = F.kind === 'exact' ? F.equals(value, target) : deviation <= res.tolerance!
    sum = F.add(sum, value)
    targetSum = F.add(targetSum, target)
    compared++
    return { ...base, value: F.toWire(value), deviation, verdict: agrees ? 'agrees' as const : 'disagrees' as const, ...(missingNote ? { note: missingNote } : {}) }
  })
  const counts = { 'agrees': 0, 'disagrees': 0, 'not evaluated': 0, 'singular point': 0 }
  for (const b of boxes) counts[b.verdict]++
  const deviation = compared ? deviationOf(F, sum, targetSum, boxes.map(b => (b.value ? read(b.value) : F.zero))) : null
  const verdict: Verdict = counts['singular point'] ? 'singular point' : counts.disagrees ? 'disagrees' : counts.agrees ? 'agrees' : 'not evaluated'
  const missing = res.boxes.map((_, i) => i).filter(i => !drawnBoxes.includes(i)).map(i => i + 1)
  const warnings = [...res.warnings]
  if (missing.length) warnings.push(`${missing.length} of the ${res.boxes.length} boxes of this process are not drawn (box ${missing.join(', ')}); the sum runs over the drawn boxes`)
  return {
    kind: 'loop-cut', n: res.n, helicities: res.helicities, arithmetic: res.arithmetic, tree: res.tree, rings: ringResults, boxes, missing,
    sum: compared ? F.toWire(sum) : null, targetSum: compared ? F.toWire(targetSum) : null, deviation, verdict, tolerance: res.tolerance, counts,
    source: res.source, warnings, ms: Math.round((performance.now() - t0) * 1000) / 1000,
  }
}
