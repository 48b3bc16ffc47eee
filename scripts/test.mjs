// npm test: install what is missing, build once, run every Vitest project against that build
// (unit, then components, then e2e: the sequence.groupOrder of each in vitest.config.ts).
import { ensureBuilt, ensureInstalled, run } from './lib.mjs'

ensureInstalled()
ensureBuilt()
run(`npx vitest run ${process.argv.slice(2).join(' ')}`)
