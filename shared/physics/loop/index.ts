// The engine entry of the quadruple cuts: loopCuts(request) → the response of POST /api/loop-cuts.
// Every box of the colour-ordered n-gluon one-loop amplitude, its coefficient by the quadruple cut
// (Britto, Cachazo, Feng, hep-th/0412103) and, for MHV, the N = 4 super-Yang–Mills target
// (Bern, Dixon, Dunbar, Kosower, Nucl. Phys. B425 (1994) 217, hep-ph/9403226): only one-mass and
// two-mass-easy boxes, c = −½ (st − P²Q²) A_tree each, the four-point box −st A_tree; in our
// normalisation (docs/engine.md "Quadruple cuts") the same signs.
import type Complex from 'complex.js'
import type Fraction from 'fraction.js'
import { LOOP_CUT_MAX_LEGS, LoopCutRequestSchema, type LoopCutBox, type LoopCutRequestInput, type LoopCutResponse } from '../../schemas/loop-cuts'
import { SingularError, complexField, rationalField, type Field } from '../field'
import { PhysicsError } from '../errors'
import { buildPoint } from '../index'
import { validateProcess, type Process } from '../theories'
import { det, momentumSum, type Kin } from '../spinors'
import { classifyGluon, parkeTaylor } from '../targets/parke-taylor'
import { deviationOf, floatTolerance } from '../verdict'
import { allBoxes, type Box } from './boxes'
import { boxCut, cornerTree, type CornerMethod } from './coefficient'
import { infraredRows } from './infrared'
import { cutStates } from './states'

export const LOOP_SOURCE = 'Bern, Dixon, Dunbar, Kosower, Nucl. Phys. B425 (1994) 217 (hep-ph/9403226); quadruple cuts: Britto, Cachazo, Feng, hep-th/0412103'

/**
 * The N = 4 MHV target of a box: c = −(r/2)(st − K1²K3² − K2²K4²) A_tree, where r counts the
 * opposite pairs of massless corners (2 for the four-point box, 1 for one-mass and two-mass-easy
 * boxes, whose massive pair makes one of the two products vanish); 0 for every other box.
 */
function n4Target<T>(F: Field<T>, k: Kin<T>, box: Box, tree: T): { value: T; rule: string } {
  const c = box.corners
  const r = (c[0]!.length === 1 && c[2]!.length === 1 ? 1 : 0) + (c[1]!.length === 1 && c[3]!.length === 1 ? 1 : 0)
  if (r === 0) return { value: F.zero, rule: '0 (no such box in N = 4 MHV)' }
  const m = c.map((x) => det(F, momentumSum(F, k, x)))
  const s = det(F, momentumSum(F, k, [...c[0]!, ...c[1]!]))
  const t = det(F, momentumSum(F, k, [...c[1]!, ...c[2]!]))
  const bracket = F.sub(F.sub(F.mul(s, t), F.mul(m[0]!, m[2]!)), F.mul(m[1]!, m[3]!))
  const value = F.mul(F.div(F.fromInt(-r), F.fromInt(2)), F.mul(bracket, tree))
  const rule = r === 2 ? '−st A_tree' : box.kind === 'one-mass' ? '−½ st A_tree' : '−½ (st − P²Q²) A_tree'
  return { value, rule }
}

export const MULTIPLET_STATES = 'N = 4 multiplet: gluons, four gluinos, six scalars (Grassmann integration over the four cut lines)'
const GLUONS_EXACT = 'gluons only: exact for this box because SU(4) counting lets only gluons cross every cut line of both solutions'
const GLUONS_ASKED = 'gluons only (asked for): fermions and scalars of the N = 4 multiplet also cross this cut and are left out'

