// Load figures of the evaluation service: the built server on loopback, driven by autocannon and a
// plain keep-alive node:http client. Run: `npm run bench:api` (after a build; POLEWRIGHT_BENCH_OUTPUT
// picks another build folder, --quick shortens every run to about a minute).
//   1. Overhead = wall − engine per process, one request at a time (after warm-up requests, so
//      every worker has served before), against the floor of a bare node:http server.
//   2. 6-gluon MHV at 32 connections: req/s, p50, errors (and 6-gluon NMHV without --quick).
//   3. p99 of GET /api/auth/me (one user, one connection) while 10-gluon evaluations saturate the pool.
// Each figure the speed aims name is printed with its aim and `goal met` / `not met`, beside the
// load average and the server's CPU time per request (the figure a busy machine does not distort).
import { spawn } from 'node:child_process'
import { mkdirSync, readdirSync, readFileSync, writeFileSync } from 'node:fs'
import http from 'node:http'
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
const med = (xs: number[]) => [...xs].sort((x, y) => x - y)[Math.floor(xs.length / 2)]!
const verdict = (ok: boolean) => (ok ? 'goal met' : '**not met**')
const load = () => loadavg()[0]!.toFixed(1)

/** One keep-alive connection, one request at a time: what a script or the editor's fetches do. */
function keepAliveClient(url: string) {
  const u = new URL(url)
  const agent = new http.Agent({ keepAlive: true, maxSockets: 1 })
  return (method: string, path: string, body?: string, headers: Record<string, string> = {}) => new Promise<{ status: number, headers: http.IncomingHttpHeaders, text: string }>((resolve, reject) => {
    const req = http.request({ host: u.hostname, port: u.port, method, path, agent, headers: { ...headers, ...(body ? { 'content-type': 'application/json', 'content-length': String(Buffer.byteLength(body)) } : {}) } }, (res) => {
      const chunks: Buffer[] = []
      res.on('data', (c: Buffer) => chunks.push(c))
      res.on('end', () => resolve({ status: res.statusCode ?? 0, headers: res.headers, text: Buffer.concat(chunks).toString() }))
    })
    req.on('error', reject)
    if (body) req.write(body)
    req.end()
  })
}

/** The floor: a bare node:http server (in its own process) answering a small JSON body, the same client. */
async function bareFloor(amount: number): Promise<{ wall: number, best: number, serverCpu: number }> {
  const port = 3950 + Math.floor(Math.random() * 40)
  const code = `require('http').createServer((q, s) => { q.resume(); q.on('end', () => { s.setHeader('content-type', 'application/json'); s.end(JSON.stringify({ ok: true, ms: 0 })) }) }).listen(${port}, '127.0.0.1', () => console.log('up'))`
  const child = spawn(process.execPath, ['-e', code], { stdio: ['ignore', 'pipe', 'inherit'] })
  await new Promise(r => child.stdout!.once('data', r))
  try {
    const send = keepAliveClient(`http://127.0.0.1:${port}`)
    const b = body(gluons(4, 2))
    for (let k = 0; k < 200; k++) await send('POST', '/', b)
    const c0 = serverCpu(child.pid!)
    const wall: number[] = []
    for (let k = 0; k < amount; k++) {
      const t = performance.now()
      await send('POST', '/', b)
      wall.push(performance.now() - t)
    }
    const c1 = serverCpu(child.pid!)
    return { wall: med(wall), best: Math.min(...wall), serverCpu: (c1.main + c1.other - c0.main - c0.other) / amount }
  }
  finally {
    child.kill()
  }
}

