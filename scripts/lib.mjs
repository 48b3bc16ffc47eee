// Shared by the start, seed and test scripts: install what is missing, build once, find the secret.
import { execSync, spawnSync } from 'node:child_process'
import { existsSync, mkdirSync, readFileSync, statSync, writeFileSync, readdirSync } from 'node:fs'
import { randomBytes } from 'node:crypto'
import { join, resolve } from 'node:path'

export const root = resolve(import.meta.dirname, '..')
process.env.NUXT_TELEMETRY_DISABLED = '1'

export function run(cmd, opts = {}) {
  console.log(`> ${cmd}`)
  execSync(cmd, { stdio: 'inherit', cwd: root, ...opts })
}

/** npm ci when node_modules is missing or older than the lockfile. */
export function ensureInstalled() {
  const marker = join(root, 'node_modules/.package-lock.json')
  if (!existsSync(marker) || statSync(marker).mtimeMs < statSync(join(root, 'package-lock.json')).mtimeMs - 1000) {
    run('npm ci --no-audit --no-fund')
  }
}

function newest(dir) {
  let t = 0
  if (!existsSync(dir)) return 0
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    if (entry.name.startsWith('.') || entry.name === 'node_modules') continue
    const p = join(dir, entry.name)
    t = Math.max(t, entry.isDirectory() ? newest(p) : statSync(p).mtimeMs)
  }
  return t
}

const sources = ['app.vue', 'error.vue', 'pages', 'components', 'stores', 'server', 'shared', 'db', 'public', 'assets', 'layouts', 'composables', 'middleware', 'plugins', 'utils', 'nuxt.config.ts', 'tailwind.config.ts', 'package-lock.json']

/** Builds into .output unless it is newer than every source file. */
export function ensureBuilt(outputDir = '.output') {
  const stamp = join(root, outputDir, 'nitro.json')
  const src = Math.max(...sources.map(s => { const p = join(root, s); return existsSync(p) ? (statSync(p).isDirectory() ? newest(p) : statSync(p).mtimeMs) : 0 }))
  if (existsSync(stamp) && statSync(stamp).mtimeMs > src && process.env.POLEWRIGHT_REBUILD !== '1') return
  run('npx nuxt build', { env: { ...process.env, NUXT_OUTPUT_DIR: outputDir === '.output' ? '' : outputDir } })
}

/** The session password: from the environment, else a local git-ignored file made once. */
export function sessionPassword() {
  if (process.env.NUXT_SESSION_PASSWORD) return process.env.NUXT_SESSION_PASSWORD
  const file = join(root, '.data/session-password')
  if (!existsSync(file)) {
    mkdirSync(join(root, '.data'), { recursive: true })
    writeFileSync(file, randomBytes(32).toString('hex'), { mode: 0o600 })
  }
  return readFileSync(file, 'utf8').trim()
}

export function serverEnv(extra = {}) {
  return {
    ...process.env,
    NUXT_SESSION_PASSWORD: sessionPassword(),
    DATABASE_URL: process.env.DATABASE_URL || `file:${join(root, 'data/polewright.db')}`,
    POLEWRIGHT_MIGRATIONS_DIR: join(root, 'db/migrations'),
    ...extra,
  }
}

export function runServerOnce(env) {
  const r = spawnSync(process.execPath, [join(root, '.output/server/index.mjs')], { cwd: root, env, stdio: 'inherit' })
  if (r.status !== 0) process.exit(r.status ?? 1)
}
