// Engine benchmark: per n = 4..12 and helicity class, BCFW float time,
// Berends–Giele float time, their ratio, exact BCFW time, agreement and heap growth.
// Run: node bench/run.mjs  [--quick] [--exact] [--quarks]
import { complexField as C, rationalField as Q } from '#shared/physics/field'
import { randomPoint, rationalPoint } from '#shared/physics/kinematics'
import { bcfw } from '#shared/physics/bcfw'
import { defaultShift, processOf, THEORIES } from '#shared/physics/theories'
import { berendsGiele } from '#shared/physics/targets/berends-giele'
import { quarkLineBerendsGiele } from '#shared/physics/targets/quark-line'
import { quarkLinesBerendsGiele } from '#shared/physics/targets/quark-lines'
import { evaluate } from '#shared/physics/index'
import { bcfwByPrimes } from '#shared/physics/modular'
import type { EvaluateRequestInput } from '#shared/schemas/evaluate'

const quick = process.argv.includes('--quick')
// --exact: only the exact backends table and the evaluate() rows
const exactOnly = process.argv.includes('--exact')
// --quarks: only the quark table and the quark evaluate() rows (run.mjs writes them into their block)
const quarksOnly = process.argv.includes('--quarks')
const gc = (globalThis as { gc?: () => void }).gc

/** k+2 negative helicities spread over n legs: the N^kMHV class. */
function classHelicities(n: number, k: number): number[] {
  const m = k + 2
  const h = Array<number>(n).fill(1)
  for (let t = 0; t < m; t++) h[Math.floor((t * n) / m)] = -1
  return h
}

function className(k: number): string {
  return k === 0 ? 'MHV' : k === 1 ? 'NMHV' : `N${k === 2 ? '²' : k === 3 ? '³' : '⁴'}MHV`
}

/** Median and best time in ms of fn over repeated runs filling ~budget ms (best resists load). */
function time(fn: () => unknown, budget: number): { ms: number; best: number; mean: number; heap: number } {
  gc?.()
  const h0 = process.memoryUsage().heapUsed
  let t = performance.now()
  fn()
  const first = performance.now() - t
  const heap = Math.max(0, process.memoryUsage().heapUsed - h0)
  const reps = Math.max(1, Math.min(2000, Math.floor(budget / Math.max(first, 1e-3))))
  const samples: number[] = []
  for (let r = 0; r < reps; r++) {
    t = performance.now()
    fn()
    samples.push(performance.now() - t)
  }
  const mean = samples.reduce((a, b) => a + b, 0) / samples.length
  samples.sort((a, b) => a - b)
  return { ms: samples[Math.floor(samples.length / 2)]!, best: samples[0]!, mean, heap }
}

const fmt = (x: number) => (x >= 100 ? x.toFixed(0) : x >= 10 ? x.toFixed(1) : x >= 1 ? x.toFixed(2) : x.toFixed(3))
const g = processOf('gluon')
const rows: string[] = []
rows.push('| n | class | BCFW float ms, median (best) | BG float ms, median (best) | BCFW/BG (best) | plain BCFW ms (best) | exact BCFW ms, median | rel. agreement | heap MB |')
rows.push('|---|---|---|---|---|---|---|---|---|')
const budget = quick ? 30 : 300
for (let n = 4; n <= (exactOnly || quarksOnly ? 0 : 12); n++) {
  for (let k = 0; 2 * k <= n - 4; k++) {
    const h = classHelicities(n, k)
    const kin = randomPoint(n, 1)
    const shift = defaultShift(g, h)
    let vb = C.zero
    const tb = time(() => (vb = bcfw(C, g, kin, h, shift).value), budget)
    let vg = C.zero
    const tg = time(() => (vg = berendsGiele(C, kin, h)), budget)
    // the same recursion without closed forms (sub-blocks down to three-point vertices)
    const plain = n <= 10 ? fmt(time(() => bcfw(C, g, kin, h, shift, { closedForms: false }), budget).best) : '—'
    let exact = '—'
    let heap = tb.heap
    if (n <= THEORIES.gluon.limits.exact) {
      const kq = rationalPoint(n, 1)
      const te = time(() => bcfw(Q, g, kq, h, shift), quick ? 50 : 500)
      exact = fmt(te.ms)
      heap = Math.max(heap, te.heap)
    }
    const agree = vb.sub(vg).abs() / vg.abs()
    rows.push(`| ${n} | ${className(k)} | ${fmt(tb.ms)} (${fmt(tb.best)}) | ${fmt(tg.ms)} (${fmt(tg.best)}) | ${(tb.best / tg.best).toFixed(2)} | ${plain} | ${exact} | ${agree.toExponential(1)} | ${(heap / 2 ** 20).toFixed(1)} |`)
    console.error(rows[rows.length - 1])
  }
}
if (!quarksOnly) console.log(rows.join('\n'))

