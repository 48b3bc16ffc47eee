// Debian's chromium driven by playwright-core (no browser download). Screenshots go to tests/screenshots.
import { afterAll, beforeAll, beforeEach } from 'vitest'
import { chromium, type BrowserContext, type Page } from 'playwright-core'
import { mkdirSync, mkdtempSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join, resolve } from 'node:path'
import { baseURL, demo, signIn } from './api'

export const screenshotDir = resolve(import.meta.dirname, '../screenshots')

const flags = [
  '--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run',
  '--disable-background-networking', '--disable-component-update', '--disable-sync',
  '--disable-domain-reliability', '--no-pings', '--host-resolver-rules=MAP * ~NOTFOUND, EXCLUDE 127.0.0.1',
]

export interface BrowserSession { context: BrowserContext, page: Page, errors: string[], close: () => Promise<void> }

/** A fresh browser profile; console errors and page errors are collected for assertions. */
export async function openBrowser(): Promise<BrowserSession> {
  const context = await chromium.launchPersistentContext(mkdtempSync(join(tmpdir(), 'pw-chromium-')), {
    executablePath: process.env.CHROMIUM_PATH || '/usr/bin/chromium',
    args: flags,
    viewport: { width: 1440, height: 900 },
    baseURL: baseURL(),
  })
  const page = context.pages()[0] ?? await context.newPage()
  const errors: string[] = []
  page.on('console', (msg) => { if (msg.type() === 'error' || (msg.type() === 'warning' && /hydrat/i.test(msg.text()))) errors.push(msg.text()) })
  page.on('pageerror', e => errors.push(e.message))
  return { context, page, errors, close: () => context.close() }
}

export async function shot(page: Page, name: string) {
  mkdirSync(screenshotDir, { recursive: true })
  await page.screenshot({ path: join(screenshotDir, `${name}.png`), fullPage: false })
}

export async function signInBrowser(page: Page, email: string, password: string) {
  await page.goto('/login')
  await page.waitForLoadState('networkidle')
  await page.fill('input[name=email]', email)
  await page.fill('input[name=password]', password)
  await Promise.all([page.waitForURL(/\/projects/), page.click('button[type=submit]')])
}

/**
 * One signed-in browser for the enclosing describe block: opened before its tests, closed after,
 * collected errors cleared before each test. The returned object is filled in by the hook.
 */
export function signedInBrowser(email: string, password: string): BrowserSession {
  const session = {} as BrowserSession
  beforeAll(async () => {
    Object.assign(session, await openBrowser())
    await signInBrowser(session.page, email, password)
  })
  afterAll(async () => {
    await session.close?.()
  })
  beforeEach(() => {
    if (session.errors) session.errors.length = 0
  })
  return session
}

export async function openEditor(page: Page, projectId: number, diagramId: number) {
  await page.goto(`/projects/${projectId}/diagrams/${diagramId}`)
  await page.waitForLoadState('networkidle')
  await page.waitForSelector('.vue-flow__pane')
}

/** Every real node's box inside the canvas's box: the ids of those that are not. */
export async function nodesOutside(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    const c = document.querySelector('[data-test=canvas]')!.getBoundingClientRect()
    const out: string[] = []
    for (const n of document.querySelectorAll('.vue-flow__node:not(.vue-flow__node-termframe)')) {
      const b = n.getBoundingClientRect()
      if (b.left < c.left - 1 || b.top < c.top - 1 || b.right > c.right + 1 || b.bottom > c.bottom + 1) out.push(n.getAttribute('data-id') ?? '?')
    }
    return out
  })
}

/** The demo owner's project (Brackenridge…) and its diagrams, read through the API. */
export async function demoProject(): Promise<{ id: number, diagrams: { id: number, title: string }[] }> {
  const c = await signIn(demo.owner)
  const projects = (await c.get('/api/projects')).body as { id: number, name: string }[]
  const p = projects.find(x => x.name.startsWith('Brackenridge'))!
  return { id: p.id, diagrams: (await c.get(`/api/projects/${p.id}/diagrams`)).body }
}

/** Creates a diagram from the project page's form, as a user does, and waits for its editor: its id. */
export async function newDiagram(page: Page, projectId: number, title: string): Promise<number> {
  await page.goto(`/projects/${projectId}`)
  await page.waitForLoadState('networkidle')
  await page.fill('input[name=diagram-title]', title)
  await Promise.all([page.waitForURL(/\/diagrams\/\d+$/), page.click('form button[type=submit]')])
  await page.waitForSelector('.vue-flow__pane')
  await page.waitForLoadState('networkidle')
  return Number(/\/diagrams\/(\d+)$/.exec(page.url())![1])
}

/** Drags from one handle to another, as a user glues two nodes. */
export async function glue(page: Page, a: { node: string, handle: string }, b: { node: string, handle: string }) {
  const h = (x: { node: string, handle: string }) => page.locator(`.vue-flow__handle[data-nodeid="${x.node}"][data-handleid="${x.handle}"]`)
  const ba = (await h(a).boundingBox())!
  const bb = (await h(b).boundingBox())!
  await page.mouse.move(ba.x + ba.width / 2, ba.y + ba.height / 2)
  await page.mouse.down()
  await page.mouse.move((ba.x + bb.x) / 2, (ba.y + bb.y) / 2, { steps: 4 })
  await page.mouse.move(bb.x + bb.width / 2, bb.y + bb.height / 2, { steps: 4 })
  await page.mouse.up()
}

/**
 * Runs a check from the editor (the header's quick button, or `evaluate` in the Check tab) and
 * waits until its results are shown and the button is free again.
 */
export async function runCheck(page: Page, button: 'evaluate-quick' | 'evaluate' = 'evaluate-quick') {
  await page.click(`[data-test=${button}]`)
  await page.waitForSelector('[data-test=results]', { timeout: 60_000 })
  await page.waitForSelector(`[data-test=${button}]:not([disabled])`, { timeout: 90_000 })
}

/** The distinct rows (rounded top edges) the visible children of an element sit in. */
export async function rowsOf(page: Page, selector: string): Promise<number> {
  return page.evaluate((sel) => {
    const el = document.querySelector(sel)!
    const tops = [...el.children].map(c => c.getBoundingClientRect()).filter(b => b.width > 0 && b.height > 0)
    // Children in one row share a vertical band: count bands by their centres.
    const centres = tops.map(b => b.top + b.height / 2).sort((x, y) => x - y)
    let rows = 0
    let last = -Infinity
    for (const c of centres) { if (c - last > 12) rows++; last = c }
    return rows
  }, selector)
}
