import { EvaluateRequestSchema, type EvaluateResponse } from '../../shared/schemas/evaluate'

// Stateless; writes nothing, so read-scope tokens may call it. Limits are checked here before any
// work; the evaluation itself runs in the worker pool within the request's time budget.
export default defineEventHandler(async (event) => {
  await requireAuth(event)
  const req = await readValid(event, EvaluateRequestSchema)
  precheckProcess(req)
  try {
    const { value, thread } = await runInPool<EvaluateResponse>({ kind: 'evaluate', req }, poolOptions(event))
    setResponseHeader(event, 'x-evaluation-thread', String(thread))
    return value
  }
  catch (e) {
    throw evaluationHttpError(e)
  }
})