// Quarks: q̄q + 6 gluons and q̄q Q̄Q + 4 gluons against 8 gluons, NMHV, float, seed-1 point
// (goal: within 2× of 8 gluons). Every case is warmed by as many runs as it is timed, so the JIT
// has compiled the quark paths as it has the gluon ones. `--quarks` prints this table alone into
// its own block of the engine section.
const qRows = ['| process | class | BCFW float ms, median (best) | BCFW float ms, mean (with GC pauses) | Berends–Giele float ms, median (best) | BCFW / 8-gluon BCFW: median, mean | rel. agreement |', '|---|---|---|---|---|---|---|']
if (!exactOnly) {
  const qcd = processOf('qcd')
  const kin = randomPoint(8, 1)
  const hg = [-1, 1, 1, -1, 1, 1, -1, 1]
  const warm = (fn: () => unknown) => {
    const t0 = performance.now()
    while (performance.now() - t0 < budget) fn()
  }
  const ref = () => bcfw(C, g, kin, hg, defaultShift(g, hg))
  warm(ref)
  const tg = time(ref, budget)
  for (const [name, h, pdg, target] of [
    ['q̄q + 6 gluons (line adjacent)', [-0.5, 0.5, 1, -1, 1, 1, -1, 1], [-1, 1, 21, 21, 21, 21, 21, 21], quarkLineBerendsGiele],
    ['q̄q + 6 gluons (line split 3 | 3)', [-0.5, 1, 1, -1, 0.5, 1, -1, 1], [-1, 21, 21, 21, 1, 21, 21, 21], quarkLineBerendsGiele],
    ['q̄q Q̄Q + 4 gluons (two lines)', [-0.5, 0.5, 1, -1, 0.5, -0.5, 1, 1], [-1, 1, 21, 21, -2, 2, 21, 21], quarkLinesBerendsGiele],
  ] as [string, number[], number[], typeof quarkLineBerendsGiele][]) {
    const shift = defaultShift(qcd, h, pdg)
    const run = () => bcfw(C, qcd, kin, h, shift, { pdg })
    warm(run)
    let vb = C.zero
    const tb = time(() => (vb = run().value), budget)
    let vq = C.zero
    const tq = time(() => (vq = target(C, kin, h, pdg)), budget)
    qRows.push(`| ${name} | NMHV | ${fmt(tb.ms)} (${fmt(tb.best)}) | ${fmt(tb.mean)} | ${fmt(tq.ms)} (${fmt(tq.best)}) | ${(tb.ms / tg.ms).toFixed(2)}, ${(tb.mean / tg.mean).toFixed(2)} | ${(vb.sub(vq).abs() / vq.abs()).toExponential(1)} |`)
    console.error(qRows[qRows.length - 1])
  }
  qRows.push(`| 8 gluons (reference) | NMHV | ${fmt(tg.ms)} (${fmt(tg.best)}) | ${fmt(tg.mean)} | — | 1.00, 1.00 | — |`)
  const qcdRequests: [string, EvaluateRequestInput][] = [
    ['q̄q + 6 gluons NMHV, float vs Berends–Giele with a quark line', { theory: 'qcd', species: ['qbar1', 'q1', 'g', 'g', 'g', 'g', 'g', 'g'], helicities: [-0.5, 0.5, 1, -1, 1, 1, -1, 1], kinematics: { kind: 'random', seed: 1 } }],
    ['q̄q Q̄Q + 4 gluons NMHV, float vs Berends–Giele with two quark lines', { theory: 'qcd', species: ['qbar1', 'q1', 'g', 'g', 'qbar2', 'q2', 'g', 'g'], helicities: [-0.5, 0.5, 1, -1, 0.5, -0.5, 1, 1], kinematics: { kind: 'random', seed: 1 } }],
    ['q̄q Q̄Q + 4 gluons NMHV, exact vs Berends–Giele with two quark lines', { theory: 'qcd', species: ['qbar1', 'q1', 'g', 'g', 'qbar2', 'q2', 'g', 'g'], helicities: [-0.5, 0.5, 1, -1, 0.5, -0.5, 1, 1], kinematics: { kind: 'rational', seed: 1 }, arithmetic: 'exact' }],
  ]
  const block = `${qRows.join('\n')}\n\n${evaluateRows(qcdRequests).join('\n')}`
  console.log(quarksOnly ? block : `\n<!-- bench:engine:quarks -->\n${block}\n<!-- /bench:engine:quarks -->`)
}

