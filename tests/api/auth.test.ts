import { describe, expect, it } from 'vitest'
import { Client, newUser, uniqueEmail, signIn, demo } from '../helpers/api'

describe('auth routes (the generated API page, "Sign-in")', () => {
  it('register → 201 with a session cookie; me → the user', async () => {
    const c = new Client()
    const email = uniqueEmail('reg')
    const res = await c.post('/api/auth/register', { email, password: 'long-enough-1', name: 'Rhea Tamsin' })
    expect(res.status).toBe(201)
    expect(res.body).toMatchObject({ email, name: 'Rhea Tamsin', role: 'member' })
    expect(c.cookie).toMatch(/=/)
    const me = await c.get('/api/auth/me')
    expect(me.status).toBe(200)
    expect(Object.keys(me.body).sort()).toEqual(['email', 'id', 'name', 'role'])
  })

  it('an e-mail already registered → 409', async () => {
    const u = await newUser('dup')
    const res = await new Client().post('/api/auth/register', { email: u.email, password: 'long-enough-1', name: 'X' })
    expect(res.status).toBe(409)
    expect(res.body.data.field).toBe('email')
  })

  it('login → 200; wrong credentials → 401; logout → 204 and the session ends', async () => {
    const u = await newUser('login')
    const c = new Client()
    expect((await c.post('/api/auth/login', { email: u.email, password: 'wrong-password' })).status).toBe(401)
    const ok = await c.post('/api/auth/login', { email: u.email.toUpperCase(), password: 'correct-horse-1' })
    expect(ok.status).toBe(200)
    expect((await c.get('/api/auth/me')).status).toBe(200)
    expect((await c.post('/api/auth/logout')).status).toBe(204)
    expect((await c.get('/api/auth/me')).status).toBe(401)
  })

  it('without a session → 401', async () => {
    expect((await new Client().get('/api/projects')).status).toBe(401)
  })

  it.each([
    ['malformed JSON', '{"email": ', 'body'],
    ['a missing field', '{"email":"a@example.test","name":"A"}', 'password'],
    ['a wrong type', '{"email":"a@example.test","password":12345678,"name":"A"}', 'password'],
    ['a bad e-mail', '{"email":"not-an-address","password":"long-enough-1","name":"A"}', 'email'],
  ])('%s → 400 naming the field', async (_what, raw, field) => {
    const res = await new Client().req('POST', '/api/auth/register', undefined, { raw })
    expect(res.status).toBe(400)
    expect(res.body.data.field).toBe(field)
    expect(res.body.message.startsWith(`${field}: `)).toBe(true)
    expect(res.body.message).not.toBe('Validation Error')
  })

  it('repeated failed logins for one e-mail are throttled with 429', async () => {
    const u = await newUser('throttle')
    const c = new Client()
    const statuses: number[] = []
    for (let i = 0; i < 7; i++) statuses.push((await c.post('/api/auth/login', { email: u.email, password: 'nope-nope' })).status)
    expect(statuses.slice(0, 5)).toEqual([401, 401, 401, 401, 401])
    expect(statuses.at(-1)).toBe(429)
    const res = await c.post('/api/auth/login', { email: u.email, password: 'correct-horse-1' })
    expect(res.status).toBe(429)
    expect(res.body.message).toMatch(/^email: too many failed sign-in attempts/)
  })

  it('a disabled account cannot sign in and its open sessions stop at the next request', async () => {
    const u = await newUser('disable')
    const admin = await signIn(demo.owner)
    expect((await u.get('/api/auth/me')).status).toBe(200)
    expect((await admin.patch(`/api/admin/users/${u.id}`, { disabled: true })).status).toBe(200)
    expect((await u.get('/api/auth/me')).status).toBe(401)
    expect((await new Client().post('/api/auth/login', { email: u.email, password: 'correct-horse-1' })).status).toBe(401)
  })

  it('a write with a foreign Origin is refused; scripts without Origin are accepted', async () => {
    const u = await newUser('origin')
    const bad = await u.req('POST', '/api/projects', { name: 'x' }, { headers: { origin: 'http://evil.example.test' } })
    expect(bad.status).toBe(403)
    expect((await u.post('/api/projects', { name: 'x' })).status).toBe(201)
  })

  it('unknown API routes → 404 JSON', async () => {
    const res = await new Client().get('/api/no/such/thing')
    expect(res.status).toBe(404)
    expect(res.body.statusCode).toBe(404)
  })
})