function run<T>(F: Field<T>, p: Process, k: Kin<T>, h: number[], corners: CornerMethod, withTarget: boolean, states: 'n4' | 'gluons') {
  const n = h.length
  const w = (x: T) => F.toWire(x)
  const tree = treeOf(F, p, k, h, corners)
  const mhv = classifyGluon(h).kind === 'mhv' && n >= 4
  const tolerance = F.kind === 'float' ? floatTolerance(n) : null
  let sum = F.zero
  let targetSum = F.zero
  let summed = 0
  const all = allBoxes(n)
  const values: (T | null)[] = []
  let allN4 = states === 'n4'
  const boxes: LoopCutBox[] = all.map((box) => {
    const base = { corners: box.corners.map((c) => c.map((e) => e + 1)), kind: box.kind }
    const none = { solutions: [], terms: [], value: null, target: null, targetRule: null, deviation: null }
    let cut
    let stateText: string
    values.push(null)
    try {
      cut = boxCut(F, p, k, h, box, { corners, states: states === 'n4' ? 'auto' : 'gluons' })
      const onlyGluons = cut.solutions.every((s) => cutStates(box, s.threePoint, h) === 'gluons')
      stateText = onlyGluons ? GLUONS_EXACT : states === 'n4' ? MULTIPLET_STATES : GLUONS_ASKED
      if (stateText === GLUONS_ASKED) allN4 = false
    }
    catch (e) {
      allN4 = false
      if (e instanceof SingularError) return { ...base, ...none, states: '—', verdict: 'singular point' as const, note: `singular point: ${e.what}` }
      if (e instanceof PhysicsError && (e.field === 'arithmetic' || e.field === 'states')) return { ...base, ...none, states: '—', verdict: 'not evaluated' as const, note: e.message }
      throw e
    }
    values[values.length - 1] = cut.value
    const solutions = cut.solutions.map((s) => ({
      threePoint: s.threePoint,
      onShell: s.cut.onShell,
      loopMomentum: s.cut.ell[0]!.flat().map(w),
      states: cutStates(box, s.threePoint, h),
    }))
    const terms = cut.terms.map((t) => ({ solution: t.solution + 1, helicities: t.helicities, multiplicity: t.multiplicity ?? 1, value: w(t.value) }))
    const out = { ...base, states: stateText, solutions, terms, value: w(cut.value) }
    if (!withTarget) return { ...out, target: null, targetRule: null, deviation: null, verdict: 'not evaluated' as const }
    if (!mhv) return { ...out, target: null, targetRule: null, deviation: null, verdict: 'not evaluated' as const, note: 'no per-box target beyond MHV; the set is checked by the infrared conditions' }
    if (stateText === GLUONS_ASKED)
      return { ...out, target: null, targetRule: null, deviation: null, verdict: 'not evaluated' as const, note: 'fermions and scalars of the N = 4 multiplet cross this cut too; the gluon-only value is not compared' }
    const target = n4Target(F, k, box, tree)
    const deviation = deviationOf(F, cut.value, target.value, cut.terms.map((t) => t.value))
    const agrees = F.kind === 'exact' ? F.equals(cut.value, target.value) : deviation <= tolerance!
    sum = F.add(sum, cut.value)
    targetSum = F.add(targetSum, target.value)
    summed++
    return { ...out, target: w(target.value), targetRule: target.rule, deviation, verdict: agrees ? 'agrees' as const : 'disagrees' as const }
  })
  const infrared = withTarget && allN4 ? infraredOf(F, k, all, values, tree, tolerance) : null
  const counts = { 'agrees': 0, 'disagrees': 0, 'not evaluated': 0, 'singular point': 0 }
  for (const b of boxes) counts[b.verdict]++
  const irBad = infrared?.verdict === 'disagrees'
  const verdict = counts['singular point'] ? 'singular point' : counts.disagrees || irBad ? 'disagrees' : counts.agrees || infrared ? 'agrees' : 'not evaluated'
  return { tree: w(tree), boxes, sum: summed ? w(sum) : null, targetSum: summed ? w(targetSum) : null, counts, infrared, verdict: verdict as LoopCutResponse['verdict'], tolerance }
}