// The two exact backends side by side: big rationals (the reference) against primes + reconstruction
// (shared/physics/modular.ts), at the seed-1 rational point, value and top-level terms, warm.
const exRows = [
  '| process | class | rational BCFW ms, median (best) | modular BCFW ms, median (best) | modular value only ms (best) | primes | speed-up (best) | same fractions |',
  '|---|---|---|---|---|---|---|---|',
]
const exCases: [string, string, ReturnType<typeof processOf>, number[]][] = []
for (let n = 4; n <= 9; n++) for (let k = 0; 2 * k <= n - 4; k++) exCases.push([`${n} gluons`, className(k), g, classHelicities(n, k)])
for (const h of [[-2, -2, 2, 2], [-2, 2, -2, 2, 2], [-2, 2, -2, 2, 2, 2], [-2, 2, -2, 2, -2, 2]]) exCases.push([`${h.length} gravitons`, h.filter((x) => x < 0).length === 2 ? 'MHV' : 'NMHV', processOf('graviton'), h])
for (const n of [6, 8]) exCases.push([`${n} cubic scalars`, '—', processOf('scalar-cubic'), Array(n).fill(0)])
for (const [name, cls, p, h] of quarksOnly ? [] : exCases) {
  const kq = rationalPoint(h.length, 1)
  const shift = defaultShift(p, h)
  let ref = bcfw(Q, p, kq, h, shift)
  const tr = time(() => (ref = bcfw(Q, p, kq, h, shift)), quick ? 50 : 400)
  let mod = bcfwByPrimes(p, kq, h, shift, { terms: true })
  const tm = time(() => (mod = bcfwByPrimes(p, kq, h, shift, { terms: true })), quick ? 50 : 400)
  const tv = time(() => bcfwByPrimes(p, kq, h, shift), quick ? 50 : 400)
  const same = !!mod && mod.value.equals(ref.value) && mod.terms.length === ref.terms.length && mod.terms.every((t, s) => t.value.equals(ref.terms[s]!.value) && t.z.equals(ref.terms[s]!.z))
  exRows.push(`| ${name} | ${cls} | ${fmt(tr.ms)} (${fmt(tr.best)}) | ${fmt(tm.ms)} (${fmt(tm.best)}) | ${fmt(tv.best)} | ${mod?.primes ?? '—'} | ${(tr.best / tm.best).toFixed(0)}× | ${same ? 'yes' : 'NO'} |`)
  console.error(exRows[exRows.length - 1])
}
if (!quarksOnly) console.log('\n' + exRows.join('\n'))

