import { LimitCheckRequestSchema, type LimitCheckResponse } from '#shared/schemas/limit-checks'

// The soft, collinear and identity checks of a process; read-only (writes nothing).
export default defineEventHandler(async (event) => {
  await requireAuth(event)
  const req = await readValid(event, LimitCheckRequestSchema)
  precheckProcess({ theory: req.theory, helicities: req.helicities, arithmetic: req.check === 'identity' ? req.arithmetic : 'float' })
  try {
    return (await runInPool<LimitCheckResponse>({ kind: 'limitCheck', req }, poolOptions(event))).value
  }
  catch (e) {
    throw evaluationHttpError(e)
  }
})
