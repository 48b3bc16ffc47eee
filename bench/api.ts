// Load figures of the evaluation service: the built server on loopback,
// driven by autocannon. Run: `npm run bench:api` (after a build; POLEWRIGHT_BENCH_OUTPUT picks
// another build folder, --quick shortens every run).
//   1. 6-gluon MHV and NMHV at 32 connections: req/s, p50, p99, errors.
//   2. p99 of GET /api/auth/me (one user, one connection) while 10-gluon evaluations saturate the pool.
//   3. One request at a time, end to end: 8-gluon N²MHV and 10-gluon NMHV (no tree).
//   4. Overhead = wall − engine per process, one request at a time, and the engine's `ms` against
//      the bare recursion + target in this process.
import { mkdirSync, readdirSync, readFileSync, writeFileSync } from 'node:fs'
import { createRequire } from 'node:module'
import { availableParallelism, cpus, loadavg } from 'node:os'
import { join } from 'node:path'
import { signInDemo, startBuiltServer } from './server'
import { complexField } from '#shared/physics/field'
import { randomPoint } from '#shared/physics/kinematics'
import { bcfw } from '#shared/physics/bcfw'
import { defaultShift, processOf } from '#shared/physics/theories'
import { autoTarget, evaluateTarget } from '#shared/physics/targets/index'

// Loaded at run time from the project's node_modules (the bundle of this file lives elsewhere).
const require = createRequire(join(process.cwd(), 'package.json'))
const autocannon = require('autocannon') as (opts: Record<string, unknown>) => Promise<AutocannonResult>

interface AutocannonResult {
  requests: { average: number, total: number }
  latency: { p50: number, p99: number, average: number, max: number }
  errors: number
  timeouts: number
  non2xx: number
}

const quick = process.argv.includes('--quick')
const root = process.cwd()
let base = ''

const gluons = (n: number, minus: number) => Array.from({ length: n }, (_, i) => (i < minus ? -1 : 1))
const body = (helicities: number[], seed = 1) => JSON.stringify({ theory: 'gluon', helicities, kinematics: { kind: 'random', seed } })

let cookie = ''
const evaluateOpts = (b: string, connections: number, more: Record<string, unknown> = {}) => ({
  url: `${base}/api/evaluate`,
  method: 'POST',
  headers: { 'content-type': 'application/json', cookie },
  body: b,
  connections,
  ...more,
})

/**
 * CPU time the server has used, ms: its request thread and all other threads (the workers, libuv).
 * Wall-clock latencies on a shared machine include time spent waiting for a core; CPU time per
 * request does not, and tells what a quiet machine would see.
 */
function serverCpu(pid: number): { main: number, other: number } {
  const tick = 10 // USER_HZ = 100 on Linux
  const read = (tid: string) => {
    const f = readFileSync(`/proc/${pid}/task/${tid}/stat`, 'utf8').split(') ')[1]!.split(' ')
    return (Number(f[11]) + Number(f[12])) * tick
  }
  let main = 0
  let other = 0
  for (const tid of readdirSync(`/proc/${pid}/task`)) {
    try {
      if (tid === String(pid)) main += read(tid)
      else other += read(tid)
    }
    catch { /* the thread ended */ }
  }
  return { main, other }
}

let serverPid = 0
async function measured<T extends { requests: { total: number } } | number>(run: () => Promise<T>): Promise<{ result: T, cpu: string, cpuPer: { main: number, other: number } }> {
  const a = serverCpu(serverPid)
  const result = await run()
  const b = serverCpu(serverPid)
  const n = typeof result === 'number' ? result : result.requests.total
  const cpuPer = { main: (b.main - a.main) / n, other: (b.other - a.other) / n }
  return { result, cpu: `server CPU per request: request thread ${fmt(cpuPer.main)} ms, workers ${fmt(cpuPer.other)} ms`, cpuPer }
}

/** Median ms of the bare recursion plus the auto target at the random seed-1 point, in this process. */
function bareEngineMs(h: number[]): number {
  const kin = randomPoint(h.length, 1)
  const p = processOf('gluon')
  const shift = defaultShift(p, h)
  const target = autoTarget('gluon', h)
  const run = () => {
    bcfw(complexField, p, kin, h, shift)
    if (target) evaluateTarget(target, complexField, kin, h)
  }
  for (let k = 0; k < 200; k++) run()
  const xs: number[] = []
  for (let k = 0; k < 400; k++) {
    const t = performance.now()
    run()
    xs.push(performance.now() - t)
  }
  return xs.sort((x, y) => x - y)[200]!
}