async function main() {
  const server = await startBuiltServer('api')
  base = server.base
  serverPid = server.child.pid!
  cookie = await signInDemo(base)
  const duration = quick ? 3 : 10
  const amount = quick ? 600 : 2000
  const figures: Record<string, unknown> = { loadBefore: loadavg()[0], node: process.version, cpus: availableParallelism(), cpu: cpus()[0]?.model, threads: Number(process.env.POLEWRIGHT_EVAL_THREADS) || availableParallelism() }
  const aims: string[] = []
  // Warm the workers' JIT and the request path (every worker serves many of these).
  await autocannon(evaluateOpts(body(gluons(6, 3)), 4, { amount: quick ? 400 : 1000 }))

  // 1. Overhead per n, one request at a time on one keep-alive connection.
  const send = keepAliveClient(base)
  const overheadRows: string[] = []
  const floor = await bareFloor(amount)
  figures.floor = floor
  for (const [name, h] of [['4-gluon MHV', gluons(4, 2)], ['6-gluon MHV', gluons(6, 2)], ['6-gluon NMHV', gluons(6, 3)], ['8-gluon N²MHV', gluons(8, 4)], ['10-gluon NMHV', gluons(10, 3)]] as const) {
    const b = body(h)
    const post = () => send('POST', '/api/evaluate', b, { cookie })
    for (let k = 0; k < 50; k++) await post()
    const wall: number[] = []
    const engine: number[] = []
    const pool: number[] = []
    const { cpuPer } = await measured(async () => {
      for (let k = 0; k < amount; k++) {
        const t = performance.now()
        const res = await post()
        wall.push(performance.now() - t)
        if (res.status !== 200) throw new Error(`${name}: ${res.status} ${res.text.slice(0, 200)}`)
        engine.push((JSON.parse(res.text) as { ms: number }).ms)
        pool.push(Number(/pool;dur=([\d.]+)/.exec(String(res.headers['server-timing'] ?? ''))?.[1] ?? NaN))
      }
      return amount
    })
    const bare = bareEngineMs(h)
    const over = wall.map((w, k) => w - engine[k]!)
    const o = med(over)
    figures[`overhead ${name}`] = { wallP50: med(wall), engineP50: med(engine), poolP50: med(pool), overheadP50: o, overheadBest: Math.min(...over), bareMs: bare, cpuPer }
    overheadRows.push(`| ${name} | ${fmt(med(wall))} | ${fmt(med(engine))} | ${fmt(med(pool))} | **${fmt(o)}** (best ${fmt(Math.min(...over))}) | ${fmt(cpuPer.main)} / ${fmt(cpuPer.other)} | ${fmt(bare)} | ${verdict(o <= 0.5)} |`)
    aims.push(`| overhead ${name}, one at a time: wall − engine ≤ 0.5 ms | ${fmt(o)} ms (best ${fmt(Math.min(...over))}) | request thread ${fmt(cpuPer.main)} ms CPU | ${load()} | ${verdict(o <= 0.5)} |`)
  }
  for (const [name, path] of [['GET /api/auth/me (session check only)', '/api/auth/me'], ['GET an unknown route (404, no session work)', '/api/no-such-route']] as const) {
    const get = () => send('GET', path, undefined, { cookie })
    for (let k = 0; k < 50; k++) await get()
    const wall: number[] = []
    const { cpuPer } = await measured(async () => {
      for (let k = 0; k < amount; k++) {
        const t = performance.now()
        await get()
        wall.push(performance.now() - t)
      }
      return amount
    })
    figures[`floor ${name}`] = { wallP50: med(wall), cpuPer }
    overheadRows.push(`| ${name} | ${fmt(med(wall))} | — | — | ${fmt(med(wall))} | ${fmt(cpuPer.main)} / — | — | — |`)
  }
  overheadRows.push(`| bare node:http server, same client (the loopback floor) | ${fmt(floor.wall)} | — | — | ${fmt(floor.wall)} (best ${fmt(floor.best)}) | ${fmt(floor.serverCpu)} / — | — | — |`)

  // 2. Throughput at 32 connections.
  const rows: string[] = []
  for (const [name, h] of (quick ? [['6-gluon MHV', gluons(6, 2)]] : [['6-gluon MHV', gluons(6, 2)], ['6-gluon NMHV', gluons(6, 3)]]) as [string, number[]][]) {
    const { result: r, cpu, cpuPer } = await measured(() => autocannon(evaluateOpts(body(h), 32, { duration })))
    const errors = r.errors + r.timeouts + r.non2xx
    figures[name] = { rps: r.requests.average, p50: r.latency.p50, p99: r.latency.p99, errors, cpuPer }
    rows.push(`| ${name}, 32 connections, ${duration} s | ${fmt(r.requests.average)} req/s | p50 ${r.latency.p50} ms | p99 ${r.latency.p99} ms | errors ${r.errors + r.timeouts} · non-2xx ${r.non2xx}; ${cpu} |`)
    if (name === '6-gluon MHV') {
      const ok = r.requests.average >= 2000 && r.latency.p50 < 15 && errors === 0
      aims.push(`| 6-gluon MHV, 32 connections: ≥ 2,000 req/s, p50 < 15 ms, 0 errors | ${fmt(r.requests.average)} req/s, p50 ${r.latency.p50} ms, ${errors} errors | ${fmt(cpuPer.main + cpuPer.other)} ms CPU per request (request thread ${fmt(cpuPer.main)}): at most ${fmt(1000 * availableParallelism() / (cpuPer.main + cpuPer.other))} req/s on ${availableParallelism()} idle cores | ${load()} | ${verdict(ok)} |`)
    }
  }

  // 3. Saturate the pool with 10-gluon NMHV evaluations, and meanwhile call /api/auth/me as one user.
  const saturate = autocannon(evaluateOpts(body(gluons(10, 3)), 16, { duration: duration + 1 }))
  await new Promise(r => setTimeout(r, 500))
  const me = await autocannon({ url: `${base}/api/auth/me`, headers: { cookie }, connections: 1, duration: duration - 1 })
  const loaded = await saturate
  figures['me under load'] = { p50: me.latency.p50, p99: me.latency.p99, max: me.latency.max, errors: me.errors + me.non2xx, loadRps: loaded.requests.average, loadP99: loaded.latency.p99 }
  rows.push(`| GET /api/auth/me while 10-gluon NMHV saturates the pool (16 connections, ${fmt(loaded.requests.average)} eval/s) | ${fmt(me.requests.average)} req/s | p50 ${me.latency.p50} ms | p99 ${me.latency.p99} ms | errors ${me.errors} · non-2xx ${me.non2xx + loaded.non2xx} |`)
  aims.push(`| GET /api/auth/me p99 < 20 ms while the pool is saturated | p99 ${me.latency.p99} ms (p50 ${me.latency.p50}, max ${me.latency.max}) | ${fmt(loaded.requests.average)} evaluations/s meanwhile | ${load()} | ${verdict(me.latency.p99 < 20 && me.errors + me.non2xx === 0)} |`)

  console.log(`\nPolewright API bench — Node ${process.version}, ${availableParallelism()} cores (${cpus()[0]?.model ?? '?'}), ${figures.threads} evaluation threads, load average ${load()} at the end (${Number(figures.loadBefore).toFixed(1)} at the start)\n`)
  console.log('| aim | measured | bound by (CPU time per request) | load | status |')
  console.log('|---|---|---|---|---|')
  for (const r of aims) console.log(r)
  console.log('\nOne request at a time on one keep-alive connection, medians in ms (overhead = wall − engine `ms`; pool = the hand-off from server-timing; CPU = server CPU per request, request thread / other threads; bare = bcfw + target in the bench process):\n')
  console.log('| process | wall | engine `ms` | pool hand-off | overhead | server CPU ms | bare recursion + target | overhead ≤ 0.5 ms |')
  console.log('|---|---|---|---|---|---|---|---|')
  for (const r of overheadRows) console.log(r)
  console.log('\n| scenario | throughput | p50 | p99 | notes |')
  console.log('|---|---|---|---|---|')
  for (const r of rows) console.log(r)
  mkdirSync(join(root, 'bench/results'), { recursive: true })
  const file = join(root, 'bench/results', `api-${new Date().toISOString().replace(/[:.]/g, '-')}.json`)
  writeFileSync(file, JSON.stringify(figures, null, 2))
  console.log(`\n(figures also in ${file.slice(root.length + 1)})`)
}

main().then(() => process.exit(0), (e) => {
  console.error(e)
  process.exit(1)
})
