// evaluate(): the docs/api.md "Evaluation request" response, verdict rules and error rules (422 PhysicsError
// naming the field; schema failures are zod errors → 400 at the route).
import { describe, expect, it } from 'vitest'
import { ZodError } from 'zod'
import { evaluate, ENGINE_VERSION, PhysicsError, physicalMomenta, randomPoint, kinToWire, solveLastTwo } from '#shared/physics/index'
import { EvaluateRequestSchema, zodIssuePath, type EvaluateRequestInput } from '#shared/schemas/evaluate'
import { Fraction, complexField as C, rationalField as Q } from '#shared/physics/field'

const mhv = (n: number) => [-1, -1, ...Array(n - 2).fill(1)]

describe('response shape', () => {
  it.each([4, 5, 6])('Parke–Taylor agrees at n = %i (float and exact)', (n) => {
    const f = evaluate({ theory: 'gluon', helicities: mhv(n), kinematics: { kind: 'random', seed: n } })
    expect(f).toMatchObject({ n, theory: 'gluon', shift: [1, 2], arithmetic: 'float', verdict: 'agrees', falloff: null, engine: { version: ENGINE_VERSION } })
    expect(f.target!.name).toBe('parke-taylor')
    expect(f.deviation!).toBeLessThan(1e-13)
    expect(typeof f.value![0]).toBe('number')
    expect(typeof f.ms).toBe('number')
    expect(f.kinematics.lambda).toHaveLength(n)
    const e = evaluate({ theory: 'gluon', helicities: mhv(n), kinematics: { kind: 'rational', seed: n }, arithmetic: 'exact' })
    expect(e.verdict).toBe('agrees')
    expect(e.deviation).toBe(0)
    expect(e.value).toEqual(e.target!.value)
    expect(e.value![0]).toMatch(/^-?\d+(\/\d+)?$/)
    expect(e.value![1]).toBe('0')
    expect((e.kinematics.lambda[0] as string[])[0]).toMatch(/^-?\d+(\/\d+)?$/)
  })

  it('the value equals Parke–Taylor at the echoed point (spinors kind round trip)', () => {
    const r = evaluate({ theory: 'gluon', helicities: [-1, 1, -1, 1, 1], kinematics: { kind: 'physical', seed: 4, energy: 7 } })
    const back = evaluate({ theory: 'gluon', helicities: [-1, 1, -1, 1, 1], kinematics: { kind: 'spinors', ...(r.kinematics as { lambda: [[number, number], [number, number]][]; lambdaTilde: [[number, number], [number, number]][] }) } })
    expect(Math.abs(back.value![0] as number - (r.value![0] as number))).toBeLessThan(1e-12 * Math.abs(r.value![0] as number) + 1e-300)
    expect(back.warnings.some((w) => w.startsWith('kinematics: exact momentum conservation restored'))).toBe(true)
  })

  it('terms: left is sorted, wrapping sets included; pole is P² at z = 0', () => {
    const r = evaluate({ theory: 'gluon', helicities: [-1, 1, -1, 1, -1, 1], kinematics: { kind: 'rational', seed: 2 }, arithmetic: 'exact', shift: [1, 3] })
    const lefts = r.terms.map((t) => t.left.join(','))
    expect(lefts).toContain('1,2')
    expect(lefts.some((l) => l === '1,5,6' || l === '1,2,6' || l === '1,6')).toBe(true)
    for (const t of r.terms) expect(t.left).toEqual([...t.left].sort((a, b) => a - b))
    let sum = new Fraction(0)
    for (const t of r.terms) sum = sum.add(new Fraction(t.value[0] as string))
    expect(sum.toFraction()).toBe(r.value![0])
  })

  it('tree: children down to three-point vertices, lines named L1, L2, …', () => {
    const r = evaluate({ theory: 'gluon', helicities: [-1, 1, -1, 1, 1, 1], kinematics: { kind: 'random', seed: 1 }, tree: true })
    const lines = new Set<string>()
    let vertices = 0
    const walk = (node: any) => {
      if ('kind' in node) {
        vertices++
        expect(['angle', 'square']).toContain(node.kind)
        expect(node.legs).toHaveLength(3)
        expect(node.helicities).toHaveLength(3)
        for (const l of node.legs) if ('line' in l) lines.add(l.line)
        return
      }
      expect(node.shift).toHaveLength(2)
      for (const t of node.terms) {
        walk(t.children.left)
        walk(t.children.right)
      }
    }
    for (const t of r.terms) {
      expect(t.children).not.toBeNull()
      walk(t.children!.left)
      walk(t.children!.right)
    }
    // Three-point vertices over every nested term of 1⁻2⁺3⁻4⁺5⁺6⁺ (measured).
    expect(vertices).toBe(4)
    expect([...lines].every((l) => /^L\d+$/.test(l))).toBe(true)
    expect(lines.has('L1')).toBe(true)
    const plain = evaluate({ theory: 'gluon', helicities: [-1, 1, -1, 1, 1, 1], kinematics: { kind: 'random', seed: 1 } })
    expect(plain.terms.every((t) => t.children === null)).toBe(true)
    expect(Math.abs((r.value![0] as number) - (plain.value![0] as number))).toBeLessThan(1e-12 * Math.abs(plain.value![0] as number))
  })

  it('probeFalloff: the exponent of an adjacent valid gluon shift is −1', () => {
    const r = evaluate({ theory: 'gluon', helicities: [-1, 1, -1, 1, 1], kinematics: { kind: 'random', seed: 3 }, probeFalloff: true })
    expect(r.falloff).toMatchObject({ exponent: -1, valid: true })
  })

  it('a user formula target (Parke–Taylor written out)', () => {
    const r = evaluate({ theory: 'gluon', helicities: [-1, -1, 1, 1], kinematics: { kind: 'rational', seed: 1 }, arithmetic: 'exact', target: { formula: '<1 2>^4/(<1 2><2 3><3 4><4 1>)' } })
    expect(r.target!.name).toBe('formula')
    expect(r.verdict).toBe('agrees')
  })
})