const fmt = (x: number) => (x >= 100 ? x.toFixed(0) : x >= 10 ? x.toFixed(1) : x.toFixed(2))

async function main() {
  const server = await startBuiltServer('api')
  base = server.base
  serverPid = server.child.pid!
  cookie = await signInDemo(base)
  const duration = quick ? 3 : 10
  // Warm the workers' JIT and the request path.
  await autocannon(evaluateOpts(body(gluons(6, 3)), 4, { amount: quick ? 200 : 1000 }))

  const rows: string[] = []
  const figures: Record<string, unknown> = { loadBefore: loadavg()[0], node: process.version, cpus: availableParallelism(), cpu: cpus()[0]?.model, threads: Number(process.env.POLEWRIGHT_EVAL_THREADS) || availableParallelism() }

  for (const [name, h] of [['6-gluon MHV', gluons(6, 2)], ['6-gluon NMHV', gluons(6, 3)]] as const) {
    const { result: r, cpu, cpuPer } = await measured(() => autocannon(evaluateOpts(body(h), 32, { duration })))
    figures[name] = { rps: r.requests.average, p50: r.latency.p50, p99: r.latency.p99, errors: r.errors + r.timeouts + r.non2xx, cpuPer }
    rows.push(`| ${name}, 32 connections, ${duration} s | ${fmt(r.requests.average)} req/s | p50 ${r.latency.p50} ms | p99 ${r.latency.p99} ms | errors ${r.errors + r.timeouts} · non-2xx ${r.non2xx}; ${cpu} |`)
  }

  // 2. Saturate the pool with 10-gluon NMHV evaluations, and meanwhile call /api/auth/me as one user.
  const load = autocannon(evaluateOpts(body(gluons(10, 3)), 16, { duration: duration + 1 }))
  await new Promise(r => setTimeout(r, 500))
  const me = await autocannon({ url: `${base}/api/auth/me`, headers: { cookie }, connections: 1, duration: duration - 1 })
  const loaded = await load
  figures['me under load'] = { p50: me.latency.p50, p99: me.latency.p99, max: me.latency.max, errors: me.errors + me.non2xx, loadRps: loaded.requests.average, loadP99: loaded.latency.p99 }
  rows.push(`| GET /api/auth/me while 10-gluon NMHV saturates the pool (16 connections, ${fmt(loaded.requests.average)} eval/s) | ${fmt(me.requests.average)} req/s | p50 ${me.latency.p50} ms | p99 ${me.latency.p99} ms | errors ${me.errors} · non-2xx ${me.non2xx + loaded.non2xx} |`)

  // 3. One request at a time, end to end on loopback (timed here to the microsecond: autocannon's
  // histogram counts whole milliseconds).
  for (const [name, h] of [['8-gluon N²MHV', gluons(8, 4)], ['10-gluon NMHV', gluons(10, 3)]] as const) {
    const amount = quick ? 100 : 500
    const b = body(h)
    const times: number[] = []
    let engine = 0
    let verdict = ''
    const warm = async () => {
      for (let k = 0; k < 50; k++) await (await fetch(`${base}/api/evaluate`, { method: 'POST', headers: { 'content-type': 'application/json', cookie }, body: b })).json()
    }
    await warm()
    const { cpu, cpuPer } = await measured(async () => {
      for (let k = 0; k < amount; k++) {
        const t = performance.now()
        const res = await fetch(`${base}/api/evaluate`, { method: 'POST', headers: { 'content-type': 'application/json', cookie }, body: b })
        const json = await res.json() as { ms: number, verdict: string }
        times.push(performance.now() - t)
        engine += json.ms
        verdict = json.verdict
      }
      return amount
    })
    times.sort((x, y) => x - y)
    const q = (p: number) => times[Math.min(times.length - 1, Math.floor(p * times.length))]!
    const mean = times.reduce((a, x) => a + x, 0) / times.length
    figures[name] = { mean, p50: q(0.5), p99: q(0.99), engineMs: engine / amount, verdict, cpuPer }
    rows.push(`| ${name}, one at a time (${amount} requests) | mean ${fmt(mean)} ms | p50 ${fmt(q(0.5))} ms | p99 ${fmt(q(0.99))} ms | engine ${fmt(engine / amount)} ms, ${verdict}; ${cpu} |`)
  }

  // 4. Overhead per n: wall time of one request at a time minus the engine's own `ms`, the
  // `pool` hand-off from server-timing, and the bare recursion + target in this process at the
  // same point (the engine path should cost no more than 1.5x that).
  const overheadRows: string[] = []
  for (const [name, h] of [['4-gluon MHV', gluons(4, 2)], ['6-gluon MHV', gluons(6, 2)], ['6-gluon NMHV', gluons(6, 3)], ['8-gluon N²MHV', gluons(8, 4)], ['10-gluon NMHV', gluons(10, 3)]] as const) {
    const amount = quick ? 100 : 400
    const b = body(h)
    const post = () => fetch(`${base}/api/evaluate`, { method: 'POST', headers: { 'content-type': 'application/json', cookie }, body: b })
    for (let k = 0; k < 30; k++) await (await post()).json()
    const wall: number[] = []
    const engine: number[] = []
    const pool: number[] = []
    for (let k = 0; k < amount; k++) {
      const t = performance.now()
      const res = await post()
      const json = await res.json() as { ms: number }
      wall.push(performance.now() - t)
      engine.push(json.ms)
      pool.push(Number(/pool;dur=([\d.]+)/.exec(res.headers.get('server-timing') ?? '')?.[1] ?? NaN))
    }
    const med = (xs: number[]) => [...xs].sort((x, y) => x - y)[Math.floor(xs.length / 2)]!
    const bare = bareEngineMs(h)
    const over = wall.map((w, k) => w - engine[k]!)
    figures[`overhead ${name}`] = { wallP50: med(wall), engineP50: med(engine), poolP50: med(pool), overheadP50: med(over), bareMs: bare }
    overheadRows.push(`| ${name} | ${fmt(med(wall))} | ${fmt(med(engine))} | ${fmt(med(pool))} | **${fmt(med(over))}** | ${fmt(bare)} | ${(med(engine) / bare).toFixed(1)}× |`)
  }

  // The floor of the HTTP stack for comparison: the same client, one request at a time.
  for (const [name, path] of [['GET /api/auth/me (session check only)', '/api/auth/me'], ['GET an unknown route (404, no session work)', '/api/no-such-route']] as const) {
    const get = () => fetch(`${base}${path}`, { headers: { cookie } })
    for (let k = 0; k < 30; k++) await (await get()).text()
    const wall: number[] = []
    for (let k = 0; k < (quick ? 100 : 400); k++) {
      const t = performance.now()
      await (await get()).text()
      wall.push(performance.now() - t)
    }
    const w = [...wall].sort((x, y) => x - y)[Math.floor(wall.length / 2)]!
    figures[`floor ${name}`] = { wallP50: w }
    overheadRows.push(`| ${name} | ${fmt(w)} | — | — | ${fmt(w)} | — | — |`)
  }

  console.log(`\nPolewright API bench — Node ${process.version}, ${availableParallelism()} cores (${cpus()[0]?.model ?? '?'}), ${figures.threads} evaluation threads, load average ${loadavg()[0]!.toFixed(1)} at the end (${Number(figures.loadBefore).toFixed(1)} at the start)\n`)
  console.log('| scenario | throughput | p50 | p99 | notes |')
  console.log('|---|---|---|---|---|')
  for (const r of rows) console.log(r)
  console.log('\nOne request at a time, medians in ms (overhead = wall − engine; bare = bcfw + target in the bench process at the same point):\n')
  console.log('| process | wall | engine `ms` | pool hand-off | overhead | bare recursion + target | engine / bare |')
  console.log('|---|---|---|---|---|---|---|')
  for (const r of overheadRows) console.log(r)
  mkdirSync(join(root, 'bench/results'), { recursive: true })
  const file = join(root, 'bench/results', `api-${new Date().toISOString().replace(/[:.]/g, '-')}.json`)
  writeFileSync(file, JSON.stringify(figures, null, 2))
  console.log(`\n(figures also in ${file})`)
}

main().then(() => process.exit(0), (e) => {
  console.error(e)
  process.exit(1)
})
