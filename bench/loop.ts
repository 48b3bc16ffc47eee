// Quadruple cuts: all box coefficients of n-gluon MHV (and one NMHV) in float and exact
// arithmetic, the engine's loopCuts without the server. Minimum and median of repeated runs after
// warm-up (on a shared, loaded machine the minimum is the cost of the work, the median includes waiting).
import { loadavg } from 'node:os'
import { loopCuts } from '../shared/physics/loop/index'

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b)
  return s[Math.floor(s.length / 2)]!
}

function time(body: Parameters<typeof loopCuts>[0], reps: number): { min: number; ms: number; boxes: number; verdict: string } {
  let r = loopCuts(body)
  for (let i = 0; i < 3; i++) r = loopCuts(body)
  const ts: number[] = []
  for (let i = 0; i < reps; i++) {
    const t0 = performance.now()
    r = loopCuts(body)
    ts.push(performance.now() - t0)
  }
  return { min: Math.min(...ts), ms: median(ts), boxes: r.boxes.length, verdict: r.verdict }
}

const rows: [string, Parameters<typeof loopCuts>[0], number][] = [
  ['4 gluons MHV, float', { helicities: [-1, -1, 1, 1] }, 200],
  ['5 gluons MHV, float', { helicities: [-1, -1, 1, 1, 1] }, 100],
  ['6 gluons MHV, float', { helicities: [-1, -1, 1, 1, 1, 1] }, 50],
  ['6 gluons MHV, float, Berends–Giele corners', { helicities: [-1, -1, 1, 1, 1, 1], corners: 'berends-giele' }, 20],
  ['6 gluons MHV, exact', { helicities: [-1, -1, 1, 1, 1, 1], arithmetic: 'exact' }, 10],
  ['6 gluons MHV −+−+++, float, N = 4 multiplet on the cuts gluinos and scalars cross', { helicities: [-1, 1, -1, 1, 1, 1] }, 50],
  ['6 gluons NMHV −−−+++, float (no target)', { helicities: [-1, -1, -1, 1, 1, 1], target: 'none' }, 20],
  ['6 gluons NMHV −+−+−+, float, N = 4 multiplet + infrared conditions', { helicities: [-1, 1, -1, 1, -1, 1] }, 30],
  ['6 gluons NMHV −+−+−+, exact, N = 4 multiplet + infrared conditions', { helicities: [-1, 1, -1, 1, -1, 1], arithmetic: 'exact' }, 5],
  ['6 gluons NMHV −+−+−+, float, gluons only', { helicities: [-1, 1, -1, 1, -1, 1], states: 'gluons' }, 30],
  ['8 gluons MHV, float', { helicities: [-1, -1, 1, 1, 1, 1, 1, 1] }, 10],
]
console.log(`load average at the start: ${loadavg().map((x) => x.toFixed(1)).join(' / ')} (1 / 5 / 15 min)\n`)
console.log('| process | boxes | verdict | min ms | median ms |')
console.log('|---|---|---|---|---|')
for (const [label, body, reps] of rows) {
  const r = time(body, reps)
  console.log(`| ${label} | ${r.boxes} | ${r.verdict} | ${r.min.toFixed(2)} | ${r.ms.toFixed(2)} |`)
}
