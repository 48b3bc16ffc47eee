import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { openBrowser, shot, signInBrowser, type BrowserSession } from '../helpers/browser'
import { newUser, uniqueEmail, Client } from '../helpers/api'
import { linkIn, waitForMail } from '../api/collab-support'

// After joining by invitation, a viewer's job is to review: comment on a diagram, with inline math.
describe('an invited viewer reviews a diagram in comments', () => {
  let s: BrowserSession
  beforeAll(async () => {
    s = await openBrowser()
  })
  afterAll(async () => {
    await s?.close()
  })

  it('joins as viewer, comments with inline math (rendered by KaTeX, markup inert), edits and deletes it', async () => {
    const lead = await newUser('review-lead', 'Petra Lindqvist')
    const project = (await lead.post('/api/projects', { name: 'Review round' })).body
    const diagram = (await lead.post(`/api/projects/${project.id}/diagrams`, { title: 'Six gluons, split helicity', graph: { nodes: [], edges: [] } })).body
    await lead.post(`/api/diagrams/${diagram.id}/comments`, { body: 'Please check the pole at $s_{123} = 0$.' })

    const email = uniqueEmail('reviewer')
    await lead.post(`/api/projects/${project.id}/members`, { email, role: 'viewer' })
    const { token } = linkIn(await waitForMail(email), 'invitations')
    const reviewer = new Client()
    await reviewer.post('/api/auth/register', { email, password: 'long-enough-1', name: 'Ode Marlow' })
    expect((await reviewer.post(`/api/invitations/${token}/accept`)).status).toBe(200)

    const { page, errors } = s
    await signInBrowser(page, email, 'long-enough-1')
    await page.goto(`/projects/${project.id}/diagrams/${diagram.id}`)
    await page.waitForLoadState('networkidle')
    await page.click('[data-test=tab-comments]')
    const thread = page.locator('[data-test=comments]')
    await expect.poll(() => thread.locator('[data-comment]').count()).toBe(1)
    // The owner's comment: math rendered by KaTeX, no edit or delete for the viewer.
    expect(await thread.locator('[data-comment] .katex').count()).toBe(1)
    expect(await thread.locator('[data-comment] button').count()).toBe(0)

    await thread.locator('textarea[name=comment]').fill('Agreed: $\\langle 1 2\\rangle^4/\\langle 1 2\\rangle\\cdots\\langle 6 1\\rangle$ <img src=x onerror="window.__pwned=1">')
    await expect.poll(() => thread.locator('[data-test=comment-preview] .katex').count()).toBe(1)
    await thread.locator('button[type=submit]').click()
    await expect.poll(() => thread.locator('[data-comment]').count()).toBe(2)
    const mine = thread.locator('[data-comment]').nth(1)
    expect(await mine.locator('.katex').count()).toBe(1)
    expect(await mine.textContent()).toContain('<img src=x')
    expect(await mine.locator('img').count()).toBe(0)
    expect(await page.evaluate(() => (window as unknown as { __pwned?: number }).__pwned)).toBeUndefined()
    await shot(page, 'invitation-review-comments')

    await mine.getByRole('button', { name: 'Edit' }).click()
    await mine.locator('textarea').fill('Agreed, the $s_{123}$ channel cancels.')
    await mine.getByRole('button', { name: 'Save' }).click()
    await expect.poll(() => thread.locator('[data-comment]').nth(1).textContent()).toContain('(edited)')

    page.once('dialog', d => d.accept())
    await thread.locator('[data-comment]').nth(1).getByRole('button', { name: 'Delete' }).click()
    await expect.poll(() => thread.locator('[data-comment]').count()).toBe(1)
    // The activity says who commented on what.
    const activity = (await lead.get(`/api/projects/${project.id}/activity`)).body.map((e: { action: string }) => e.action)
    expect(activity.filter((a: string) => a === 'comment.create')).toHaveLength(2)
    expect(errors.filter(e => !/KaTeX doesn't work in quirks mode/.test(e))).toEqual([])
  })
})
