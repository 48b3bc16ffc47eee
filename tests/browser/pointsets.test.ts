// Browser: an editor uploads an event file, runs a batch check over it, and sees the progress,
// the summary and the deviation histogram. Screenshots: tests/screenshots/pointsets-*.png.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { mkdtempSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { openBrowser, shot, signInBrowser, type BrowserSession } from '../helpers/browser'
import { demo, signIn } from '../helpers/api'
import { generatePoints, toCsv } from '#shared/pointsets'

let b: BrowserSession
beforeAll(async () => {
  b = await openBrowser()
})
afterAll(async () => {
  await b?.close()
})

describe('point sets in the browser', () => {
  it('uploads a file, runs a batch and draws the histogram', async () => {
    const owner = await signIn(demo.owner)
    const project = (await owner.get('/api/projects')).body.find((p: { name: string }) => p.name.startsWith('Brackenridge'))
    // A five-gluon CSV of 400 invented RAMBO points, as a user would upload it.
    const dir = mkdtempSync(join(tmpdir(), 'pw-upload-'))
    const file = join(dir, 'five-gluon-points.csv')
    writeFileSync(file, toCsv([...generatePoints({ kind: 'physical', n: 5, count: 400, seed: 77, energy: 13 })].map((data, idx) => ({ idx, data }))))

    const { page, errors } = b
    await signInBrowser(page, demo.editor, demo.password)
    await page.goto(`/projects/${project.id}/point-sets`)
    await page.waitForLoadState('networkidle')
    await expect(page.locator('[data-test=point-set-list]').textContent()).resolves.toContain('Five-gluon phase-space points')
    await page.setInputFiles('[data-test=upload-form] input[type=file]', file)
    await page.fill('[data-test=upload-form] input[name=name]', 'Five gluons at 13, uploaded in the browser')
    await page.click('[data-test=upload-form] button[type=submit]')
    await page.waitForSelector('[data-test=upload-result]')
    expect(await page.locator('[data-test=upload-result]').textContent()).toMatch(/Stored 400 of 400 points/)
    await shot(page, 'pointsets-list')

    await page.click('[data-test=upload-result] a')
    await page.waitForURL(/\/point-sets\/\d+$/)
    await page.waitForLoadState('networkidle')
    await page.check('input[name=show-invariants]')
    await page.waitForSelector('[data-test=invariants]')
    await shot(page, 'pointsets-points')
    // The five-gluon MHV demo diagram is offered for a five-leg set.
    const option = await page.locator('[data-test=batch-form] select[name=diagram] option', { hasText: 'Five gluons, MHV' }).first().getAttribute('value')
    await page.selectOption('[data-test=batch-form] select[name=diagram]', option!)
    await Promise.all([page.waitForURL(/\/batch-checks\/\d+$/), page.click('[data-test=batch-form] button[type=submit]')])
    await page.waitForSelector('[data-test=batch-progress]')
    await page.waitForFunction(() => document.querySelector('[data-test=batch-status]')?.textContent === 'done', null, { timeout: 60_000 })
    await page.waitForSelector('[data-test=deviation-histogram] canvas')
    await page.waitForSelector('[data-test=deviation-scatter] canvas')
    expect(await page.locator('[data-test=batch-done]').textContent()).toMatch(/400 \/ 400 points/)
    expect(await page.locator('[data-test=batch-summary]').textContent()).toMatch(/agrees\s*400/)
    await page.waitForTimeout(300)
    await shot(page, 'pointsets-batch')
    await page.locator('[data-test=batch-rows]').scrollIntoViewIfNeeded()
    await shot(page, 'pointsets-batch-rows')
    expect(errors).toEqual([])
  })

  it('shows a running batch with its progress, and cancels it from the page', async () => {
    const owner = await signIn(demo.owner)
    const project = (await owner.get('/api/projects')).body.find((p: { name: string }) => p.name.startsWith('Brackenridge'))
    const set = (await owner.post(`/api/projects/${project.id}/point-sets/generate`, { kind: 'physical', n: 8, count: 6000, seed: 8, name: 'Eight legs, 6000 points' })).body
    const diagram = (await owner.post(`/api/projects/${project.id}/diagrams`, { title: 'Eight gluons, NMHV', graph: { schemaVersion: 1, nodes: [], edges: [], process: { theory: 'gluon', helicities: [-1, -1, -1, 1, 1, 1, 1, 1] } } })).body
    const check = (await owner.post(`/api/diagrams/${diagram.id}/batch-checks`, { pointSetId: set.id })).body
    const { page, errors } = b
    await page.goto(`/projects/${project.id}/batch-checks/${check.id}`)
    await page.waitForFunction(() => /running/.test(document.querySelector('[data-test=batch-status]')?.textContent ?? ''), null, { timeout: 30_000 })
    await page.waitForSelector('[data-test=batch-live-counts]', { timeout: 30_000 })
    await shot(page, 'pointsets-running')
    await page.click('[data-test=cancel]')
    await page.waitForFunction(() => document.querySelector('[data-test=batch-status]')?.textContent === 'cancelled', null, { timeout: 30_000 })
    expect(await page.locator('[data-test=batch-progress]').textContent()).toMatch(/cancelled after \d+ of 6000 points/)
    expect(errors).toEqual([])
  })

  it('gives a viewer the pages without the forms', async () => {
    const viewer = await openBrowser()
    try {
      const owner = await signIn(demo.owner)
      const project = (await owner.get('/api/projects')).body.find((p: { name: string }) => p.name.startsWith('Brackenridge'))
      const set = (await owner.get(`/api/projects/${project.id}/point-sets`)).body.find((s: { name: string, count: number }) => s.name.startsWith('Five-gluon phase-space'))
      await signInBrowser(viewer.page, demo.viewer, demo.password)
      await viewer.page.goto(`/projects/${project.id}/point-sets`)
      await viewer.page.waitForLoadState('networkidle')
      expect(await viewer.page.locator('[data-test=upload-form]').count()).toBe(0)
      await viewer.page.goto(`/projects/${project.id}/point-sets/${set.id}`)
      await viewer.page.waitForLoadState('networkidle')
      // the page shows the points 50 to a page
      expect(await viewer.page.locator('[data-test=point]').count()).toBe(Math.min(50, set.count))
      expect(await viewer.page.locator('[data-test=delete-set]').count()).toBe(0)
      expect(await viewer.page.locator('[data-test=batch-form]').count()).toBe(0)
      expect(viewer.errors).toEqual([])
    }
    finally {
      await viewer.close()
    }
  })

  it('documents the routes on the API page', async () => {
    const { page, errors } = b
    await page.goto('/docs/api#point-sets')
    await page.waitForLoadState('networkidle')
    const section = page.locator('[data-test=docs-point-sets]')
    await section.scrollIntoViewIfNeeded()
    expect(await section.textContent()).toMatch(/POST\s*\/api\/diagrams\/:id\/batch-checks/)
    await shot(page, 'pointsets-docs')
    expect(errors).toEqual([])
  })
})
