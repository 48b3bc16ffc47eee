import { defineConfig } from 'vitest/config'
import { defineVitestProject } from '@nuxt/test-utils/config'
import { fileURLToPath } from 'node:url'
import { existsSync } from 'node:fs'
import type { Plugin } from 'vite'

const alias = { '~~': fileURLToPath(new URL('./', import.meta.url)), '~': fileURLToPath(new URL('./', import.meta.url)), '#shared': fileURLToPath(new URL('./shared', import.meta.url)) }

const publicDir = fileURLToPath(new URL('./public', import.meta.url))
const PUBLIC_PREFIX = '\0public-asset:'
/**
 * `<img src="/favicon.svg">` in app.vue: Nuxt's dev resolver names it `virtual:public?…svg`, an id
 * Vite's server.fs check refuses since 7.3.2. The component tests resolve such URLs themselves to an
 * id without the extension, as the URL string the app would use.
 */
const publicAssets: Plugin = {
  name: 'polewright:test-public-assets',
  enforce: 'pre',
  resolveId(id) {
    if (id.startsWith('/') && !id.startsWith('/@') && !id.includes('..') && existsSync(publicDir + id) && !existsSync(id)) return PUBLIC_PREFIX + Buffer.from(id).toString('hex')
  },
  load(id) {
    if (id.startsWith(PUBLIC_PREFIX)) return `export default ${JSON.stringify(Buffer.from(id.slice(PUBLIC_PREFIX.length), 'hex').toString())}`
  },
}

// Loading the test Nuxt costs seconds: skip it when the command line names only other projects.
const named = process.argv.flatMap((a, k, all) => (a === '--project' ? [all[k + 1] ?? ''] : a.startsWith('--project=') ? [a.slice(10)] : []))
const withComponents = !named.length || named.some(n => n === 'components' || n.includes('*'))
// Components mounted in one Nuxt runtime (happy-dom): the app's auto-imports, Pinia and $fetch.
const componentProjects: ReturnType<typeof defineVitestProject>[] = []
if (withComponents) {
  componentProjects.push(defineVitestProject({
    plugins: [publicAssets],
    test: {
      name: 'components',
      include: ['tests/components/**/*.test.ts'],
      setupFiles: ['tests/components/setup.ts'],
      environment: 'nuxt',
      // Its own build dir: loading the test Nuxt rewrites generated files that lint and typecheck read in .nuxt.
      environmentOptions: { nuxt: { domEnvironment: 'happy-dom', overrides: { buildDir: '.nuxt-vitest' } } },
      testTimeout: 30_000,
      sequence: { groupOrder: 1 },
    },
  }))
}

export default defineConfig({
  resolve: { alias },
  test: {
    projects: [
      {
        resolve: { alias },
        // Exact and fully expanded cases take seconds on a busy 2-core machine: a generous per-test limit.
        test: { name: 'unit', include: ['tests/unit/**/*.test.ts'], environment: 'node', testTimeout: 60_000, sequence: { groupOrder: 0 } },
      },
      ...componentProjects,
      {
        resolve: { alias },
        // API and browser tests share one built server and a temporary SQLite file.
        test: {
          name: 'e2e',
          include: ['tests/api/**/*.test.ts', 'tests/browser/**/*.test.ts'],
          environment: 'node',
          globalSetup: ['tests/setup/server.ts'],
          hookTimeout: 120_000,
          testTimeout: 120_000,
          // One file at a time: the browser tests wait on the server's two evaluation threads, and a
          // batch check in a parallel file could starve them on a 2-core machine.
          maxWorkers: 1,
          // Runs after the unit and component projects, so the server does not compete with them.
          sequence: { groupOrder: 2 },
        },
      },
    ],
  },
})
