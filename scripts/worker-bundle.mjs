// esbuild options for the files that run outside Nitro's bundle: the evaluation thread
// (server/workers/evaluate.ts) and the queue worker process (server/queue/worker.ts). Used by
// modules/evaluation-worker.ts (build) and scripts/worker.mjs (`npm run worker` from the sources).
import { join } from 'node:path'
import { build } from 'esbuild'

const common = {
  bundle: true,
  platform: 'node',
  format: 'esm',
  target: 'node20',
  logLevel: 'warning',
  // CommonJS dependencies (complex.js, fraction.js, seedrandom, mathjs) may call require().
  banner: { js: "import { createRequire as __pwRequire } from 'node:module'; const require = __pwRequire(import.meta.url);" },
}

// `#shared` is Nuxt's alias for the project's shared/ folder; outside Nitro esbuild needs it spelled out.
const alias = (root) => ({ '#shared': join(root, 'shared') })

export const evaluateOptions = (root, outfile) => ({ ...common, alias: alias(root), entryPoints: [join(root, 'server/workers/evaluate.ts')], outfile })

// The native libSQL binding and tinypool (which starts threads from its own files) stay packages.
export const queueWorkerOptions = (root, outfile) => ({
  ...common,
  alias: alias(root),
  entryPoints: [join(root, 'server/queue/worker.ts')],
  outfile,
  external: ['@libsql/*', 'libsql', 'tinypool'],
})

/** Builds both into dir: dir/worker.mjs and dir/workers/evaluate.mjs. */
export async function bundleWorkers(root, dir) {
  await Promise.all([build(evaluateOptions(root, join(dir, 'workers/evaluate.mjs'))), build(queueWorkerOptions(root, join(dir, 'worker.mjs')))])
}