describe('verdict rules, in order', () => {
  it.each([
    ['all plus', [1, 1, 1, 1, 1]],
    ['one minus', [1, -1, 1, 1, 1, 1]],
    ['one plus (gravitons)', [-2, -2, -2, 2, -2]],
  ])('vanishing class (%s): value 0, target 0 exactly, agrees', (_, h) => {
    const r = evaluate({ theory: Math.abs(h[0]!) === 2 ? 'graviton' : 'gluon', helicities: h, kinematics: { kind: 'random', seed: 1 } })
    expect(r.value).toEqual([0, 0])
    expect(r.target!.value).toEqual([0, 0])
    expect(r.deviation).toBe(0)
    expect(r.verdict).toBe('agrees')
  })
  it('target none → not evaluated', () => {
    expect(evaluate({ theory: 'gluon', helicities: mhv(5), kinematics: { kind: 'random', seed: 1 }, target: 'none' }).verdict).toBe('not evaluated')
  })
  it('[+,−⟩ shift → boundary term suspected by the table alone, falloff null', () => {
    const r = evaluate({ theory: 'gluon', helicities: [-1, -1, 1, 1, 1], kinematics: { kind: 'random', seed: 1 }, shift: [3, 2] })
    expect(r.verdict).toBe('boundary term suspected')
    expect(r.falloff).toBeNull()
  })
  it('scalar adjacent shift → boundary term suspected; the probe says 0', () => {
    const r = evaluate({ theory: 'scalar-cubic', helicities: [0, 0, 0, 0], kinematics: { kind: 'rational', seed: 1 }, arithmetic: 'exact', shift: [1, 2], probeFalloff: true })
    expect(r.verdict).toBe('boundary term suspected')
    expect(r.falloff!.exponent).toBe(0)
    expect(r.deviation).toBeGreaterThan(0)
  })
  it('spin 3: Bose warning, no target (auto → none), evaluated', () => {
    const r = evaluate({ theory: 'spin', spin: 3, helicities: [-3, -3, 3, 3], kinematics: { kind: 'rational', seed: 1 }, arithmetic: 'exact' })
    expect(r.verdict).toBe('not evaluated')
    expect(r.target).toBeNull()
    expect(r.value).not.toBeNull()
    expect(r.warnings.some((w) => /antisymmetric/.test(w))).toBe(true)
  })
  it('a wrong formula target disagrees', () => {
    const r = evaluate({ theory: 'gluon', helicities: [-1, -1, 1, 1], kinematics: { kind: 'random', seed: 1 }, target: { formula: '2*<1 2>^4/(<1 2><2 3><3 4><4 1>)' } })
    expect(r.verdict).toBe('disagrees')
    expect(r.deviation!).toBeCloseTo(0.5, 12)
  })
  it('singular point: collinear legs 1 ∥ 2 → 200 shape, value null, warning names the pole', () => {
    const f = (a: number, b = 1) => new Fraction(a, b)
    const k = solveLastTwo(Q, {
      lambda: [[f(1), f(2)], [f(2), f(4)], [f(3), f(-1)], [f(1), f(5)]],
      lambdaTilde: [[f(1), f(1)], [f(2), f(-3)], [f(0), f(0)], [f(0), f(0)]],
    })
    const w = kinToWire(Q, k) as { lambda: [string, string][]; lambdaTilde: [string, string][] }
    const r = evaluate({ theory: 'gluon', helicities: [-1, -1, 1, 1], kinematics: { kind: 'exact-spinors', ...w }, arithmetic: 'exact' })
    expect(r.verdict).toBe('singular point')
    expect(r.value).toBeNull()
    expect(r.warnings.some((x) => /s\(1,2\)/.test(x))).toBe(true)
  })
})

