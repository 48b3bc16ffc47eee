// Evaluates the drawn terms at a point and turns a check of the process into a check of the drawing:
// the drawn residue sum against the target, each drawn term's value, and the comparison with the
// process's full recursion under the same shift. Every channel is cut with the engine's own
// kinematics (channelKinematics: z*, the split of P̂, −P̂ as (λ_P, −λ̃_P)), every Block is the
// engine's sub-amplitude and every vertex its three-point amplitude, so a drawing of the engine's
// own term tree gives the engine's value.
import { FERMION_EXCHANGE_SIGN, channelKinematics, subAmplitudeValue, type ChannelKinematics } from '../../physics/bcfw'
import { isQuarkCode } from '../../physics/quarks'
import { codeOf, processSpecies } from '../species'
import { Complex, SingularError, complexField, parseRational, rationalField, type Field } from '../../physics/field'
import { ddField, ddOf } from '../../physics/double-double'
import { toDoubleDouble } from '../../physics/kinematics'
import type { Kin, Spinor } from '../../physics/spinors'
import { isValidShift, vanishes, type Process } from '../../physics/theories'
import { threePoint } from '../../physics/three-point'
import { decideVerdict, deviationOf, lostPrecision, type Verdict } from '../../physics/verdict'
import type { Process as GraphProcess } from '../../schemas/graph'
import type { EvaluateResponse, WireComplex } from '../../schemas/evaluate'
import type { EditorEdge, EditorNode, LineData } from '../types'
import { nodeOf } from '../types'
import { validateGraph } from '../validate'
import { compareDrawing, type DrawingComparison } from './compare'
import { engineProcess, labelsUpTo, type DrawnPart, type DrawingStructure } from './structure'

export interface DrawnTermValue {
  /** The component id. */
  id: string
  /** Sorted labels on the side of the shifted leg i, or null when no Line separates a channel. */
  channel: number[] | null
  /** Helicity of the top-level Line at leg i's side. */
  internalHelicity: number | null
  /** "{1,6} | −". */
  label: string | null
  /** The top-level Line (edge id). */
  lineId: string | null
  zStar: WireComplex | null
  pole: WireComplex | null
  /** A_L · A_R / P² of what is drawn; null when the term cannot be read or meets a singular point. */
  value: WireComplex | null
  /** What is wrong with this term (empty: a well-formed term). */
  problems: string[]
}

export interface DrawingResult {
  /** The drawn residue sum (terms that cannot be evaluated are left out and named). */
  sum: WireComplex | null
  terms: DrawnTermValue[]
  comparison: DrawingComparison
  /** The process's full recursion under the same shift, as a check of the process reports it. */
  recursion: { value: WireComplex | null, deviation: number | null, verdict: Verdict }
  /** One sentence: what the verdict rests on. */
  message: string
}

export type CheckedResponse = EvaluateResponse & { drawing?: DrawingResult }

interface Parsers<T> {
  F: Field<T>
  num: (w: WireComplex) => T
  kin: (w: { lambda: unknown[], lambdaTilde: unknown[] }) => Kin<T>
}

function parsersFor(arithmetic: 'float' | 'exact', theory: string): Parsers<unknown> {
  if (arithmetic === 'exact') {
    const sp = (s: unknown): Spinor<unknown> => [parseRational(String((s as string[])[0])), parseRational(String((s as string[])[1]))]
    return { F: rationalField as Field<unknown>, num: w => parseRational(String(w[0])), kin: w => ({ lambda: w.lambda.map(sp), lambdaTilde: w.lambdaTilde.map(sp) }) }
  }
  // Built on the prototype, as the engine's field does: complex.js's constructor parses its arguments.
  const c = (x: unknown) => {
    const z = Object.create(Complex.prototype) as Complex
    z.re = (x as number[])[0]!
    z.im = (x as number[])[1]!
    return z
  }
  const sp = (s: unknown): Spinor<Complex> => [c((s as unknown[])[0]), c((s as unknown[])[1])]
  const kinC = (w: { lambda: unknown[], lambdaTilde: unknown[] }): Kin<Complex> => ({ lambda: w.lambda.map(sp), lambdaTilde: w.lambdaTilde.map(sp) })
  // The engine's float field: doubles for gluons, double-double for the rest (DEVELOPERS.md "Precision").
  if (theory === 'gluon' || theory === 'qcd') return { F: complexField as Field<unknown>, num: w => c(w), kin: kinC as Parsers<unknown>['kin'] }
  return { F: ddField as Field<unknown>, num: w => ddOf(Number(w[0]), Number(w[1])), kin: w => toDoubleDouble(kinC(w)) as Kin<unknown> }
}

