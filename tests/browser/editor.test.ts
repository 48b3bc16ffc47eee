// The diagram editor in Debian's chromium: the demo loop (expand, evaluate, agrees), a recursion
// assembled by hand, a save conflict that loses nothing, exports, and the empty and read-only views.
import { beforeAll, describe, expect, it } from 'vitest'
import { readFileSync } from 'node:fs'
import { demoProject, glue, newDiagram, openEditor, runCheck, shot, signedInBrowser } from '../helpers/browser'
import { demo, signIn } from '../helpers/api'

describe('diagram editor', () => {
  const a = signedInBrowser(demo.owner, demo.password)
  let project: Awaited<ReturnType<typeof demoProject>>
  beforeAll(async () => {
    project = await demoProject()
  })

  it('a new, empty diagram opens on the Vue Flow pane with a hint, and logs no error', async () => {
    const { page, errors } = a
    await newDiagram(page, project.id, 'Scratch: empty canvas')
    await expect.poll(() => page.locator('[data-test=empty-hint]').textContent()).toContain('empty canvas')
    expect(await page.locator('.vue-flow__node').count()).toBe(0)
    await page.keyboard.press('?')
    await expect.poll(() => page.locator('[data-test=help-overlay]').textContent()).toContain('undo')
    await shot(page, 'editor-empty-help')
    await page.keyboard.press('Escape')
    await page.reload()
    await page.waitForSelector('.vue-flow__pane')
    await page.waitForLoadState('networkidle')
    await shot(page, 'editor-empty')
    expect(errors).toEqual([])
  })

  it('opens the six-gluon demo, expands, evaluates and agrees; hovering a term lights up its part of the canvas', async () => {
    const { page, errors } = a
    const d = project.diagrams.find(x => x.title.startsWith('Six gluons'))!
    await openEditor(page, project.id, d.id)
    await page.click('[data-test=expand]')
    // The three channel terms of [1,2⟩, each with its six legs and its two sides.
    await expect.poll(() => page.locator('.vue-flow__node:not(.vue-flow__node-termframe)').count()).toBe(3 * (6 + 2))
    await runCheck(page)
    await expect.poll(() => page.locator('[data-test=results] [data-test=verdict]').first().textContent()).toBe('agrees')
    expect(await page.locator('[data-test=term-table] tbody tr').count()).toBe(3)
    await page.hover('[data-test=term-0]')
    await expect.poll(() => page.locator('.pw-highlight, .pw-highlight-box, .ring-accent\\/40').count()).toBeGreaterThan(0)
    await expect.poll(() => page.locator('[data-test=term-formula] .katex').count()).toBe(1)
    await expect.poll(() => page.locator('[data-test=falloff-plot] canvas').count(), { timeout: 30_000 }).toBe(1)
    await expect.poll(() => page.locator('[data-test=cross-shift]').textContent()).toContain('valid shifts agree')
    await shot(page, 'editor-six-gluon-agrees')
    // The run of the saved process is stored as a Check and listed beside the diagram.
    expect(await page.locator('[data-test=stored-as]').textContent()).toMatch(/stored as check #\d+/)
    await page.click('[data-test=tab-checks]')
    // The list is fetched when the tab opens; on a loaded CI machine that can take longer than a second.
    await expect.poll(() => page.locator('[data-test=checks] li').count(), { timeout: 15_000 }).toBeGreaterThan(0)
    await expect.poll(() => page.locator('[data-test=checks] li').first().textContent(), { timeout: 15_000 }).toContain('agrees')
    await page.click('[data-test=tab-revisions]')
    await expect.poll(() => page.locator('[data-test=revisions] li').count()).toBeGreaterThan(0)
    await page.click('[data-test=tab-comments]')
    await page.waitForLoadState('networkidle')
    await page.click('[data-test=tab-check]')
    await expect.poll(() => page.locator('[data-test=kinematics]').count()).toBe(1)
    await page.click('[data-test=tab-inspect]')
    // Fully expanded: only three-point vertices remain.
    await page.click('[data-test=expand-full]')
    await expect.poll(() => page.locator('[data-test=block]').count()).toBe(0)
    await page.keyboard.press('f')
    await shot(page, 'editor-six-gluon-full')
    expect(errors).toEqual([])
  })

  it('builds a four-gluon recursion from two vertices by hand, says what is wrong on the way, and evaluates it', async () => {
    const { page, errors } = a
    await newDiagram(page, project.id, 'Four gluons by hand')
    for (const t of ['angle', 'square', 'leg', 'leg', 'leg', 'leg']) await page.click(`[data-test=palette-${t}]`)
    await page.click('[data-test=tidy]')
    await page.click('[data-test=fit]')
    const id = async (sel: string) => (await page.locator(sel).first().getAttribute('data-id'))!
    const angle = await id('.vue-flow__node-angle')
    const square = await id('.vue-flow__node-square')
    const leg = async (l: number) => (await page.locator(`.vue-flow__node-leg:has([data-label="${l}"])`).getAttribute('data-id'))!
    const [l1, l2, l3, l4] = [await leg(1), await leg(2), await leg(3), await leg(4)]
    // The editor checks as you go: an unglued vertex says so on itself.
    await expect.poll(() => page.locator(`.vue-flow__node[data-id="${angle}"] [data-test=node-issues]`).textContent()).toContain('0 of 3 slots connected')
    await glue(page, { node: l1, handle: 'p' }, { node: angle, handle: 'h0' })
    await glue(page, { node: l4, handle: 'p' }, { node: angle, handle: 'h1' })
    await glue(page, { node: l2, handle: 'p' }, { node: square, handle: 'h0' })
    await glue(page, { node: l3, handle: 'p' }, { node: square, handle: 'h1' })
    await glue(page, { node: angle, handle: 'h2' }, { node: square, handle: 'h2' })
    await expect.poll(() => page.locator('.vue-flow__edge').count()).toBe(5)
    await page.click('[data-test=tidy]')
    await page.click('[data-test=fit]')
    await expect.poll(() => page.locator('[data-test=node-issues]').count()).toBe(0)
    // A wrong shape is named on the node: flip the line, and both vertices complain.
    await page.click('[data-test=line-badge]')
    await expect.poll(() => page.locator(`.vue-flow__node[data-id="${angle}"] [data-test=node-issues]`).textContent()).toContain('this is a square vertex, not an angle vertex')
    await shot(page, 'editor-hand-built-wrong')
    await page.keyboard.press('Control+z')
    await expect.poll(() => page.locator('[data-test=node-issues]').count()).toBe(0)
    // The shift: click leg 1, then leg 2.
    await page.click('[data-test=pick-shift]')
    await page.locator(`.vue-flow__node[data-id="${l1}"] [data-test=leg-1]`).click()
    await page.locator(`.vue-flow__node[data-id="${l2}"] [data-test=leg-2]`).click()
    await expect.poll(() => page.locator('[data-test=shift-button]').textContent()).toContain('[1,2⟩')
    await expect.poll(() => page.locator('[data-test=z-halo]').count()).toBe(2)
    await runCheck(page)
    await expect.poll(() => page.locator('[data-test=results] [data-test=verdict]').first().textContent()).toBe('agrees')
    expect(await page.locator('[data-test=term-0]').textContent()).toContain('1 term')
    await shot(page, 'editor-hand-built-agrees')
    expect(errors).toEqual([])
  })

  it('a save that meets a newer version keeps the work: 409, then kept as a new revision', async () => {
    const { page, errors } = a
    const d = project.diagrams.find(x => x.title.startsWith('Four gravitons'))!
    await openEditor(page, project.id, d.id)
    const before = (await (await signIn(demo.editor)).get(`/api/diagrams/${d.id}`)).body
    // My change: a new vertex, and a new title.
    const drawn = await page.locator('.vue-flow__node-square').count()
    await page.click('[data-test=palette-square]')
    await page.fill('input[name=diagram-title]', 'Four gravitons: consistency test (mine)')
    await page.locator('input[name=diagram-title]').press('Tab')
    // Someone else saves in between.
    const other = await signIn(demo.editor)
    const theirs = await other.put(`/api/diagrams/${d.id}`, { title: 'Four gravitons: their title', graph: before.graph, version: before.version })
    expect(theirs.status).toBe(200)
    await page.click('[data-test=save]')
    await expect.poll(() => page.locator('[data-test=conflict]').textContent()).toContain('Someone saved this diagram in between')
    await shot(page, 'editor-conflict')
    // Nothing lost while deciding: the canvas still holds my vertex, and a draft is kept.
    const squares = await page.locator('.vue-flow__node-square').count()
    expect(squares).toBe(drawn + 1)
    expect(await page.evaluate(id => localStorage.getItem(`polewright:draft:${id}`) !== null, d.id)).toBe(true)
    await page.click('[data-test=keep-mine]')
    await expect.poll(() => page.locator('[data-test=version]').textContent()).toBe(`v${before.version + 2}`)
    const now = (await other.get(`/api/diagrams/${d.id}`)).body
    expect(now.title).toBe('Four gravitons: consistency test (mine)')
    expect(now.graph.nodes.filter((n: { type: string }) => n.type === 'square').length).toBe(squares)
    const revs = (await other.get(`/api/diagrams/${d.id}/revisions`)).body as { version: number, title: string }[]
    expect(revs.find(r => r.version === before.version + 1)?.title).toBe('Four gravitons: their title')
    // The browser itself logs the refused PUT; nothing else may appear.
    expect(errors.filter(e => !/status of 409 \(Conflict\)/.test(e))).toEqual([])
  })

  it('exports the canvas as PNG and SVG, and the diagram as re-importable JSON', async () => {
    const { page, errors } = a
    const d = project.diagrams.find(x => x.title.startsWith('Five gluons'))!
    await openEditor(page, project.id, d.id)
    await page.click('[data-test=export]')
    const [png] = await Promise.all([page.waitForEvent('download'), page.click('[data-test=export-png]')])
    const bytes = readFileSync((await png.path())!)
    expect(bytes.subarray(1, 4).toString()).toBe('PNG')
    expect(bytes.length).toBeGreaterThan(5000)
    await png.saveAs(`${import.meta.dirname}/../screenshots/editor-export.png`)
    await page.click('[data-test=export]')
    const [svg] = await Promise.all([page.waitForEvent('download'), page.click('[data-test=export-svg]')])
    const svgText = readFileSync((await svg.path())!, 'utf8')
    expect(svgText).toMatch(/^<svg xmlns="http:\/\/www.w3.org\/2000\/svg"/)
    expect((svgText.match(/<polygon/g) ?? []).length).toBeGreaterThan(0)
    await page.click('[data-test=export]')
    const [json] = await Promise.all([page.waitForEvent('download'), page.click('[data-test=export-json]')])
    const file = (await json.path())!
    const body = JSON.parse(readFileSync(file, 'utf8'))
    // The file holds every node on the canvas (term frames are drawn, not stored).
    expect(body.graph.nodes).toHaveLength(await page.locator('.vue-flow__node:not(.vue-flow__node-termframe)').count())
    // Re-import into the empty scratch diagram: the same nodes appear there.
    const count = await page.locator('.vue-flow__node').count()
    const scratch = (await demoProject()).diagrams.find(x => x.title === 'Scratch: empty canvas')!
    await openEditor(page, project.id, scratch.id)
    expect(await page.locator('.vue-flow__node').count()).toBe(0)
    await page.setInputFiles('[data-test=import-file]', file)
    await expect.poll(() => page.locator('.vue-flow__node').count()).toBe(count)
    await expect.poll(() => page.locator('[data-test=save-state]').textContent()).toContain('unsaved')
    expect(errors).toEqual([])
  })

  describe('as a viewer', () => {
    const b = signedInBrowser(demo.viewer, demo.password)

    it('a viewer gets a read-only editor, told why, with no save', async () => {
      const d = project.diagrams.find(x => x.title.startsWith('Bad shift'))!
      await openEditor(b.page, project.id, d.id)
      await expect.poll(() => b.page.locator('[data-test=read-only]').textContent()).toContain('viewer')
      expect(await b.page.locator('[data-test=save]').count()).toBe(0)
      await runCheck(b.page)
      await expect.poll(() => b.page.locator('[data-test=results] [data-test=verdict]').first().textContent()).toBe('boundary term suspected')
      await shot(b.page, 'editor-viewer-bad-shift')
      expect(b.errors).toEqual([])
    })
  })
})
