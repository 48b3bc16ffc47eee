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

export default function run(task: Task): Outcome {
  return runTask(task)
}