/**
 * Which channel kinematics and part values several drawn components share: components of one
 * channel (an expanded sub-amplitude distributes over them) cut the same channels at the same point
 * and often hold the same side. Ids: a channel at given kinematics (named by the channel above
 * it), a part at given kinematics (its kind, zero flag, and for a channel its cut and sides), so
 * each is evaluated once. Parts with no id (the only component of their channel) and a null result
 * (nothing shared) are evaluated as they stand.
 */
export interface SharedParts {
  ids: Map<DrawnPart, { ck: number, val: number }>
  cks: number
  vals: number
}

export function sharedParts(s: DrawingStructure): SharedParts | null {
  // Numeric keys (strings cost more to build and hash than the lookups they save).
  const ckIds = new Map<number, number>()
  const termIds = new Map<number, number>()
  const leafIds = new Map<number, number>()
  const ids = new Map<DrawnPart, { ck: number, val: number }>()
  let vals = 0
  let shared = false
  let tooBig = false
  const intern = (m: Map<number, number>, k: number, next: () => number): number => {
    if (!Number.isSafeInteger(k)) tooBig = true
    const id = m.get(k)
    if (id !== undefined) {
      shared = true
      return id
    }
    const v = next()
    m.set(k, v)
    return v
  }
  const maskOf = (L: readonly number[]) => {
    let mask = 0
    for (const u of L) mask |= 1 << u
    return mask
  }
  // `kin` numbers the kinematics and, with them, the helicities and codes of the amplitude read
  // there (the process's at the top: 0; below, a side of a numbered channel with the helicity at
  // its end of the Line; codes follow from the channel), so a part's id needs only its kind and
  // zero flag or, for a channel, its cut, helicity and sides.
  const hel = (h: number) => Math.round(2 * h) + 64
  const walk = (x: DrawnPart, kin: number): number => {
    let ck = -1
    let val: number
    if (x.kind === 'term') {
      const c = intern(ckIds, ((kin * 32 + x.shift[0]) * 32 + x.shift[1]) * 65536 + maskOf(x.L), () => ckIds.size)
      ck = c
      // Each side named with the helicity at its own end of the Line (a Line drawn + to + has two).
      const side = (y: DrawnPart, r: 0 | 1) => ((c + 1) * 256 + hel(y.helicities.at(-1)!)) * 2 + r
      const l = walk(x.left, side(x.left, 0))
      const r = walk(x.right, side(x.right, 1))
      val = intern(termIds, ((c * 256 + hel(x.helicity)) * 65536 + l) * 65536 + r, () => vals++)
    }
    else val = intern(leafIds, (kin * 3 + (x.kind === 'block' ? 2 : x.vertexKind === 'angle' ? 0 : 1)) * 2 + (x.zero ? 1 : 0), () => vals++)
    ids.set(x, { ck, val })
    return val
  }
  // Parts of different top-level channels meet different kinematics: only components of one channel can share.
  const byChannel = new Map<number, Extract<DrawnPart, { kind: 'term' }>[]>()
  for (const t of s.terms) {
    if (t.plan?.kind !== 'term') continue
    const k = (t.plan.shift[0] * 32 + t.plan.shift[1]) * 65536 + maskOf(t.plan.L)
    const g = byChannel.get(k)
    if (g) g.push(t.plan)
    else byChannel.set(k, [t.plan])
  }
  for (const g of byChannel.values()) if (g.length > 1) for (const x of g) walk(x, 0)
  // Keys stay exact while children number below 2^16 and channels below 2^13 (far beyond any canvas).
  return shared && !tooBig && vals < 65536 && ckIds.size < 8192 ? { ids, cks: ckIds.size, vals } : null
}

