// The evaluation worker's entry (tinypool calls the default export with one task). Bundled with
// the engine into <server output>/workers/evaluate.mjs by modules/evaluation-worker.ts.
import { runTask, type Outcome, type Task } from './tasks'

export default function run(task: Task): Outcome {
  return runTask(task)
}
