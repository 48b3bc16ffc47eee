import { CrossShiftRequestSchema, type CrossShiftResponse } from '#shared/schemas/service'

// The same amplitude under every [i,j⟩ shift at one point; at n = 4 the four-particle test.
export default defineEventHandler(async (event) => {
  await requireAuth(event)
  const req = await readValid(event, CrossShiftRequestSchema)
  precheckProcess(req)
  try {
    return (await runInPool<CrossShiftResponse>({ kind: 'crossShift', req }, poolOptions(event))).value
  }
  catch (e) {
    throw evaluationHttpError(e)
  }
})
