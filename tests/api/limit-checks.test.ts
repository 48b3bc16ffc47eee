// POST /api/limit-checks against the built server: soft (Weinberg, Phys. Rev. 140 (1965) B516),
// collinear (Mangano & Parke, Phys. Rept. 200 (1991) 301) and identity checks (Kleiss & Kuijf,
// Nucl. Phys. B312 (1989) 616), and the error statuses with the field named.
import { beforeAll, describe, expect, it } from 'vitest'
import type { Client } from '../helpers/api'
import { newUser } from '../helpers/api'

let u: Client
beforeAll(async () => {
  u = await newUser('limits')
})

const post = (body: unknown) => u.post('/api/limit-checks', body)

describe('POST /api/limit-checks', () => {
  it('soft graviton: the ratio tends to 1 like ε', async () => {
    const res = await post({ check: 'soft', theory: 'graviton', helicities: [-2, -2, 2, 2, 2], soft: 4 })
    expect(res.status).toBe(200)
    expect(res.body).toMatchObject({ check: 'soft', n: 5, legs: [4], holds: true, expectedRate: 1 })
    expect(res.body.rows).toHaveLength(8)
    expect(res.body.rows[7].deviation).toBeLessThan(1e-6)
  })
  it('soft graviton with the subleading factor: the ratio tends to 1 like ε²', async () => {
    const res = await post({ check: 'soft', theory: 'graviton', helicities: [-2, -2, -2, 2, 2], soft: 1, order: 'subleading' })
    expect(res.status).toBe(200)
    expect(res.body).toMatchObject({ check: 'soft', order: 'subleading', holds: true, expectedRate: 2 })
    expect(Math.abs(res.body.rate - 2)).toBeLessThan(0.15)
    const gluon = await post({ check: 'soft', theory: 'gluon', helicities: [-1, 1, -1, 1, 1], soft: 2, order: 'subleading' })
    expect(gluon.status).toBe(422)
    expect(gluon.body.data.field).toBe('order')
  })
  it('collinear gluons 6 ∥ 1', async () => {
    const res = await post({ check: 'collinear', theory: 'gluon', helicities: [-1, -1, 1, -1, 1, 1], leg: 6, z: 0.4 })
    expect(res.status).toBe(200)
    expect(res.body).toMatchObject({ legs: [6, 1], holds: true })
  })
  it('Kleiss–Kuijf exact: the sum is exactly 0', async () => {
    const res = await post({ check: 'identity', theory: 'gluon', helicities: [-1, 1, -1, 1, -1, 1], identity: 'kleiss-kuijf', alpha: [2, 3], arithmetic: 'exact' })
    expect(res.status).toBe(200)
    expect(res.body).toMatchObject({ holds: true, residual: 0, sum: ['0', '0'], tolerance: null })
  })
  it.each([
    [{ check: 'soft', theory: 'gluon', helicities: [-1, -1, 1, 1, 1], soft: 9 }, 422, 'soft'],
    [{ check: 'soft', theory: 'gluon', helicities: [-1, -1, 1, 1, 1], soft: 1 }, 422, 'helicities'],
    [{ check: 'collinear', theory: 'gluon', helicities: [-1, -1, 1, 1, 1], leg: 2, z: 1.5 }, 400, 'z'],
    [{ check: 'identity', theory: 'gluon', helicities: [-1, 2, 1, 1], identity: 'bcj' }, 422, 'helicities[1]'],
    [{ check: 'bogus', theory: 'gluon', helicities: [-1, 1] }, 400, 'check'],
  ])('%j → %i on %s', async (body, status, field) => {
    const res = await post(body)
    expect(res.status).toBe(status)
    expect(res.body.data.field).toBe(field)
    expect(res.body.message.startsWith(field)).toBe(true)
  })
})
