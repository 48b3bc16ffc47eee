// Bundles the evaluation worker (server/workers/evaluate.ts with the whole engine) into its own
// file: Nitro bundles server code into chunks, but a worker thread needs a file to start from.
// Build: <server output>/workers/evaluate.mjs, found by server/utils/pool.ts next to index.mjs.
// Dev: <buildDir>/workers/evaluate.mjs, rebuilt when the engine changes, its path in runtimeConfig.
// The build also holds the queue worker process, <server output>/worker.mjs (server/queue/worker.ts).
import { existsSync, cpSync, mkdirSync } from 'node:fs'
import { createRequire } from 'node:module'
import { dirname, join, resolve } from 'node:path'
import { build, type BuildOptions } from 'esbuild'
import { defineNuxtModule } from '@nuxt/kit'
import { evaluateOptions, queueWorkerOptions } from '../scripts/worker-bundle.mjs'

export default defineNuxtModule({
  meta: { name: 'polewright-evaluation-worker' },
  setup(_options, nuxt) {
    const options = (outfile: string) => evaluateOptions(nuxt.options.rootDir, outfile) as BuildOptions

    if (nuxt.options.dev) {
      // One-shot builds (no long-lived esbuild service across Nuxt's restarts): at start, and
      // again when a file the worker bundles changes. Workers started later load the new file.
      const outfile = join(nuxt.options.buildDir, 'workers/evaluate.mjs')
      nuxt.options.runtimeConfig.evaluationWorker = outfile
      const sources = ['shared/physics/', 'shared/schemas/', 'shared/editor/', 'server/workers/'].map(d => resolve(nuxt.options.rootDir, d))
      let pending: Promise<unknown> | null = null
      const rebuild = () => {
        pending ??= build(options(outfile))
          .catch(e => console.warn('[polewright] evaluation worker build failed:', (e as Error).message))
          .finally(() => (pending = null))
        return pending
      }
      nuxt.hook('nitro:build:before', async () => {
        await rebuild()
      })
      nuxt.hook('builder:watch', async (_event, path) => {
        const abs = resolve(nuxt.options.rootDir, path)
        if (sources.some(d => abs.startsWith(d))) await rebuild()
      })
      return
    }

    nuxt.hook('nitro:init', (nitro) => {
      nitro.hooks.hook('compiled', async () => {
        if (nitro.options.dev) return
        const serverDir = nitro.options.output.serverDir
        await build(options(join(serverDir, 'workers/evaluate.mjs')))
        await build(queueWorkerOptions(nuxt.options.rootDir, join(serverDir, 'worker.mjs')) as BuildOptions)
        // tinypool starts its threads from its own dist/entry/worker.js, which file tracing misses.
        const traced = join(serverDir, 'node_modules/tinypool')
        if (existsSync(traced) && !existsSync(join(traced, 'dist/entry/worker.js'))) {
          const source = dirname(createRequire(join(nuxt.options.rootDir, 'package.json')).resolve('tinypool/package.json'))
          mkdirSync(join(traced, 'dist'), { recursive: true })
          cpSync(join(source, 'dist'), join(traced, 'dist'), { recursive: true })
        }
      })
    })
  },
})
