// The theory and target registries and the shared colour-order helpers: what the zod enums, the
// batch runner and the editor derive from them.
import { describe, expect, it } from 'vitest'
import { THEORIES, THEORY_NAMES, isColourOrdered, legsOf, pdgOf, processOf, spinOf, theoryOfSpin, validateProcess } from '#shared/physics/theories'
import { TARGETS, TARGET_INFO, TARGET_NAMES } from '#shared/physics/targets/index'
import { checkOrder, effectiveOrder, inOrder, orderProblem, responseToLabels, shiftInOrder, toLabelOrder } from '#shared/physics/colour-order'
import { TargetNameEnum, TheoryEnum, type EvaluateResponse } from '#shared/schemas/evaluate'
import { TheorySchema } from '#shared/schemas/graph'

describe('theory registry', () => {
  it('is the source of both theory enums', () => {
    expect(TheoryEnum.options).toEqual([...THEORY_NAMES])
    expect(TheorySchema.options).toEqual([...THEORY_NAMES])
    expect(TheorySchema.safeParse('photon').error?.issues[0]?.message).toBe('must be gluon, graviton, scalar-cubic, spin or qcd')
  })
  it('gives particle codes by the PDG numbering scheme (gluon 21, graviton 39; Particle Data Group, "Monte Carlo particle numbering scheme")', () => {
    expect(pdgOf('gluon')).toBe(21)
    expect(pdgOf('graviton')).toBe(39)
    expect(pdgOf('scalar-cubic')).toBeNull()
  })
  it('maps spins to theories and back', () => {
    expect([0, 1, 2, 3].map(theoryOfSpin)).toEqual(['scalar-cubic', 'gluon', 'graviton', 'spin'])
    expect(THEORY_NAMES.filter(t => !THEORIES[t].needsSpin).map(t => spinOf(t))).toEqual([1, 2, 0, 1])
    expect(spinOf('spin', 3)).toBe(3)
    expect(THEORY_NAMES.filter(isColourOrdered)).toEqual(['gluon', 'scalar-cubic', 'qcd'])
  })
  it('gives every leg a species and a helicity', () => {
    expect(legsOf('gluon', [-1, 1])).toEqual([{ species: 'gluon', h: -1 }, { species: 'gluon', h: 1 }])
    expect(validateProcess('graviton', [-2, -2, 2, 2], 'float').process.legs).toEqual(legsOf('graviton', [-2, -2, 2, 2]))
    expect(processOf('spin', 3)).toEqual({ theory: 'spin', s: 3, colourOrdered: false })
  })
})

describe('target registry', () => {
  it('is the source of the target enum and the catalogue entries', () => {
    expect(TargetNameEnum.options).toEqual(['auto', ...TARGET_NAMES, 'none'])
    expect(TARGET_INFO.map(t => t.name)).toEqual(TARGETS.map(t => t.name))
    // The catalogue crosses a worker boundary: its entries must survive structured cloning.
    expect(structuredClone(TARGET_INFO)).toEqual(TARGET_INFO)
  })
})

describe('colour order', () => {
  const order = [3, 1, 4, 2, 5]
  it('names the field of a bad order', () => {
    expect(orderProblem([1, 2], 3)).toEqual({ field: 'order', message: '2 labels given for 3 legs' })
    expect(orderProblem([1, 1, 2], 3)).toEqual({ field: 'order[1]', message: 'leg 1 appears twice; the colour order must name every leg once' })
    expect(() => checkOrder([1, 2, 4], 3)).toThrow('order[2]: leg 4 does not exist (legs are 1..3)')
  })
  it('applies only to colour-ordered theories and non-identity orders', () => {
    expect(effectiveOrder('gluon', order)).toEqual(order)
    expect(effectiveOrder('graviton', order)).toBeNull()
    expect(effectiveOrder('gluon', [1, 2, 3])).toBeNull()
  })
  it('takes lists into the order and back', () => {
    const xs = ['a', 'b', 'c', 'd', 'e']
    expect(inOrder(xs, order)).toEqual(['c', 'a', 'd', 'b', 'e'])
    expect(toLabelOrder(inOrder(xs, order), order)).toEqual(xs)
    expect(shiftInOrder([1, 2], order)).toEqual([2, 4])
  })
  it('maps an answer in positions back to labels', () => {
    const r = {
      shift: [2, 4],
      terms: [{ left: [1, 2], helicity: 1, z: [0, 0], pole: [0, 0], value: [0, 0], children: { left: { legs: [{ label: 1 }, { label: 5 }] }, right: { legs: [{ label: 3 }] } } }],
      kinematics: { lambda: ['p1', 'p2', 'p3', 'p4', 'p5'], lambdaTilde: ['q1', 'q2', 'q3', 'q4', 'q5'] },
    } as unknown as EvaluateResponse
    const back = responseToLabels(r, order)
    expect(back.shift).toEqual([1, 2])
    expect(back.terms[0]!.left).toEqual([1, 3])
    expect(back.terms[0]!.children).toEqual({ left: { legs: [{ label: 3 }, { label: 5 }] }, right: { legs: [{ label: 4 }] } })
    expect(back.kinematics.lambda).toEqual(['p2', 'p4', 'p1', 'p3', 'p5'])
  })
})