/** One evaluation's memo of shared channels and values (sharedParts' ids). */
interface Memo<T> {
  ids: SharedParts['ids']
  cks: (ChannelKinematics<T> | undefined)[]
  vals: (T | undefined)[]
}

const memoOf = <T>(sp: SharedParts | null | undefined): Memo<T> | null => (sp ? { ids: sp.ids, cks: new Array(sp.cks), vals: new Array(sp.vals) } : null)

/** The channel kinematics of a drawn channel, from the memo when another component cut it. */
function channelOf<T>(F: Field<T>, x: Extract<DrawnPart, { kind: 'term' }>, k: Kin<T>, m: Memo<T> | null): ChannelKinematics<T> {
  const e = m?.ids.get(x)
  if (!e) return channelKinematics(F, k, x.shift, x.L, x.R)
  return (m!.cks[e.ck] ??= channelKinematics(F, k, x.shift, x.L, x.R))
}

/** The value of a drawn part at the kinematics of its legs (in the part's leg order). */
export function partValue<T>(F: Field<T>, p: Process, x: DrawnPart, k: Kin<T>, m: Memo<T> | null = null): T {
  const e = m?.ids.get(x)
  // No id: its component is the only one of its channel, and so is everything below it.
  if (!e) return ownValue(F, p, x, k, null)
  const hit = m!.vals[e.val]
  if (hit !== undefined) return hit
  return (m!.vals[e.val] = ownValue(F, p, x, k, m))
}

function ownValue<T>(F: Field<T>, p: Process, x: DrawnPart, k: Kin<T>, m: Memo<T> | null): T {
  if (x.kind === 'vertex') return x.zero ? F.zero : threePoint(F, p, k, x.helicities, x.vertexKind, undefined, x.pdg)
  if (x.kind === 'block') {
    if (x.zero || vanishes(p, x.helicities, x.pdg)) return F.zero
    return x.helicities.length === 3 ? F.zero : subAmplitudeValue(F, p, k, x.helicities, x.pdg)
  }
  return termValue(F, p, x, channelOf(F, x, k, m), m)
}

/** A_L · A_R / P² of a drawn channel, with the recursion's −1 when a quark is exchanged (docs/conventions.md "Quarks"). */
function termValue<T>(F: Field<T>, p: Process, x: Extract<DrawnPart, { kind: 'term' }>, ck: { kL: Kin<T>, kR: Kin<T>, P2: T }, m: Memo<T> | null): T {
  const left = partValue(F, p, x.left, ck.kL, m)
  if (F.isZero(left)) return F.zero
  const v = F.div(F.mul(left, partValue(F, p, x.right, ck.kR, m)), ck.P2)
  const exchanged = x.left.pdg?.at(-1)
  return exchanged !== undefined && isQuarkCode(exchanged) && FERMION_EXCHANGE_SIGN < 0 ? F.neg(v) : v
}

export interface DrawnValues<T> {
  sum: T
  terms: { id: string, value: T | null, z: T | null, pole: T | null, singular: string | null }[]
}

/**
 * The drawn terms at a point given per leg label (kin.lambda[label − 1]). Terms with no plan, or
 * that meet a vanishing pole or bracket, get value null and are left out of the sum.
 */
export function drawnValues<T>(F: Field<T>, process: GraphProcess, s: DrawingStructure, kinByLabel: Kin<T>, shared?: SharedParts | null): DrawnValues<T> {
  const p = engineProcess(process)
  let sum = F.zero
  const terms: DrawnValues<T>['terms'] = []
  if (!p) return { sum, terms }
  const n = process.helicities.length
  const order = p.colourOrdered && process.order?.length === n ? process.order : labelsUpTo(n)
  const k0: Kin<T> = { lambda: order.map(l => kinByLabel.lambda[l - 1]!), lambdaTilde: order.map(l => kinByLabel.lambdaTilde[l - 1]!) }
  const m = memoOf<T>(shared)
  for (const t of s.terms) {
    if (!t.plan || t.plan.kind !== 'term') { terms.push({ id: t.id, value: null, z: null, pole: null, singular: null }); continue }
    try {
      const ck = channelOf(F, t.plan, k0, m)
      const v = termValue(F, p, t.plan, ck, m)
      sum = F.add(sum, v)
      terms.push({ id: t.id, value: v, z: ck.z, pole: ck.P2, singular: null })
    }
    catch (e) {
      if (!(e instanceof SingularError)) throw e
      terms.push({ id: t.id, value: null, z: null, pole: null, singular: e.what })
    }
  }
  return { sum, terms }
}

