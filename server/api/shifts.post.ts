import { ShiftsRequestSchema, SHIFTS_MEASURE_LIMIT, type ShiftsResponse } from '../../shared/schemas/service'

// Every [i,j⟩ shift of a process with its falloff exponent and validity (the editor's shift picker).
export default defineEventHandler(async (event) => {
  await requireAuth(event)
  const req = await readValid(event, ShiftsRequestSchema)
  precheckProcess(req)
  if (req.measure && req.helicities.length > SHIFTS_MEASURE_LIMIT) {
    throw fieldError(422, 'helicities', `${req.helicities.length} legs exceed the limit of ${SHIFTS_MEASURE_LIMIT} for measuring the falloff of every shift exactly`)
  }
  try {
    return (await runInPool<ShiftsResponse>({ kind: 'shifts', req }, poolOptions(event))).value
  }
  catch (e) {
    throw evaluationHttpError(e)
  }
})
