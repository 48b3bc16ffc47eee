// The loop-cut page: a signed-in user computes the four-point box (it agrees with −st A_tree,
// Bern, Dixon, Dunbar, Kosower, hep-ph/9403226), then six gluons in exact arithmetic, then sees a
// bad helicity named.
import { readFileSync } from 'node:fs'
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
    // exact values are fractions (long ones elided, the full value on hover, the decimal beneath)
    const first = page.locator('[data-test=loop-value] [data-test=num]').first()
    expect(await first.getAttribute('title')).toMatch(/^-?\d+(\/\d+)?$/)
    await shot(page, 'loop-cuts-six-exact')

    await page.fill('input[name=helicities]', '-1 2 1 1')
    await page.click('[data-test=loop-run]')
    await expect.poll(() => page.locator('[data-test=loop-problem]').textContent()).toContain('helicities[1]')
    expect(await page.locator('[data-test=loop-result]').count()).toBe(0)
    expect(s.errors.filter((e) => !/422|Unprocessable/.test(e))).toEqual([])
  })

  it('six-gluon NMHV over the N = 4 multiplet: the infrared conditions agree; CSV and JSON exports hold the table', async () => {
    const { page } = s
    s.errors.length = 0
    await page.goto('/loop-cuts')
    await page.waitForLoadState('networkidle')
    await page.fill('input[name=helicities]', '-+-+-+')
    await page.selectOption('select[name=arithmetic]', 'exact')
    await page.selectOption('select[name=states]', 'n4')
    await page.click('[data-test=loop-run]')
    await expect.poll(() => page.locator('[data-test=loop-box]').count()).toBe(15)
    await expect.poll(() => page.locator('[data-test=loop-verdict]').textContent()).toBe('agrees')
    expect(await page.locator('[data-test=loop-infrared-row]').count()).toBe(10)
    expect(await page.locator('[data-test=loop-states]').allTextContents()).toContain('N = 4 multiplet: gluons, four gluinos, six scalars (Grassmann integration over the four cut lines)')
    // a gluino routing shows its multiplicity
    expect(await page.locator('[data-test=loop-table]').textContent()).toContain('×4')
    await shot(page, 'loop-cuts-nmhv-multiplet')
    await page.locator('[data-test=loop-infrared]').scrollIntoViewIfNeeded()
    await shot(page, 'loop-cuts-infrared')
    const [csv] = await Promise.all([page.waitForEvent('download'), page.click('[data-test=loop-export-csv]')])
    expect(csv.suggestedFilename()).toBe('loop-cuts-mpmpmp.csv')
    const text = readFileSync((await csv.path())!, 'utf8')
    expect(text.split('\n')[1]).toBe('row,box,corners,kind,states,solution,helicities,multiplicity,value_re,value_im,target_re,target_im,deviation,verdict')
    expect(text.split('\n').filter((l) => l.startsWith('infrared,'))).toHaveLength(10)
    const [json] = await Promise.all([page.waitForEvent('download'), page.click('[data-test=loop-export-json]')])
    const doc = JSON.parse(readFileSync((await json.path())!, 'utf8'))
    expect(doc).toMatchObject({ format: 'polewright-loop-cuts', formatVersion: 1, request: { helicities: [-1, 1, -1, 1, -1, 1], states: 'n4' } })
    expect(doc.result.boxes).toHaveLength(15)
    // the exported values are the full ones the table elides
    const title = await page.locator('[data-test=loop-value] [data-test=num]').first().getAttribute('title')
    expect(doc.result.boxes[0].value[0]).toBe(title)
    expect(s.errors).toEqual([])
  })
})