/**
 * What the compiler reads of a graph (ids, kinds, wiring, labels, helicities, line names; handoff.ts packs it): the rest
 * (positions, layout data, cached values) need not cross to a worker thread.
 */
export function drawingGraph(g: { nodes?: EditorNode[], edges?: EditorEdge[] }): { nodes: EditorNode[], edges: EditorEdge[] } {
  const pick = (d: Record<string, unknown> | undefined, keys: string[]) => {
    const out: Record<string, unknown> = {}
    for (const k of keys) if (d && d[k] !== undefined) out[k] = d[k]
    return out
  }
  return {
    nodes: (g.nodes ?? []).map(n => nodeOf(n.id, n.type, { x: 0, y: 0 }, pick(n.data, n.type === 'leg' ? ['label', 'helicity', 'species'] : n.type === 'block' ? ['helicities'] : []))),
    edges: (g.edges ?? []).map(e => ({ id: e.id, source: e.source, target: e.target, sourceHandle: e.sourceHandle ?? null, targetHandle: e.targetHandle ?? null, data: pick(e.data, ['helicity', 'targetHelicity', 'line', 'external', 'species']) })),
  }
}

/** Whether a graph has drawn terms: a component with a vertex or a Block. */
export function hasDrawnTerms(nodes: { type: string }[]): boolean {
  return nodes.some(n => n.type !== 'leg')
}

/** What a drawing compiles to before any point: its structure and its comparison with the recursion (read-only: a cache may hand it to many checks). */
export interface CompiledDrawing {
  structure: DrawingStructure
  comparison: DrawingComparison
  /** Channels and parts several components share, evaluated once (null: none). */
  shared: SharedParts | null
}

/** Validates and compiles a drawing for `proc` (the process with the shift the check uses) and compares it with the recursion. */
export function compileDrawing(proc: GraphProcess, graph: { nodes: EditorNode[], edges: EditorEdge[] }): CompiledDrawing {
  const structure = validateGraph(graph.nodes, graph.edges, proc, { slots: false }).drawing
  // Built when a message names a line (a complete drawing names none).
  let edgeById: Map<string, EditorEdge> | null = null
  const lineName = (e: string) => (((edgeById ??= new Map(graph.edges.map(x => [x.id, x]))).get(e)?.data ?? {}) as LineData).line ?? 'a line'
  return { structure, comparison: compareDrawing(proc, structure, lineName), shared: sharedParts(structure) }
}

/**
 * A check of the drawing: `res` is the engine's answer for the process (its full recursion, the
 * target, the point used — in the diagram's labels), `graph` the canvas. The value, deviation and
 * verdict become the drawing's; the recursion's stay in `drawing.recursion`. An incomplete or
 * wrong drawing never `agrees`.
 */
export function checkDrawing(res: EvaluateResponse, process: GraphProcess, graph: { nodes: EditorNode[], edges: EditorEdge[] }): CheckedResponse {
  const proc: GraphProcess = { ...process, shift: res.shift }
  return checkCompiled(res, proc, compileDrawing(proc, graph))
}

