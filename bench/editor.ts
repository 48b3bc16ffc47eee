// Editor figures: `node bench/run.mjs editor` after a build
// (POLEWRIGHT_BENCH_OUTPUT picks another build folder).
//   1. Expand + layout of an 8-gluon NMHV recursion fully to three-point vertices: the pure
//      functions in node, and end to end in chromium (click → every node rendered), cold (term tree
//      from the server) and warm (tree in memory).
//   2. Panning a canvas of 300+ nodes by mouse drag in chromium: frame rate and frame-time p95.
import { readFileSync, writeFileSync } from 'node:fs'
import { createRequire } from 'node:module'
import { join } from 'node:path'
import { evaluate } from '#shared/physics/index'
import { expandAllSpecs, specsToGraph, topSpecs, STRUCTURE_SEED } from '#shared/editor/expand'
import { evaluateRequest, toLabels } from '#shared/editor/process'
import { layoutGraph } from '#shared/editor/layout'
import { expandedGraph } from '#shared/editor/demo'
import type { Process } from '#shared/schemas/graph'
import { startBuiltServer } from './server'

const require = createRequire(join(process.cwd(), 'package.json'))
const { chromium } = require('playwright-core') as typeof import('playwright-core')

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!
const pct = (xs: number[], p: number) => [...xs].sort((a, b) => a - b)[Math.min(xs.length - 1, Math.floor(p * xs.length))]!
const aims: string[] = []
const NMHV8: Process = { theory: 'gluon', helicities: [-1, -1, -1, 1, 1, 1, 1, 1], shift: [1, 2] }

// ---- 1a. the pure functions ----
{
  const times: number[] = []
  let nodes = 0
  for (let k = 0; k < 7; k++) {
    const t0 = performance.now()
    const res = toLabels(evaluate(evaluateRequest(NMHV8, { kinematics: { kind: 'random', seed: STRUCTURE_SEED }, target: 'none', tree: true })), NMHV8)
    const t1 = performance.now()
    const specs = expandAllSpecs(res.terms, topSpecs(res.terms))
    const g = specsToGraph(res.terms, specs)
    const laid = layoutGraph(g.nodes, g.edges)
    const t2 = performance.now()
    nodes = laid.length
    if (k > 1) times.push(t2 - t1, t1 - t0)
  }
  const expandLayout = times.filter((_, i) => i % 2 === 0)
  const tree = times.filter((_, i) => i % 2 === 1)
  console.log(`8-gluon NMHV (−−−+++++) under [1,2⟩, fully expanded: ${nodes} nodes`)
  console.log(`  node: term tree by the engine ${median(tree).toFixed(1)} ms; expand + layout ${median(expandLayout).toFixed(1)} ms (median of 5)`)
}

