// POST /api/shifts and POST /api/cross-shift with species per leg (theory qcd), as POST /api/evaluate
// takes them: the rows follow the qcd falloff table (docs/conventions.md "Falloff"), every valid
// shift gives the same amplitude (BCFW under different shifts, the consistency check itself),
// and bad species are a 422 naming the field.
import { beforeAll, describe, expect, it } from 'vitest'
import { newUser, type Client } from '../helpers/api'

let u: Client
beforeAll(async () => {
  u = await newUser('quarkshifts')
})

const H = [-0.5, 0.5, -1, 1, 1]
const S = ['qbar1', 'q1', 'g', 'g', 'g']

describe('species on the shift routes', () => {
  it('shifts: the quark table, species echoed', async () => {
    const res = await u.post('/api/shifts', { theory: 'qcd', helicities: H, species: S })
    expect(res.status).toBe(200)
    expect(res.body.species).toEqual(S)
    const row = (i: number, j: number) => res.body.rows.find((r: { shift: number[] }) => r.shift[0] === i && r.shift[1] === j)
    // [f−, f+⟩ adjacent: rise 1 above −1, so 0 and invalid; [g−, g+⟩ adjacent: −1, valid.
    expect(row(1, 2)).toMatchObject({ exponent: 0, valid: false })
    expect(row(3, 4)).toMatchObject({ exponent: -1, valid: true })
    const ev = await u.post('/api/evaluate', { theory: 'qcd', helicities: H, species: S, kinematics: { kind: 'random', seed: 3 } })
    expect(res.body.defaultShift).toEqual(ev.body.shift)
  })

  it('cross-shift: every valid shift agrees', async () => {
    const res = await u.post('/api/cross-shift', { theory: 'qcd', helicities: H, species: S })
    expect(res.status).toBe(200)
    expect(res.body.rows.filter((r: { valid: boolean }) => r.valid).length).toBeGreaterThan(2)
    expect(res.body.agree).toBe(true)
  })

  it('bad species: 422 naming the field on both routes; not a list: 400', async () => {
    for (const route of ['/api/shifts', '/api/cross-shift']) {
      const lonely = await u.post(route, { theory: 'qcd', helicities: [-0.5, 1, -1, 1], species: ['q1', 'g', 'g', 'g'] })
      expect(lonely.status).toBe(422)
      expect(lonely.body.data.field).toBe('species[0]')
      expect(lonely.body.message).toContain('no partner qbar1')
      const short = await u.post(route, { theory: 'qcd', helicities: H, species: S.slice(1) })
      expect(short.status).toBe(422)
      expect(short.body.data.field).toBe('species')
      const gluonTheory = await u.post(route, { theory: 'gluon', helicities: [-1, -1, 1, 1], species: ['q1', 'g', 'g', 'g'] })
      expect(gluonTheory.status).toBe(422)
      expect(gluonTheory.body.data.field).toBe('species[0]')
      const bad = await u.post(route, { theory: 'qcd', helicities: H, species: 'q1' })
      expect(bad.status).toBe(400)
    }
  })
})
