// Drawing benchmark: a check of a drawn, fully expanded recursion (the worker's checkDrawing task:
// the process evaluated, then the drawing compiled, compared and evaluated at the same point)
// against the engine's check of the same process (the worker's evaluate task), tree off and on.
// The worker keeps compiled drawings (server/workers/drawing-cache.ts): a check run again on the
// same canvas (the common case) is timed as it is, a first check with the cache emptied every run.
// Aim: the drawn 8-gluon NMHV check costs < 2× the engine's. Run: node bench/run.mjs drawing [--quick]
import { expandedGraph } from '#shared/editor/demo'
import { checkCompiled, checkDrawing, compileDrawing, drawingGraph } from '#shared/editor/drawing/evaluate'
import { packDrawingGraph, unpackDrawingGraph } from '#shared/editor/drawing/handoff'
import { compareDrawing } from '#shared/editor/drawing/compare'
import { validateGraph } from '#shared/editor/validate'
import type { EditorEdge, EditorNode } from '#shared/editor/types'
import { evaluate } from '#shared/physics/index'
import type { Process } from '#shared/schemas/graph'
import { runTask } from '../server/workers/tasks'
import { clearDrawingCache, compilePacked } from '../server/workers/drawing-cache'

const quick = process.argv.includes('--quick')
const budget = quick ? 300 : 1500
const gc = (globalThis as { gc?: () => void }).gc

function time(fn: () => unknown): { ms: number, best: number } {
  gc?.()
  for (let w = 0; w < 5; w++) fn()
  const samples: number[] = []
  const end = performance.now() + budget
  while (performance.now() < end || samples.length < 5) {
    const t = performance.now()
    fn()
    samples.push(performance.now() - t)
  }
  samples.sort((a, b) => a - b)
  return { ms: samples[Math.floor(samples.length / 2)]!, best: samples[0]! }
}

const fmt = (x: number) => (x >= 100 ? x.toFixed(0) : x >= 10 ? x.toFixed(1) : x >= 1 ? x.toFixed(2) : x.toFixed(3))

const cases: { name: string, p: Process, full?: true | 'readable' }[] = [
  { name: '6-gluon NMHV (−+−+−+) [1,2⟩', p: { theory: 'gluon', helicities: [-1, 1, -1, 1, -1, 1], shift: [1, 2] } },
  { name: '8-gluon NMHV (−−−+++++) [3,4⟩', p: { theory: 'gluon', helicities: [-1, -1, -1, 1, 1, 1, 1, 1], shift: [3, 4] } },
  { name: '8-gluon NMHV (−−−+++++) [3,4⟩, as Expand fully shows it (readable: Blocks kept)', p: { theory: 'gluon', helicities: [-1, -1, -1, 1, 1, 1, 1, 1], shift: [3, 4] }, full: 'readable' },
  { name: '8-gluon NMHV (−+−++−++) [1,2⟩', p: { theory: 'gluon', helicities: [-1, 1, -1, 1, 1, -1, 1, 1], shift: [1, 2] } },
  { name: '5-graviton NMHV (−−−++) [1,2⟩', p: { theory: 'graviton', helicities: [-2, -2, -2, 2, 2], shift: [1, 2] } },
]

