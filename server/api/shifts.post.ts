import { ShiftsRequestSchema, shiftsMeasureLimit, type ShiftsResponse } from '#shared/schemas/service'

// Every [i,j⟩ shift of a process with its falloff exponent and validity (the editor's shift picker).
export default defineEventHandler(async (event) => {
  await requireAuth(event)
  const req = await readValid(event, ShiftsRequestSchema)
  precheckProcess(req)
  const limit = shiftsMeasureLimit(req.theory)
  if (req.measure && req.helicities.length > limit) {
    throw fieldError(422, 'helicities', `${req.helicities.length} legs exceed the limit of ${limit} for measuring the falloff of every shift exactly (${req.theory})`)
  }
  try {
    return (await runInPool<ShiftsResponse>({ kind: 'shifts', req }, poolOptions(event))).value
  }
  catch (e) {
    throw evaluationHttpError(e)
  }
})
