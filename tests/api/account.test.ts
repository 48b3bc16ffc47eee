// The account routes (name, password change) and the public worked example of the landing page.
import { describe, expect, it } from 'vitest'
import { Client, newUser } from '../helpers/api'

async function tokenClient(owner: Client, scope: 'read' | 'read-write') {
  const t = (await owner.post('/api/tokens', { name: `script ${scope}`, scope })).body as { token: string }
  const c = new Client()
  c.token = t.token
  return c
}

describe('PATCH /api/account', () => {
  it('changes the name; empty or long names are refused on `name`; tokens are refused', async () => {
    const u = await newUser('acct-name', 'Pia Example')
    expect((await u.patch('/api/account', { name: '  ' })).body.data.field).toBe('name')
    const long = await u.patch('/api/account', { name: 'x'.repeat(121) })
    expect(long.status).toBe(400)
    expect(long.body.message).toMatch(/^name: must have at most 120 characters/)
    const ok = await u.patch('/api/account', { name: '  Pia R. Example ' })
    expect(ok.status).toBe(200)
    expect(ok.body).toMatchObject({ name: 'Pia R. Example', email: u.email })
    expect((await u.get('/api/auth/me')).body.name).toBe('Pia R. Example')
    const script = await tokenClient(u, 'read-write')
    expect((await script.patch('/api/account', { name: 'Someone' })).status).toBe(403)
    expect((await new Client().patch('/api/account', { name: 'Someone' })).status).toBe(401)
  })
})

describe('POST /api/account/password', () => {
  it('needs the current password, the sign-up strength rule and a new value; ends the other sessions only', async () => {
    const u = await newUser('acct-pw', 'Quin Example')
    const other = new Client()
    expect((await other.post('/api/auth/login', { email: u.email, password: 'correct-horse-1' })).status).toBe(200)
    const script = await tokenClient(u, 'read-write')

    const wrong = await u.post('/api/account/password', { currentPassword: 'wrong-one-9', password: 'seven quiet lanterns drift east' })
    expect(wrong.status).toBe(400)
    expect(wrong.body.data.field).toBe('currentPassword')
    const missing = await u.post('/api/account/password', { password: 'seven quiet lanterns drift east' })
    expect(missing.body.data.field).toBe('currentPassword')
    const weak = await u.post('/api/account/password', { currentPassword: 'correct-horse-1', password: 'password123' })
    expect(weak.status).toBe(400)
    expect(weak.body.data.field).toBe('password')
    expect(weak.body.message).toMatch(/too easy to guess/)
    const own = await u.post('/api/account/password', { currentPassword: 'correct-horse-1', password: `${u.email} quin` })
    expect(own.body.data.field).toBe('password')
    const same = await u.post('/api/account/password', { currentPassword: 'correct-horse-1', password: 'correct-horse-1' })
    expect(same.body.message).toMatch(/^password: is the same/)
    expect((await script.post('/api/account/password', { currentPassword: 'correct-horse-1', password: 'seven quiet lanterns drift east' })).status).toBe(403)

    const ok = await u.post('/api/account/password', { currentPassword: 'correct-horse-1', password: 'seven quiet lanterns drift east' })
    expect(ok.status).toBe(200)
    expect(ok.body.sessionsEnded).toBe(1)
    expect((await u.get('/api/auth/me')).status).toBe(200)
    expect((await other.get('/api/auth/me')).status).toBe(401)
    // Tokens stay: the owner knew the password (a reset, by contrast, revokes them).
    expect((await script.get('/api/auth/me')).status).toBe(200)
    expect((await new Client().post('/api/auth/login', { email: u.email, password: 'correct-horse-1' })).status).toBe(401)
    expect((await new Client().post('/api/auth/login', { email: u.email, password: 'seven quiet lanterns drift east' })).status).toBe(200)
  })
})

describe('GET /api/showcase', () => {
  it('is public and carries the engine\'s picture and verdicts', async () => {
    const res = await new Client().get('/api/showcase')
    expect(res.status).toBe(200)
    expect(res.body.svg).toMatch(/^<svg /)
    expect(res.body.process.helicities).toEqual([-1, -1, 1, 1, 1])
    // Parke–Taylor is the closed form of MHV gluon amplitudes (Parke and Taylor, 1986).
    expect(res.body.checks).toMatchObject([
      { arithmetic: 'float', verdict: 'agrees', target: 'parke-taylor', tolerance: 1e-9 },
      { arithmetic: 'exact', verdict: 'agrees', target: 'parke-taylor', deviation: 0 },
    ])
    expect(res.body.checks[0].deviation).toBeLessThan(1e-9)
  })
})
