// The editor's Limits tab in Debian's chromium: every control (soft leg and factor, collinear pair and
// z, the arithmetic and each identity) on a six-gluon and a five-graviton diagram, asserting what the
// panel shows — the verdict, its numbers and thresholds, the plot and the path table. Nothing is saved
// by these checks. Page and console errors fail the test (the one expected 422 aside).
import { beforeAll, describe, expect, it } from 'vitest'
import type { Page } from 'playwright-core'
import { shot, signedInBrowser } from '../helpers/browser'
import { demo, signIn } from '../helpers/api'

async function openLimits(page: Page, projectId: number, diagramId: number) {
  await page.goto(`/projects/${projectId}/diagrams/${diagramId}`)
  await page.waitForLoadState('networkidle')
  await page.waitForSelector('.vue-flow__pane')
  await page.click('[data-test=tab-limits]')
  await page.waitForSelector('[data-test=limits-panel]')
}

/** Clicks a run button and waits for the answer whose title is `title`. */
async function runAndWait(page: Page, button: string, title: string) {
  await page.click(`[data-test=${button}]`)
  await page.waitForFunction(t => document.querySelector('[data-test=limit-title]')?.textContent === t && !document.querySelector('[data-test=limits-panel] button[disabled]:not([data-test=collinear-run])'), title, { timeout: 90_000 })
}

const text = (page: Page, sel: string) => page.locator(`[data-test=${sel}]`).innerText()

