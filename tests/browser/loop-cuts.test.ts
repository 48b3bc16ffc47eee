// The loop-cut page: a signed-in user computes the four-point box (it agrees with −st A_tree,
// Bern, Dixon, Dunbar, Kosower, hep-ph/9403226), then six gluons in exact arithmetic, then sees a
// bad helicity named.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { openBrowser, shot, signInBrowser, type BrowserSession } from '../helpers/browser'
import { demo } from '../helpers/api'

describe('loop cuts in the browser', () => {
  let s: BrowserSession
  beforeAll(async () => {
    s = await openBrowser()
  })
  afterAll(async () => {
    await s?.close()
  })

  it('four-point box agrees; six gluons exact: 15 boxes; a bad helicity is named', async () => {
    const { page } = s
    await signInBrowser(page, demo.viewer, demo.password)
    await page.goto('/loop-cuts')
    await page.waitForLoadState('networkidle')
    await page.fill('input[name=helicities]', '- - + +')
    await page.click('[data-test=loop-run]')
    await expect.poll(() => page.locator('[data-test=loop-verdict]').textContent()).toBe('agrees')
    await expect.poll(() => page.locator('[data-test=loop-box]').count()).toBe(1)
    const row = await page.locator('[data-test=loop-box]').first().textContent()
    expect(row).toContain('{1} {2} {3} {4}')
    expect(row).toContain('−st A_tree')
    await shot(page, 'loop-cuts-four-point')

    await page.fill('input[name=helicities]', '--++++')
    await page.selectOption('select[name=arithmetic]', 'exact')
    await page.selectOption('select[name=corners]', 'berends-giele')
    await page.fill('input[name=seed]', '2')
    await page.click('[data-test=loop-run]')
    await expect.poll(() => page.locator('[data-test=loop-box]').count()).toBe(15)
    await expect.poll(() => page.locator('[data-test=loop-verdict]').textContent()).toBe('agrees')
    expect(await page.locator('[data-test=loop-result]').textContent()).toContain('15 agree')
    // exact values are fractions
    expect(await page.locator('[data-test=loop-value]').first().textContent()).toMatch(/^-?\d+(\/\d+)?$/)
    await shot(page, 'loop-cuts-six-exact')

    await page.fill('input[name=helicities]', '-1 2 1 1')
    await page.click('[data-test=loop-run]')
    await expect.poll(() => page.locator('[data-test=loop-problem]').textContent()).toContain('helicities[1]')
    expect(await page.locator('[data-test=loop-result]').count()).toBe(0)
    expect(s.errors.filter((e) => !/422|Unprocessable/.test(e))).toEqual([])
  })
})
