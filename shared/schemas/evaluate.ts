// The request body of POST /api/evaluate, exactly as docs/api.md "Evaluation request" fixes it, and the
// response type. zod 4's z.number() refuses NaN and ±Infinity, so a non-finite number fails here
// (400) and never reaches the engine.
import { z } from 'zod'
import { THEORY_NAMES } from '../physics/theories'
import { TARGET_NAMES } from '../physics/targets/index'

const num = z.number()
const complex = z.tuple([num, num])
const complexSpinor = z.tuple([complex, complex])
/** An exact input: an integer or "p/q" string, reduced or not. */
export const RationalString = z.string().regex(/^\s*[+-]?\d+(\s*\/\s*[+-]?\d+)?\s*$/, 'expected an integer or "p/q" string')
const exactSpinor = z.tuple([RationalString, RationalString])
const seed = z.union([z.number().int(), z.string().min(1).max(200)])

/** Characters a target formula may have (the formula parser refuses longer ones too). */
export const FORMULA_MAX_LENGTH = 2000
/** A typed target formula; the length message names the limit the parser enforces. */
export const FormulaTarget = z.object({ formula: z.string().max(FORMULA_MAX_LENGTH, { error: `is longer than ${FORMULA_MAX_LENGTH} characters` }) })

export const TheoryEnum = z.enum(THEORY_NAMES)
export const TargetNameEnum = z.enum(['auto', ...TARGET_NAMES, 'none'])
/** The target names in words, for error messages. */
export const TARGET_WORDS = `${TargetNameEnum.options.join(', ')} or { formula }`

export const KinematicsSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('spinors'), lambda: z.array(complexSpinor), lambdaTilde: z.array(complexSpinor) }),
  z.object({ kind: z.literal('exact-spinors'), lambda: z.array(exactSpinor), lambdaTilde: z.array(exactSpinor) }),
  z.object({ kind: z.literal('momenta'), momenta: z.array(z.tuple([num, num, num, num])) }),
  z.object({ kind: z.literal('random'), seed }),
  z.object({ kind: z.literal('rational'), seed }),
  z.object({ kind: z.literal('physical'), seed, energy: num.positive().default(1) }),
])

export const EvaluateRequestSchema = z.object({
  theory: TheoryEnum,
  spin: num.optional(),
  // No upper bound here: a long list is refused with 422 and the limit (docs/api.md), before any work.
  helicities: z.array(num).min(1),
  // Several species (theory qcd): one name per leg, "g", "q1".."q6", "qbar1".."qbar6"; omitted, every
  // leg is the theory's first species (a gluon). The engine checks names and lengths (422).
  species: z.array(z.string().max(16)).optional(),
  kinematics: KinematicsSchema,
  shift: z.tuple([z.number().int(), z.number().int()]).optional(),
  target: z.union([TargetNameEnum, FormulaTarget]).default('auto'),
  arithmetic: z.enum(['float', 'exact']).default('float'),
  probeFalloff: z.boolean().default(false),
  tree: z.boolean().default(false),
  // How exact arithmetic is carried out; both give the same fractions. 'modular' evaluates modulo
  // word-size primes and reconstructs the rationals (much faster); 'rational' uses big rationals
  // throughout (the reference). The term tree is always built in big rationals.
  exact: z.object({ backend: z.enum(['modular', 'rational']).default('modular') }).optional(),
})

/** The request after parsing (defaults applied). */
export type EvaluateRequest = z.output<typeof EvaluateRequestSchema>
/** The request as a client may send it (defaults optional). */
export type EvaluateRequestInput = z.input<typeof EvaluateRequestSchema>
export type Kinematics = z.output<typeof KinematicsSchema>

/** [re, im]: numbers in float, "p/q" strings in exact. */
export type WireComplex = [number, number] | [string, string]
export type WireLeg = { label: number } | { line: string }

export interface WireVertex {
  kind: 'angle' | 'square'
  legs: WireLeg[]
  helicities: number[]
  value: WireComplex
}

export interface WireSubAmplitude {
  value: WireComplex
  shift: [number, number]
  legs: WireLeg[]
  helicities: number[]
  terms: WireTerm[]
}

export interface WireTerm {
  left: number[]
  /** Below the top of a term tree: the legs (labels or lines) behind the positions in `left`. */
  leftLegs?: WireLeg[]
  helicity: number
  z: WireComplex
  pole: WireComplex
  value: WireComplex
  children: { left: WireSubAmplitude | WireVertex; right: WireSubAmplitude | WireVertex } | null
}

export type Verdict = 'singular point' | 'not evaluated' | 'boundary term suspected' | 'agrees' | 'disagrees'

export interface EvaluateResponse {
  n: number
  theory: z.output<typeof TheoryEnum>
  spin?: number
  /** Echoed when the request gave species per leg. */
  species?: string[]
  shift: [number, number]
  arithmetic: 'float' | 'exact'
  value: WireComplex | null
  terms: WireTerm[]
  target: { name: string; value: WireComplex | null; latex?: string } | null
  deviation: number | null
  verdict: Verdict
  falloff: { exponent: number; valid: boolean; spread?: number; measured?: boolean } | null
  warnings: string[]
  kinematics: { lambda: unknown[]; lambdaTilde: unknown[] }
  engine: { version: string }
  /**
   * The arithmetic the recursion ran in and the relative precision it is estimated to have reached:
   * `estimated` = unit roundoff × max(1 / condition, cancellation); `condition` = min |s_S| / max |s_ij|;
   * `cancellation` = max |term| / |value|. Null estimates in exact arithmetic.
   */
  precision?: { arithmetic: 'double' | 'double-double' | 'exact'; condition: number; cancellation: number | null; estimated: number | null }
  ms: number
}

/** A zod issue's path written as docs/api.md does: `kinematics.lambda[2][1]`. */
export function zodIssuePath(issue: { path: ReadonlyArray<PropertyKey> }): string {
  let out = ''
  for (const seg of issue.path) {
    if (typeof seg === 'number') out += `[${seg}]`
    else out += out ? `.${String(seg)}` : String(seg)
  }
  return out
}
