// Editor extras in Debian's chromium: the formula syntax reference (beside the field and on the
// help page, from the compiler's table) and a formula typed with ⟨12⟩ that gets a verdict; the
// exported SVG and PNG carry the process and the shift; at 1280×720 with 10 legs the header rows
// stay single rows, the canvas keeps half the width, and the compact helicity string changes the
// process, which is saved. Page errors and console errors fail every test.
import { beforeAll, describe, expect, it } from 'vitest'
import { readFileSync } from 'node:fs'
import type { Page } from 'playwright-core'
import { demoProject, newDiagram, rowsOf, runCheck, shot, signedInBrowser } from '../helpers/browser'
import { demo, signIn } from '../helpers/api'
import { FORMULA_SYNTAX } from '#shared/physics/formula-syntax'
import { exportCaption } from '#shared/editor/exports'

async function setLegs(page: Page, n: number) {
  await page.fill('input[name=legs]', String(n))
  await page.locator('input[name=legs]').press('Tab')
}

describe('editor extras', () => {
  const a = signedInBrowser(demo.owner, demo.password)
  let project: number
  beforeAll(async () => {
    project = (await demoProject()).id
  })

  it('the syntax reference beside the formula field and on the help page; a formula typed with ⟨12⟩ agrees', async () => {
    const { page, errors } = a
    await page.setViewportSize({ width: 1440, height: 900 })
    await newDiagram(page, project, 'Typed brackets')
    await page.click('[data-test=process-start]')
    await setLegs(page, 5)
    await page.click('[data-test=tab-check]')
    await page.selectOption('select[name=target]', 'formula')
    await page.click('[data-test=syntax-toggle]')
    const ref = page.locator('[data-test=kinematics] [data-test=formula-syntax]')
    await ref.waitFor()
    for (const r of FORMULA_SYNTAX) expect(await ref.textContent()).toContain(r.form)
    expect(await ref.locator('.katex').count()).toBe(FORMULA_SYNTAX.length)
    // "use" puts an example into the field.
    await ref.locator('[data-test=syntax-use]').first().click()
    expect(await page.inputValue('input[name=formula]')).toBe(FORMULA_SYNTAX[0]!.example)
    await page.locator('[data-test=formula-preview] .katex').waitFor()
    // The reference fits the side panel: nothing scrolls sideways.
    expect(await page.evaluate(() => { const el = document.querySelector('[data-test=kinematics]')!.parentElement!; return el.scrollWidth - el.clientWidth })).toBeLessThanOrEqual(0)
    await shot(page, 'editor-extras-syntax')
    // Parke–Taylor for − − + + +, typed with Unicode angle brackets and a bracket written as ⟨1 2⟩.
    await page.fill('input[name=formula]', '⟨1 2⟩^4/(⟨12⟩⟨23⟩⟨34⟩⟨45⟩⟨51⟩)')
    await page.locator('input[name=formula]').press('Tab')
    await expect.poll(() => page.locator('[data-test=formula-preview] .katex').count()).toBe(1)
    await runCheck(page, 'evaluate')
    expect(await page.locator('[data-test=results] [data-test=verdict]').first().textContent()).toBe('agrees')
    // One verdict badge on screen while the drawer is open.
    expect(await page.locator('[data-test=verdict]:visible').count()).toBe(1)
    // A typo in the typed form is named with its position, before any check.
    await page.fill('input[name=formula]', '⟨1 2]')
    await page.locator('input[name=formula]').press('Tab')
    await expect.poll(() => page.locator('[data-test=formula-error]').textContent()).toContain('at position 5')

    await page.goto('/help#formulas')
    await page.waitForLoadState('networkidle')
    const help = page.locator('[data-test=help-formulas]')
    for (const r of FORMULA_SYNTAX) {
      expect(await help.textContent()).toContain(r.form)
      expect(await help.textContent()).toContain(r.meaning)
    }
    expect(await help.locator('.katex').count()).toBe(FORMULA_SYNTAX.length)
    await help.scrollIntoViewIfNeeded()
    await shot(page, 'editor-extras-help')
    expect(errors).toEqual([])
  })

  it('the exported SVG and PNG are captioned with the process and the shift; Block slots are labelled', async () => {
    const { page, errors } = a
    await page.setViewportSize({ width: 1440, height: 900 })
    await newDiagram(page, project, 'Captioned figure')
    await page.click('[data-test=process-start]')
    await setLegs(page, 5)
    await page.click('[data-test=hel-3]')
    await page.click('[data-test=shift-button]')
    await page.click('[data-test=shift-1-3]')
    await page.click('[data-test=expand]')
    await page.waitForSelector('[data-test=block]')
    const caption = exportCaption({ theory: 'gluon', helicities: [-1, -1, -1, 1, 1], shift: [1, 3] })
    expect(caption).toBe('A₅(1⁻, 2⁻, 3⁻, 4⁺, 5⁺) · gluons (colour-ordered) · shift [1,3⟩')
    await page.click('[data-test=export]')
    const [svg] = await Promise.all([page.waitForEvent('download'), page.click('[data-test=export-svg]')])
    const text = readFileSync((await svg.path())!, 'utf8')
    expect(text).toContain(`data-role="caption">${caption}</text>`)
    const slots = await page.locator('[data-test=block] sup').count()
    expect(slots).toBeGreaterThan(0)
    expect((text.match(/data-role="slot"/g) ?? []).length).toBe(slots)
    const width = Number(/width="(\d+)"/.exec(text)![1])
    const height = Number(/height="(\d+)"/.exec(text)![1])
    await page.click('[data-test=export]')
    const [png] = await Promise.all([page.waitForEvent('download'), page.click('[data-test=export-png]')])
    const bytes = readFileSync((await png.path())!)
    expect(bytes.subarray(1, 4).toString()).toBe('PNG')
    // Drawn from the same SVG at twice the size: the caption's band is in it.
    expect([bytes.readUInt32BE(16), bytes.readUInt32BE(20)]).toEqual([2 * width, 2 * height])
    await png.saveAs(`${import.meta.dirname}/../screenshots/editor-extras-figure.png`)
    expect(errors).toEqual([])
  })

  it('at 1280×720 with 10 legs: one-row header, canvas at least half the width, the helicity string edits and saves the process', async () => {
    const { page, errors } = a
    await page.setViewportSize({ width: 1280, height: 720 })
    const id = await newDiagram(page, project, 'Ten gluons at 1280')
    await page.click('[data-test=process-start]')
    await setLegs(page, 10)
    const string = page.locator('[data-test=helicity-string]')
    await string.waitFor()
    expect(await page.locator('[data-test=helicity-chips]').count()).toBe(0)
    expect(await string.inputValue()).toBe('−−++++++++')
    await string.fill('−−++−+−+++')
    await string.press('Enter')
    await expect.poll(() => page.locator('[data-test=process-tex]').textContent()).toContain('5−')
    // A wrong count is named beside the field and changes nothing.
    await string.fill('−−+')
    await string.press('Enter')
    await expect.poll(() => page.locator('[data-test=helicity-error]').textContent()).toContain('10 of + and −')
    await string.fill('-−++−+−+++')
    await string.press('Enter')
    expect(await page.locator('[data-test=helicity-error]').count()).toBe(0)
    await page.click('[data-test=shift-button]')
    await page.click('[data-test=shift-1-2]')

    expect(await rowsOf(page, '[data-test=process-header]')).toBe(1)
    expect(await rowsOf(page, '[data-test=editor] > div:first-child')).toBe(1)
    const canvas = (await page.locator('[data-test=canvas]').boundingBox())!
    expect(canvas.width).toBeGreaterThanOrEqual(640)
    // The arithmetic select shows its whole option text.
    await page.click('[data-test=tab-check]')
    const fits = await page.evaluate(() => {
      const sel = document.querySelector<HTMLSelectElement>('select[name=arithmetic]')!
      const probe = document.createElement('span')
      probe.style.font = getComputedStyle(sel).font
      probe.style.whiteSpace = 'nowrap'
      probe.textContent = sel.options[sel.selectedIndex]!.text
      document.body.appendChild(probe)
      const w = probe.getBoundingClientRect().width
      probe.remove()
      return w + 40 <= sel.clientWidth
    })
    expect(fits).toBe(true)
    await page.click('[data-test=save]')
    await expect.poll(() => page.locator('[data-test=save-state]').textContent()).toBe('saved')
    const c = await signIn(demo.owner)
    const saved = (await c.get(`/api/diagrams/${id}`)).body as { graph: { process: { helicities: number[], shift: number[] } } }
    expect(saved.graph.process.helicities).toEqual([-1, -1, 1, 1, -1, 1, -1, 1, 1, 1])
    await page.reload()
    await page.waitForSelector('[data-test=helicity-string]')
    expect(await page.inputValue('[data-test=helicity-string]')).toBe('−−++−+−+++')
    await page.click('[data-test=tab-check]')
    await runCheck(page, 'evaluate')
    expect(await page.locator('[data-test=verdict]:visible').count()).toBe(1)
    await shot(page, 'editor-extras-1280-result')
    await page.setViewportSize({ width: 1440, height: 900 })
    await shot(page, 'editor-extras-1440-result')
    await page.setViewportSize({ width: 1280, height: 720 })
    await page.click('[data-test=tab-inspect]')
    await shot(page, 'editor-extras-1280-10legs')
    // Twelve legs: A₁₂(…) fits the inspector, the header stays one row.
    await setLegs(page, 12)
    await expect.poll(() => page.inputValue('[data-test=helicity-string]')).toBe('−−++−+−+++++')
    expect(await rowsOf(page, '[data-test=process-header]')).toBe(1)
    const overflow = await page.evaluate(() => {
      const box = document.querySelector<HTMLElement>('[data-test=process-tex]')!
      return box.scrollWidth - box.clientWidth
    })
    expect(overflow).toBeLessThanOrEqual(0)
    await shot(page, 'editor-extras-1280-12legs')
    expect(errors).toEqual([])
  })
})