/** checkDrawing from a compiled drawing (`proc` carries the check's shift); `compiled` is left as it is. */
export function checkCompiled(res: EvaluateResponse, proc: GraphProcess, compiled: CompiledDrawing): CheckedResponse {
  const s = compiled.structure
  const comparison: DrawingComparison = { ...compiled.comparison, messages: [...compiled.comparison.messages] }
  const recursion = { value: res.value, deviation: res.deviation, verdict: res.verdict }
  const P = parsersFor(res.arithmetic, res.theory)
  const F = P.F
  const n = res.n
  let sumW: WireComplex | null = null
  const terms: DrawnTermValue[] = []
  let singular: string | null = res.value === null && res.verdict === 'singular point' ? (res.warnings.find(w => w.startsWith('singular point')) ?? 'singular point') : null
  let deviation: number | null = null
  let sum: unknown = null
  const target = res.target?.value ? P.num(res.target.value) : null
  if (!singular) {
    const dv = drawnValues(F, proc, s, P.kin(res.kinematics), compiled.shared)
    sum = dv.sum
    sumW = F.toWire(dv.sum) as WireComplex
    dv.terms.forEach((x, t) => {
      const st = s.terms[t]!
      const problems = [...st.problems]
      if (x.singular) problems.push(`singular point: ${x.singular}`)
      terms.push({
        id: x.id,
        channel: st.channel?.left ?? null,
        internalHelicity: st.channel?.helicity ?? null,
        label: st.label,
        lineId: st.lineId,
        zStar: x.z === null ? null : (F.toWire(x.z) as WireComplex),
        pole: x.pole === null ? null : (F.toWire(x.pole) as WireComplex),
        value: x.value === null ? null : (F.toWire(x.value) as WireComplex),
        problems,
      })
    })
    const singularTerm = dv.terms.find(x => x.singular)
    if (singularTerm) comparison.messages.push(`a drawn term meets a singular point: ${singularTerm.singular}`)
    if (target !== null) deviation = deviationOf(F, dv.sum, target, dv.terms.filter(x => x.value !== null).map(x => x.value!))
    if (F.kind === 'float' && !Number.isFinite(F.abs(dv.sum))) singular = 'a non-finite drawn sum'
  }
  const p = engineProcess(proc)!
  const order = p.colourOrdered && proc.order?.length === n ? proc.order : labelsUpTo(n)
  const hOrdered = order.map(l => proc.helicities[l - 1]!)
  const species = processSpecies(proc)
  const codes = species ? order.map(l => codeOf(species[l - 1])) : undefined
  const pos = (l: number) => order.indexOf(l)
  let verdict = decideVerdict({
    singular: !!singular,
    targetNone: res.target === null,
    shiftValidByTable: isValidShift(p, hOrdered, pos(res.shift[0]), pos(res.shift[1]), codes),
    probedExponent: res.falloff ? res.falloff.exponent : null,
    vanishing: vanishes(p, hOrdered, codes),
    arithmetic: res.arithmetic,
    n,
    deviation: deviation ?? Infinity,
    exactEqual: sum !== null && target !== null && F.equals(sum, target),
  })
  const problem = comparison.messages[0]
  if (verdict === 'agrees' && problem) verdict = 'disagrees'
  // A complete drawing holds the recursion's terms, so the recursion's precision estimate is its own.
  if (!problem && lostPrecision(verdict, n, deviation, res.precision?.estimated ?? null)) verdict = 'not evaluated'
  // One sentence: the engine's warning already says "singular point: …"; its reason follows a colon.
  const why = singular?.replace(/^singular point:?\s*/, '') ?? ''
  const message = singular
    ? why ? `the drawing meets a singular point: ${why}` : 'the drawing meets a singular point'
    : problem
      ? `the drawing is not the recursion of [${res.shift[0]}, ${res.shift[1]}⟩: ${problem}${comparison.messages.length > 1 ? ` (and ${comparison.messages.length - 1} more)` : ''}`
      : verdict === 'agrees'
        ? `the drawing holds every term of [${res.shift[0]}, ${res.shift[1]}⟩ once, and its sum agrees with the target`
        : verdict === 'disagrees'
          ? 'the drawing holds every term of the recursion once, but its sum disagrees with the target'
          : `the drawing holds every term of the recursion once (verdict: ${verdict})`
  const warnings = [...res.warnings]
  if (problem) warnings.push(`drawing: ${problem}`)
  return {
    ...res,
    value: singular ? null : sumW,
    deviation: singular ? null : deviation,
    verdict,
    warnings,
    drawing: { sum: singular ? null : sumW, terms, comparison, recursion, message },
  }
}
