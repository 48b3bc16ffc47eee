import { z } from 'zod'
import { LoopCutRequestSchema, LOOP_CUT_MAX_LEGS, type LoopCutResponse } from '#shared/schemas/loop-cuts'
import { loopCutsCsv, loopCutsJson } from '#shared/physics/loop/exports'

const QuerySchema = z.object({ format: z.enum(['csv', 'json']).optional() })

// The box coefficients of a one-loop gluon amplitude by quadruple cuts; read-only (writes nothing).
// ?format=csv or ?format=json answers the box table as a download (the page's export buttons).
export default defineEventHandler(async (event) => {
  await requireAuth(event)
  const q = QuerySchema.safeParse(getQuery(event))
  if (!q.success) throw fieldError(400, 'format', 'must be csv or json')
  const req = await readValid(event, LoopCutRequestSchema)
  // Bounds before queueing: the engine repeats them (422 naming the field).
  const n = req.helicities.length
  if (n < 4) throw fieldError(422, 'helicities', `a box needs at least 4 legs, got ${n}`)
  if (n > LOOP_CUT_MAX_LEGS) throw fieldError(422, 'helicities', `${n} legs exceed the limit of ${LOOP_CUT_MAX_LEGS} for loop cuts`)
  precheckProcess({ theory: 'gluon', helicities: req.helicities, arithmetic: req.arithmetic })
  let r: LoopCutResponse
  try {
    r = (await runInPool<LoopCutResponse>({ kind: 'loopCuts', req }, poolOptions(event))).value
  }
  catch (e) {
    throw evaluationHttpError(e)
  }
  if (q.data.format === 'csv') {
    attachment(event, 'loop-cuts.csv', 'text/csv; charset=utf-8')
    return loopCutsCsv(r)
  }
  if (q.data.format === 'json') {
    attachment(event, 'loop-cuts.json', 'application/json; charset=utf-8')
    return loopCutsJson(r, req)
  }
  return r
})
