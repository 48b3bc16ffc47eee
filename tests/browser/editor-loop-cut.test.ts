// A loop-cut diagram in Debian's chromium: a four-gluon box (−−++) built by hand from the palette
// (four three-point corners, four legs, four Lines with their helicities left open) agrees with the
// N = 4 coefficient −st A_tree (Bern, Dixon, Dunbar, Kosower, hep-ph/9403226); it is kept on save
// and reload; for five gluons "Generate boxes" draws every box and the check agrees box by box.
// Page errors and console errors fail the test.
import { describe, expect, it } from 'vitest'
import type { Page } from 'playwright-core'
import { nodesOutside, shot, signedInBrowser } from '../helpers/browser'
import { demo, signIn } from '../helpers/api'

async function glue(page: Page, a: { node: string, handle: string }, b: { node: string, handle: string }) {
  const h = (x: { node: string, handle: string }) => page.locator(`.vue-flow__handle[data-nodeid="${x.node}"][data-handleid="${x.handle}"]`)
  const ba = (await h(a).boundingBox())!
  const bb = (await h(b).boundingBox())!
  await page.mouse.move(ba.x + ba.width / 2, ba.y + ba.height / 2)
  await page.mouse.down()
  await page.mouse.move((ba.x + bb.x) / 2, (ba.y + bb.y) / 2, { steps: 4 })
  await page.mouse.move(bb.x + bb.width / 2, bb.y + bb.height / 2, { steps: 4 })
  await page.mouse.up()
}
/** Drags a palette item onto the canvas at (x, y) from the canvas's top-left; the new node's id. */
async function place(page: Page, type: string, x: number, y: number): Promise<string> {
  const before = new Set(await page.locator('.vue-flow__node').evaluateAll(ns => ns.map(n => n.getAttribute('data-id'))))
  await page.locator(`[data-test=palette-${type}]`).dragTo(page.locator('[data-test=canvas]'), { targetPosition: { x, y } })
  await expect.poll(() => page.locator('.vue-flow__node').count()).toBe(before.size + 1)
  const ids = await page.locator('.vue-flow__node').evaluateAll(ns => ns.map(n => n.getAttribute('data-id')!))
  return ids.find(id => !before.has(id))!
}
/** Drags a node so its centre sits at (x, y) from the canvas's top-left. */
async function moveTo(page: Page, id: string, x: number, y: number) {
  const c = (await page.locator('[data-test=canvas]').boundingBox())!
  const b = (await page.locator(`.vue-flow__node[data-id="${id}"]`).boundingBox())!
  await page.mouse.move(b.x + b.width / 2, b.y + b.height / 2)
  await page.mouse.down()
  await page.mouse.move(c.x + x, c.y + y, { steps: 6 })
  await page.mouse.up()
}
async function runLoopCheck(page: Page) {
  await page.click('[data-test=evaluate-quick]')
  await page.waitForSelector('[data-test=loop-result]', { timeout: 60_000 })
  await page.waitForSelector('[data-test=evaluate-quick]:not([disabled])', { timeout: 90_000 })
}
const verdict = (page: Page) => page.locator('[data-test=loop-result] [data-test=loop-verdict]').textContent()

