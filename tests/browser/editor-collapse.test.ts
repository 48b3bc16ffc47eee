// Big expansions stay readable, in Debian's chromium: "Expand fully" of an 8-gluon NMHV process shows
// at most READABLE_NODES vertices and Blocks, all inside the canvas at 1440×900 and 1280×720, the rest
// as labelled Blocks that open one at a time; a viewer opens and folds Blocks to explore (nothing is
// saved, the page says so) and checks what is drawn without storing a check.
// Page errors and console errors fail every test.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Page } from 'playwright-core'
import { READABLE_NODES } from '#shared/editor/collapse'
import { nodesOutside, openBrowser, openEditor, runCheck, shot, signInBrowser, type BrowserSession } from '../helpers/browser'
import { projectWithRoles } from '../helpers/api'

const PASSWORD = 'correct-horse-1'
const NMHV8 = { theory: 'gluon', helicities: [-1, -1, -1, 1, 1, 1, 1, 1] }

/** Vertices and Blocks on the canvas (legs and term frames not counted). */
const shownNodes = (page: Page) => page.locator('.vue-flow__node-angle, .vue-flow__node-square, .vue-flow__node-block').count()
const blockIds = (page: Page) => page.locator('.vue-flow__node-block').evaluateAll(ns => ns.map(n => n.getAttribute('data-id')!))

/** Clicks "expand" on the first Block that has one; returns its id. */
async function openFirstBlock(page: Page): Promise<string> {
  const btn = page.locator('.vue-flow__node-block [data-test=block-expand]').first()
  const id = await btn.evaluate(b => b.closest('.vue-flow__node')!.getAttribute('data-id')!)
  await btn.click()
  await expect.poll(() => page.locator(`.vue-flow__node[data-id="${id}"]`).count()).toBe(0)
  return id
}

