// A user's target formula in the trade's bracket notation: <1 2> (angle), [1 2] (square),
// s(1,2,3) (Mandelstam), <1|2+3|4] (sandwich), + - * / ^ (integer exponents), parentheses and
// numbers. Typed lookalikes (⟨ ⟩, 〈 〉, −, ·, ×) are read as their ASCII forms through the table
// of formula-syntax.ts, which also drives the syntax reference. A small tokenizer turns each bracket into a function call (ang, sq, sand, mand) and
// keeps a map back to the user's characters; the expression grammar is mathjs's own `parse`.
// The mathjs tree is then compiled into closures over Field<T>, so exact mode stays exact
// (decimals become exact rationals), and rendered to LaTeX for KaTeX.
import { create, parseDependencies } from 'mathjs'
import type { BigNumber, MathNode, ConstantNode, FunctionNode, OperatorNode, ParenthesisNode } from 'mathjs'
import type { Field } from './field'
import { SingularError } from './field'
import type { Kin } from './spinors'
import { PhysicsError } from './errors'
import { FORMULA_MAX_LENGTH } from '../schemas/evaluate'
import { normaliseFormula } from './formula-syntax'

const FIELD = 'target.formula'
/** Longest formula accepted (characters), and the largest |exponent|: both keep exact mode bounded. */
export { FORMULA_MAX_LENGTH }
export const FORMULA_MAX_EXPONENT = 64
/** Numbers are written with a decimal exponent in ±FORMULA_MAX_LITERAL_EXPONENT and at most this many digits. */
export const FORMULA_MAX_LITERAL_EXPONENT = 100
export const FORMULA_MAX_LITERAL_DIGITS = 100
/**
 * Bound on the size of intermediate exact numbers, in "bracket degrees": a bracket counts 1 (a sandwich
 * or s(…) 2), a number one per 20 digits, a product adds, a power multiplies. Nested powers such as
 * ((<1 2>^64)^64)^64 would otherwise build numbers of millions of digits in exact mode.
 */
export const FORMULA_MAX_DEGREE = 2048

// BigNumber constants: mathjs keeps a decimal literal exactly, so 0.1 becomes 1/10.
const math = create({ parseDependencies: parseDependencies! }, { number: 'BigNumber', precision: 64 })

/** A(σ) of the same process with its legs in the order σ (0-based), for formulas that refer to amplitudes. */
export type AmplitudeOf = <T>(F: Field<T>, k: Kin<T>, order: number[]) => T

export interface CompiledFormula {
  latex: string
  /** Whether the formula refers to amplitudes A(…) (then `evaluate` needs `amplitude`). */
  usesAmplitudes: boolean
  evaluate<T>(F: Field<T>, k: Kin<T>, amplitude?: AmplitudeOf): T
}

// The amplitude callback of the evaluation in progress (evaluation is synchronous and not re-entered).
let currentAmplitude: AmplitudeOf | null = null

function fail(message: string, position: number): never {
  throw new PhysicsError(FIELD, `${message} at position ${position}`)
}

type Bracket
  = | { kind: 'ang' | 'sq'; legs: [number, number] }
    | { kind: 'sand'; i: number; j: number; p: number[] }
    | { kind: 'mand'; p: number[] }
    | { kind: 'amp'; p: number[] }

interface Translation {
  text: string
  /** For each character of `text`, the 0-based index of the user's character it came from. */
  map: number[]
  /** 0-based source positions of the explicit operators + - * / ^, in source order. */
  ops: number[]
}

