// Browser: the landing page (the engine's recursion picture, its verdicts, signing in from it),
// the account page (change the name; change the password, with errors beside the fields, other
// sessions ended, then sign in with the new one) and the last owner's error beside the control.
// Screenshots at 1440×900 and 1280×720: tests/screenshots/account-landing-*.png.
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest'
import { openBrowser, shot, signInBrowser, type BrowserSession } from '../helpers/browser'
import { Client, newUser } from '../helpers/api'

let b: BrowserSession
beforeAll(async () => {
  b = await openBrowser()
})
afterAll(async () => {
  await b?.close()
})
beforeEach(() => {
  b.errors.length = 0
})

async function both(name: string) {
  for (const [width, height] of [[1440, 900], [1280, 720]] as const) {
    await b.page.setViewportSize({ width, height })
    await b.page.waitForTimeout(150)
    await shot(b.page, `account-landing-${name}-${width}`)
  }
  await b.page.setViewportSize({ width: 1440, height: 900 })
}

describe('landing and account pages in the browser', () => {
  it('the landing page shows the recursion and its verdicts, and signs in', async () => {
    const user = await newUser('landing', 'Lior Example')
    const { page, errors } = b
    await page.goto('/')
    await page.waitForLoadState('networkidle')
    const picture = page.locator('[data-test=showcase-picture] svg')
    await picture.waitFor()
    // The drawing is the engine's full expansion (its vertex count comes from the answer).
    const showcase = (await new Client().get('/api/showcase')).body
    expect(showcase.vertices).toBeGreaterThanOrEqual(3)
    expect(await picture.locator('text').count()).toBeGreaterThan(5)
    const verdicts = page.locator('[data-test=showcase-verdicts] li')
    expect(await verdicts.count()).toBe(2)
    const floatText = await page.locator('[data-test=showcase-verdicts] li[data-arithmetic=float]').textContent()
    expect(floatText).toMatch(/agrees/)
    expect(floatText).toMatch(/parke-taylor/)
    expect(floatText).toMatch(/tolerance 1e\u22129/)
    expect(floatText).toMatch(/\d+ channel terms?\b/)
    expect(floatText).not.toMatch(/(^|\D)1 channel terms/)
    expect(await page.locator('[data-test=showcase-verdicts] li[data-arithmetic=exact]').textContent()).toMatch(/agrees.*equal/s)
    expect(showcase.checks.map((c: { verdict: string }) => c.verdict)).toEqual(['agrees', 'agrees'])
    await both('landing')

    // Sign in from the landing page's own form.
    await page.fill('[data-test=landing-sign-in] input[name=email]', user.email)
    await page.fill('[data-test=landing-sign-in] input[name=password]', 'correct-horse-1')
    await Promise.all([page.waitForURL(/\/projects/), page.click('[data-test=landing-sign-in] button[type=submit]')])
    await page.goto('/')
    await page.waitForURL(/\/projects/)
    expect(errors).toEqual([])
    await b.context.clearCookies()
  })

  it('changes the name and the password; the new password signs in, other sessions end', async () => {
    const user = await newUser('account', 'Ana Example')
    const other = new Client()
    expect((await other.post('/api/auth/login', { email: user.email, password: 'correct-horse-1' })).status).toBe(200)
    const { page, errors } = b
    await signInBrowser(page, user.email, 'correct-horse-1')
    await page.goto('/account')
    await page.waitForLoadState('networkidle')

    // Name: empty is refused beside the field; a new one is saved and shown.
    await page.fill('input[name=account-name]', '   ')
    await page.click('[data-test=save-name]')
    expect(await page.locator('[data-test=account-name] [data-error-for=name]').textContent()).toBe('is required')
    await page.fill('input[name=account-name]', 'Ana M. Example')
    await page.click('[data-test=save-name]')
    await page.waitForSelector('[data-test=name-notice]')
    expect(await page.locator('[data-test=account-who]').textContent()).toContain('Ana M. Example')
    expect((await user.get('/api/auth/me')).body.name).toBe('Ana M. Example')

    // Password: a wrong current password, then a weak new one, each beside its field.
    await page.fill('input[name=current-password]', 'not-my-password')
    await page.fill('input[name=new-password]', 'seven quiet lanterns drift east')
    await page.click('[data-test=change-password]')
    const currentError = page.locator('[data-test=account-password] [data-error-for=currentPassword]')
    await currentError.waitFor()
    expect(await currentError.textContent()).toBe('is not your current password')
    await page.fill('input[name=current-password]', 'correct-horse-1')
    await page.fill('input[name=new-password]', 'password123')
    await page.click('[data-test=change-password]')
    const newError = page.locator('[data-test=account-password] [data-error-for=password]')
    await newError.waitFor()
    expect(await newError.textContent()).toMatch(/too easy to guess/)
    await both('account-errors')

    await page.fill('input[name=new-password]', 'seven quiet lanterns drift east')
    await page.click('[data-test=change-password]')
    await page.waitForSelector('[data-test=password-notice]')
    expect(await page.locator('[data-test=password-notice]').textContent()).toMatch(/Password changed\..*signed out/)
    await both('account-changed')
    // This browser stays signed in; the other session is ended; the old password no longer works.
    await page.reload()
    await page.waitForSelector('[data-test=account-who]')
    expect((await other.get('/api/auth/me')).status).toBe(401)
    expect((await new Client().post('/api/auth/login', { email: user.email, password: 'correct-horse-1' })).status).toBe(401)

    await b.context.clearCookies()
    await signInBrowser(page, user.email, 'seven quiet lanterns drift east')
    await page.goto('/account')
    await page.waitForSelector('[data-test=account-who]')
    expect(await page.locator('[data-test=account-who]').textContent()).toContain('Ana M. Example')
    // The two refusals above are expected answers (the browser logs their status), nothing else.
    expect(errors.filter(e => !/status of 400 \(Bad Request\)/.test(e))).toEqual([])
    await b.context.clearCookies()
  })

  it('the last owner error appears beside the role or remove control that caused it', async () => {
    const owner = await newUser('lastowner', 'Oda Example')
    const viewer = await newUser('lastviewer', 'Vik Example')
    const project = (await owner.post('/api/projects', { name: 'Last owner group' })).body
    expect((await owner.post(`/api/projects/${project.id}/members`, { email: viewer.email, role: 'viewer' })).status).toBe(201)
    const { page, errors } = b
    page.on('dialog', d => d.accept())
    await signInBrowser(page, owner.email, 'correct-horse-1')
    await page.goto(`/projects/${project.id}`)
    await page.waitForLoadState('networkidle')
    const row = page.locator(`[data-member="${owner.email}"]`)

    await row.locator('select').selectOption('editor')
    const rowError = row.locator('[data-test=member-error]')
    await rowError.waitFor()
    expect(await rowError.textContent()).toMatch(/at least one owner/)
    // Beside the control: on the owner's row, not on the add form nor on another row.
    expect(await page.locator(`[data-member="${viewer.email}"] [data-test=member-error]`).count()).toBe(0)
    expect(await page.locator('[data-test=members] form [data-error-for]').count()).toBe(0)
    expect(await row.locator('select').inputValue()).toBe('owner')
    await both('last-owner')

    await row.locator('button[aria-label^=Remove]').click()
    await page.waitForFunction(email => /last owner cannot be removed/.test(document.querySelector(`[data-member="${email}"] [data-test=member-error]`)?.textContent ?? ''), owner.email)
    const members = (await owner.get(`/api/projects/${project.id}/members`)).body as { email: string, role: string }[]
    expect(members.find(m => m.email === owner.email)?.role).toBe('owner')
    expect(errors.filter(e => !/status of 422 \(Unprocessable/.test(e))).toEqual([])
  })
})