const rows: string[] = []
const parts: string[] = []
rows.push('| process, fully expanded | nodes | terms | engine check ms (tree off) | engine check ms (tree on) | drawn check ms, run again | drawn / engine (tree off), run again: median (best) | drawn / engine (tree on), run again | drawn check ms, first run | drawn / engine (tree off), first run: median (best) | verdict |')
rows.push('|---|---|---|---|---|---|---|---|---|---|---|')
parts.push('| process | engine check (the floor) | hand-off: pack + clone | cache hit | drawn terms + response | sum, run again | drawn check, run again | floor of the ratio, run again: (engine + hand-off + hit + drawn terms) / engine | unpack | validate + compile | compare | drawn check, first run | floor of the ratio, first run: (sum + unpack + compile + compare) / engine |')
parts.push('|---|---|---|---|---|---|---|---|---|---|---|---|---|')
const above: string[] = []
for (const c of cases) {
  const g = expandedGraph(c.p, c.full ?? true)
  const graph = { nodes: g.nodes as EditorNode[], edges: g.edges as EditorEdge[] }
  const process = g.process!
  const req = { theory: process.theory, helicities: process.helicities, shift: process.shift, kinematics: { kind: 'random' as const, seed: 1 } }
  // The worker tasks the check route hands off, structured-cloned as postMessage would.
  const plain = time(() => runTask(structuredClone({ kind: 'evaluate', req })))
  const tree = time(() => runTask(structuredClone({ kind: 'evaluate', req: { ...req, tree: true } })))
  // As the check route hands it off: the graph packed (only what the compiler reads), cloned; the worker compiles it once.
  const task = () => runTask(structuredClone({ kind: 'checkDrawing', req, process, graph: packDrawingGraph(graph) }))
  const drawn = time(task)
  const first = time(() => {
    clearDrawingCache()
    return task()
  })
  const res = evaluate(req)
  const proc = { ...process, shift: res.shift }
  const slim = drawingGraph(graph)
  const out = checkDrawing(res, process, graph)
  // Where the drawn check's time goes.
  const handoff = time(() => structuredClone(packDrawingGraph(graph)))
  const packed = structuredClone(packDrawingGraph(graph))
  compilePacked(proc, packed)
  const hit = time(() => compilePacked(proc, packed))
  const compiled = compileDrawing(proc, slim)
  const rest = time(() => checkCompiled(res, proc, compiled))
  // The drawn terms right after an engine check, as in the task (minus that engine check alone).
  const engineAlone = time(() => evaluate(req))
  const afterEngine = time(() => checkCompiled(evaluate(req), proc, compiled))
  const inTask = Math.max(0, afterEngine.best - engineAlone.best)
  const unpack = time(() => unpackDrawingGraph(packed))
  const compile = time(() => validateGraph(slim.nodes, slim.edges, proc))
  const v = validateGraph(slim.nodes, slim.edges, proc)
  const cmp = time(() => compareDrawing(proc, v.drawing))
  const sum = plain.best + handoff.best + hit.best + rest.best
  rows.push(`| ${c.name} | ${graph.nodes.length} | ${out.drawing!.terms.length} | ${fmt(plain.ms)} (${fmt(plain.best)}) | ${fmt(tree.ms)} (${fmt(tree.best)}) | ${fmt(drawn.ms)} (${fmt(drawn.best)}) | ${(drawn.ms / plain.ms).toFixed(2)} (${(drawn.best / plain.best).toFixed(2)}) | ${(drawn.ms / tree.ms).toFixed(2)} (${(drawn.best / tree.best).toFixed(2)}) | ${fmt(first.ms)} (${fmt(first.best)}) | ${(first.ms / plain.ms).toFixed(2)} (${(first.best / plain.best).toFixed(2)}) | ${out.verdict} |`)
  const floor = sum / plain.best
  const floorFirst = (sum + unpack.best + compile.best + cmp.best) / plain.best
  parts.push(`| ${c.name} | ${fmt(plain.best)} | ${fmt(handoff.best)} | ${fmt(hit.best)} | ${fmt(rest.best)} | ${fmt(sum)} | ${fmt(drawn.best)} | ${floor.toFixed(2)} | ${fmt(unpack.best)} | ${fmt(compile.best)} | ${fmt(cmp.best)} | ${fmt(first.best)} | ${floorFirst.toFixed(2)} |`)
  if (drawn.ms / plain.ms >= 2) above.push(`- ${c.name}: run again ${(drawn.ms / plain.ms).toFixed(2)}× (median), above the aim. Its floor, with every part at its best alone, is ${floor.toFixed(2)}×: the engine checks this process in ${fmt(plain.best)} ms, while the drawing's own ${out.drawing!.terms.length} terms are evaluated vertex by vertex and Line by Line (${fmt(rest.best)} ms with the response) and the canvas crosses to the worker (${fmt(handoff.best)} ms). The whole task costs ${fmt(drawn.best - sum)} ms more than its parts at their best alone: the garbage collection of everything together, and parts that no longer run alone in a tight loop (the drawn terms right after each engine check cost ${fmt(inTask)} ms, against ${fmt(rest.best)} ms alone).`)
}
console.log(rows.join('\n'))
console.log('\nWhere the drawn check goes (best ms of each part, measured alone): the check evaluates the process as the engine check does (its target, recursion, precision estimate: the response carries them all), then reads the drawing. Run again on the same canvas, its cost over the engine is the hand-off, the cache hit (the packed graph compared with the compiled one) and the drawn terms with the response; a first run also unpacks, validates, compiles and compares. The sum of parts is below the whole drawn check, which also pays the garbage collection of everything together.\n')
console.log(parts.join('\n'))
console.log(above.length ? `\nAbove 2× when run again (what sets the floor):\n\n${above.join('\n')}` : '\nEvery case run again is below 2× the engine\'s check.')
console.log('\nA first run (a new or edited drawing, or a check landing on a pool thread that has not compiled it) also unpacks, validates, compiles and compares: its floor is the last column.')
console.log(`\nmedian (best) ms over ~${budget} ms of runs each; node ${process.version}; load average ${(await import('node:os')).loadavg()[0]!.toFixed(1)}${quick ? '; quick run' : ''}`)
