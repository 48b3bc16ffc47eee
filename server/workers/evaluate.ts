// The evaluation worker's entry (tinypool calls the default export with one task). Bundled with
// the engine into <server output>/workers/evaluate.mjs by modules/evaluation-worker.ts.
import { setPriority } from 'node:os'
import { runTask, type Outcome, type Task } from './tasks'

// On Linux the nice value is per thread: a nicer worker lets the request thread win the CPU when
// evaluations saturate every core, so other users' requests stay quick (POLEWRIGHT_WORKER_NICE, default 5).
try {
  const nice = Number(process.env.POLEWRIGHT_WORKER_NICE ?? 5)
  if (Number.isInteger(nice) && nice > 0) setPriority(Math.min(19, nice))
}
catch { /* not permitted here: run at the normal priority */ }

// Warm-up before tinypool marks this worker ready (it loads this file first): the first user
// request would otherwise pay the JIT of the engine's hot paths (several ms).
const WARM_UP: Task[] = [
  { kind: 'evaluate', req: { theory: 'gluon', helicities: [-1, 1, -1, 1, -1, 1], kinematics: { kind: 'random', seed: 1 } } },
  { kind: 'evaluate', req: { theory: 'gluon', helicities: [-1, -1, 1, 1, 1, 1], kinematics: { kind: 'physical', seed: 1 } } },
  { kind: 'evaluate', req: { theory: 'gluon', helicities: [-1, 1, -1, 1, 1, 1], kinematics: { kind: 'rational', seed: 1 }, arithmetic: 'exact' } },
  { kind: 'evaluate', req: { theory: 'graviton', helicities: [-2, -2, 2, 2, 2], kinematics: { kind: 'random', seed: 1 } } },
]
if (process.env.POLEWRIGHT_WORKER_WARMUP !== '0') {
  for (let round = 0; round < 30; round++) for (const t of WARM_UP) runTask(t)
}

export default function run(task: Task): Outcome {
  return runTask(task)
}
