// The account page's list of signed-in browsers, and a weak password refused beside the field.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { openBrowser, shot, signInBrowser, type BrowserSession } from '../helpers/browser'
import { Client, newUser, uniqueEmail } from '../helpers/api'

describe('account security in the browser', () => {
  let b: BrowserSession
  beforeAll(async () => {
    b = await openBrowser()
  })
  afterAll(async () => {
    await b?.close()
  })

  it('V2.1.7 registering with a common password shows why beside the field', async () => {
    const { page } = b
    await page.goto('/register')
    await page.waitForLoadState('networkidle')
    await page.fill('input[name=name]', 'Weak Example')
    await page.fill('input[name=email]', uniqueEmail('weak-browser'))
    await page.fill('input[name=password]', 'password')
    await page.click('button[type=submit]')
    await expect.poll(() => page.locator('[data-error-for=password]').textContent()).toContain('most used passwords')
    await shot(page, 'security-weak-password')
  })

  it('V3.3.4 the account page lists this browser and another device, and ends the other one', async () => {
    const { page, errors } = b
    errors.length = 0 // the refused registration above logged its 400
    const u = await newUser('browser-sessions', 'Sessions Person')
    const script = new Client(undefined, { 'user-agent': 'Mozilla/5.0 (iPhone) Safari/605.1' })
    expect((await script.post('/api/auth/login', { email: u.email, password: 'correct-horse-1' })).status).toBe(200)
    await b.context.clearCookies()
    await signInBrowser(page, u.email, 'correct-horse-1')
    await page.goto('/account')
    await page.waitForLoadState('networkidle')
    const rows = page.locator('[data-test=sessions] tbody tr')
    await expect.poll(() => rows.count()).toBe(3)
    expect(await page.locator('[data-test=current-session]').count()).toBe(1)
    await shot(page, 'security-account-sessions')
    page.once('dialog', d => void d.accept())
    await page.locator('[data-test=sessions] tr', { hasText: 'Safari on iOS' }).getByRole('button').click()
    await expect.poll(() => rows.count()).toBe(2)
    expect((await script.get('/api/auth/me')).status).toBe(401)
    expect(errors).toEqual([])
  })
})