/** Turns brackets into calls; everything else mathjs is allowed to see is copied verbatim. */
function translate(src: string, n: number): Translation {
  let text = ''
  const map: number[] = []
  const ops: number[] = []
  const emit = (s: string, at: number) => {
    text += s
    for (let c = 0; c < s.length; c++) map.push(at)
  }
  let pos = 0
  const end = src.length
  const ws = () => {
    while (pos < end && /\s/.test(src[pos]!)) pos++
  }
  const expectChar = (chars: string, what: string): string => {
    ws()
    if (pos >= end) fail('unexpected end of input', end + 1)
    const c = src[pos]!
    if (!chars.includes(c)) fail(`expected ${what}, found "${c}"`, pos + 1)
    pos++
    return c
  }
  /** One leg number (1..n), or — for n ≤ 9 and `allowPair` — two digits written together ("12"). */
  const legs = (allowPair: boolean): number[] => {
    ws()
    if (pos >= end) fail('unexpected end of input', end + 1)
    const start = pos
    while (pos < end && /\d/.test(src[pos]!)) pos++
    if (start === pos) fail(`expected a leg number, found "${src[pos]}"`, pos + 1)
    const digits = src.slice(start, pos)
    const out: number[] = []
    if (allowPair && n <= 9 && digits.length > 1) {
      for (let d = 0; d < digits.length; d++) {
        out.push(checkLeg(Number(digits[d]), start + d))
        legAt.push(start + d)
      }
    }
    else {
      out.push(checkLeg(Number(digits), start))
      legAt.push(start)
    }
    return out
  }
  const checkLeg = (leg: number, at: number): number => {
    if (!Number.isSafeInteger(leg) || leg < 1 || leg > n) fail(`leg ${leg} does not exist (legs are 1..${n})`, at + 1)
    return leg
  }
  // Source positions of the legs read since the last reset, for pointing at a repeated one.
  let legAt: number[] = []
  const noRepeats = (list: number[], what: string) => {
    const seen = new Set<number>()
    list.forEach((l, t) => {
      if (seen.has(l)) fail(`leg ${l} appears twice in ${what}`, legAt[t]! + 1)
      seen.add(l)
    })
  }
  /** Legs joined by + (the momentum of a sandwich), up to the closing "|". */
  const momentum = (): number[] => {
    const p = legs(false)
    for (;;) {
      ws()
      if (src[pos] === '+') {
        pos++
        p.push(...legs(false))
      }
      else return p
    }
  }
  /** "(" legs separated by commas ")" after the name s or A (the first may be digits written together). */
  const legList = (name: string, allowPair: boolean): number[] => {
    expectChar('(', `"(" after ${name}`)
    legAt = []
    const p: number[] = [...legs(allowPair)]
    for (;;) {
      ws()
      if (src[pos] === ',') {
        pos++
        p.push(...legs(false))
      }
      else break
    }
    expectChar(')', `"," or ")" in ${name}(…)`)
    return p
  }
  const call = (b: Bracket, at: number) => {
    const args = b.kind === 'sand' ? [b.i, b.j, ...b.p] : b.kind === 'mand' || b.kind === 'amp' ? b.p : b.legs
    // A space keeps "<1 2><2 3>" an implicit product for mathjs.
    const prev = text[text.length - 1]
    emit(`${prev !== undefined && /[\w).]/.test(prev) ? ' ' : ''}${b.kind}(${args.join(',')})`, at)
  }

  while (pos < end) {
    const c = src[pos]!
    const at = pos
    if (/\s/.test(c)) {
      emit(' ', pos++)
    }
    else if (c === '<' || c === '[') {
      // <i j>, [i j], <i|P|j] or [j|P|i> (= <i|P|j]).
      pos++
      const first = legs(true)
      ws()
      if (src[pos] === '|') {
        if (first.length !== 1) fail('a sandwich starts with a single leg', at + 2)
        pos++
        legAt = []
        const p = momentum()
        noRepeats(p, 'the momentum of a sandwich')
        expectChar('|', '"|"')
        const last = legs(false)
        expectChar(c === '<' ? ']' : '>', c === '<' ? '"]" (a sandwich reads <i|P|j])' : '">" (a sandwich reads [j|P|i>)')
        const [i, j] = c === '<' ? [first[0]!, last[0]!] : [last[0]!, first[0]!]
        call({ kind: 'sand', i, j, p }, at)
      }
      else {
        const pair = [...first]
        if (pair.length === 1) {
          if (src[pos] === ',') pos++
          pair.push(...legs(false))
        }
        if (pair.length !== 2) fail(`a bracket holds two legs, found ${pair.length}`, at + 1)
        expectChar(c === '<' ? '>' : ']', c === '<' ? '">" (an angle bracket reads <i j>)' : '"]" (a square bracket reads [i j])')
        call({ kind: c === '<' ? 'ang' : 'sq', legs: [pair[0]!, pair[1]!] }, at)
      }
    }
    else if (/[A-Za-z_]/.test(c)) {
      let e = pos
      while (e < end && /\w/.test(src[e]!)) e++
      const name = src.slice(pos, e)
      if (name !== 's' && name !== 'A') fail(`unknown name "${name}" (use <i j>, [i j], s(i,j,…), <i|P|j] or A(…))`, pos + 1)
      pos = e
      if (name === 'A') {
        // A(σ1, …, σn): the amplitude of the same process with its legs in this order
        const p = legList('A', n <= 9)
        noRepeats(p, 'A(…)')
        if (p.length !== n) fail(`A(…) lists every leg once: ${n} legs, found ${p.length}`, at + 1)
        call({ kind: 'amp', p }, at)
        continue
      }
      const p = legList('s', true)
      if (p.length < 2) fail('s(…) needs at least two legs', at + 1)
      noRepeats(p, 's(…)')
      call({ kind: 'mand', p }, at)
    }
    else if (/[\d.]/.test(c)) {
      const m = /^(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?/.exec(src.slice(pos))
      if (!m) fail(`unexpected "${c}"`, pos + 1)
      if (m[1]!.replace('.', '').length > FORMULA_MAX_LITERAL_DIGITS) fail(`the number has more than ${FORMULA_MAX_LITERAL_DIGITS} digits`, pos + 1)
      if (m[2] && Math.abs(Number(m[2].slice(1))) > FORMULA_MAX_LITERAL_EXPONENT) {
        fail(`the number's exponent is out of range (between -${FORMULA_MAX_LITERAL_EXPONENT} and ${FORMULA_MAX_LITERAL_EXPONENT})`, pos + 1)
      }
      emit(m[0], pos)
      for (let t = 1; t < m[0].length; t++) map[map.length - m[0].length + t] = pos + t
      pos += m[0].length
    }
    else if ('+-*/^'.includes(c)) {
      ops.push(pos)
      emit(c, pos++)
    }
    else if (c === '(' || c === ')') {
      emit(c, pos++)
    }
    else {
      fail(`unexpected character "${c}"`, pos + 1)
    }
  }
  return { text, map, ops }
}

const MESSAGES: Array<[RegExp, (m: RegExpExecArray) => string]> = [
  [/^Unexpected end of expression/, () => 'unexpected end of input'],
  [/^Value expected/, () => 'a value is expected'],
  [/^Parenthesis \) expected/, () => 'a closing parenthesis is missing'],
  [/^Unexpected operator (.*?) \(char/, (m) => `unexpected "${m[1]}"`],
  [/^Unexpected part "(.*?)"/, (m) => `unexpected "${m[1]}" (two values side by side need an operator)`],
]

function parseWithMathjs(tr: Translation, src: string): MathNode {
  try {
    return math.parse(tr.text)
  }
  catch (e) {
    const err = e as SyntaxError & { char?: number }
    const msg = err.message ?? String(e)
    let reason = msg.replace(/\s*\(char \d+\)\s*$/, '')
    for (const [re, f] of MESSAGES) {
      const m = re.exec(msg)
      if (m) {
        reason = f(m)
        break
      }
    }
    reason = reason.charAt(0).toLowerCase() + reason.slice(1)
    const c = typeof err.char === 'number' ? err.char - 1 : tr.text.length
    const position = reason === 'unexpected end of input' || c >= tr.map.length ? src.length + 1 : tr.map[Math.max(0, c)]! + 1
    fail(reason, position)
  }
}

type Eval = <T>(F: Field<T>, k: Kin<T>) => T

/** Decimal digits to a field element, exactly in exact mode. */
function fromDigits<T>(F: Field<T>, digits: string): T {
  const neg = digits.startsWith('-')
  const s = neg ? digits.slice(1) : digits
  let acc = F.zero
  const base = F.fromInt(1e9)
  let start = s.length % 9 || 9
  acc = F.fromInt(Number(s.slice(0, start)))
  for (; start < s.length; start += 9) acc = F.add(F.mul(acc, base), F.fromInt(Number(s.slice(start, start + 9))))
  return neg ? F.neg(acc) : acc
}

// Numbers parse as BigNumber (the instance is created with number: 'BigNumber'); an empty formula is a constant without a value.
type Constant = ConstantNode<BigNumber | undefined>

function argLegs(node: FunctionNode): number[] {
  return node.args.map((a) => (a as ConstantNode<BigNumber>).value).map((d) => d.toNumber() - 1)
}

/** Walks the mathjs tree in source order, compiling to closures; `opAt` yields operator positions. */
function compile(node: MathNode, opAt: () => number): Eval {
  switch (node.type) {
    case 'ConstantNode': {
      const v = (node as Constant).value
      if (v === undefined) fail('the formula is empty', 1)
      const [num, den] = v.toFraction().map((d) => d.toFixed())
      return (F) => (den === '1' ? fromDigits(F, num!) : F.div(fromDigits(F, num!), fromDigits(F, den!)))
    }
    case 'ParenthesisNode':
      return compile((node as ParenthesisNode).content, opAt)
    case 'FunctionNode': {
      const fn = node as FunctionNode
      const legs = argLegs(fn)
      switch (fn.fn.name) {
        case 'ang': {
          const [i, j] = legs as [number, number]
          return (F, k) => {
            const a = k.lambda[i]!, b = k.lambda[j]!
            return F.sub(F.mul(a[0], b[1]), F.mul(a[1], b[0]))
          }
        }
        case 'sq': {
          const [i, j] = legs as [number, number]
          return (F, k) => {
            const a = k.lambdaTilde[i]!, b = k.lambdaTilde[j]!
            return F.sub(F.mul(a[1], b[0]), F.mul(a[0], b[1]))
          }
        }
        case 'sand': {
          // ⟨i|P|j] = Σ_{l∈P} ⟨il⟩[lj]
          const [i, j, ...p] = legs as [number, number, ...number[]]
          return (F, k) => {
            let s = F.zero
            const li = k.lambda[i]!, tj = k.lambdaTilde[j]!
            for (const l of p) {
              const ll = k.lambda[l]!, tl = k.lambdaTilde[l]!
              const ang = F.sub(F.mul(li[0], ll[1]), F.mul(li[1], ll[0]))
              const sq = F.sub(F.mul(tl[1], tj[0]), F.mul(tl[0], tj[1]))
              s = F.add(s, F.mul(ang, sq))
            }
            return s
          }
        }
        case 'amp': {
          const order = legs
          return (F, k) => {
            if (!currentAmplitude) throw new PhysicsError(FIELD, 'A(…) needs the process the formula belongs to')
            return currentAmplitude(F, k, order)
          }
        }
        default: {
          // s(P) = det Σ_{l∈P} λ_l λ̃_lᵀ
          return (F, k) => {
            let a = F.zero, b = F.zero, c = F.zero, d = F.zero
            for (const l of legs) {
              const x = k.lambda[l]!, y = k.lambdaTilde[l]!
              a = F.add(a, F.mul(x[0], y[0]))
              b = F.add(b, F.mul(x[0], y[1]))
              c = F.add(c, F.mul(x[1], y[0]))
              d = F.add(d, F.mul(x[1], y[1]))
            }
            return F.sub(F.mul(a, d), F.mul(b, c))
          }
        }
      }
    }
    case 'OperatorNode': {
      const op = node as OperatorNode
      const args = op.args
      if (args.length === 1) {
        opAt()
        const x = compile(args[0]!, opAt)
        return op.fn === 'unaryMinus' ? (F, k) => F.neg(x(F, k)) : x
      }
      // In-order: left operand, this operator, right operand — the source order of the operators.
      const left = compile(args[0]!, opAt)
      const at = op.implicit ? -1 : opAt()
      if (op.fn === 'pow') {
        const e = exponentOf(args[1]!, at)
        // Skip the exponent's own operators (unary minus) so later positions stay aligned.
        countOps(args[1]!, opAt)
        return (F, k) => {
          const base = left(F, k)
          if (e < 0 && F.isZero(base)) throw new SingularError(`the formula raises zero to a negative power at position ${at + 1}`)
          return F.pow(base, e)
        }
      }
      const right = compile(args[1]!, opAt)
      switch (op.fn) {
        case 'add':
          return (F, k) => F.add(left(F, k), right(F, k))
        case 'subtract':
          return (F, k) => F.sub(left(F, k), right(F, k))
        case 'multiply':
          return (F, k) => F.mul(left(F, k), right(F, k))
        case 'divide':
          return (F, k) => F.div(left(F, k), right(F, k), `the formula divides by zero at position ${at + 1}`)
        default:
          fail(`the operator "${op.op}" is not supported`, at + 1)
      }
    }
    // falls through: no other node can come out of the translation
    default:
      fail(`unsupported expression "${node.toString()}"`, 1)
  }
}

/** The bracket degree of a subtree (see FORMULA_MAX_DEGREE); powers are checked by exponentOf first. */
function degreeOf(node: MathNode): number {
  switch (node.type) {
    case 'ConstantNode': {
      const v = (node as Constant).value
      if (v === undefined) return 0
      const [num, den] = v.toFraction()
      const digits = num!.toFixed().length + den!.toFixed().length
      return Math.ceil(digits / 20)
    }
    case 'ParenthesisNode':
      return degreeOf((node as ParenthesisNode).content)
    case 'FunctionNode': {
      const name = (node as FunctionNode).fn.name
      return name === 'ang' || name === 'sq' ? 1 : 2
    }
    case 'OperatorNode': {
      const op = node as OperatorNode
      if (op.args.length === 1) return degreeOf(op.args[0]!)
      if (op.fn === 'pow') {
        const e = Math.abs(exponentOf(op.args[1]!, 0))
        return degreeOf(op.args[0]!) * e
      }
      const [a, b] = op.args.map(degreeOf) as [number, number]
      return op.fn === 'add' || op.fn === 'subtract' ? Math.max(a, b) : a + b
    }
    default:
      return 0
  }
}

function countOps(node: MathNode, opAt: () => number): void {
  node.traverse((c) => {
    if (c.type === 'OperatorNode' && !(c as OperatorNode).implicit) opAt()
  })
}

/** The exponent must be an integer constant (possibly negated or in parentheses). */
function exponentOf(node: MathNode, at: number): number {
  let sign = 1
  let x = node
  for (;;) {
    if (x.type === 'ParenthesisNode') x = (x as ParenthesisNode).content
    else if (x.type === 'OperatorNode' && (x as OperatorNode).args.length === 1) {
      if ((x as OperatorNode).fn === 'unaryMinus') sign = -sign
      x = (x as OperatorNode).args[0]!
    }
    else break
  }
  const v = x.type === 'ConstantNode' ? (x as Constant).value : null
  if (!v || !v.isInteger()) fail('an exponent must be an integer', at + 1)
  const e = sign * v.toNumber()
  if (Math.abs(e) > FORMULA_MAX_EXPONENT) fail(`the exponent ${e} is too large (at most ${FORMULA_MAX_EXPONENT} in size)`, at + 1)
  return e === 0 ? 0 : e
}

// ---- LaTeX ----------------------------------------------------------------------------------

function legTex(legs: number[]): string {
  return legs.every((l) => l < 10) ? legs.join('') : legs.join(',')
}

function texHandler(node: MathNode): string | undefined {
  if (node.type !== 'FunctionNode') return undefined
  const fn = node as FunctionNode
  const legs = argLegs(fn).map((l) => l + 1)
  switch (fn.fn.name) {
    case 'ang':
      return `\\langle ${legs[0]}\\,${legs[1]}\\rangle`
    case 'sq':
      return `[${legs[0]}\\,${legs[1]}]`
    case 'sand':
      return `\\langle ${legs[0]}|${legs.slice(2).join('+')}|${legs[1]}]`
    case 'mand':
      return `s_{${legTex(legs)}}`
    case 'amp':
      return `A(${legs.join(',')})`
    default:
      return undefined
  }
}

/** Parses and checks a formula for n legs (labels 1..n); errors are PhysicsErrors on target.formula. */
export function compileFormula(src: string, n: number): CompiledFormula {
  if (typeof src !== 'string') throw new PhysicsError(FIELD, 'the formula must be a string')
  if (src.length > FORMULA_MAX_LENGTH) throw new PhysicsError(FIELD, `the formula is longer than ${FORMULA_MAX_LENGTH} characters`)
  if (src.trim() === '') throw new PhysicsError(FIELD, 'the formula is empty')
  const tr = translate(normaliseFormula(src), n)
  const tree = parseWithMathjs(tr, src)
  let op = 0
  const opAt = () => tr.ops[op++] ?? src.length
  const run = compile(tree, opAt)
  const degree = degreeOf(tree)
  if (degree > FORMULA_MAX_DEGREE) {
    throw new PhysicsError(FIELD, `the formula is too large for exact arithmetic (degree ${degree}, at most ${FORMULA_MAX_DEGREE}: lower the powers)`)
  }
  const latex = tree.toTex({ parenthesis: 'auto', implicit: 'hide', handler: texHandler })
  return {
    latex,
    usesAmplitudes: /\bamp\(/.test(tr.text),
    evaluate<T>(F: Field<T>, k: Kin<T>, amplitude?: AmplitudeOf): T {
      if (k.lambda.length !== n || k.lambdaTilde.length !== n) {
        throw new PhysicsError(FIELD, `the formula was compiled for ${n} legs, the point has ${k.lambda.length}`)
      }
      const outer = currentAmplitude
      currentAmplitude = amplitude ?? null
      try {
        return run(F, k)
      }
      finally {
        currentAmplitude = outer
      }
    },
  }
}