describe('the loop-cut editor', () => {
  const a = signedInBrowser(demo.owner, demo.password)

  it('a four-point box by hand agrees with −st A_tree, is kept on reload; five gluons: every box generated agrees', async () => {
    const { page, errors } = a
    const c = await signIn(demo.owner)
    const project = ((await c.get('/api/projects')).body as { id: number, name: string }[])[0]!
    await page.goto(`/projects/${project.id}`)
    await page.waitForLoadState('networkidle')
    await page.fill('input[name=diagram-title]', 'Four gluons, the box by hand')
    await page.selectOption('select[name=diagram-kind]', 'loop-cut')
    await Promise.all([page.waitForURL(/\/diagrams\/\d+$/), page.click('form button[type=submit]')])
    await page.waitForSelector('.vue-flow__pane')
    await page.waitForLoadState('networkidle')
    expect(await page.locator('[data-test=loop-bar]').count()).toBe(1)
    expect(await page.locator('[data-test=expand]').count()).toBe(0)
    expect(await page.locator('[data-test=empty-hint]').textContent()).toContain('Generate boxes')
    await page.click('[data-test=process-start]')
    // the ring: angle (leg 1), square (leg 2), angle (leg 3), square (leg 4), clockwise
    const corners = [
      await place(page, 'angle', 300, 130), await place(page, 'square', 620, 130),
      await place(page, 'angle', 620, 380), await place(page, 'square', 300, 380),
    ]
    const legs = [
      await place(page, 'leg', 150, 80), await place(page, 'leg', 790, 80),
      await place(page, 'leg', 790, 450), await place(page, 'leg', 150, 450),
    ]
    // the view fitted itself to the first node: move that one to its place
    await moveTo(page, corners[0]!, 300, 130)
    for (let q = 0; q < 4; q++) await glue(page, { node: legs[q]!, handle: 'p' }, { node: corners[q]!, handle: 'h0' })
    for (let q = 0; q < 4; q++) await glue(page, { node: corners[q]!, handle: 'h1' }, { node: corners[(q + 1) % 4]!, handle: 'h2' })
    await expect.poll(() => page.locator('.vue-flow__edge').count()).toBe(8)
    // the Lines start open, and the ring reads as the box
    await expect.poll(() => page.locator('[data-test=line-badge]').allTextContents()).toEqual(['±', '±', '±', '±'])
    await expect.poll(() => page.locator('[data-test=term-label]').textContent()).toContain('box 1 · zero-mass · {1}{2}{3}{4}')
    expect(await page.locator('[data-test=node-issues]').count()).toBe(0)
    await runLoopCheck(page)
    expect(await verdict(page)).toBe('agrees')
    const row = page.locator('[data-test=loop-box]')
    await expect.poll(() => row.count()).toBe(1)
    expect(await row.textContent()).toContain('−st A_tree')
    expect(await page.locator('[data-test=loop-sum]').textContent()).toContain('relative deviation is ≤ 1e-9')
    await shot(page, 'loop-cut-four-point-by-hand')
    // a Line given a helicity: the ring keeps only those terms, the result goes stale
    await page.locator('[data-test=line-badge]').first().click()
    await expect.poll(() => page.locator('[data-test=loop-result] [data-test=stale]').count()).toBe(1)
    await page.locator('[data-test=line-badge]').first().click()
    await page.locator('[data-test=line-badge]').first().click()
    await expect.poll(() => page.locator('[data-test=line-badge]').allTextContents()).toEqual(['±', '±', '±', '±'])
    // save and reload: the kind and the ring are kept
    await page.click('[data-test=save]')
    await expect.poll(() => page.locator('[data-test=save-state]').textContent()).toBe('saved')
    await page.reload()
    await page.waitForSelector('.vue-flow__pane')
    await page.waitForLoadState('networkidle')
    expect(await page.locator('[data-test=loop-bar]').count()).toBe(1)
    await expect.poll(() => page.locator('[data-test=term-label]').count()).toBe(1)
    expect(await page.locator('.vue-flow__edge').count()).toBe(8)
    await runLoopCheck(page)
    expect(await verdict(page)).toBe('agrees')

    // five gluons: every box generated
    await page.fill('input[name=legs]', '5')
    await page.locator('input[name=legs]').press('Tab')
    await expect.poll(() => page.locator('[data-test=helicity-chips] button').allTextContents()).toEqual(['1−', '2−', '3+', '4+', '5+'])
    await expect.poll(() => page.locator('[data-test=loop-result] [data-test=stale]').count()).toBe(1)
    await page.click('[data-test=generate-boxes]')
    await expect.poll(() => page.locator('[data-test=term-label]').count()).toBe(5)
    await expect.poll(() => page.locator('[data-test=loop-ring-count]').textContent()).toContain('5 rings drawn · 5 boxes in this process')
    await page.waitForTimeout(300)
    expect(await nodesOutside(page)).toEqual([])
    expect(await page.locator('[data-test=node-issues]').count()).toBe(0)
    await runLoopCheck(page)
    expect(await verdict(page)).toBe('agrees')
    await expect.poll(() => page.locator('[data-test=loop-box]').count()).toBe(5)
    for (const t of await page.locator('[data-test=loop-box]').allTextContents()) expect(t).toMatch(/one-mass.*−½ st A_tree.*agrees/)
    expect(await page.locator('[data-test=loop-result] [data-test=stale]').count()).toBe(0)
    await shot(page, 'loop-cut-five-gluon-boxes')
    // close up on the first ring: a Block corner shows ± on its open line slots
    const block = page.locator('.vue-flow__node-block').first()
    const bb = (await block.boundingBox())!
    await page.mouse.move(bb.x + bb.width / 2, bb.y + bb.height / 2)
    await page.mouse.wheel(0, -900)
    await page.waitForTimeout(400)
    expect(await block.textContent()).toContain('±')
    await shot(page, 'loop-cut-ring-close-up')
    await page.click('[data-test=fit]')
    // exact arithmetic: equality, no tolerance
    await page.selectOption('select[name=loop-arithmetic]', 'exact')
    await runLoopCheck(page)
    expect(await verdict(page)).toBe('agrees')
    expect(await page.locator('[data-test=loop-sum]').textContent()).toContain('exact rational arithmetic: agreement is equality')
    // one chosen box, then back by undo
    await page.selectOption('select[name=loop-box]', '1')
    await page.click('[data-test=generate-boxes]')
    await expect.poll(() => page.locator('[data-test=term-label]').allTextContents()).toEqual(['ring 1 · box 2 · one-mass · {1}{2}{3,4}{5}'])
    await expect.poll(() => page.locator('[data-test=loop-result] [data-test=stale]').count()).toBe(1)
    await page.click('[data-test=undo]')
    await expect.poll(() => page.locator('[data-test=term-label]').count()).toBe(5)
    await page.click('[data-test=save]')
    await expect.poll(() => page.locator('[data-test=save-state]').textContent()).toBe('saved')
    expect(errors).toEqual([])
  })

  it('a broken ring is named on the node, and the check refuses it by name', async () => {
    const { page, errors } = a
    const url = page.url()
    await page.goto(url)
    await page.waitForSelector('.vue-flow__pane')
    await page.waitForLoadState('networkidle')
    // swap one generated corner's kind: the node says what the cut needs
    const square = (await page.locator('.vue-flow__node-square').first().getAttribute('data-id'))!
    await page.click(`.vue-flow__node[data-id="${square}"]`)
    await page.click('[data-test=inspector] button:has-text("Make it an angle vertex")')
    const issues = page.locator(`.vue-flow__node[data-id="${square}"] [data-test=node-issues]`)
    await expect.poll(() => issues.getAttribute('title')).toContain('the cut makes this corner a square vertex')
    await page.click('[data-test=evaluate-quick]')
    await expect.poll(() => page.locator('[data-test=notice]').textContent()).toMatch(/^graph\.nodes\[\d+\]: angle vertex .*the cut makes this corner a square vertex/)
    await shot(page, 'loop-cut-wrong-corner')
    // the check refused with a 422, which the browser logs as a failed request
    errors.splice(0, errors.length, ...errors.filter(e => !/status of 422/.test(e)))
    expect(errors).toEqual([])
  })
})
