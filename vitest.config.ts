import { defineConfig } from 'vitest/config'
import { fileURLToPath } from 'node:url'

const alias = { '~~': fileURLToPath(new URL('./', import.meta.url)), '~': fileURLToPath(new URL('./', import.meta.url)), '#shared': fileURLToPath(new URL('./shared', import.meta.url)) }

export default defineConfig({
  resolve: { alias },
  test: {
    projects: [
      {
        resolve: { alias },
        // Exact and fully expanded cases take seconds on a busy 2-core machine: a generous per-test limit.
        test: { name: 'unit', include: ['tests/unit/**/*.test.ts'], environment: 'node', testTimeout: 60_000, sequence: { groupOrder: 0 } },
      },
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
          // Runs after the unit project, so the server does not compete with the engine tests.
          sequence: { groupOrder: 1 },
        },
      },
    ],
  },
})