// ---- the server and the browser ----
const server = await startBuiltServer('editor')
const { base, dir } = server
const ctx = await chromium.launchPersistentContext(join(dir, 'profile'), {
  executablePath: process.env.CHROMIUM_PATH || '/usr/bin/chromium',
  args: ['--headless', '--no-sandbox', '--disable-gpu', '--no-first-run'],
  viewport: { width: 1440, height: 900 },
  baseURL: base,
})
try {
  const page = ctx.pages()[0] ?? await ctx.newPage()
  await page.goto('/login')
  await page.waitForLoadState('networkidle')
  await page.fill('input[name=email]', 'ines.varga@example.test')
  await page.fill('input[name=password]', 'polewright-demo')
  await Promise.all([page.waitForURL(/\/projects/), page.click('button[type=submit]')])
  const api = async (method: string, path: string, body?: unknown) => page.evaluate(async ([m, p, b]) => {
    const r = await fetch(p as string, { method: m as string, headers: { 'content-type': 'application/json' }, body: b === undefined ? undefined : JSON.stringify(b) })
    return r.json()
  }, [method, path, body] as const)
  const projects = await api('GET', '/api/projects') as { id: number, name: string }[]
  const pid = projects.find(p => p.name.startsWith('Brackenridge'))!.id

  // ---- 1b. expand fully in the browser ----
  const d = await api('POST', `/api/projects/${pid}/diagrams`, { title: 'Bench: 8-gluon NMHV', graph: { schemaVersion: 1, process: NMHV8, nodes: [], edges: [] } }) as { id: number }
  await page.goto(`/projects/${pid}/diagrams/${d.id}`)
  await page.waitForLoadState('networkidle')
  await page.waitForSelector('.vue-flow__pane')
  const clickAndWait = (sel: string) => page.evaluate(async (s) => {
    const frame = () => new Promise(r => requestAnimationFrame(() => r(null)))
    const t0 = performance.now()
    ;(document.querySelector(s) as HTMLButtonElement).click()
    const pinia = (document.querySelector('#__nuxt') as unknown as { __vue_app__: { config: { globalProperties: { $pinia: { state: { value: { editor: { lastLayoutMs: number, nodes: unknown[], edges: unknown[] } } } } } } } }).__vue_app__.config.globalProperties.$pinia
    // Done when the notice reports the expansion (readable: some Blocks kept; or all three-point
    // vertices) and every node and every edge of the store is on the screen.
    for (;;) {
      await frame()
      const nodes = document.querySelectorAll('.vue-flow__node:not(.vue-flow__node-termframe)')
      const notice = [...document.querySelectorAll('[data-test=notice]')].map(x => x.textContent).join(' / ')
      const editor = pinia.state.value.editor
      if (nodes.length && nodes.length === editor.nodes.length && /three-point|kept collapsed|already/.test(notice)
        && document.querySelectorAll('.vue-flow__edge').length === editor.edges.length
        && [...nodes].every(n => (n as HTMLElement).offsetWidth > 0)) break
      if (performance.now() - t0 > 30_000) throw new Error(`timeout; notice: ${notice}`)
    }
    await frame()
    return { ms: performance.now() - t0, nodes: document.querySelectorAll('.vue-flow__node:not(.vue-flow__node-termframe)').length, blocks: document.querySelectorAll('[data-test=block]').length, layout: pinia.state.value.editor.lastLayoutMs }
  }, sel)
  const cold: number[] = []
  const warm: number[] = []
  const layoutMs: number[] = []
  let shown = 0
  for (let k = 0; k < 5; k++) {
    // Back to the channel terms (fetches the tree), then expand fully: cold the first time, then warm.
    await page.click('[data-test=expand]')
    await page.waitForFunction(() => document.querySelectorAll('[data-test=block]').length > 0)
    await page.evaluate(() => { const n = document.querySelector('[data-test=notice] button') as HTMLButtonElement | null; n?.click() })
    await page.waitForSelector('[data-test=expand-full]:not([disabled])')
    const r = await clickAndWait('[data-test=expand-full]')
    shown = r.nodes
    warm.push(r.ms)
    layoutMs.push(r.layout)
  }
  // Cold: a fresh page load, the tree not yet in memory, so the click fetches it from the server.
  // --profile=FILE: a performance trace of the last cold click (open it in chromium's DevTools) and
  // where its main thread spent the time.
  const profile = process.argv.find(a => a.startsWith('--profile='))?.slice(10)
  for (let k = 0; k < 5; k++) {
    await page.evaluate(id => localStorage.removeItem(`polewright:draft:${id}`), d.id)
    await page.goto(`/projects/${pid}/diagrams/${d.id}`)
    await page.waitForLoadState('networkidle')
    await page.waitForSelector('.vue-flow__pane')
    await page.waitForSelector('[data-test=expand-full]:not([disabled])')
    const cdp = profile && k === 4 ? await page.context().newCDPSession(page) : null
    const events: { name: string, ph: string, dur?: number, tid: number, ts: number, args?: { name?: string } }[] = []
    if (cdp) {
      cdp.on('Tracing.dataCollected', e => events.push(...(e.value as unknown as typeof events)))
      await cdp.send('Tracing.start', { categories: 'devtools.timeline,v8.execute', transferMode: 'ReportEvents' })
      await cdp.send('Profiler.enable')
      await cdp.send('Profiler.setSamplingInterval', { interval: 500 })
      await cdp.send('Profiler.start')
    }
    const r = await clickAndWait('[data-test=expand-full]')
    if (cdp) {
      writeFileSync(profile!.replace(/(\.json)?$/, '.cpuprofile'), JSON.stringify((await cdp.send('Profiler.stop')).profile))
      const ended = new Promise(r => cdp.once('Tracing.tracingComplete', r))
      await cdp.send('Tracing.end')
      await ended
      writeFileSync(profile!, JSON.stringify({ traceEvents: events }))
      // Where the renderer's main thread spent the click: top-level events by kind (RunMicrotasks is mostly Vue rendering).
      const main = (events as { name: string, tid: number, args?: { name?: string } }[]).find(e => e.name === 'thread_name' && e.args?.name === 'CrRendererMain')?.tid
      const byName = new Map<string, number>()
      let end = 0
      for (const e of events.filter(e => e.tid === main && e.ph === 'X' && e.dur).sort((x, y) => x.ts - y.ts)) {
        if (e.ts < end) continue // nested in the task before
        end = e.ts + e.dur!
        byName.set(e.name, (byName.get(e.name) ?? 0) + e.dur! / 1000)
      }
      console.log(`  cold click trace (${profile}): ${[...byName].sort((a, b) => b[1] - a[1]).map(([n, ms]) => `${n} ${ms.toFixed(0)} ms`).join(', ')}`)
    }
    cold.push(r.ms)
  }
  let blocks = 0
  ;({ blocks } = await page.evaluate(() => ({ blocks: document.querySelectorAll('[data-test=block]').length })))
  console.log(`  chromium: click "Expand fully" → ${shown} nodes rendered (${blocks} Blocks kept so it stays readable): cold (term tree from the server) ${median(cold).toFixed(0)} ms (best ${Math.min(...cold).toFixed(0)}), warm ${median(warm).toFixed(0)} ms, of which expand + layout ${median(layoutMs).toFixed(0)} ms (medians of ${cold.length} and ${warm.length})`)
  aims.push(`| "Expand fully", 8-gluon NMHV, cold (term tree fetched) → every node and edge rendered < 300 ms | median ${median(cold).toFixed(0)} ms, best ${Math.min(...cold).toFixed(0)} (${shown} nodes) | ${(readFileSync('/proc/loadavg', 'utf8').split(' ')[0])} | ${median(cold) < 300 ? 'goal met' : '**not met**'} |`)

  // ---- 2. panning with 300+ nodes ----
  // Copies of the fully expanded 8-gluon NMHV canvas, stacked, until there are 300 nodes or more.
  const big = expandedGraph(NMHV8, true)
  const copies = Math.max(1, Math.ceil(300 / big.nodes.length))
  const height = Math.max(...big.nodes.map(n => n.position.y)) + 160
  const nodes = []
  const edges = []
  for (let c = 0; c < copies; c++) {
    const dy = c * height
    nodes.push(...big.nodes.map(n => ({ ...n, id: `k${c}${n.id}`, position: { x: n.position.x, y: n.position.y + dy } })))
    edges.push(...big.edges.map(e => ({ ...e, id: `k${c}${e.id}`, source: `k${c}${e.source}`, target: `k${c}${e.target}` })))
  }
  const bigD = await api('POST', `/api/projects/${pid}/diagrams`, { title: 'Bench: 300 nodes', graph: { schemaVersion: 1, process: big.process, nodes, edges } }) as { id: number }
  await page.goto(`/projects/${pid}/diagrams/${bigD.id}`)
  await page.waitForLoadState('networkidle')
  await page.waitForSelector('.vue-flow__node')
  await page.waitForTimeout(1000)
  const pane = (await page.locator('.vue-flow__pane').boundingBox())!
  const runs: { fps: number, p95: number, worst: number }[] = []
  for (let k = 0; k < 3; k++) {
    await page.evaluate(() => {
      const w = window as unknown as { __frames: number[], __stop: boolean }
      w.__frames = []
      w.__stop = false
      const tick = (t: number) => { w.__frames.push(t); if (!w.__stop) requestAnimationFrame(tick) }
      requestAnimationFrame(tick)
    })
    const x0 = pane.x + pane.width / 2
    const y0 = pane.y + pane.height / 2
    await page.mouse.move(x0, y0)
    await page.mouse.down()
    for (let s = 0; s < 120; s++) await page.mouse.move(x0 + 300 * Math.sin(s / 12), y0 + 200 * Math.cos(s / 15))
    await page.mouse.up()
    const frames = await page.evaluate(() => { const w = window as unknown as { __frames: number[], __stop: boolean }; w.__stop = true; return w.__frames })
    const dts = frames.slice(1).map((t, i) => t - frames[i]!)
    const span = frames.at(-1)! - frames[0]!
    runs.push({ fps: (1000 * dts.length) / span, p95: pct(dts, 0.95), worst: Math.max(...dts) })
  }
  const rendered = await page.locator('.vue-flow__node').count()
  const best = runs.sort((a, b) => b.fps - a.fps)[1]!
  console.log(`panning ${nodes.length} nodes (${rendered} in the DOM), mouse drag of 120 steps: ${best.fps.toFixed(0)} frames/s, frame time p95 ${best.p95.toFixed(1)} ms, worst ${best.worst.toFixed(1)} ms (median run of 3)`)
}
finally {
  await ctx.close()
  server.stop()
}
console.log('\n| aim | measured | load | status |\n|---|---|---|---|')
for (const a of aims) console.log(a)
