// The time budget and the worker pool: work over budget gets 503 (its worker is terminated and
// replaced), while other users are still served by the request thread. Orderings, not timings:
// the answers that must come first are checked to come before the slow ones.
import { describe, expect, it } from 'vitest'
import { newUser } from '../helpers/api'

// Every shift of six gravitons (NMHV) measured exactly: 30 shifts × probe points × an exact
// recursion each, seconds of work for one worker (10 s on two busy cores) against a budget of 800 ms.
const heavy = (k: number) => ({ theory: 'graviton', helicities: k === 1 ? [-2, 2, -2, 2, -2, 2] : [-2, -2, 2, -2, 2, 2], measure: true })

describe('time budget and responsiveness', () => {
  it('over budget → 503 saying so, while another user\'s GET /api/auth/me and an over-limit refusal answer first', async () => {
    const busy = await newUser('busy')
    const other = await newUser('other')
    const order: string[] = []
    const slow = [1, 2].map(k => busy.req('POST', '/api/shifts?budgetMs=800', heavy(k))
      .then((r) => { order.push('slow'); return r }))
    await new Promise(r => setTimeout(r, 150))
    const me = other.get('/api/auth/me').then((r) => { order.push('me'); return r })
    const refused = other.post('/api/evaluate', { theory: 'gluon', helicities: Array(13).fill(1), kinematics: { kind: 'random', seed: 1 } })
      .then((r) => { order.push('refused'); return r })
    const [[s1, s2], m, x] = await Promise.all([Promise.all(slow), me, refused])
    expect(m.status).toBe(200)
    expect(m.body.email).toBe(other.email)
    expect(x.status).toBe(422)
    expect(x.body.message).toContain('limit of 12')
    for (const s of [s1!, s2!]) {
      expect(s.status).toBe(503)
      expect(s.body.message).toBe('the evaluation exceeded its time budget of 800 ms')
    }
    expect(order.slice(0, 2).sort()).toEqual(['me', 'refused'])
  })

  it('the pool recovers: evaluations succeed after workers were terminated', async () => {
    const u = await newUser('after')
    const over = await u.req('POST', '/api/evaluate?budgetMs=1', { theory: 'gluon', helicities: [-1, -1, 1, -1, 1, -1, 1, 1, 1], arithmetic: 'exact', kinematics: { kind: 'rational', seed: 1 }, probeFalloff: true })
    expect(over.status).toBe(503)
    for (let k = 0; k < 4; k++) {
      const ok = await u.post('/api/evaluate', { theory: 'gluon', helicities: [-1, -1, 1, 1, 1], kinematics: { kind: 'random', seed: k } })
      expect(ok.status).toBe(200)
      expect(ok.body.verdict).toBe('agrees')
    }
  })

  it('a budget asked for can only lower the server\'s', async () => {
    const u = await newUser('raise')
    const res = await u.req('POST', '/api/evaluate?budgetMs=99999999', { theory: 'gluon', helicities: [-1, -1, 1, 1], kinematics: { kind: 'random', seed: 1 } })
    expect(res.status).toBe(200)
  })
})
