// The canvas is the computation, in Debian's chromium: every header control changes the process
// (persisted on save, undone by Ctrl+Z); a check evaluates what is drawn (a term deleted, a Line
// flipped, both shifted legs on one vertex: `disagrees`, named; the whole drawing: `agrees`); a
// result goes stale on the next edit; each demo diagram opens with every node inside the canvas.
// Page errors and console errors fail every test (an error toast logs one too).
import { beforeAll, describe, expect, it } from 'vitest'
import type { Page } from 'playwright-core'
import { demoProject, glue, newDiagram, nodesOutside, openEditor, runCheck, shot, signedInBrowser } from '../helpers/browser'
import { demo } from '../helpers/api'

const verdict = (page: Page) => page.locator('[data-test=results] [data-test=verdict]').first().textContent()
const chips = (page: Page) => page.locator('[data-test=helicity-chips] button').allTextContents()
const blur = (page: Page) => page.evaluate(() => (document.activeElement as HTMLElement | null)?.blur())

describe('the canvas is the computation', () => {
  const a = signedInBrowser(demo.owner, demo.password)
  let project: Awaited<ReturnType<typeof demoProject>>
  beforeAll(async () => {
    project = await demoProject()
  })

  it('every header control changes the process; saved, reloaded, undone', async () => {
    const { page, errors } = a
    await newDiagram(page, project.id, 'Header controls')
    await page.click('[data-test=process-start]')
    expect(await chips(page)).toEqual(['1−', '2−', '3+', '4+'])
    await page.click('[data-test=hel-3]')
    await expect.poll(() => chips(page)).toEqual(['1−', '2−', '3−', '4+'])
    await page.fill('input[name=legs]', '5')
    await page.locator('input[name=legs]').press('Tab')
    await expect.poll(() => chips(page)).toEqual(['1−', '2−', '3−', '4+', '5+'])
    await page.fill('input[name=order]', '1 3 2 4 5')
    await page.locator('input[name=order]').press('Enter')
    await page.click('[data-test=shift-button]')
    await page.click('[data-test=shift-1-3]')
    await expect.poll(() => page.locator('[data-test=shift-button]').textContent()).toContain('[1,3⟩')
    await expect.poll(() => page.locator('[data-test=save-state]').textContent()).toContain('unsaved')
    await shot(page, 'editor-header-edited')
    await page.click('[data-test=save]')
    await expect.poll(() => page.locator('[data-test=save-state]').textContent()).toBe('saved')
    await page.reload()
    await page.waitForSelector('[data-test=helicity-chips]')
    expect(await chips(page)).toEqual(['1−', '2−', '3−', '4+', '5+'])
    expect(await page.inputValue('input[name=order]')).toBe('1 3 2 4 5')
    expect(await page.locator('[data-test=shift-button]').textContent()).toContain('[1,3⟩')
    // Theory and spin.
    await page.selectOption('select[name=theory]', 'spin')
    await page.fill('input[name=spin]', '3')
    await page.locator('input[name=spin]').press('Tab')
    await expect.poll(() => chips(page)).toEqual(['1−3', '2−3', '3−3', '4+3', '5+3'])
    await blur(page)
    await page.keyboard.press('Control+z')
    await expect.poll(() => chips(page)).toEqual(['1−2', '2−2', '3−2', '4+2', '5+2'])
    await page.keyboard.press('Control+z')
    await expect.poll(() => chips(page)).toEqual(['1−', '2−', '3−', '4+', '5+'])
    expect(await page.inputValue('select[name=theory]')).toBe('gluon')
    await page.keyboard.press('Control+Shift+z')
    await expect.poll(() => chips(page)).toEqual(['1−2', '2−2', '3−2', '4+2', '5+2'])
    await page.keyboard.press('Control+y')
    await expect.poll(() => chips(page)).toEqual(['1−3', '2−3', '3−3', '4+3', '5+3'])
    // Spin 3, four legs (−−++) under [1,2⟩: one story, decided from the falloff and the cross-shift check together.
    await page.fill('input[name=legs]', '4')
    await page.locator('input[name=legs]').press('Tab')
    await page.click('[data-test=hel-3]')
    await expect.poll(() => chips(page)).toEqual(['1−3', '2−3', '3+3', '4+3'])
    await page.click('[data-test=shift-button]')
    await page.click('[data-test=shift-1-2]')
    await page.click('[data-test=evaluate-quick]')
    await page.waitForSelector('[data-test=results], [data-test=notice]', { timeout: 60_000 })
    await page.waitForSelector('[data-test=evaluate-quick]:not([disabled])', { timeout: 90_000 })
    expect(await page.locator('[data-test=results]').count(), (await page.locator('[data-test=notice]').textContent().catch(() => '')) ?? '').toBe(1)
    await expect.poll(() => page.locator('[data-test=cross-shift]').count(), { timeout: 60_000 }).toBe(1)
    const story = (await page.locator('[data-test=story]').textContent())!
    const cross = (await page.locator('[data-test=cross-shift]').textContent())!
    expect(await page.locator('[data-test=results]').textContent()).not.toContain('can be trusted')
    if (cross.includes('valid shifts disagree')) expect(story).toMatch(/valid shifts disagree.*Do not trust/)
    await shot(page, 'editor-spin3-story')
    expect(errors).toEqual([])
  })

  it('both shifted legs on one vertex: the node says so, and the check does not agree', async () => {
    const { page, errors } = a
    await newDiagram(page, project.id, 'Four gluons, shifted legs together')
    await page.click('[data-test=process-start]')
    for (const t of ['angle', 'square', 'leg', 'leg', 'leg', 'leg']) await page.click(`[data-test=palette-${t}]`)
    await page.click('[data-test=tidy]')
    await page.click('[data-test=fit]')
    const id = async (sel: string) => (await page.locator(sel).first().getAttribute('data-id'))!
    const angle = await id('.vue-flow__node-angle')
    const square = await id('.vue-flow__node-square')
    const leg = async (l: number) => (await page.locator(`.vue-flow__node-leg:has([data-label="${l}"])`).getAttribute('data-id'))!
    const [l1, l2, l3, l4] = [await leg(1), await leg(2), await leg(3), await leg(4)]
    await glue(page, { node: l1, handle: 'p' }, { node: angle, handle: 'h0' })
    await glue(page, { node: l2, handle: 'p' }, { node: angle, handle: 'h1' })
    await glue(page, { node: l3, handle: 'p' }, { node: square, handle: 'h0' })
    await glue(page, { node: l4, handle: 'p' }, { node: square, handle: 'h1' })
    await glue(page, { node: angle, handle: 'h2' }, { node: square, handle: 'h2' })
    await expect.poll(() => page.locator('.vue-flow__edge').count()).toBe(5)
    await page.click('[data-test=tidy]')
    await page.click('[data-test=fit]')
    await expect.poll(() => page.locator(`.vue-flow__node[data-id="${angle}"] [data-test=node-issues]`).getAttribute('title')).toContain('both shifted legs 1 and 2')
    await shot(page, 'editor-shifted-legs-together')
    await runCheck(page)
    expect(await verdict(page)).not.toBe('agrees')
    await expect.poll(() => page.locator('[data-test=story]').textContent()).toMatch(/not the recursion/)
    await shot(page, 'editor-shifted-legs-together-checked')
    expect(errors).toEqual([])
  })

  it('the six-gluon demo: a deleted term and a flipped Line disagree, named; the whole drawing agrees; an edit makes the result stale', async () => {
    const { page, errors } = a
    const d = project.diagrams.find(x => x.title.startsWith('Six gluons'))!
    await openEditor(page, project.id, d.id)
    await expect.poll(() => page.locator('[data-test=term-label]').count()).toBe(3)
    // The whole drawing.
    await runCheck(page)
    expect(await verdict(page)).toBe('agrees')
    await expect.poll(() => page.locator('[data-test=drawing]').textContent()).toContain('every term of the recursion, drawn once')
    await shot(page, 'editor-six-gluon-drawing-agrees')
    // An edit after the run: the drawer says stale.
    await page.click('[data-test=term-item-0]')
    await shot(page, 'editor-six-gluon-term-focused')
    const label = (await page.locator('[data-test=term-item-0]').textContent())!.replace(/^\s*1\s*/, '').trim()
    await page.click('[data-test=term-delete]')
    await expect.poll(() => page.locator('[data-test=stale]').count()).toBe(1)
    await shot(page, 'editor-six-gluon-stale')
    await runCheck(page)
    expect(await verdict(page)).toBe('disagrees')
    const channel = label.split(' | ')[0]!
    await expect.poll(() => page.locator('[data-test=drawing-messages]').textContent()).toContain(`channel ${channel}`)
    await expect.poll(() => page.locator('[data-test=drawing-messages]').textContent()).toContain('is not drawn')
    await shot(page, 'editor-six-gluon-term-deleted')
    await blur(page)
    await page.keyboard.press('Control+z')
    await expect.poll(() => page.locator('[data-test=term-label]').count()).toBe(3)
    // Flip the top-level Line of one term.
    await page.locator('[data-test=line-badge]').first().click()
    await runCheck(page)
    expect(await verdict(page)).toBe('disagrees')
    await expect.poll(() => page.locator('[data-test=drawing-messages]').textContent()).toMatch(/wrong way round|is not drawn/)
    await shot(page, 'editor-six-gluon-line-flipped')
    await blur(page)
    await page.keyboard.press('Control+z')
    await runCheck(page)
    expect(await verdict(page)).toBe('agrees')
    expect(errors).toEqual([])
  })

  for (const [w, h] of [[1440, 900], [1280, 720]] as const) {
    it(`every demo diagram opens fitted at ${w}×${h}: every node inside the canvas`, async () => {
      const { page, errors } = a
      await page.setViewportSize({ width: w, height: h })
      try {
        for (const d of project.diagrams.filter(x => !/^(Scratch|Header|Four gluons,)/.test(x.title))) {
          await openEditor(page, project.id, d.id)
          await page.waitForTimeout(300)
          expect(await nodesOutside(page), d.title).toEqual([])
          await shot(page, `editor-fit-${w}-${d.title.split(/[ ,:]/)[0]!.toLowerCase()}-${d.id}`)
        }
        const six = project.diagrams.find(x => x.title.startsWith('Six gluons'))!
        await openEditor(page, project.id, six.id)
        await page.click('[data-test=expand-full]')
        await page.waitForTimeout(400)
        expect(await nodesOutside(page), 'six gluons, fully expanded').toEqual([])
        await shot(page, `editor-fit-${w}-six-full`)
        await page.keyboard.press('Control+z')
      }
      finally {
        await page.setViewportSize({ width: 1440, height: 900 })
      }
      expect(errors).toEqual([])
    })
  }
})