// evaluate() end to end for the other theories and the falloff probe (median of 3 calls)
const ev: [string, EvaluateRequestInput][] = [
  ['8 cubic scalars, float (double-double)', { theory: 'scalar-cubic', helicities: Array(8).fill(0), kinematics: { kind: 'random', seed: 1 } }],
  ['8 cubic scalars, exact', { theory: 'scalar-cubic', helicities: Array(8).fill(0), kinematics: { kind: 'rational', seed: 1 }, arithmetic: 'exact' }],
  ['8 cubic scalars, exact, big rationals', { theory: 'scalar-cubic', helicities: Array(8).fill(0), kinematics: { kind: 'rational', seed: 1 }, arithmetic: 'exact', exact: { backend: 'rational' } }],
  ['8-gluon NMHV exact vs Berends–Giele', { theory: 'gluon', helicities: [-1, 1, 1, -1, 1, 1, -1, 1], kinematics: { kind: 'rational', seed: 1 }, arithmetic: 'exact' }],
  ['8-gluon NMHV exact vs Berends–Giele, big rationals', { theory: 'gluon', helicities: [-1, 1, 1, -1, 1, 1, -1, 1], kinematics: { kind: 'rational', seed: 1 }, arithmetic: 'exact', exact: { backend: 'rational' } }],
  ['9-gluon N²MHV exact vs Berends–Giele', { theory: 'gluon', helicities: [-1, 1, -1, 1, 1, -1, 1, -1, 1], kinematics: { kind: 'rational', seed: 1 }, arithmetic: 'exact' }],
  ['9-gluon N²MHV exact vs Berends–Giele, big rationals', { theory: 'gluon', helicities: [-1, 1, -1, 1, 1, -1, 1, -1, 1], kinematics: { kind: 'rational', seed: 1 }, arithmetic: 'exact', exact: { backend: 'rational' } }],
  ['6 gravitons NMHV, float (double-double) vs KLT', { theory: 'graviton', helicities: [-2, 2, -2, 2, -2, 2], kinematics: { kind: 'random', seed: 1 } }],
  ['6 gravitons NMHV, exact vs KLT', { theory: 'graviton', helicities: [-2, 2, -2, 2, -2, 2], kinematics: { kind: 'rational', seed: 1 }, arithmetic: 'exact' }],
  ['6 gravitons NMHV, exact vs KLT, big rationals', { theory: 'graviton', helicities: [-2, 2, -2, 2, -2, 2], kinematics: { kind: 'rational', seed: 1 }, arithmetic: 'exact', exact: { backend: 'rational' } }],
  ['7 gravitons NMHV, float (double-double)', { theory: 'graviton', helicities: [-2, 2, -2, 2, -2, 2, 2], kinematics: { kind: 'random', seed: 1 }, target: 'none' }],
  ['7 gravitons MHV, float vs Hodges', { theory: 'graviton', helicities: [-2, 2, -2, 2, 2, 2, 2], kinematics: { kind: 'random', seed: 1 } }],
  ['8-gluon NMHV with the term tree', { theory: 'gluon', helicities: [-1, 1, -1, 1, -1, 1, 1, 1], kinematics: { kind: 'random', seed: 1 }, tree: true }],
  ['9-gluon N²MHV exact + falloff probe', { theory: 'gluon', helicities: [-1, 1, -1, 1, -1, 1, -1, 1, 1], kinematics: { kind: 'rational', seed: 1 }, arithmetic: 'exact', probeFalloff: true }],
  ['12-gluon N²MHV float + falloff probe', { theory: 'gluon', helicities: [-1, 1, 1, -1, 1, 1, -1, 1, 1, -1, 1, 1], kinematics: { kind: 'random', seed: 1 }, probeFalloff: true }],
  ['7 gravitons NMHV float + falloff probe', { theory: 'graviton', helicities: [-2, 2, -2, 2, -2, 2, 2], kinematics: { kind: 'random', seed: 1 }, target: 'none', probeFalloff: true }],
]
if (!quarksOnly) console.log('\n' + evaluateRows(ev.filter(([, req]) => req.theory !== 'qcd')).join('\n'))
console.log(`\npeak RSS ${(process.resourceUsage().maxRSS / 1024).toFixed(0)} MB; node ${process.version}; load average ${(await import('node:os')).loadavg()[0]!.toFixed(1)} on ${(await import('node:os')).cpus().length} cores; ${quick ? 'quick' : 'full'} run`)

/** evaluate() end to end, median of 3 calls after a warm-up call. */
function evaluateRows(list: [string, EvaluateRequestInput][]): string[] {
  const out = ['| evaluate() request | ms (median of 3, after a warm-up call) | verdict |', '|---|---|---|']
  for (const [name, req] of list) {
    const ms: number[] = []
    let verdict = ''
    evaluate(req) // warm: JIT and the remembered point
    for (let r = 0; r < (quick ? 1 : 3); r++) {
      const res = evaluate(req)
      ms.push(res.ms)
      verdict = res.verdict
    }
    ms.sort((a, b) => a - b)
    out.push(`| ${name} | ${fmt(ms[Math.floor(ms.length / 2)]!)} | ${verdict} |`)
    console.error(out[out.length - 1])
  }
  return out
}
