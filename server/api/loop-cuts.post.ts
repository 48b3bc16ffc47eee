import { LoopCutRequestSchema, LOOP_CUT_MAX_LEGS, type LoopCutResponse } from '#shared/schemas/loop-cuts'

// The box coefficients of a one-loop gluon amplitude by quadruple cuts; read-only (writes nothing).
export default defineEventHandler(async (event) => {
  await requireAuth(event)
  const req = await readValid(event, LoopCutRequestSchema)
  // Bounds before queueing: the engine repeats them (422 naming the field).
  const n = req.helicities.length
  if (n < 4) throw fieldError(422, 'helicities', `a box needs at least 4 legs, got ${n}`)
  if (n > LOOP_CUT_MAX_LEGS) throw fieldError(422, 'helicities', `${n} legs exceed the limit of ${LOOP_CUT_MAX_LEGS} for loop cuts`)
  precheckProcess({ theory: 'gluon', helicities: req.helicities, arithmetic: req.arithmetic })
  try {
    return (await runInPool<LoopCutResponse>({ kind: 'loopCuts', req }, poolOptions(event))).value
  }
  catch (e) {
    throw evaluationHttpError(e)
  }
})
