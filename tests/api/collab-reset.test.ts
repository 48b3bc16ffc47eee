import { describe, expect, it } from 'vitest'
import { createHash } from 'node:crypto'
import { Client, newUser, uniqueEmail } from '../helpers/api'
import { linkIn, mailsTo, testDb, waitForMail } from './collab-support'

const sha256 = (s: string) => createHash('sha256').update(s).digest('hex')

async function login(email: string, password: string) {
  const c = new Client()
  const res = await c.post('/api/auth/login', { email, password })
  return { c, status: res.status }
}

describe('password reset by e-mail', () => {
  it('the e-mail arrives; the new password works; the old password and every old session stop working', async () => {
    const user = await newUser('reset', 'Reset Person')
    const other = (await login(user.email, 'correct-horse-1')).c // a second device
    expect((await other.get('/api/auth/me')).status).toBe(200)

    const res = await new Client().post('/api/auth/password/forgot', { email: user.email })
    expect(res.status).toBe(202)
    const mail = await waitForMail(user.email)
    expect(mail.subject).toMatch(/reset/i)
    expect(mail.text).toContain('Reset Person')
    expect(mail.text).toMatch(/one hour/)
    expect(mail.text).toMatch(/You get this message because a password reset was requested/)
    expect(mail.html).toMatch(/href="http[^"]+\/password\/reset\//)
    const { token, path } = linkIn(mail, 'password/reset')

    const stored = await testDb().execute({ sql: 'SELECT token_hash, expires_at, created_at FROM password_resets WHERE user_id = ?', args: [user.id] })
    expect(stored.rows.map(r => r.token_hash)).toEqual([sha256(token)])
    expect(Number(stored.rows[0]!.expires_at) - Number(stored.rows[0]!.created_at)).toBeGreaterThan(3590_000)
    expect(Number(stored.rows[0]!.expires_at) - Number(stored.rows[0]!.created_at)).toBeLessThanOrEqual(3600_000 + 2000)

    expect((await new Client().get(`/api/auth/password/reset/${token}`)).body).toMatchObject({ valid: true, status: 'pending' })
    expect((await new Client().req('GET', path)).status).toBe(200)

    const resetter = new Client()
    const done = await resetter.post('/api/auth/password/reset', { token, password: 'brand-new-secret-2' })
    expect(done.status).toBe(200)
    expect(done.body).toMatchObject({ email: user.email, signedIn: true })
    expect((await resetter.get('/api/auth/me')).status).toBe(200)

    // Old sessions (the registering client and the second device) are over.
    expect((await user.get('/api/auth/me')).status).toBe(401)
    expect((await other.get('/api/projects')).status).toBe(401)
    expect((await login(user.email, 'correct-horse-1')).status).toBe(401)
    expect((await login(user.email, 'brand-new-secret-2')).status).toBe(200)

    // One use only.
    const again = await new Client().post('/api/auth/password/reset', { token, password: 'another-secret-3' })
    expect(again.status).toBe(410)
    expect(again.body.data).toMatchObject({ field: 'token', status: 'used' })
    expect((await login(user.email, 'another-secret-3')).status).toBe(401)
  })

  it('an unknown address gets exactly the same answer as a known one, and no e-mail is sent', async () => {
    const known = await newUser('known-reset')
    const unknown = uniqueEmail('nobody')
    const a = await new Client().post('/api/auth/password/forgot', { email: known.email })
    const b = await new Client().post('/api/auth/password/forgot', { email: unknown })
    expect(b.status).toBe(a.status)
    expect(b.body.message.replace(unknown, 'X')).toBe(a.body.message.replace(known.email, 'X'))
    expect(Object.keys(b.body)).toEqual(Object.keys(a.body))
    await waitForMail(known.email)
    await new Promise(r => setTimeout(r, 500))
    expect(mailsTo(unknown)).toEqual([])
  })

  it('requests are throttled per address, known or not (429 naming the field)', async () => {
    for (const email of [(await newUser('throttle')).email, uniqueEmail('throttle-unknown')]) {
      const statuses: number[] = []
      for (let i = 0; i < 5; i++) statuses.push((await new Client().post('/api/auth/password/forgot', { email })).status)
      expect(statuses).toEqual([202, 202, 202, 429, 429])
      const last = await new Client().post('/api/auth/password/forgot', { email })
      expect(last.body.data.field).toBe('email')
      expect(last.body.message).toMatch(/^email: too many reset requests/)
    }
  })

  it('an expired link is refused (410) and changes nothing', async () => {
    const user = await newUser('expired-reset')
    await new Client().post('/api/auth/password/forgot', { email: user.email })
    const { token } = linkIn(await waitForMail(user.email), 'password/reset')
    await testDb().execute({ sql: 'UPDATE password_resets SET expires_at = ? WHERE user_id = ?', args: [Date.now() - 1000, user.id] })
    expect((await new Client().get(`/api/auth/password/reset/${token}`)).body).toMatchObject({ valid: false, status: 'expired' })
    const res = await new Client().post('/api/auth/password/reset', { token, password: 'brand-new-secret-2' })
    expect(res.status).toBe(410)
    expect(res.body.message).toMatch(/^token: this reset link has expired/)
    expect((await user.get('/api/auth/me')).status).toBe(200)
    expect((await login(user.email, 'correct-horse-1')).status).toBe(200)
  })

  it.each([
    ['no token', { password: 'long-enough-1' }, 400, 'token'],
    ['short password', { token: 'x'.repeat(43), password: 'short' }, 400, 'password'],
    ['unknown token', { token: 'x'.repeat(43), password: 'long-enough-1' }, 404, 'token'],
  ])('reset with %s → %i naming %s', async (_label, body, status, field) => {
    const res = await new Client().post('/api/auth/password/reset', body)
    expect(res.status).toBe(status)
    expect(res.body.data.field).toBe(field)
  })

  it('forgot with a malformed address → 400 naming email', async () => {
    const res = await new Client().post('/api/auth/password/forgot', { email: 'not-an-address' })
    expect(res.status).toBe(400)
    expect(res.body.data.field).toBe('email')
  })
})