describe('big expansions collapse to labelled Blocks that open one at a time', () => {
  let roles: Awaited<ReturnType<typeof projectWithRoles>>
  let diagramId: number
  let owner: BrowserSession
  beforeAll(async () => {
    roles = await projectWithRoles()
    const d = await roles.owner.post(`/api/projects/${roles.project.id}/diagrams`, { title: 'Eight gluons, NMHV', graph: { schemaVersion: 1, process: NMHV8, nodes: [], edges: [] } })
    expect(d.status).toBe(201)
    diagramId = d.body.id
    owner = await openBrowser()
    await signInBrowser(owner.page, roles.owner.email, PASSWORD)
  })
  afterAll(async () => {
    await owner?.close()
  })

  it('Expand fully: at most READABLE_NODES vertices and Blocks, inside the canvas; a Block opens', async () => {
    const { page, errors } = owner
    await openEditor(page, roles.project.id, diagramId)
    await page.click('[data-test=expand-full]')
    await expect.poll(() => page.locator('[data-test=block]').count()).toBeGreaterThan(0)
    expect(await shownNodes(page)).toBeLessThanOrEqual(READABLE_NODES)
    await expect.poll(() => page.locator('[data-test=notice]').textContent()).toMatch(/kept collapsed so the canvas stays readable/)
    // Each Block is labelled with its side and its channel's legs.
    const labels = await page.locator('[data-test=block-label]').allTextContents()
    for (const l of labels) expect(l).toMatch(/^A[LR]\{\d+(,\d+)*\}$/)
    await page.click('[data-test=save]')
    await expect.poll(() => page.locator('[data-test=save-state]').textContent()).toBe('saved')
    for (const [w, h] of [[1440, 900], [1280, 720]] as const) {
      await page.setViewportSize({ width: w, height: h })
      await openEditor(page, roles.project.id, diagramId)
      await page.waitForTimeout(300)
      expect(await shownNodes(page)).toBeLessThanOrEqual(READABLE_NODES)
      expect(await nodesOutside(page), `${w}×${h}`).toEqual([])
      await shot(page, `editor-collapse-8-nmhv-${w}`)
    }
    await page.setViewportSize({ width: 1440, height: 900 })
    await openEditor(page, roles.project.id, diagramId)
    const before = await shownNodes(page)
    const others = await blockIds(page)
    const opened = await openFirstBlock(page)
    // It expands: more vertices and Blocks than before; every Block of the other terms is still there
    // (the opened one's own term is redrawn once per channel term of the Block: ids `<term>-b<k>`).
    expect(await shownNodes(page)).toBeGreaterThan(before)
    const term = (id: string) => id.split('-')[0]
    for (const id of others.filter(x => term(x) !== term(opened))) expect(await page.locator(`.vue-flow__node[data-id="${id}"]`).count(), id).toBe(1)
    await page.keyboard.press('f')
    await page.waitForTimeout(300)
    await shot(page, 'editor-collapse-8-nmhv-opened')
    // Undo brings the collapsed Block back (an editor's opening is an undo step).
    await page.evaluate(() => (document.activeElement as HTMLElement | null)?.blur())
    await page.keyboard.press('Control+z')
    await expect.poll(() => page.locator(`.vue-flow__node[data-id="${opened}"]`).count()).toBe(1)
    expect(errors).toEqual([])
  })

  it('a viewer opens and folds Blocks to explore, nothing is saved, and checks what is drawn', async () => {
    const b = await openBrowser()
    try {
      const { page, errors } = b
      await signInBrowser(page, roles.viewer.email, PASSWORD)
      const saved = (await roles.owner.get(`/api/diagrams/${diagramId}`)).body as { version: number, graph: unknown }
      await openEditor(page, roles.project.id, diagramId)
      await expect.poll(() => page.locator('[data-test=read-only]').textContent()).toContain('explore')
      expect(await page.locator('[data-test=explore-state]').count()).toBe(0)
      // Controls a viewer cannot use look disabled.
      const undo = await page.locator('[data-test=undo]').evaluate(el => ({ disabled: (el as HTMLButtonElement).disabled, cursor: getComputedStyle(el).cursor, opacity: Number(getComputedStyle(el).opacity) }))
      expect(undo).toEqual({ disabled: true, cursor: 'not-allowed', opacity: expect.any(Number) })
      expect(undo.opacity).toBeLessThan(1)
      expect(await page.locator('[data-test=save]').count()).toBe(0)

      await expect.poll(() => page.locator('[data-test=block-expand]').count()).toBeGreaterThan(0)
      const before = await shownNodes(page)
      await openFirstBlock(page)
      expect(await shownNodes(page)).toBeGreaterThan(before)
      await expect.poll(() => page.locator('[data-test=explore-state]').textContent()).toContain('not saved')
      // Fold one back again.
      const folds = page.locator('[data-test=block-fold]')
      await expect.poll(() => folds.count()).toBeGreaterThan(0)
      const n = await shownNodes(page)
      await folds.first().click()
      await expect.poll(() => shownNodes(page)).toBeLessThan(n)
      await openFirstBlock(page)
      await shot(page, 'editor-collapse-viewer-explores')

      // The check of what is drawn: a verdict, not stored.
      await runCheck(page)
      await expect.poll(() => page.locator('[data-test=results] [data-test=verdict]').first().textContent()).toContain('agrees')
      await expect.poll(() => page.locator('[data-test=results]').textContent()).toContain('this is a check of what is drawn')
      await shot(page, 'editor-collapse-viewer-check')

      // Nothing was saved and no check was stored.
      const after = (await roles.owner.get(`/api/diagrams/${diagramId}`)).body as { version: number, graph: unknown }
      expect(after.version).toBe(saved.version)
      expect(after.graph).toEqual(saved.graph)
      expect((await roles.owner.get(`/api/diagrams/${diagramId}/checks`)).body).toEqual([])
      expect(errors).toEqual([])
    }
    finally {
      await b.close()
    }
  })

  it('the route checks a posted drawing for a viewer, stores nothing, and refuses outsiders and bad graphs', async () => {
    const saved = (await roles.owner.get(`/api/diagrams/${diagramId}`)).body as { graph: Record<string, unknown> }
    const body = { kinematics: { kind: 'random', seed: 3 }, graph: saved.graph }
    const ok = await roles.viewer.post(`/api/diagrams/${diagramId}/check-drawing`, body)
    expect(ok.status).toBe(200)
    expect(ok.body.verdict).toBe('agrees')
    expect(ok.body.drawing.comparison.complete).toBe(true)
    expect((await roles.outsider.post(`/api/diagrams/${diagramId}/check-drawing`, body)).status).toBe(404)
    expect((await roles.anonymous.post(`/api/diagrams/${diagramId}/check-drawing`, body)).status).toBe(401)
    const bad = await roles.viewer.post(`/api/diagrams/${diagramId}/check-drawing`, { ...body, graph: { ...saved.graph, nodes: 'x' } })
    expect(bad.status).toBe(400)
    expect(bad.body.message).toMatch(/^graph\.nodes/)
    const noProcess = await roles.viewer.post(`/api/diagrams/${diagramId}/check-drawing`, { ...body, graph: { ...saved.graph, process: { theory: 'gluon', helicities: [-1, -1] } } })
    expect(noProcess.status).toBe(400)
    expect((await roles.owner.get(`/api/diagrams/${diagramId}/checks`)).body).toEqual([])
  })
})