/** The tree of the process: Parke–Taylor for MHV and its conjugate, else BCFW by the corner method. */
function treeOf<T>(F: Field<T>, p: Process, k: Kin<T>, h: number[], method: CornerMethod): T {
  const c = classifyGluon(h).kind
  return c === 'other' ? cornerTree(F, p, k, h, method) : parkeTaylor(F, k, h)
}

function infraredOf<T>(F: Field<T>, k: Kin<T>, boxes: Box[], values: (T | null)[], tree: T, tolerance: number | null): LoopCutResponse['infrared'] {
  const rows = infraredRows(F, k, boxes, values, tree)
  if (!rows) return null
  const out = rows.map((r) => {
    // a zero target (a three-particle invariant) against the largest box term of its sum
    const dev = F.isZero(r.target) ? (r.scale === 0 ? 0 : F.abs(r.value) / r.scale) : deviationOf(F, r.value, r.target, [])
    const ok = F.kind === 'exact' ? F.equals(r.value, r.target) : dev <= tolerance!
    const invariant = r.legs === 'leading' ? '1/ε²' : `ln(−s_${r.legs.map((x) => x + 1).join('')})`
    return { invariant, value: F.toWire(r.value), target: F.toWire(r.target), deviation: dev, verdict: ok ? 'agrees' as const : 'disagrees' as const }
  })
  return {
    rows: out,
    verdict: out.every((r) => r.verdict === 'agrees') ? 'agrees' : 'disagrees',
    note: 'Σ boxes b F against −(1/ε²) Σ_i (−s_{i,i+1})^(−ε) A_tree: the 1/ε² coefficient and that of 1/ε per invariant, b = −2c/Δ (docs/engine.md "Quadruple cuts")',
  }
}

export function loopCuts(input: LoopCutRequestInput): LoopCutResponse {
  const t0 = performance.now()
  const req = LoopCutRequestSchema.parse(input)
  const n = req.helicities.length
  if (n < 4) throw new PhysicsError('helicities', `a box needs at least 4 legs, got ${n}`)
  if (n > LOOP_CUT_MAX_LEGS) throw new PhysicsError('helicities', `${n} legs exceed the limit of ${LOOP_CUT_MAX_LEGS} for loop cuts`)
  const { process: p, warnings } = validateProcess('gluon', req.helicities, req.arithmetic)
  const kin = req.kinematics ?? (req.arithmetic === 'exact' ? { kind: 'rational' as const, seed: 1 } : { kind: 'random' as const, seed: 1 })
  const pt = buildPoint(kin, n, req.arithmetic)
  warnings.push(...pt.warnings)
  const withTarget = req.target === 'n4-mhv'
  const body = pt.F.kind === 'exact'
    ? run(rationalField, p, pt.kin as Kin<Fraction>, req.helicities, req.corners, withTarget, req.states)
    : run(complexField, p, pt.kin as Kin<Complex>, req.helicities, req.corners, withTarget, req.states)
  if (body.boxes.some((b) => b.states === GLUONS_ASKED)) warnings.push('some cuts carry the whole N = 4 multiplet; their gluon-only values are shown without a target')
  return {
    theory: 'gluon', n, helicities: req.helicities, arithmetic: req.arithmetic, corners: req.corners, states: req.states, ...body,
    source: LOOP_SOURCE, warnings, ms: Math.round((performance.now() - t0) * 1000) / 1000,
  }
}

export { allBoxes, rotateBox, boxKind, type Box, type BoxKind } from './boxes'
export { boxCut, cornerTree, type CornerMethod, type BoxCut } from './coefficient'
export { solveQuadrupleCut, fieldSqrt, type CutSolution } from './cut'
export { cutStates, orientations, helicitiesOf } from './states'
export { superCorner, superSolution, productSign, stateOf, UnsupportedCorner, type Grassmann } from './super'
export { infraredRows, type InfraredRow } from './infrared'
