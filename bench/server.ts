// Starts the built server for a benchmark: loopback, a temporary SQLite file, the demo seed.
// POLEWRIGHT_BENCH_OUTPUT picks the build folder (default .output); POLEWRIGHT_BENCH_NODE_ARGS adds
// node options to the server (e.g. `--cpu-prof --cpu-prof-dir=/tmp/prof`: a profile per thread).
import { spawn, type ChildProcess } from 'node:child_process'
import { existsSync, mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join, resolve } from 'node:path'

/** dir: the temporary folder (database; free for other scratch files), removed by stop(). */
export interface BenchServer { base: string, child: ChildProcess, dir: string, stop: () => void }

export async function startBuiltServer(tag: string, env: Record<string, string> = {}): Promise<BenchServer> {
  const root = process.cwd()
  const output = process.env.POLEWRIGHT_BENCH_OUTPUT || '.output'
  const entry = resolve(root, output, 'server/index.mjs')
  if (!existsSync(entry)) {
    console.error(`No build at ${entry}: run "npx nuxt build" first (or set POLEWRIGHT_BENCH_OUTPUT).`)
    process.exit(2)
  }
  const dir = mkdtempSync(join(tmpdir(), `polewright-bench-${tag}-`))
  const port = 3700 + Math.floor(Math.random() * 200)
  const base = `http://127.0.0.1:${port}`
  const nodeArgs = (process.env.POLEWRIGHT_BENCH_NODE_ARGS ?? '').split(' ').filter(Boolean)
  const child = spawn(process.execPath, [...nodeArgs, entry], {
    cwd: root,
    stdio: ['ignore', 'ignore', 'inherit'],
    env: {
      ...process.env, PORT: String(port), HOST: '127.0.0.1', NODE_ENV: 'production',
      DATABASE_URL: `file:${join(dir, 'bench.db')}`,
      NUXT_SESSION_PASSWORD: 'bench-session-password-0123456789-abcdefghijkl',
      POLEWRIGHT_MIGRATIONS_DIR: join(root, 'db/migrations'),
      POLEWRIGHT_SEED: '1',
      ...env,
    },
  })
  let stopped = false
  const stop = () => {
    if (stopped) return
    stopped = true
    // SIGINT lets node write its --cpu-prof files.
    child.kill(nodeArgs.length ? 'SIGINT' : 'SIGTERM')
    rmSync(dir, { recursive: true, force: true })
  }
  process.on('exit', stop)
  for (let i = 0; i < 300; i++) {
    if (child.exitCode !== null) throw new Error('the server exited early')
    try {
      if ((await fetch(`${base}/api/auth/me`)).status > 0) return { base, child, dir, stop }
    }
    catch { /* not up yet */ }
    await new Promise(r => setTimeout(r, 100))
  }
  throw new Error('the server did not start')
}

/** Signs in a demo user; returns the cookie header. */
export async function signInDemo(base: string, email = 'ines.varga@example.test'): Promise<string> {
  const res = await fetch(`${base}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email, password: 'polewright-demo' }) })
  if (res.status !== 200) throw new Error(`sign-in failed: ${res.status}`)
  return res.headers.getSetCookie().map(c => c.split(';')[0]).join('; ')
}
