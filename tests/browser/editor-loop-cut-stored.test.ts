// A loop-cut diagram's stored check in Debian's chromium: the header shows no BCFW shift (a box is
// cut, not recursed); a run with a changed seed saves the drawing first, stores the check (five
// gluons −−+++, every box against the N = 4 coefficient −½ st A_tree of Bern, Dixon, Dunbar,
// Kosower, hep-ph/9403226) and lists it in the Stored tab; the drawer's CSV and JSON exports say
// what was stored; the project's list shows the kind and the latest check. A viewer's run is not
// stored. Page errors and console errors fail the test.
import { readFileSync } from 'node:fs'
import Papa from 'papaparse'
import { beforeAll, describe, expect, it } from 'vitest'
import type { Page } from 'playwright-core'
import { openEditor, shot, signedInBrowser } from '../helpers/browser'
import { demo, signIn, type Client } from '../helpers/api'
import { boxRings } from '#shared/editor/loop-cut'
import type { Graph, Process } from '#shared/schemas/graph'

const five: Process = { theory: 'gluon', helicities: [-1, -1, 1, 1, 1] }
let owner: Client
let project: { id: number }
let diagram: { id: number }
let tree: { id: number }

beforeAll(async () => {
  owner = await signIn(demo.owner)
  project = (await owner.post('/api/projects', { name: 'Loop cuts, stored checks' })).body
  expect((await owner.post(`/api/projects/${project.id}/members`, { email: demo.viewer, role: 'viewer' })).status).toBeLessThan(300)
  const graph = { schemaVersion: 1, kind: 'loop-cut', process: five, ...boxRings(five) } as Graph
  diagram = (await owner.post(`/api/projects/${project.id}/diagrams`, { title: 'Five gluons, every box', graph })).body
  tree = (await owner.post(`/api/projects/${project.id}/diagrams`, { title: 'Five gluons, tree', graph: { schemaVersion: 1, process: { ...five, shift: [1, 2] }, nodes: [], edges: [] } })).body
})

async function runLoopCheck(page: Page) {
  await page.click('[data-test=evaluate-quick]')
  await page.waitForSelector('[data-test=loop-result]', { timeout: 60_000 })
  await page.waitForSelector('[data-test=evaluate-quick]:not([disabled])', { timeout: 90_000 })
}
async function downloaded(page: Page, button: string): Promise<{ name: string, text: string }> {
  const [d] = await Promise.all([page.waitForEvent('download'), page.click(button)])
  return { name: d.suggestedFilename(), text: readFileSync((await d.path())!, 'utf8') }
}
const squash = (s: string | null) => (s ?? '').replace(/\s+/g, ' ').trim()

