import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { openBrowser, shot, signInBrowser, type BrowserSession } from '../helpers/browser'
import { newUser, uniqueEmail, demo } from '../helpers/api'
import { linkIn, waitForMail } from '../api/collab-support'

describe('an invitation followed end to end in the browser', () => {
  let owner: BrowserSession
  let invitee: BrowserSession
  beforeAll(async () => {
    owner = await openBrowser()
    invitee = await openBrowser()
  })
  afterAll(async () => {
    await owner?.close()
    await invitee?.close()
  })

  it('the owner invites an address; its e-mail link leads the invitee through registering to joining as editor; the link then is spent', async () => {
    const lead = await newUser('lead', 'Petra Lindqvist')
    const project = (await lead.post('/api/projects', { name: 'Soft limits of seven gluons' })).body
    const email = uniqueEmail('student')

    // The owner invites from the project page and sees the invitation pending.
    await signInBrowser(owner.page, lead.email, 'correct-horse-1')
    await owner.page.goto(`/projects/${project.id}`)
    await owner.page.waitForLoadState('networkidle')
    await owner.page.fill('input[name=member-email]', email)
    await owner.page.selectOption('select[name=member-role]', 'editor')
    await owner.page.click('[data-test=members] button[type=submit]')
    await expect.poll(() => owner.page.locator('[data-test=member-notice]').textContent()).toContain('an invitation was e-mailed')
    await expect.poll(() => owner.page.locator(`[data-invitation="${email}"]`).count()).toBe(1)
    await shot(owner.page, 'invitation-owner-pending')

    // The e-mail arrives at the local catcher.
    const mail = await waitForMail(email)
    expect(mail.text).toContain('Petra Lindqvist')
    const { path } = linkIn(mail, 'invitations')

    // The invitee opens the link: who invites, to what, as what; registering keeps the address.
    const page = invitee.page
    await page.goto(path)
    await page.waitForLoadState('networkidle')
    expect(await page.locator('[data-test=invitation-project]').textContent()).toContain('Soft limits of seven gluons')
    expect(await page.locator('[data-test=invitation-summary]').textContent()).toMatch(/Petra Lindqvist.*invites.*as an editor/s)
    await shot(page, 'invitation-invitee-landing')
    await Promise.all([page.waitForURL(/\/register\?/), page.click('[data-test=register]')])
    await page.waitForLoadState('networkidle')
    expect(await page.inputValue('input[name=email]')).toBe(email)
    await page.fill('input[name=name]', 'Sami Roque')
    await page.fill('input[name=password]', 'long-enough-1')
    await Promise.all([page.waitForURL(new RegExp(`${path}$`)), page.click('button[type=submit]')])
    await page.waitForLoadState('networkidle')
    expect(await page.locator('[data-test=accept]').textContent()).toContain('Join as editor')
    await shot(page, 'invitation-invitee-join')
    await Promise.all([page.waitForURL(new RegExp(`/projects/${project.id}$`)), page.click('[data-test=accept]')])
    await expect.poll(() => page.locator('[data-test=my-role]').textContent()).toContain('editor')
    await shot(page, 'invitation-invitee-joined')

    // The link is spent.
    await page.goto(path)
    await page.waitForLoadState('networkidle')
    expect(await page.locator('[data-test=invitation-gone]').textContent()).toContain('already used')

    // The owner's page: no longer pending, the member is listed, the activity says who joined.
    await owner.page.reload()
    await owner.page.waitForLoadState('networkidle')
    await expect.poll(() => owner.page.locator(`[data-member="${email}"]`).count()).toBe(1)
    expect(await owner.page.locator(`[data-invitation="${email}"]`).count()).toBe(0)
    expect(await owner.page.locator('[data-test=activity]').textContent()).toContain('joined as editor by invitation')
    expect([...owner.errors, ...invitee.errors]).toEqual([])
  })

  it('an existing account signs in from the invitation page and accepts', async () => {
    const lead = await newUser('lead2', 'Petra Lindqvist')
    const project = (await lead.post('/api/projects', { name: 'Graviton factorisation' })).body
    const email = uniqueEmail('postdoc')
    await lead.post(`/api/projects/${project.id}/members`, { email, role: 'viewer' })
    const { path } = linkIn(await waitForMail(email), 'invitations')
    // The address registers on its own before opening the link.
    const { Client } = await import('../helpers/api')
    expect((await new Client().post('/api/auth/register', { email, password: 'long-enough-1', name: 'Ode Marlow' })).status).toBe(201)

    const { context } = invitee
    await context.clearCookies()
    const page = invitee.page
    await page.goto(path)
    await page.waitForLoadState('networkidle')
    await Promise.all([page.waitForURL(/\/login/), page.click('[data-test=sign-in]')])
    await page.fill('input[name=email]', email)
    await page.fill('input[name=password]', 'long-enough-1')
    await Promise.all([page.waitForURL(/\/invitations\//), page.click('button[type=submit]')])
    await page.waitForLoadState('networkidle')
    await Promise.all([page.waitForURL(new RegExp(`/projects/${project.id}$`)), page.click('[data-test=accept]')])
    await expect.poll(() => page.locator('[data-test=my-role]').textContent()).toContain('viewer')
  })

  it('the site admin reads the invitation in the outbox page', async () => {
    await owner.context.clearCookies()
    await signInBrowser(owner.page, demo.owner, demo.password)
    await owner.page.goto('/admin/outbox')
    await owner.page.waitForLoadState('networkidle')
    // Subjects carry no project names; the list also shows the recipient.
    await owner.page.locator('[data-test=outbox-list] button', { hasText: 'postdoc-' }).first().click()
    await expect.poll(() => owner.page.locator('[data-test=outbox-message]').textContent()).toContain('Petra Lindqvist')
    await shot(owner.page, 'invitation-admin-outbox')
  })
})
