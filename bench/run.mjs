// Bundles bench/engine.ts with esbuild (installed with Nuxt) and runs it with --expose-gc.
import { build } from 'esbuild'
import { spawnSync } from 'node:child_process'
import { mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join, dirname } from 'node:path'
import { fileURLToPath } from 'node:url'

const here = dirname(fileURLToPath(import.meta.url))
const dir = mkdtempSync(join(tmpdir(), 'polewright-bench-'))
const out = join(dir, 'engine.mjs')
await build({ entryPoints: [join(here, 'engine.ts')], bundle: true, platform: 'node', format: 'esm', outfile: out, logLevel: 'warning' })
const r = spawnSync(process.execPath, ['--expose-gc', out, ...process.argv.slice(2)], { stdio: 'inherit' })
rmSync(dir, { recursive: true, force: true })
process.exit(r.status ?? 1)