describe('a loop-cut diagram\'s stored check', () => {
  const a = signedInBrowser(demo.owner, demo.password)

  it('no shift in the header; the check is saved first and stored; both exports match it; the list shows kind and latest check', async () => {
    const { page, errors } = a
    await openEditor(page, project.id, diagram.id)
    expect(await page.locator('[data-test=loop-bar]').count()).toBe(1)
    const header = page.locator('[data-test=process-header]')
    for (const t of ['shift-button', 'pick-shift', 'shift-controls', 'expand', 'expand-full']) expect(await header.locator(`[data-test=${t}]`).count(), t).toBe(0)
    expect(await header.textContent()).not.toMatch(/Shift|Pick/)
    expect(await header.locator('[data-test=helicity-chips] button').allTextContents()).toEqual(['1−', '2−', '3+', '4+', '5+'])
    expect(await header.locator('[data-test=loop-process-note]').textContent()).toBe('colour order 1…n · no shift in a box')
    expect(await page.locator('[data-test=version]').textContent()).toBe('v1')
    // a new seed is an unsaved change: the run saves the drawing, then stores its check
    await page.fill('input[name=loop-seed]', '4')
    await page.locator('input[name=loop-seed]').press('Tab')
    await expect.poll(() => page.locator('[data-test=save-state]').textContent()).toContain('unsaved')
    await runLoopCheck(page)
    expect(await page.locator('[data-test=loop-result] [data-test=loop-verdict]').textContent()).toBe('agrees')
    await expect.poll(() => page.locator('[data-test=save-state]').textContent()).toBe('saved')
    expect(await page.locator('[data-test=version]').textContent()).toBe('v2')
    const storedText = (await page.locator('[data-test=loop-result] [data-test=stored-as]').textContent())!
    const checkId = Number(/stored as check #(\d+)/.exec(storedText)![1])
    const stored = (await owner.get(`/api/checks/${checkId}`)).body
    expect(stored).toMatchObject({ diagramId: diagram.id, diagramVersion: 2, verdict: 'agrees', seed: 4, createdByName: expect.any(String), result: { kind: 'loop-cut', verdict: 'agrees' } })
    await expect.poll(() => page.locator('[data-test=loop-box]').count()).toBe(5)
    await shot(page, 'loop-cut-stored-check')

    // the CSV: provenance, one box row per box with the stored value, tolerance and verdict
    const csv = await downloaded(page, '[data-test=loop-result] [data-test=loop-export-csv]')
    expect(csv.name).toBe('five-gluons-every-box-boxes.csv')
    const tol = String(stored.result.tolerance)
    const [meta, head, ...lines] = csv.text.trimEnd().split('\n')
    expect(meta!.startsWith(`# loop-cut check of the drawn rings, helicities (-1 -1 1 1 1), float arithmetic (agrees when the relative deviation is <= ${tol}), tree `)).toBe(true)
    expect(meta!.endsWith('verdict agrees')).toBe(true)
    expect(head).toBe('row,box,ring,corners,kind,lines,solution,helicities,value_re,value_im,target_re,target_im,deviation,tolerance,verdict,target_rule,note')
    const parsed = Papa.parse<string[]>(lines.join('\n'))
    expect(parsed.errors).toEqual([])
    const rows = parsed.data
    const boxes = rows.filter(r => r[0] === 'box')
    expect(boxes).toHaveLength(5)
    boxes.forEach((b, i) => {
      const s = stored.result.boxes[i]
      expect(b.slice(0, 5)).toEqual(['box', String(s.box), String(s.rings[0]), s.corners.map((c: number[]) => `{${c.join(' ')}}`).join(' '), 'one-mass'])
      expect(b.slice(8, 12)).toEqual([String(s.value[0]), String(s.value[1]), String(s.target[0]), String(s.target[1])])
      expect(b.slice(12, 16)).toEqual([String(s.deviation), tol, 'agrees', '−½ st A_tree'])
    })
    const terms = rows.filter(r => r[0] === 'term')
    expect(terms.length).toBe(stored.result.rings.reduce((k: number, r: { terms: unknown[] }) => k + r.terms.length, 0))
    for (const t of terms) expect(t[5]).toBe('(open open open open)')
    expect(rows.find(r => r[0] === 'sum')!.slice(12, 15)).toEqual([String(stored.result.deviation), tol, 'agrees'])
    // the JSON: the stored result, and what it was run with
    const json = await downloaded(page, '[data-test=loop-result] [data-test=loop-export-json]')
    expect(json.name).toBe('five-gluons-every-box-boxes.json')
    const doc = JSON.parse(json.text)
    expect(doc).toMatchObject({ format: 'polewright-loop-cut-check', formatVersion: 1, request: { diagram: { id: diagram.id }, check: checkId, arithmetic: 'float', corners: 'closed', kinematics: { kind: 'random', seed: 4 } } })
    expect(doc.result).toEqual(stored.result)

    // the header's Export menu offers the box table, not the tree's term table; the same file
    await page.click('[data-test=export]')
    const menu = page.locator('[data-test=export] + div')
    expect(await menu.locator('button').allTextContents()).toEqual(['Diagram (JSON)', 'Canvas as PNG', 'Canvas as SVG', 'Box table (CSV)', 'Box table (JSON)', 'Import a diagram (JSON)…'])
    await shot(page, 'loop-cut-export-menu')
    const fromMenu = await downloaded(page, '[data-test=export] + div button:has-text("Box table (CSV)")')
    expect(fromMenu).toEqual(csv)

    // the Stored tab lists it; opening it shows it in the drawer
    await page.click('[data-test=tab-checks]')
    const item = page.locator(`[data-test=check-${checkId}]`)
    await item.waitFor()
    expect(squash(await item.textContent())).toMatch(new RegExp(`^agrees #${checkId} · v2 · random 4 · float · loop cut, 5 boxes · dev \\S+ .+, `))
    await item.click()
    await expect.poll(() => page.locator('[data-test=notice]').textContent()).toContain(`Showing stored check #${checkId} (diagram v2)`)
    expect(await page.locator('[data-test=loop-result] [data-test=stored-as]').textContent()).toBe(`stored as check #${checkId}`)

    // the project's list: kind labels, the loop cut's latest check
    await page.goto(`/projects/${project.id}`)
    await page.waitForLoadState('networkidle')
    const row = page.locator(`[data-test=diagram-list] tr[data-diagram="${diagram.id}"]`)
    expect(await row.locator('[data-test=diagram-kind]').textContent()).toBe('loop cut')
    expect(await row.locator('td').nth(0).textContent()).toContain('gluon −−+++ · boxes')
    expect(await row.locator('td').nth(2).textContent()).toContain('agrees')
    const treeRow = page.locator(`[data-test=diagram-list] tr[data-diagram="${tree.id}"]`)
    expect(await treeRow.locator('[data-test=diagram-kind]').textContent()).toBe('tree')
    expect(await treeRow.locator('td').nth(2).textContent()).toContain('never checked')
    await shot(page, 'loop-cut-project-list')
    await page.selectOption('select[name=diagram-kind-filter]', 'loop-cut')
    await expect.poll(() => page.locator('[data-test=diagram-list] tr[data-diagram]').count()).toBe(1)
    expect(await page.locator('[data-test=diagram-list] tr[data-diagram]').getAttribute('data-diagram')).toBe(String(diagram.id))
    await page.selectOption('select[name=diagram-kind-filter]', 'tree')
    await expect.poll(() => page.locator('[data-test=diagram-list] tr[data-diagram]').getAttribute('data-diagram')).toBe(String(tree.id))

    // the project's checks: a loop cut has no shift; its result is the sum over the boxes
    await page.goto(`/projects/${project.id}/checks`)
    await page.waitForLoadState('networkidle')
    const check = page.locator(`[data-test=checks-table] tr[data-check="${checkId}"]`)
    const cellsOf = async () => (await check.locator('td').allTextContents()).map(squash)
    // the diagram cell: its title, then its version (set apart by a margin, not a space)
    expect((await cellsOf()).slice(1, 9)).toEqual([expect.stringMatching(/^Five gluons, every box ?v2$/), 'gluon −−+++', 'loop cut', 'N = 4 box coefficients', 'float', '1 · seed 4', 'agrees', expect.stringMatching(/^\d\.\de−\d+$/)])
    await check.locator('[data-test=open-result]').click()
    const shown = (w: [number, number]) => w.map(x => Number(x).toPrecision(8))
    const dd = page.locator('[data-test=check-detail] dd')
    await expect.poll(() => dd.count()).toBe(4)
    expect(await dd.nth(0).textContent()).toBe(`${shown(stored.result.sum)[0]} + ${shown(stored.result.sum)[1]} i`)
    expect(await dd.nth(1).textContent()).toBe(`${shown(stored.result.targetSum)[0]} + ${shown(stored.result.targetSum)[1]} i`)
    await shot(page, 'loop-cut-project-checks')
    expect(errors).toEqual([])
  })
})

describe('a viewer on a loop-cut diagram', () => {
  const v = signedInBrowser(demo.viewer, demo.password)

  it('checks the drawing without storing it', async () => {
    const { page, errors } = v
    const before = ((await owner.get(`/api/diagrams/${diagram.id}/checks`)).body as unknown[]).length
    await openEditor(page, project.id, diagram.id)
    expect(await page.locator('[data-test=read-only]').count()).toBe(1)
    expect(await page.locator('[data-test=generate-boxes]').count()).toBe(0)
    expect(await page.locator('[data-test=process-header] [data-test=shift-button]').count()).toBe(0)
    await runLoopCheck(page)
    expect(await page.locator('[data-test=loop-result] [data-test=loop-verdict]').textContent()).toBe('agrees')
    expect(await page.locator('[data-test=loop-result] [data-test=not-stored]').textContent()).toContain('not stored')
    expect(await page.locator('[data-test=loop-result] [data-test=stored-as]').count()).toBe(0)
    expect(((await owner.get(`/api/diagrams/${diagram.id}/checks`)).body as unknown[]).length).toBe(before)
    // the exports work for a viewer too
    const csv = await downloaded(page, '[data-test=loop-result] [data-test=loop-export-csv]')
    expect(csv.text.split('\n').filter(l => l.startsWith('box,'))).toHaveLength(5)
    await shot(page, 'loop-cut-viewer-check')
    expect(errors).toEqual([])
  })
})
