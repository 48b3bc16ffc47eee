// The sign-in throttle (server/utils/throttle.ts), ASVS 4.0 V2.2.1: atomic under a parallel burst,
// keyed so that one address cannot lock the owner out, with a per-account ceiling and a
// per-address limit across accounts.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { Client, newUser, uniqueEmail } from '../helpers/api'
import { startExtraServer, type ExtraServer } from './security-auth-support'

const PASSWORD = 'correct-horse-1'
const LIMIT = 5

describe('sign-in throttle on the shared server (no trusted proxy)', () => {
  it('V2.2.1 a parallel burst of 200 guesses gets at most the limit checked; the right password inside it does not get in', async () => {
    const u = await newUser('burst')
    const guesses = Array.from({ length: 200 }, (_, i) => (i === 199 ? PASSWORD : `wrong-guess-${i}`))
    const results = await Promise.all(guesses.map(password => new Client().post('/api/auth/login', { email: u.email, password })))
    const statuses = results.map(r => r.status)
    const checked = statuses.filter(s => s !== 429).length
    console.log(`burst of 200: ${checked} checked, ${statuses.filter(s => s === 429).length} refused with 429`)
    expect(checked).toBeLessThanOrEqual(LIMIT)
    expect(statuses.filter(s => s === 200)).toEqual([])
    expect(results[199]!.status).toBe(429)
    expect(results[199]!.body.message).toMatch(/^email: too many failed sign-in attempts/)
    // The right password stays refused from this address for the window, whatever the timing.
    expect((await new Client().post('/api/auth/login', { email: u.email, password: PASSWORD })).status).toBe(429)
  })

  it('V2.2.1 X-Forwarded-For is ignored unless a proxy is trusted: a forged header does not reset the count', async () => {
    const u = await newUser('spoof')
    const statuses: number[] = []
    for (let i = 0; i < LIMIT + 2; i++) {
      const c = new Client(undefined, { 'x-forwarded-for': `203.0.113.${i + 1}` })
      statuses.push((await c.post('/api/auth/login', { email: u.email, password: `wrong-guess-${i}` })).status)
    }
    expect(statuses).toEqual([...Array(LIMIT).fill(401), 429, 429])
  })

  it('V2.2.1 a success clears the failures of that address (the owner is not punished for typos)', async () => {
    const u = await newUser('typos')
    const c = new Client()
    for (let i = 0; i < LIMIT - 1; i++) expect((await c.post('/api/auth/login', { email: u.email, password: `typo-${i}` })).status).toBe(401)
    expect((await c.post('/api/auth/login', { email: u.email, password: PASSWORD })).status).toBe(200)
    for (let i = 0; i < LIMIT - 1; i++) expect((await c.post('/api/auth/login', { email: u.email, password: `typo-${i}` })).status).toBe(401)
    expect((await c.post('/api/auth/login', { email: u.email, password: PASSWORD })).status).toBe(200)
  })
})

describe('sign-in throttle behind a trusted proxy', () => {
  let server: ExtraServer
  const ACCOUNT_CEILING = 12
  const ADDRESS_LIMIT = 15
  beforeAll(async () => {
    server = await startExtraServer({
      APP_URL: 'http://polewright.example.test',
      POLEWRIGHT_TRUSTED_PROXIES: '1',
      POLEWRIGHT_LOGIN_ACCOUNT_ATTEMPTS: String(ACCOUNT_CEILING),
      POLEWRIGHT_LOGIN_ADDRESS_ATTEMPTS: String(ADDRESS_LIMIT),
    })
  })
  afterAll(() => server?.stop())

  const from = (address: string) => new Client(server.baseURL, { 'x-forwarded-for': address })
  async function account() {
    const email = uniqueEmail('proxied')
    expect((await from('192.0.2.1').post('/api/auth/register', { email, password: PASSWORD, name: 'Proxied Person' })).status).toBe(201)
    return email
  }

  it('V2.2.1 failures from one address do not lock the owner out from another', async () => {
    const email = await account()
    const attacker = from('203.0.113.66')
    const statuses: number[] = []
    for (let i = 0; i < LIMIT + 1; i++) statuses.push((await attacker.post('/api/auth/login', { email, password: `wrong-guess-${i}` })).status)
    expect(statuses).toEqual([...Array(LIMIT).fill(401), 429])
    expect((await attacker.post('/api/auth/login', { email, password: PASSWORD })).status).toBe(429)
    // The owner, elsewhere, signs in.
    expect((await from('198.51.100.20').post('/api/auth/login', { email, password: PASSWORD })).status).toBe(200)
  })

  it('V2.2.1 the per-account ceiling holds across many addresses', async () => {
    const email = await account()
    for (let i = 0; i < ACCOUNT_CEILING; i++) {
      expect((await from(`203.0.113.${100 + i}`).post('/api/auth/login', { email, password: `wrong-guess-${i}` })).status).toBe(401)
    }
    const res = await from('203.0.113.200').post('/api/auth/login', { email, password: PASSWORD })
    expect(res.status).toBe(429)
    expect(res.body.message).toMatch(/^email: too many failed sign-in attempts for this account;/)
  })

  it('V2.2.1 one address spraying many accounts is stopped by the per-address limit', async () => {
    const sprayer = from('198.51.100.99')
    for (let i = 0; i < ADDRESS_LIMIT; i++) {
      expect((await sprayer.post('/api/auth/login', { email: uniqueEmail('spray'), password: 'Winter2026!' })).status).toBe(401)
    }
    const res = await sprayer.post('/api/auth/login', { email: uniqueEmail('spray'), password: 'Winter2026!' })
    expect(res.status).toBe(429)
    expect(res.body.message).toMatch(/^email: too many failed sign-in attempts from your address;/)
    // Another address is not affected.
    const email = await account()
    expect((await from('198.51.100.100').post('/api/auth/login', { email, password: PASSWORD })).status).toBe(200)
  })
})
