// npm run seed: migrate and load the demo data (idempotent), then exit.
import { ensureBuilt, ensureInstalled, runServerOnce, serverEnv } from './lib.mjs'

ensureInstalled()
ensureBuilt()
runServerOnce(serverEnv({ POLEWRIGHT_SEED: 'only', PORT: '0' }))