describe('bad input: typed errors naming the field', () => {
  const base: EvaluateRequestInput = { theory: 'gluon', helicities: [-1, -1, 1, 1], kinematics: { kind: 'random', seed: 1 } }
  const k4 = kinToWire(C, randomPoint(4, 1)) as { lambda: [[number, number], [number, number]][]; lambdaTilde: [[number, number], [number, number]][] }
  const good = physicalMomenta(4, 1, 2)
  it.each([
    ['wrong number of spinors', { ...base, kinematics: { kind: 'spinors', lambda: k4.lambda.slice(0, 3), lambdaTilde: k4.lambdaTilde } }, 'kinematics.lambda', /^kinematics\.lambda: 3 angle spinors given for 4 helicities/],
    ['non-conserving momenta', { ...base, kinematics: { kind: 'momenta', momenta: good.map((p, i) => (i === 3 ? p.map((x) => x * 1.1) : p)) } }, 'kinematics', /^kinematics: momentum is not conserved: \|Σp\| = .* relative to the largest energy$/],
    ['a massive leg', { ...base, kinematics: { kind: 'momenta', momenta: good.map((p, i) => (i === 1 ? [p[0] + 0.5, p[1], p[2], p[3]] : p)) } }, 'kinematics', /^kinematics: leg 2 is not massless: p² = /],
    ['a shift naming a missing leg', { ...base, shift: [1, 9] }, 'shift', /^shift: leg 9 does not exist \(legs are 1\.\.4\)$/],
    ['exact arithmetic with float input', { ...base, arithmetic: 'exact' }, 'arithmetic', /^arithmetic: exact arithmetic needs exact input/],
    ['half-integer spin', { theory: 'spin', spin: 1.5, helicities: [-1.5, -1.5, 1.5, 1.5], kinematics: { kind: 'random', seed: 1 } }, 'spin', /^spin: half-integer spin 3\/2 is refused/],
    ['spin ≠ 2 at n = 5', { theory: 'spin', spin: 3, helicities: [-3, -3, 3, 3, 3], kinematics: { kind: 'random', seed: 1 } }, 'helicities', /only n = 4/],
    ['a helicity the theory lacks', { ...base, helicities: [-2, -1, 1, 1] }, 'helicities[0]', /^helicities\[0\]: a gluon has helicity ±1, got -2$/],
    ['over the gluon float limit', { ...base, helicities: [-1, -1, ...Array(11).fill(1)] }, 'helicities', /limit of 12/],
    ['over the exact graviton limit', { theory: 'graviton', helicities: [-2, -2, 2, 2, 2, 2, 2], kinematics: { kind: 'rational', seed: 1 }, arithmetic: 'exact' }, 'helicities', /limit of 6/],
    ['a target that does not apply', { ...base, target: 'hodges' }, 'target', /^target: hodges does not apply/],
    ['a formula with a syntax error', { ...base, target: { formula: '<1 2>^4/(' } }, 'target.formula', /^target\.formula: .*position/],
  ] as [string, EvaluateRequestInput, string, RegExp][])('%s → 422', (_, req, field, msg) => {
    try {
      evaluate(req)
      expect.unreachable()
    }
    catch (e) {
      expect(e).toBeInstanceOf(PhysicsError)
      expect((e as PhysicsError).status).toBe(422)
      expect((e as PhysicsError).field).toBe(field)
      expect((e as Error).message).toMatch(msg)
    }
  })

  it.each([
    ['"NaN" where a number belongs', { ...base, kinematics: { kind: 'spinors', lambda: [[['NaN', 0], [0, 0]]], lambdaTilde: [] } }, 'kinematics.lambda[0][0][0]'],
    ['NaN', { ...base, helicities: [NaN, -1, 1, 1] }, 'helicities[0]'],
    ['Infinity', { ...base, kinematics: { kind: 'physical', seed: 1, energy: Infinity } }, 'kinematics.energy'],
    ['an unknown theory', { ...base, theory: 'photon' }, 'theory'],
    ['an unknown kinematics kind', { ...base, kinematics: { kind: 'lattice' } }, 'kinematics.kind'],
    ['a bad rational', { ...base, arithmetic: 'exact', kinematics: { kind: 'exact-spinors', lambda: [['1/2', 'x']], lambdaTilde: [] } }, 'kinematics.lambda[0][1]'],
    ['a fractional shift', { ...base, shift: [1.5, 2] }, 'shift[0]'],
    ['an unknown exact backend', { ...base, arithmetic: 'exact', kinematics: { kind: 'rational', seed: 1 }, exact: { backend: 'p-adic' } }, 'exact.backend'],
  ])('%s fails the schema (400) at %s', (_, req, path) => {
    const r = EvaluateRequestSchema.safeParse(req)
    expect(r.success).toBe(false)
    expect(r.error!.issues.map(zodIssuePath)).toContain(path)
    expect(() => evaluate(req as EvaluateRequestInput)).toThrow(ZodError)
  })

  it('defaults: shift by the documented rule, target auto, float, no probe, no tree', () => {
    const r = EvaluateRequestSchema.parse(base)
    expect(r).toMatchObject({ target: 'auto', arithmetic: 'float', probeFalloff: false, tree: false })
    expect(r.shift).toBeUndefined()
    expect(evaluate({ ...base, helicities: [1, 1, -1, 1, -1] }).shift).toEqual([3, 4])
    expect(evaluate({ theory: 'scalar-cubic', helicities: [0, 0, 0, 0, 0], kinematics: { kind: 'random', seed: 1 } }).shift).toEqual([1, 3])
  })

  it('zodIssuePath writes docs/api.md paths', () => {
    expect(zodIssuePath({ path: ['kinematics', 'lambda', 2, 1] })).toBe('kinematics.lambda[2][1]')
    expect(zodIssuePath({ path: ['target', 'formula'] })).toBe('target.formula')
    expect(zodIssuePath({ path: ['helicities', 0] })).toBe('helicities[0]')
  })
})

