// Runs a benchmark: `node bench/run.mjs [name] [args…]` bundles bench/<name>.ts (default: engine)
// with esbuild (installed with Nuxt) and runs it with --expose-gc; a bench/<name>.mjs runs as is.
// Its output goes to the terminal and replaces the benchmark's section of bench/RESULTS.md.
import { build } from 'esbuild'
import { spawn } from 'node:child_process'
import { existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs'
import { loadavg } from 'node:os'
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
  await build({ entryPoints: [ts], bundle: true, platform: 'node', format: 'esm', outfile: entry, logLevel: 'warning', external: ['@libsql/*', 'libsql'], alias: { '#shared': join(here, '../shared') } })
}
else if (!existsSync(mjs) || name === 'run') {
  console.error(`no benchmark bench/${name}.ts or bench/${name}.mjs`)
  process.exit(2)
}
const child = spawn(process.execPath, ['--expose-gc', entry, ...args], { stdio: ['inherit', 'pipe', 'inherit'], cwd: join(here, '..') })
let out = ''
child.stdout.on('data', (d) => {
  process.stdout.write(d)
  out += d
})
const status = await new Promise(resolve => child.on('close', resolve))
if (dir) rmSync(dir, { recursive: true, force: true })
if (status === 0) writeResults(name, args, out)
process.exit(status ?? 1)

/** Replaces the section of bench/RESULTS.md between `<!-- bench:name -->` markers (or appends it). */
function writeResults(name, args, text) {
  const file = join(here, 'RESULTS.md')
  const head = '# Benchmark results\n\nWritten by `node bench/run.mjs <name>` (`npm run bench*`); each section is replaced by the next run of its benchmark. Figures depend on the machine and its load: compare runs of one machine only.\n'
  const old = existsSync(file) ? readFileSync(file, 'utf8') : head
  // `engine --quarks` rewrites only its block inside the engine section
  const block = name === 'engine' && args.includes('--quarks')
  const key = block ? 'engine:quarks' : name
  const open = `<!-- bench:${key} -->`
  const close = `<!-- /bench:${key} -->`
  const when = new Date().toISOString().slice(0, 16).replace('T', ' ')
  const line = `\`node bench/run.mjs ${[name, ...args].join(' ')}\` — ${when} UTC, load average ${loadavg()[0].toFixed(1)} at the end`
  const body = block ? `${open}\n${line}\n\n${text.trim()}\n${close}` : `${open}\n## ${name}\n\n${line}\n\n${text.trim()}\n${close}`
  const a = old.indexOf(open)
  const b = old.indexOf(close)
  const next = a >= 0 && b > a ? old.slice(0, a) + body + old.slice(b + close.length) : `${old.trimEnd()}\n\n${body}\n`
  writeFileSync(file, next)
}
