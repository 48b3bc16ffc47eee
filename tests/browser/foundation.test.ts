import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { openBrowser, shot, signInBrowser, type BrowserSession } from '../helpers/browser'
import { uniqueEmail, demo } from '../helpers/api'

describe('foundation in the browser', () => {
  let a: BrowserSession
  let b: BrowserSession
  beforeAll(async () => {
    a = await openBrowser()
    b = await openBrowser()
  })
  afterAll(async () => {
    await a?.close()
    await b?.close()
  })

  it('register, create a project, add a member; the viewer is refused an edit', async () => {
    const { page } = a
    const email = uniqueEmail('browser')
    await page.goto('/register')
    await page.waitForLoadState('networkidle')
    // The shared zod schema complains beside the field before anything is sent.
    await page.click('button[type=submit]')
    await expect.poll(() => page.locator('[data-error-for=name]').textContent()).toContain('is required')
    await page.fill('input[name=name]', 'Odile Brannock')
    await page.fill('input[name=email]', email)
    await page.fill('input[name=password]', 'long-enough-1')
    await Promise.all([page.waitForURL(/\/projects$/), page.click('button[type=submit]')])
    // The URL changes before the projects page replaces the register form (both have a name field).
    await page.waitForSelector('textarea[name=description]')

    await page.fill('input[name=name]', 'Collinear limits')
    await page.fill('textarea[name=description]', 'Where do the recursions lose digits?')
    await Promise.all([page.waitForURL(/\/projects\/\d+$/), page.click('form button[type=submit]')])
    await expect.poll(() => page.locator('[data-test=my-role]').textContent()).toContain('owner')

    await page.fill('input[name=member-email]', demo.viewer)
    await page.selectOption('select[name=member-role]', 'viewer')
    await page.click('[data-test=members] button[type=submit]')
    await expect.poll(() => page.locator('[data-test=member-notice]').textContent()).toContain('was added as viewer')
    await expect.poll(() => page.locator(`[data-member="${demo.viewer}"]`).count()).toBe(1)
    await shot(page, 'foundation-project-owner')
    const projectUrl = page.url()

    await signInBrowser(b.page, demo.viewer, demo.password)
    await b.page.goto(projectUrl)
    await b.page.waitForLoadState('networkidle')
    await expect.poll(() => b.page.locator('[data-test=my-role]').textContent()).toContain('viewer')
    expect(await b.page.locator('input[name=diagram-title]').count()).toBe(0)
    expect(await b.page.textContent('body')).toContain('You are a viewer here')
    // An edit through the API from the viewer's own browser session is refused with 403.
    const projectId = Number(projectUrl.split('/').pop())
    const status = await b.page.evaluate(async (id) => {
      const r = await fetch(`/api/projects/${id}/diagrams`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ title: 'sneaky', graph: { nodes: [], edges: [] } }) })
      return r.status
    }, projectId)
    expect(status).toBe(403)
    await shot(b.page, 'foundation-project-viewer')
    expect(a.errors.filter(e => !/401|Unauthorized/.test(e))).toEqual([])
  })

  it('a page the user may not see says so', async () => {
    await b.page.goto('/admin/users')
    await b.page.waitForLoadState('networkidle')
    expect(await b.page.textContent('[data-test=error-text]')).toContain('site administrators')
    await shot(b.page, 'foundation-403')
  })
})
