// Runs a benchmark: `node bench/run.mjs [name] [args…]` bundles bench/<name>.ts (default: engine)
// with esbuild (installed with Nuxt) and runs it with --expose-gc; a bench/<name>.mjs runs as is.
import { build } from 'esbuild'
import { spawnSync } from 'node:child_process'
import { existsSync, mkdirSync, mkdtempSync, rmSync } from 'node:fs'
import { join, dirname } from 'node:path'
import { fileURLToPath } from 'node:url'

const here = dirname(fileURLToPath(import.meta.url))
const args = process.argv.slice(2)
const name = args[0] && !args[0].startsWith('-') ? args.shift() : 'engine'
const ts = join(here, `${name}.ts`)
const mjs = join(here, `${name}.mjs`)
let entry = mjs
let dir = null
if (existsSync(ts)) {
  // Inside node_modules, so the packages left out of the bundle (the native libSQL binding) resolve.
  mkdirSync(join(here, '../node_modules/.cache'), { recursive: true })
  dir = mkdtempSync(join(here, '../node_modules/.cache/polewright-bench-'))
  entry = join(dir, `${name}.mjs`)
  await build({ entryPoints: [ts], bundle: true, platform: 'node', format: 'esm', outfile: entry, logLevel: 'warning', external: ['@libsql/*', 'libsql'] })
} else if (!existsSync(mjs) || name === 'run') {
  console.error(`no benchmark bench/${name}.ts or bench/${name}.mjs`)
  process.exit(2)
}
const r = spawnSync(process.execPath, ['--expose-gc', entry, ...args], { stdio: 'inherit', cwd: join(here, '..') })
if (dir) rmSync(dir, { recursive: true, force: true })
process.exit(r.status ?? 1)