describe('Limits tab', () => {
  const a = signedInBrowser(demo.owner, demo.password)
  let projectId: number
  let gluons: number
  let gravitons: number
  let version: number
  beforeAll(async () => {
    const c = await signIn(demo.owner)
    const projects = (await c.get('/api/projects')).body as { id: number, name: string }[]
    projectId = projects.find(x => x.name.startsWith('Brackenridge'))!.id
    const make = async (title: string, process: unknown) => (await c.post(`/api/projects/${projectId}/diagrams`, { title, graph: { schemaVersion: 1, nodes: [], edges: [], process } })).body as { id: number, version: number }
    const g = await make('Six gluons, alternating', { theory: 'gluon', helicities: [-1, 1, -1, 1, -1, 1] })
    gluons = g.id
    version = g.version
    gravitons = (await make('Five gravitons, three minus', { theory: 'graviton', helicities: [-2, -2, -2, 2, 2] })).id
  })

  it('gluons: a soft leg and a collinear pair with z, each with its plot, table and verdict', async () => {
    const { page, errors } = a
    await openLimits(page, projectId, gluons)
    expect(await page.locator('[data-test=soft-order]').count()).toBe(0) // gluons: leading only
    await page.selectOption('[data-test=soft-leg]', '3')
    await runAndWait(page, 'soft-run', 'soft leg 3 (leading)')
    expect(await text(page, 'limit-verdict')).toBe('holds')
    expect(await text(page, 'limit-arithmetic')).toMatch(/^fitted rate 1\.\d{3} \(expected 1; must be > 0\.75\); last \|ratio − 1\| = \d\.\de-\d+ at ε = 1\.0e-8 \(must be < 1\.0e-2\) → holds$/)
    await expect(page.locator('[data-test=limit-row]').count()).resolves.toBe(8)
    expect(await page.locator('[data-test=limit-row]').first().innerText()).toMatch(/^1e-1\s/)
    await page.waitForSelector('[data-test=limit-plot] canvas')
    await shot(page, 'limits-gluon-soft')

    await page.selectOption('[data-test=collinear-pair]', '6')
    await page.fill('[data-test=collinear-z]', '1.5')
    await page.waitForSelector('[data-test=collinear-z-error]')
    expect(await page.locator('[data-test=collinear-run]').isDisabled()).toBe(true)
    await page.fill('[data-test=collinear-z]', '0.4')
    expect(await page.locator('[data-test=collinear-z-error]').count()).toBe(0)
    await runAndWait(page, 'collinear-run', 'collinear 6 ∥ 1')
    expect(await text(page, 'limit-verdict')).toBe('holds')
    expect(await text(page, 'limit-arithmetic')).toMatch(/expected 1; must be > 0\.75\); last \|ratio − 1\| = .* at δ = 1\.0e-8 .* → holds$/)
    expect(await page.locator('[data-test=limit-table] th').first().innerText()).toBe('δ')
    await expect(page.locator('[data-test=limit-row]').count()).resolves.toBe(8)
    expect(errors).toEqual([])
  })

  it('gluons: each identity in double-double, and BCJ in exact rationals', async () => {
    const { page, errors } = a
    await openLimits(page, projectId, gluons)
    for (const [id, title] of [['kleiss-kuijf', 'Kleiss–Kuijf'], ['bcj', 'BCJ'], ['u1-decoupling', 'photon decoupling'], ['reflection', 'reflection'], ['cyclicity', 'cyclicity']]) {
      await runAndWait(page, `identity-${id}`, title!)
      expect(await text(page, 'limit-verdict')).toBe('holds')
      expect(await text(page, 'identity-tolerance')).toBe('1.000e-12')
      const residual = Number(await text(page, 'identity-residual'))
      expect(residual).toBeLessThanOrEqual(1e-12)
      expect(await text(page, 'limit-arithmetic')).toMatch(/^residual \|Σ\| \/ max \|term\| = .* \(must be ≤ tolerance 1\.0e-12\) → holds$/)
    }
    await shot(page, 'limits-gluon-identity')
    await page.selectOption('[data-test=identity-arithmetic]', 'exact')
    await page.click('[data-test=identity-cyclicity]') // leave BCJ's title for the wait below
    await page.waitForFunction(() => document.querySelector('[data-test=limit-title]')?.textContent === 'cyclicity' && document.querySelector('[data-test=identity-tolerance]')?.textContent === 'exactly 0')
    await runAndWait(page, 'identity-bcj', 'BCJ')
    expect(await text(page, 'identity-tolerance')).toBe('exactly 0')
    expect(await text(page, 'limit-arithmetic')).toBe('Σ = 0 + 0i in exact rationals (must be exactly 0) → holds')
    expect(errors).toEqual([])
  })

  it('gravitons: the subleading factor falls like ε², the leading one like ε; a vanishing A_{n−1} is said', async () => {
    const { page, errors } = a
    await openLimits(page, projectId, gravitons)
    expect(await page.locator('[data-test=collinear-run]').count()).toBe(0)
    expect(await page.locator('[data-test=identity-bcj]').count()).toBe(0)
    await page.selectOption('[data-test=soft-leg]', '1')
    await page.selectOption('[data-test=soft-order]', 'subleading')
    await runAndWait(page, 'soft-run', 'soft leg 1 (subleading)')
    expect(await text(page, 'limit-verdict')).toBe('holds')
    expect(await text(page, 'limit-arithmetic')).toMatch(/^fitted rate (1\.9|2\.0)\d\d \(expected 2; must be > 1\.75\)/)
    expect(await page.locator('[data-test=limit-result]').innerText()).toMatch(/Cachazo & Strominger, arXiv:1404\.4091/)
    await shot(page, 'limits-graviton-subleading')
    await page.selectOption('[data-test=soft-order]', 'leading')
    await runAndWait(page, 'soft-run', 'soft leg 1 (leading)')
    expect(await text(page, 'limit-arithmetic')).toMatch(/^fitted rate (0\.9|1\.0)\d\d \(expected 1; must be > 0\.75\)/)
    // Leg 4 is a plus graviton: A_4 of three minus gravitons vanishes, and the panel says so.
    await page.selectOption('[data-test=soft-leg]', '4')
    await page.click('[data-test=soft-run]')
    await page.waitForSelector('[data-test=limit-error]')
    expect(await text(page, 'limit-error')).toMatch(/^helicities: A_4 with helicities \[-2, -2, -2, 2\] vanishes identically/)
    expect(await page.locator('[data-test=limit-result]').count()).toBe(0)
    expect(errors.filter(e => !/status of 422/.test(e))).toEqual([])
  })

  it('running checks saves nothing', async () => {
    const c = await signIn(demo.owner)
    expect((await c.get(`/api/diagrams/${gluons}`)).body.version).toBe(version)
    expect((await c.get(`/api/diagrams/${gluons}/checks`)).body).toEqual([])
  })
})
