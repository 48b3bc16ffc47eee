// The one entry to the engine: evaluate(request) → the response of docs/api.md. The route, the worker,
// the batch runner and the tests all call this.
import { Complex, SingularError, complexField, rationalField, type Field, type Fraction } from './field'
import type { Kin } from './spinors'
import { det, momentumSum } from './spinors'
import { PhysicsError } from './errors'
import {
  kinToWire,
  physicalPoint,
  pointFromExactSpinors,
  pointFromMomenta,
  pointFromSpinors,
  randomPoint,
  rationalPoint,
  conditionRatio,
  toDoubleDouble,
  toFloatKin,
  type BuiltPoint,
} from './kinematics'
import { checkShift, defaultShift, isValidShift, validateProcess, vanishes, type Process } from './theories'
import { bcfw, type SubAmplitude, type Term, type Vertex } from './bcfw'
import { probeFalloff, type FalloffResult } from './falloff'
import { decideVerdict, deviationOf, floatTolerance, lostPrecision } from './verdict'
import { applicableTargets, autoTarget, evaluateTarget, type TargetName } from './targets/index'
import { ddField } from './double-double'
import { berendsGiele } from './targets/berends-giele'
import { compileFormula, type CompiledFormula } from './formula'
import { byPrimes } from './modular'
import {
  EvaluateRequestSchema,
  type EvaluateRequestInput,
  type EvaluateResponse,
  type Kinematics,
  type WireComplex,
  type WireSubAmplitude,
  type WireTerm,
  type WireVertex,
} from '../schemas/evaluate'

export const ENGINE_VERSION = '0.1.0'

/** Float poles |s_S| below this fraction of max |s_ij| count as vanishing (a singular point). */
export const FLOAT_POLE_THRESHOLD = 1e-12

export type AnyKin = { F: Field<Complex>; kin: Kin<Complex> } | { F: Field<Fraction>; kin: Kin<Fraction> }

const EXACT_KINDS = new Set(['exact-spinors', 'rational'])

/**
 * Builds the point of a request (lengths checked against n, exact arithmetic only from exact
 * input). Exported for the point sets and the editor.
 */
export function buildPoint(kin: Kinematics, n: number, arithmetic: 'float' | 'exact'): { warnings: string[] } & AnyKin {
  if (kin.kind === 'spinors' || kin.kind === 'exact-spinors') {
    if (kin.lambda.length !== n) throw new PhysicsError('kinematics.lambda', `${kin.lambda.length} angle spinors given for ${n} helicities`)
    if (kin.lambdaTilde.length !== n) throw new PhysicsError('kinematics.lambdaTilde', `${kin.lambdaTilde.length} square spinors given for ${n} helicities`)
  }
  if (kin.kind === 'momenta' && kin.momenta.length !== n) throw new PhysicsError('kinematics.momenta', `${kin.momenta.length} momenta given for ${n} helicities`)
  if (arithmetic === 'exact' && !EXACT_KINDS.has(kin.kind))
    throw new PhysicsError('arithmetic', `exact arithmetic needs exact input (kinematics kind "exact-spinors" or "rational"), got "${kin.kind}"`)
  let exact: BuiltPoint<Fraction> | null = null
  if (kin.kind === 'exact-spinors') exact = pointFromExactSpinors(kin.lambda, kin.lambdaTilde)
  if (kin.kind === 'rational') exact = { kin: rationalPoint(n, kin.seed), warnings: [] }
  if (exact) {
    if (arithmetic === 'exact') return { F: rationalField, kin: exact.kin, warnings: exact.warnings }
    return { F: complexField, kin: toFloatKin(exact.kin), warnings: exact.warnings }
  }
  let pt: BuiltPoint<Complex> | undefined
  switch (kin.kind) {
    case 'spinors': {
      const c = (s: [[number, number], [number, number]]): [Complex, Complex] => [new Complex(s[0][0], s[0][1]), new Complex(s[1][0], s[1][1])]
      pt = pointFromSpinors(kin.lambda.map(c), kin.lambdaTilde.map(c))
      break
    }
    case 'momenta':
      pt = pointFromMomenta(kin.momenta)
      break
    case 'random':
      pt = { kin: randomPoint(n, kin.seed), warnings: [] }
      break
    case 'physical':
      pt = { kin: physicalPoint(n, kin.seed, kin.energy), warnings: [] }
      break
  }
  if (!pt) throw new PhysicsError('kinematics.kind', 'unknown kinematics kind')
  return { F: complexField, kin: pt.kin, warnings: pt.warnings }
}

