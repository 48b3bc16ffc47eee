// `npm run worker`: a queue worker process from the current sources (bundled into
// node_modules/.cache/polewright-worker). Needs REDIS_URL; DATABASE_URL as for the server.
// In a build, `node .output/server/worker.mjs` is the same worker without the bundling step.
import { dirname, join } from 'node:path'
import { fileURLToPath, pathToFileURL } from 'node:url'
import { bundleWorkers } from './worker-bundle.mjs'

const root = join(dirname(fileURLToPath(import.meta.url)), '..')
const dir = join(root, 'node_modules/.cache/polewright-worker')
await bundleWorkers(root, dir)
await import(pathToFileURL(join(dir, 'worker.mjs')).href)
