import { EvaluateRequestSchema, type EvaluateResponse } from '#shared/schemas/evaluate'

// Stateless; writes nothing, so read-scope tokens may call it. Limits are checked here before any
// work; the evaluation itself runs in the worker pool within the request's time budget.
export default defineEventHandler(async (event) => {
  await requireAuth(event)
  const req = await readValid(event, EvaluateRequestSchema)
  precheckProcess(req)
  try {
    const t0 = performance.now()
    // The worker sends the response as JSON text (EvaluateResponse), passed on unparsed.
    const { value, thread, ms } = await runInPool<string>({ kind: 'evaluate', req, json: true }, poolOptions(event))
    // Where the time went: the engine itself, and the whole hand-off (queue + transfer + engine).
    setResponseHeaders(event, {
      'content-type': 'application/json',
      'x-evaluation-thread': String(thread),
      'server-timing': `engine;dur=${ms}, pool;dur=${(performance.now() - t0).toFixed(3)}`,
    })
    return jsonText<EvaluateResponse>(value)
  }
  catch (e) {
    throw evaluationHttpError(e)
  }
})