/** The physical channels of the theory (0-based sets; one of each complementary pair). */
function poleSets(p: Process, n: number): number[][] {
  const key = `${p.colourOrdered ? 'c' : 'a'}${n}`
  let out = poleSetCache.get(key)
  if (!out) poleSetCache.set(key, (out = computePoleSets(p, n)))
  return out
}
const poleSetCache = new Map<string, number[][]>()

function computePoleSets(p: Process, n: number): number[][] {
  const out: number[][] = []
  if (p.colourOrdered) {
    for (let m = 2; 2 * m <= n; m++) for (let a = 0; a < (2 * m === n ? n / 2 : n); a++) out.push(Array.from({ length: m }, (_, t) => (a + t) % n))
    return out
  }
  for (let mask = 1; mask < 1 << n; mask++) {
    const S = Array.from({ length: n }, (_, t) => t).filter((t) => mask & (1 << t))
    if (S.length >= 2 && 2 * S.length <= n) out.push(S)
  }
  return out
}

/** Unit roundoff of doubles and of double-double. */
const UNIT = { 'double': 2 ** -53, 'double-double': 2 ** -104 } as const
/**
 * Gluons run in doubles unless the point is poorly conditioned: min |s_S| / max |s_ij| below this,
 * or terms cancelling by more than 1/this. Measured: 5 gluons with one leg at 1e-9 of √s lost 4e-8
 * in doubles (condition 1e-9), while generic points (condition ≥ 1e-3) stay near 1e-14.
 */
export const POOR_CONDITION = 1e-5
/** A double Berends–Giele value within this relative distance of the double BCFW value is kept. */
const CONFIRM_DOUBLE = 1e-12

/** A vanishing physical pole of the point, as a sentence, or null. */
function vanishingPole<T>(F: Field<T>, p: Process, k: Kin<T>): string | null {
  // Seeded points are remembered (kinematics.ts), so their pole check is too.
  let byKind = poleChecks.get(k)
  if (!byKind) poleChecks.set(k, (byKind = new Map()))
  const key = `${F.kind}:${p.colourOrdered}`
  let v = byKind.get(key)
  if (v === undefined) byKind.set(key, (v = findVanishingPole(F, p, k)))
  return v
}
const poleChecks = new WeakMap<object, Map<string, string | null>>()

function findVanishingPole<T>(F: Field<T>, p: Process, k: Kin<T>): string | null {
  const n = k.lambda.length
  const sets = poleSets(p, n)
  const vals = sets.map((S) => det(F, momentumSum(F, k, S)))
  const scale = Math.max(...vals.filter((_, t) => sets[t]!.length === 2).map((v) => F.abs(v)))
  for (let t = 0; t < sets.length; t++) {
    const v = vals[t]!
    const zero = F.kind === 'exact' ? F.isZero(v) : F.abs(v) <= FLOAT_POLE_THRESHOLD * scale
    if (zero) return `the pole s(${sets[t]!.map((x) => x + 1).join(',')}) vanishes`
  }
  return null
}

function termToWire<T>(F: Field<T>, t: Term<T>): WireTerm {
  return {
    left: t.left,
    ...(t.leftLegs ? { leftLegs: t.leftLegs } : {}),
    helicity: t.helicity,
    z: F.toWire(t.z),
    pole: F.toWire(t.pole),
    value: F.toWire(t.value),
    children: t.children ? { left: nodeToWire(F, t.children.left), right: nodeToWire(F, t.children.right) } : null,
  }
}

function nodeToWire<T>(F: Field<T>, x: SubAmplitude<T> | Vertex<T>): WireSubAmplitude | WireVertex {
  if ('kind' in x) return { kind: x.kind, legs: x.legs, helicities: x.helicities, value: F.toWire(x.value) }
  return { value: F.toWire(x.value), shift: x.shift, legs: x.legs, helicities: x.helicities, terms: x.terms.map((t) => termToWire(F, t)) }
}

interface Computed<T> {
  value: T | null
  terms: Term<T>[]
  targetValue: T | null
  singular: string | null
}

