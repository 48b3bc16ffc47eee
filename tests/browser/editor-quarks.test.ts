// Quarks in the editor, in Debian's chromium: theory qcd, a species select beside each helicity
// chip (±½ for quarks), problems said in words beside the header (a quark without its antiquark,
// a shift the falloff table forbids), Expand fully draws quark legs and Lines with a fermion-flow
// arrow marker, the check of the drawing agrees, species survive save and reload, and a species
// change is undone. Page errors and console errors fail the test.
import { beforeAll, describe, expect, it } from 'vitest'
import { openEditor, nodesOutside, rowsOf, shot, signedInBrowser } from '../helpers/browser'
import { demo, signIn } from '../helpers/api'

let project: number
beforeAll(async () => {
  const c = await signIn(demo.owner)
  const projects = (await c.get('/api/projects')).body as { id: number, name: string }[]
  project = projects.find(x => x.name.startsWith('Brackenridge'))!.id
})

describe('quark legs and lines in the editor', () => {
  const a = signedInBrowser(demo.owner, demo.password)

  it('q̄⁻ q⁺ g⁻ g⁺: species in the header, arrows on quark lines, agrees, kept on reload, undone', async () => {
    const { page, errors } = a
    await page.setViewportSize({ width: 1440, height: 900 })
    await page.goto(`/projects/${project}`)
    await page.waitForLoadState('networkidle')
    await page.fill('input[name=diagram-title]', 'Quark line by the header')
    await Promise.all([page.waitForURL(/\/diagrams\/\d+$/), page.click('form button[type=submit]')])
    await page.waitForSelector('.vue-flow__pane')
    await page.waitForLoadState('networkidle')
    const diagram = Number(/\/diagrams\/(\d+)$/.exec(page.url())![1])
    await page.click('[data-test=process-start]')
    await page.selectOption('select[name=theory]', 'qcd')
    await expect.poll(() => page.locator('[data-test^=species-]').count()).toBe(4)
    // A quark alone is said in words.
    await page.selectOption('[data-test=species-1]', 'qbar1')
    await expect.poll(() => page.locator('[data-test=species-problem]').textContent()).toContain('leg 1: qbar1 has no partner q1')
    await page.selectOption('[data-test=species-2]', 'q1')
    await expect.poll(() => page.locator('[data-test=hel-1]').textContent()).toBe('1−½')
    // Helicities q̄⁻ q⁺ g⁻ g⁺.
    await page.click('[data-test=hel-2]')
    await page.click('[data-test=hel-3]')
    await expect.poll(() => page.locator('[data-test=hel-2]').textContent()).toBe('2+½')
    await expect.poll(() => page.locator('[data-test=hel-3]').textContent()).toBe('3−')
    // [1,2⟩ on q̄⁻ q⁺ has a boundary term by the table.
    await expect.poll(() => page.locator('[data-test=species-problem]').textContent()).toContain('[1,2⟩ is not valid')
    await page.click('[data-test=shift-button]')
    await page.click('[data-test=shift-3-1]')
    await expect.poll(() => page.locator('[data-test=species-problem]').count()).toBe(0)
    await page.click('[data-test=expand-full]')
    await expect.poll(() => page.locator('.vue-flow__node-leg').count(), { timeout: 30_000 }).toBe(8)
    // Quark legs (two per term) and the exchanged quark Line carry the arrow marker.
    const arrows = page.locator('.vue-flow__edge [data-test=fermion-arrow]')
    await expect.poll(() => arrows.count()).toBe(5)
    for (const m of await arrows.evaluateAll(els => els.map(e => e.getAttribute('marker-mid')))) expect(m).toBe('url(#pw-fermion-flow)')
    expect(await page.locator('#pw-fermion-flow').count()).toBe(1)
    // The species tag on the quark legs; the fermion colour on their strokes.
    await expect.poll(() => page.locator('[data-test=leg-species-1]').first().textContent()).toBe('q̄₁')
    const badges = await page.locator('[data-test=line-badge]').allTextContents()
    expect(badges.some(b => b.includes('1/2'))).toBe(true)
    expect(await nodesOutside(page)).toEqual([])
    await page.click('[data-test=tab-check]')
    await page.click('[data-test=evaluate]')
    await page.waitForSelector('[data-test=results]', { timeout: 60_000 })
    await page.waitForSelector('[data-test=evaluate]:not([disabled])', { timeout: 90_000 })
    await expect.poll(() => page.locator('[data-test=results] [data-test=verdict]').first().textContent()).toBe('agrees')
    await shot(page, 'editor-quarks-agrees')
    await page.click('[data-test=save]')
    await expect.poll(() => page.locator('[data-test=save-state]').textContent()).not.toContain('unsaved')
    // What was saved: the species of the process and of the drawn legs and Lines.
    const c = await signIn(demo.owner)
    const saved = (await c.get(`/api/diagrams/${diagram}`)).body as { graph: { process: { species: string[] }, edges: { data?: { species?: string } }[] } }
    expect(saved.graph.process.species).toEqual(['qbar1', 'q1', 'g', 'g'])
    expect(saved.graph.edges.some(e => e.data?.species)).toBe(true)
    await page.reload()
    await openEditor(page, project, diagram)
    expect(await page.locator('[data-test=species-1]').inputValue()).toBe('qbar1')
    expect(await page.locator('[data-test=species-2]').inputValue()).toBe('q1')
    await expect.poll(() => page.locator('.vue-flow__edge [data-test=fermion-arrow]').count()).toBe(5)
    // A species change, then undo.
    await page.selectOption('[data-test=species-4]', 'q2')
    await expect.poll(() => page.locator('[data-test=species-problem]').textContent()).toContain('q2 has no partner qbar2')
    await expect.poll(() => page.locator('[data-test=hel-4]').textContent()).toBe('4+½')
    await page.click('[data-test=undo]')
    await expect.poll(() => page.locator('[data-test=species-4]').inputValue()).toBe('g')
    await expect.poll(() => page.locator('[data-test=hel-4]').textContent()).toBe('4+')
    await expect.poll(() => page.locator('[data-test=species-problem]').count()).toBe(0)
    expect(errors).toEqual([])
  })

  it('the demo quark diagram opens with its quark lines drawn', async () => {
    const { page, errors } = a
    const c = await signIn(demo.owner)
    const diagrams = (await c.get(`/api/projects/${project}/diagrams`)).body as { id: number, title: string }[]
    const d = diagrams.find(x => x.title.startsWith('A quark line'))!
    await openEditor(page, project, d.id)
    await expect.poll(() => page.locator('.vue-flow__edge [data-test=fermion-arrow]').count()).toBeGreaterThan(0)
    await shot(page, 'editor-quarks-demo')
    // the header with a species select beside each chip stays one row at both laptop widths
    for (const [width, height] of [[1440, 900], [1280, 720]] as const) {
      await page.setViewportSize({ width, height })
      await expect.poll(() => rowsOf(page, '[data-test=process-header]')).toBe(1)
    }
    expect(errors).toEqual([])
  })
})
