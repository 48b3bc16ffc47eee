// Batch checks on the job queue: points per second with 1 and 2 worker processes (one thread
// each) against the embedded pool, and the queue's overhead per chunk. Starts its own redis-server,
// the built server and the workers (tests/helpers/queue-stack.ts). Eight-gluon N²MHV (−−−−++++)
// over generated physical points. Run: `npm run bench:queue` after a build;
// `node bench/run.mjs queue --points=N --chunk=M`.
import { createClient } from '@libsql/client'
import { startQueueStack } from '../tests/helpers/queue-stack'

const arg = (name: string, def: number) => Number(process.argv.find(a => a.startsWith(`--${name}=`))?.split('=')[1] ?? def)
const POINTS = arg('points', 2000)
const CHUNK = arg('chunk', 100)
const s = await startQueueStack({ chunk: CHUNK, root: process.cwd(), lockMs: 15_000 })
const db = createClient({ url: s.databaseUrl })
try {
  const set = await s.pointSet(8, POINTS, 21)
  const d = await s.diagram('Eight gluons N2MHV', [-1, -1, -1, -1, 1, 1, 1, 1])
  const run = async (url: string) => {
    const t0 = performance.now()
    const a = await s.api(url, 'POST', `/api/diagrams/${d}/batch-checks`, { pointSetId: set })
    if (a.status !== 202) throw new Error(JSON.stringify(a.body))
    const end = await s.waitEnd(url, a.body.id, 600_000)
    const wall = (performance.now() - t0) / 1000
    if (end.status !== 'done') throw new Error(`batch ${end.status}: ${JSON.stringify(end.summary)}`)
    const c = (await db.execute({ sql: 'select count(*) as n, sum(eval_ms) as ev from batch_chunks where check_id = ?', args: [a.body.id] })).rows[0]!
    return { wall, chunks: Number(c.n), evalMs: Number(c.ev ?? 0) }
  }
  const rows: string[][] = []
  const line = (label: string, workers: number, r: { wall: number, chunks: number, evalMs: number }) => {
    // Time a worker spends on a chunk besides evaluating it: taking the job, reading the points,
    // the transaction, the acknowledgement (the tail where a worker idles counts too).
    const overhead = r.chunks ? (workers * r.wall * 1000 - r.evalMs) / r.chunks : NaN
    rows.push([label, (POINTS / r.wall).toFixed(0), r.wall.toFixed(2), r.chunks ? overhead.toFixed(1) : '–'])
  }
  line('embedded pool (2 threads)', 2, await run(s.embedded))
  s.startWorker()
  await s.workersConnected(1)
  const one = await run(s.queued)
  line('queue, 1 worker × 1 thread', 1, one)
  s.startWorker()
  await s.workersConnected(2)
  const two = await run(s.queued)
  line('queue, 2 workers × 1 thread', 2, two)
  // Overhead alone: four-gluon MHV points evaluate in microseconds.
  const tiny = await s.pointSet(4, POINTS, 22)
  const d4 = await s.diagram('Four gluons MHV', [-1, -1, 1, 1])
  const t0 = performance.now()
  const a = await s.api(s.queued, 'POST', `/api/diagrams/${d4}/batch-checks`, { pointSetId: tiny })
  await s.waitEnd(s.queued, a.body.id, 600_000)
  const tinyWall = (performance.now() - t0) / 1000
  const tc = (await db.execute({ sql: 'select count(*) as n, sum(eval_ms) as ev from batch_chunks where check_id = ?', args: [a.body.id] })).rows[0]!
  console.log(`\nQueue batch checks: ${POINTS} points, chunks of ${CHUNK}, eight-gluon N2MHV, ${process.env.HOSTNAME ?? 'this machine'}`)
  console.log(['run', 'points/s', 'wall s', 'non-eval ms/chunk'].join(' | '))
  for (const r of rows) console.log(r.join(' | '))
  console.log(`speed-up 1 → 2 workers: ${(one.wall / two.wall).toFixed(2)}×`)
  console.log(`four-gluon MHV (evaluation ≈ 0): ${POINTS} points in ${Number(tc.n)} chunks, ${tinyWall.toFixed(2)} s → ${(tinyWall * 1000 / Number(tc.n)).toFixed(1)} ms per chunk wall with 2 workers (${(2 * tinyWall * 1000 / Number(tc.n) - Number(tc.ev) / Number(tc.n)).toFixed(1)} ms of worker time per chunk outside evaluation)`)
}
finally {
  db.close()
  await s.stop()
}
