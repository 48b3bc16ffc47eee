// The batch runner's per-point request: a colour order is applied to the point before it goes to the
// pool (the worker's evaluateMany takes legs as given). Checked against the evaluation service's own
// evaluateInOrder, which the single-check route uses.
import { describe, expect, it } from 'vitest'
import { requestFor, codeMismatch } from '../../../server/utils/batch'
import { evaluateInOrder } from '../../../server/workers/tasks'
import { evaluate } from '#shared/physics/index'
import { generatePoint } from '#shared/pointsets'
import type { Process } from '#shared/schemas/graph'

describe('batch requests', () => {
  it.each<[Process & { order: number[] }]>([
    [{ theory: 'gluon', helicities: [-1, 1, -1, 1, 1], order: [1, 3, 2, 5, 4], shift: [1, 3] }],
    [{ theory: 'gluon', helicities: [-1, -1, 1, 1, 1, 1], order: [2, 1, 3, 4, 6, 5] }],
    [{ theory: 'graviton', helicities: [-2, -2, 2, 2], order: [1, 3, 2, 4] }],
  ])('a colour order gives what the single check gives (%#)', (process) => {
    const point = generatePoint('physical', process.helicities.length, 5, 0, 3)
    const res = evaluate(requestFor({ process, target: 'auto' }, point))
    const ref = evaluateInOrder({ theory: process.theory, helicities: process.helicities, kinematics: { kind: 'momenta', momenta: point.momenta! }, ...(process.shift ? { shift: process.shift } : {}) }, process.order)
    expect(res.verdict).toBe('agrees')
    expect(res.value![0]).toBeCloseTo(ref.value![0] as number, 10)
    expect(res.value![1]).toBeCloseTo(ref.value![1] as number, 10)
    expect(res.deviation).toBeLessThan(1e-9)
  })

  it('names the leg whose particle does not fit the process', () => {
    expect(codeMismatch('gluon', [21, 21, 21, 21])).toBeNull()
    expect(codeMismatch('gluon', [21, 2, -2, 21])).toBe('leg 2 has particle code 2; a gluon process needs code 21 on every leg')
    expect(codeMismatch('graviton', [39, 39, 21, 39])).toMatch(/^leg 3 has particle code 21; a graviton process needs code 39/)
    expect(codeMismatch('scalar-cubic', [1, 2, 3, 4])).toBeNull()
    expect(codeMismatch('gluon', undefined)).toBeNull()
  })
})
