// POST /api/loop-cuts against the built server: box coefficients by quadruple cuts compared with
// the N = 4 MHV coefficients of Bern, Dixon, Dunbar, Kosower, hep-ph/9403226, and the error
// statuses with the field named.
import { beforeAll, describe, expect, it } from 'vitest'
import type { Client } from '../helpers/api'
import { newUser } from '../helpers/api'

let u: Client
beforeAll(async () => {
  u = await newUser('loopcuts')
})

const post = (body: unknown) => u.post('/api/loop-cuts', body)

describe('POST /api/loop-cuts', () => {
  it('the four-point box agrees with −st A_tree (float)', async () => {
    const res = await post({ helicities: [-1, -1, 1, 1] })
    expect(res.status).toBe(200)
    expect(res.body).toMatchObject({ n: 4, verdict: 'agrees', counts: { agrees: 1 } })
    expect(res.body.boxes[0]).toMatchObject({ corners: [[1], [2], [3], [4]], kind: 'zero-mass', targetRule: '−st A_tree', verdict: 'agrees' })
    expect(res.body.boxes[0].solutions).toHaveLength(2)
    expect(res.body.boxes[0].terms).toHaveLength(2)
  })
  it('six-gluon MHV in exact arithmetic: 15 boxes, every one equal to its target', async () => {
    const res = await post({ helicities: [-1, -1, 1, 1, 1, 1], arithmetic: 'exact' })
    expect(res.status).toBe(200)
    expect(res.body.boxes).toHaveLength(15)
    expect(res.body.counts.agrees).toBe(15)
    expect(res.body.tolerance).toBeNull()
    for (const b of res.body.boxes) {
      expect(b.value).toEqual(b.target)
      for (const s of b.solutions) expect(s.onShell).toBe(0)
    }
  })
  it.each([
    [{ helicities: [-1, -1, 1] }, 422, 'helicities'],
    [{ helicities: [-1, -1, 1, 1, 1, 1, 1, 1, 1] }, 422, 'helicities'],
    [{ helicities: [-1, 2, 1, 1] }, 422, 'helicities[1]'],
    [{ helicities: [-1, -1, 1, 1], corners: 'feynman' }, 400, 'corners'],
    [{ helicities: [-1, -1, 1, 1], arithmetic: 'exact', kinematics: { kind: 'random', seed: 1 } }, 422, 'arithmetic'],
    [{ helicities: 'abc' }, 400, 'helicities'],
  ])('%j → %i on %s', async (body, status, field) => {
    const res = await post(body)
    expect(res.status).toBe(status)
    expect(res.body.data.field).toBe(field)
    expect(res.body.message.startsWith(field)).toBe(true)
  })
})
