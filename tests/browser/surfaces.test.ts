// Browser: the project page's diagram list (verdict badge, filter, duplicate, delete with
// confirmation), renaming and deleting a project, and the project-wide checks table.
// Screenshots at 1440×900 and 1280×720: tests/screenshots/surfaces-*.png.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { openBrowser, shot, signInBrowser, type BrowserSession } from '../helpers/browser'
import { demo, newUser, signIn } from '../helpers/api'

let b: BrowserSession
beforeAll(async () => {
  b = await openBrowser()
})
afterAll(async () => {
  await b?.close()
})

async function both(name: string) {
  await b.page.setViewportSize({ width: 1440, height: 900 })
  await b.page.waitForTimeout(150)
  await shot(b.page, `${name}-1440`)
  await b.page.setViewportSize({ width: 1280, height: 720 })
  await b.page.waitForTimeout(150)
  await shot(b.page, `${name}-1280`)
  await b.page.setViewportSize({ width: 1440, height: 900 })
}

describe('work surfaces in the browser', () => {
  it('lists, filters, duplicates and deletes diagrams; renames and deletes the project; shows the checks table', async () => {
    const owner = await newUser('surfaces', 'Noor Example')
    const project = (await owner.post('/api/projects', { name: 'Surfaces group', description: 'Four-gluon checks' })).body
    const d = (await owner.post(`/api/projects/${project.id}/diagrams`, { title: 'Four gluons, MHV', graph: { nodes: [], edges: [] } })).body
    const saved = (await owner.put(`/api/diagrams/${d.id}`, { version: d.version, graph: { ...d.graph, process: { theory: 'gluon', helicities: [-1, -1, 1, 1], shift: [1, 2] } } })).body
    expect(saved.version).toBe(2)
    const check = await owner.post(`/api/diagrams/${d.id}/checks`, { kinematics: { kind: 'random', seed: 7 } })
    expect(check.status).toBe(201)
    await owner.post(`/api/projects/${project.id}/diagrams`, { title: 'Six gravitons', graph: { nodes: [], edges: [], process: { theory: 'graviton', helicities: [-1, -1, 1, 1, 1, 1] } } })

    const { page, errors } = b
    await signInBrowser(page, owner.email, 'correct-horse-1')
    await page.goto(`/projects/${project.id}`)
    await page.waitForLoadState('networkidle')
    const list = page.locator('[data-test=diagram-list]')
    const row = list.locator(`tr[data-diagram="${d.id}"]`)
    expect(await row.textContent()).toMatch(/v2.*Noor Example.*agrees/s)
    await both('surfaces-project')

    // Filter by verdict and theory.
    await page.selectOption('select[name=diagram-verdict]', 'agrees')
    expect(await list.locator('[data-test=diagram-title]').allTextContents()).toEqual(['Four gluons, MHV'])
    await page.selectOption('select[name=diagram-verdict]', 'none')
    expect(await list.locator('[data-test=diagram-title]').allTextContents()).toEqual(['Six gravitons'])
    await page.selectOption('select[name=diagram-verdict]', '')
    await page.selectOption('select[name=diagram-theory]', 'graviton')
    expect(await list.locator('[data-test=diagram-title]').allTextContents()).toEqual(['Six gravitons'])
    await page.selectOption('select[name=diagram-theory]', '')

    // Duplicate: the copy carries the process and shift, at version 1, with no checks.
    await row.locator('[data-test=duplicate-diagram]').click()
    await page.waitForFunction(() => [...document.querySelectorAll('[data-test=diagram-title]')].some(e => e.textContent === 'Four gluons, MHV (copy)'))
    const diagrams = (await owner.get(`/api/projects/${project.id}/diagrams`)).body as { id: number, title: string, version: number, latestCheck: unknown }[]
    const copy = diagrams.find(x => x.title === 'Four gluons, MHV (copy)')!
    expect(copy.version).toBe(1)
    expect(copy.latestCheck).toBeNull()
    expect((await owner.get(`/api/diagrams/${copy.id}`)).body.graph.process).toEqual({ theory: 'gluon', helicities: [-1, -1, 1, 1], shift: [1, 2] })

    // Delete the copy: a confirmation that says the checks go too, then it is gone.
    const copyRow = list.locator(`tr[data-diagram="${copy.id}"]`)
    await copyRow.locator('[data-test=delete-diagram]').click()
    expect(await page.locator('[data-test=delete-diagram-confirm]').textContent()).toMatch(/stored checks .* are deleted with it/)
    await both('surfaces-delete-confirm')
    await page.click('[data-test=confirm-delete-diagram]')
    await page.waitForFunction(id => !document.querySelector(`tr[data-diagram="${id}"]`), copy.id)
    expect((await owner.get(`/api/diagrams/${copy.id}`)).status).toBe(404)

    // Rename the project.
    await page.click('[data-test=rename-project]')
    await page.fill('input[name=project-name]', 'Surfaces group, renamed')
    await page.click('[data-test=rename-form] button[type=submit]')
    await page.waitForFunction(() => document.querySelector('[data-test=project-name]')?.textContent === 'Surfaces group, renamed')
    // Activity links to the diagram.
    await page.waitForSelector('[data-test=activity-link]')

    // Revision diff: v1 had no process, v2 set it.
    await page.click(`tr[data-diagram="${d.id}"] [data-test=diagram-revisions]`)
    await page.waitForURL(new RegExp(`/revisions/${d.id}$`))
    await page.waitForSelector('[data-test=diff-process]')
    expect(await page.locator('[data-test=revision-diff]').textContent()).toMatch(/process helicities\s*— → −−\+\+.*process shift\s*— → \[1,2⟩/s)
    await both('surfaces-revisions')

    // The checks table: the one stored check, its result opened in place, its diagram linked.
    await page.goto(`/projects/${project.id}/checks`)
    await page.waitForLoadState('networkidle')
    const table = page.locator('[data-test=checks-table]')
    expect(await table.locator('tbody tr').first().textContent()).toMatch(/Four gluons, MHV.*gluon −−\+\+.*\[1,2⟩.*float.*agrees.*Noor Example/s)
    await table.locator('[data-test=open-result]').first().click()
    await page.waitForSelector('[data-test=check-detail] dl')
    expect(await page.locator('[data-test=check-detail]').textContent()).toMatch(/value.*random.*seed 7/s)
    await both('surfaces-checks')
    await page.selectOption('select[name=filter-verdict]', 'disagrees')
    expect(await page.locator('[data-test=checks-count]').textContent()).toBe('0 of 1')
    await page.selectOption('select[name=filter-verdict]', '')
    await table.locator('[data-test=check-diagram]').first().click()
    await page.waitForURL(new RegExp(`/diagrams/${d.id}$`))

    // The point-set page: a compact table, a row opens to its legs; the generate form's seed message.
    const set = (await owner.post(`/api/projects/${project.id}/point-sets/generate`, { kind: 'physical', n: 4, count: 120, seed: 3 })).body
    await page.goto(`/projects/${project.id}/point-sets/${set.id}`)
    await page.waitForLoadState('networkidle')
    expect(await page.locator('[data-test=point]').count()).toBe(50)
    expect(await page.locator('[data-test=points-page]').textContent()).toBe('1 / 3')
    await page.locator('[data-test=point]').first().click()
    expect(await page.locator('[data-test=point-legs]').count()).toBe(1)
    await both('surfaces-pointset')
    await page.goto(`/projects/${project.id}/point-sets`)
    await page.waitForLoadState('networkidle')
    await page.fill('[data-test=generate-form] input[name=seed]', 'abc')
    await page.click('[data-test=generate-form] button[type=submit]')
    expect(await page.locator('[data-test=generate-form]').textContent()).toContain('must be a number')

    // Delete the project: refused until its name is typed, then gone.
    await page.goto(`/projects/${project.id}`)
    await page.waitForLoadState('networkidle')
    await page.click('[data-test=delete-project]')
    await page.click('[data-test=delete-project-form] button[type=submit]')
    expect(await page.locator('[data-test=delete-project-error]').textContent()).toMatch(/Type the project's name/)
    await page.fill('input[name=confirm-project-name]', 'Surfaces group, renamed')
    await Promise.all([page.waitForURL(/\/projects$/), page.click('[data-test=delete-project-form] button[type=submit]')])
    expect((await owner.get(`/api/projects/${project.id}`)).status).toBe(404)
    expect(errors).toEqual([])
  })

  it('shows the demo project\'s diagram list and checks table', async () => {
    const s = await openBrowser()
    try {
      const ownerApi = await signIn(demo.owner)
      const project = (await ownerApi.get('/api/projects')).body.find((p: { name: string }) => p.name.startsWith('Brackenridge'))
      await signInBrowser(s.page, demo.owner, demo.password)
      await s.page.goto(`/projects/${project.id}`)
      await s.page.waitForLoadState('networkidle')
      const prev = b
      b = s
      await both('surfaces-demo-project')
      await s.page.goto(`/projects/${project.id}/checks`)
      await s.page.waitForLoadState('networkidle')
      expect(await s.page.locator('[data-test=checks-table]').count()).toBe(1)
      await both('surfaces-demo-checks')
      b = prev
      expect(s.errors).toEqual([])
    }
    finally {
      await s.close()
    }
  })
})