describe('limits', () => {
  it('a very long helicity list is a 422 naming the limit, not a schema failure', () => {
    expect(() => evaluate({ theory: 'gluon', helicities: Array(100).fill(1), kinematics: { kind: 'random', seed: 1 } })).toThrow(/^helicities: 100 legs exceed the limit of 12/)
  })
})

describe('overflow', () => {
  it('momenta at 1e200 overflow doubles: a singular point, never NaN on the wire', () => {
    const r = evaluate({ theory: 'gluon', helicities: [-1, 1, -1, 1, 1, 1], kinematics: { kind: 'momenta', momenta: physicalMomenta(6, 1, 1e200) } })
    expect(r.verdict).toBe('singular point')
    expect(r.value).toBeNull()
    expect(JSON.stringify(r)).not.toMatch(/NaN|null,null/)
  })
})

describe('float gravity runs in double-double', () => {
  it('6-graviton NMHV at a real rational point where plain doubles lose 86% agrees with KLT', () => {
    const r = evaluate({ theory: 'graviton', helicities: [-2, 2, -2, 2, -2, 2], kinematics: { kind: 'rational', seed: 3 } })
    expect(r.verdict).toBe('agrees')
    expect(r.deviation!).toBeLessThan(1e-13)
    expect(typeof r.value![0]).toBe('number')
  })
})