type ResolvedTarget = { kind: 'none' } | { kind: 'named'; name: TargetName } | { kind: 'formula'; formula: CompiledFormula }

function resolveTarget(target: EvaluateRequestInput['target'], theory: Process['theory'], helicities: number[], spin?: number, pdg?: number[]): ResolvedTarget {
  const t = target ?? 'auto'
  if (typeof t === 'object') return { kind: 'formula', formula: compileFormula(t.formula, helicities.length) }
  if (t === 'none') return { kind: 'none' }
  if (t === 'auto') {
    const a = autoTarget(theory, helicities, spin, pdg)
    return a ? { kind: 'named', name: a } : { kind: 'none' }
  }
  if (!applicableTargets(theory, helicities, spin, pdg).includes(t)) {
    throw new PhysicsError('target', `${t} does not apply to ${theory === 'spin' ? `spin ${spin}` : theory} with helicities [${helicities.join(', ')}]`)
  }
  return { kind: 'named', name: t }
}

/** Evaluates one amplitude by on-shell recursion and compares it with its target (docs/api.md "Evaluation request"). */
export function evaluate(input: EvaluateRequestInput): EvaluateResponse {
  const t0 = performance.now()
  const req = EvaluateRequestSchema.parse(input)
  const { theory, helicities, arithmetic } = req
  const n = helicities.length
  const { process: p, warnings } = validateProcess(theory, helicities, arithmetic, req.spin, req.species)
  const pdg = p.pdg
  const shift = req.shift ? checkShift(req.shift as [number, number], n) : defaultShift(p, helicities)
  const target = resolveTarget(req.target, theory, helicities, req.spin, pdg)
  const point = buildPoint(req.kinematics, n, arithmetic)
  warnings.push(...point.warnings)
  const modular = arithmetic === 'exact' && !req.tree && (req.exact?.backend ?? 'modular') === 'modular'
  let body: Omit<EvaluateResponse, 'ms'>
  if (point.F.kind === 'exact') body = run(rationalField, point.kin as Kin<Fraction>, 'exact', null, modular ? computeByPrimes(point.kin as Kin<Fraction>) : null)
  else {
    const kd = point.kin as Kin<Complex>
    const condition = conditionRatio(complexField, kd)
    if (p.theory !== 'gluon' && p.theory !== 'qcd') body = run(ddField, toDoubleDouble(kd), 'double-double', condition) // see toDoubleDouble
    else if (condition < POOR_CONDITION) {
      body = run(ddField, toDoubleDouble(kd), 'double-double', condition)
      body.warnings.push(`the point is poorly conditioned (min |s| / max |s_ij| = ${condition.toExponential(1)}), so the recursion ran in double-double`)
    }
    else {
      const before = warnings.length
      body = run(complexField, kd, 'double', condition) // doubles measured ≤ 1e-11 off at generic points
      const c = body.precision?.cancellation ?? 1
      if (c > 1 / POOR_CONDITION) {
        warnings.length = before
        body = run(ddField, toDoubleDouble(kd), 'double-double', condition)
        body.warnings.push(`the terms cancel to ${(1 / c).toExponential(1)} of their largest, so the recursion ran in double-double`)
      }
    }
  }
  return { ...body, ms: Math.round((performance.now() - t0) * 1000) / 1000 }

  /**
   * The exact value, target and terms modulo primes (modular.ts), or null when the first primes
   * all meet a zero (then the rational computation gives the singular point and its message).
   */
  function computeByPrimes(k: Kin<Fraction>): Computed<Fraction> | null {
    const vanishing = vanishes(p, helicities)
    const key = `${theory}:${req.spin ?? ''}:${helicities.join(',')}:${pdg?.join(',') ?? ''}:${shift.join(',')}:${target.kind === 'named' ? target.name : target.kind}:${req.kinematics.kind}`
    const r = byPrimes(
      k,
      (Fp, km) => {
        if (!vanishing && vanishingPole(Fp, p, km)) throw new SingularError('a pole vanishes')
        const b = bcfw(Fp, p, km, helicities, shift)
        const tv = target.kind === 'none' ? null : target.kind === 'named' ? evaluateTarget(target.name, Fp, km, helicities, pdg) : target.formula.evaluate(Fp, km, amplitudeOf)
        const values = tv === null ? [b.value] : [b.value, tv]
        let shape = ''
        for (const t of b.terms) {
          values.push(t.z, t.pole, t.value)
          shape += `${t.left.join('.')}:${t.helicity};`
        }
        return { shape, values, info: b.terms }
      },
      { key },
    )
    if (!r) return null
    const off = target.kind === 'none' ? 1 : 2
    return {
      value: r.values[0]!,
      targetValue: target.kind === 'none' ? null : r.values[1]!,
      terms: r.info.map((t, s) => ({ left: t.left, helicity: t.helicity, z: r.values[off + 3 * s]!, pole: r.values[off + 3 * s + 1]!, value: r.values[off + 3 * s + 2]!, children: null })),
      singular: null,
    }
  }

  /** A(σ) for a formula target: this process with its legs in the order σ, by BCFW under the default shift. */
  function amplitudeOf<T>(F: Field<T>, k: Kin<T>, order: number[]): T {
    const h = order.map((t) => helicities[t]!)
    const c = pdg ? order.map((t) => pdg[t]!) : undefined
    if (vanishes(p, h, c)) return F.zero
    const kk = { lambda: order.map((t) => k.lambda[t]!), lambdaTilde: order.map((t) => k.lambdaTilde[t]!) }
    return bcfw(F, p, kk, h, defaultShift(p, h, c), { pdg: c }).value
  }

  function compute<T>(F: Field<T>, k: Kin<T>): Computed<T> {
    const [i, j] = shift
    const vanishing = vanishes(p, helicities)
    let singular: string | null = vanishing ? null : vanishingPole(F, p, k)
    let value: T | null = null
    let terms: Term<T>[] = []
    if (!singular) {
      try {
        const r = bcfw(F, p, k, helicities, shift, { tree: req.tree })
        value = r.value
        terms = r.terms
      }
      catch (e) {
        if (!(e instanceof SingularError)) throw e
        // Not a physical pole (checked above): a zero met by this shift's terms.
        singular = `under the shift [${i + 1}, ${j + 1}⟩ ${e.what}; another valid shift may avoid it`
      }
    }
    let targetValue: T | null = null
    if (target.kind !== 'none' && !singular) {
      try {
        targetValue = target.kind === 'named' ? namedTarget(F, k, target.name, value, pdg) : target.formula.evaluate(F, k, amplitudeOf)
      }
      catch (e) {
        if (!(e instanceof SingularError)) throw e
        singular = target.kind === 'named' ? `${e.what} in the target ${target.name}` : e.what.replace(/^the formula/, 'the target formula')
      }
    }
    return { value, terms, targetValue, singular }
  }

  /**
   * A named target. Berends–Giele in doubles costs a fifth of its double-double run, but the
   * Feynman-diagram sum can cancel (docs/engine.md "Berends–Giele"), so the double value is kept only
   * when the independent BCFW value confirms it to CONFIRM_DOUBLE; otherwise the double-double run
   * decides, as before. Any verdict therefore comes from the same figures: a kept double value is
   * within CONFIRM_DOUBLE of BCFW, far inside every tolerance.
   */
  function namedTarget<T>(F: Field<T>, k: Kin<T>, name: TargetName, bcfwValue: T | null, pdg?: number[]): T {
    if ((F as unknown) === complexField && name === 'berends-giele' && bcfwValue !== null && (!pdg || pdg.every((c) => c === 21)) && helicities.every((h) => h === 1 || h === -1)) {
      const quick = berendsGiele(F, k, helicities, { precision: 'double' })
      const scale = Math.max(F.abs(quick), F.abs(bcfwValue))
      if (Number.isFinite(scale) && scale > 0 && F.abs(F.sub(quick, bcfwValue)) <= CONFIRM_DOUBLE * scale) return quick
    }
    return evaluateTarget(name, F, k, helicities, pdg)
  }

  function run<T>(F: Field<T>, k: Kin<T>, arith: 'double' | 'double-double' | 'exact', condition: number | null, computed: Computed<T> | null = null): Omit<EvaluateResponse, 'ms'> {
    const [i, j] = shift
    const validByTable = isValidShift(p, helicities, i, j)
    const vanishing = vanishes(p, helicities)
    const c = computed ?? compute(F, k)
    const terms = c.terms
    let { value, targetValue, singular } = c
    let falloff: FalloffResult | null = null
    if (req.probeFalloff) {
      try {
        falloff = probeFalloff(p, helicities, i, j)
      }
      catch (e) {
        if (!(e instanceof SingularError)) throw e
        warnings.push(`probeFalloff: ${e.what}; the falloff was not measured`)
      }
    }
    if (!singular && F.kind === 'float') {
      // A double that overflowed (or became NaN) cannot go on the wire as a number.
      const bad = (x: T | null) => x !== null && !Number.isFinite(F.abs(x))
      if (bad(value) || bad(targetValue)) singular = `an intermediate is not finite (the point's scale overflows double precision; rescale the momenta)`
    }
    if (singular) {
      warnings.push(`singular point: ${singular}`)
      value = null
      if (targetValue !== null && F.kind === 'float' && !Number.isFinite(F.abs(targetValue))) targetValue = null
    }
    const deviation = value !== null && targetValue !== null ? deviationOf(F, value, targetValue, terms.map((t) => t.value)) : null
    let cancellation: number | null = null
    let estimated: number | null = null
    if (F.kind === 'float' && value !== null && arith !== 'exact') {
      const largest = Math.max(0, ...terms.map((t) => F.abs(t.value)))
      const size = F.abs(value)
      cancellation = largest === 0 ? 1 : size === 0 ? Infinity : Math.max(1, largest / size)
      estimated = UNIT[arith] * Math.max(1 / Math.max(condition ?? 1, Number.MIN_VALUE), cancellation)
    }
    let verdict = decideVerdict({
      singular: !!singular,
      targetNone: target.kind === 'none',
      shiftValidByTable: validByTable,
      probedExponent: falloff ? falloff.exponent : null,
      vanishing,
      arithmetic,
      n,
      deviation: deviation ?? Infinity,
      exactEqual: value !== null && targetValue !== null && F.equals(value, targetValue),
    })
    if (lostPrecision(verdict, n, deviation, estimated)) {
      verdict = 'not evaluated'
      warnings.push(`precision loss: the recursion reached about ${estimated!.toExponential(1)} relative precision at this point, above the tolerance ${floatTolerance(n).toExponential(1)}, so the deviation ${deviation!.toExponential(1)} decides nothing`)
    }
    if (!validByTable && !vanishing) warnings.push(`shift: [${i + 1}, ${j + 1}⟩ is not a valid shift for these helicities (by the table of valid shifts); a boundary term is expected`)
    return {
      n,
      theory,
      ...(theory === 'spin' ? { spin: req.spin } : {}),
      ...(req.species ? { species: req.species } : {}),
      shift: [i + 1, j + 1],
      arithmetic,
      value: value === null ? null : (F.toWire(value) as WireComplex),
      terms: singular ? [] : terms.map((t) => termToWire(F, t)),
      target:
        target.kind === 'none'
          ? null
          : {
              name: target.kind === 'named' ? target.name : 'formula',
              value: targetValue === null ? null : (F.toWire(targetValue) as WireComplex),
              ...(target.kind === 'formula' ? { latex: target.formula.latex } : {}),
            },
      deviation,
      verdict,
      falloff: falloff ? { exponent: falloff.exponent, valid: falloff.valid, spread: falloff.spread, measured: falloff.measured } : null,
      warnings,
      kinematics: kinToWire(F, k),
      engine: { version: ENGINE_VERSION },
      precision: { arithmetic: arith, condition: condition ?? conditionRatio(F, k), cancellation, estimated },
    }
  }
}

export { PhysicsError } from './errors'
export { SingularError, complexField, rationalField, parseRational } from './field'
export type { Field, WireNumber, Arithmetic } from './field'
export * from './kinematics'
export { THEORIES, LIMITS, validateProcess, processOf, isValidShift, defaultShift, tableExponent, vanishes } from './theories'
export type { TheoryName, Process } from './theories'
export { bcfw, bcfwValue, channels } from './bcfw'
export { threePoint, threePointFormula, boseSymmetry } from './three-point'
export { probeFalloff, falloffTable, fit as fitSlope } from './falloff'
export type { FalloffRow, FalloffResult } from './falloff'
export { crossShift } from './cross-shift'
export type { CrossShiftResult, CrossShiftRow } from './cross-shift'
export { floatTolerance, deviationOf, decideVerdict, lostPrecision } from './verdict'
