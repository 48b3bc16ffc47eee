import { CheckRunSchema } from '../../../../../shared/schemas/service'
import type { EvaluateRequest, EvaluateResponse } from '../../../../../shared/schemas/evaluate'

// Runs a check: the diagram's process (theory, spin, helicities, colour order, shift) at the
// point in the body, stored with its provenance (engine version, arithmetic, seed, duration, who).
export default defineEventHandler(async (event) => {
  const id = routeId(event)
  const { diagram, user, project } = await requireDiagramRole(event, id, 'editor')
  const body = await readValid(event, CheckRunSchema)
  const process = diagramProcess(diagram.graph)
  const req: EvaluateRequest = {
    ...body,
    theory: process.theory,
    ...(process.spin !== undefined ? { spin: process.spin } : {}),
    helicities: process.helicities,
    ...(process.shift ? { shift: process.shift } : {}),
  }
  precheckProcess(req, 'graph.process.')
  const t0 = performance.now()
  let result: EvaluateResponse
  try {
    result = (await runInPool<EvaluateResponse>({ kind: 'evaluate', req, ...(process.order ? { order: process.order } : {}) }, poolOptions(event))).value
  }
  catch (e) {
    throw evaluationHttpError(e, processField)
  }
  const durationMs = Math.round((performance.now() - t0) * 1000) / 1000
  const seed = 'seed' in req.kinematics && typeof req.kinematics.seed === 'number' ? req.kinematics.seed : null
  const row = await useDB().insert(tables.checks).values({
    projectId: project.id,
    diagramId: diagram.id,
    diagramVersion: diagram.version,
    kind: 'single',
    status: 'done',
    request: { ...req, ...(process.order ? { order: process.order } : {}) },
    result: result as unknown as Record<string, unknown>,
    summary: checkSummary(req, process, result),
    verdict: result.verdict,
    engineVersion: result.engine.version,
    arithmetic: result.arithmetic,
    seed,
    durationMs,
    done: 1,
    total: 1,
    createdBy: user.id,
  }).returning().get()
  await audit(project.id, user.id, 'check.run', 'check', row.id, { diagramId: diagram.id, diagramVersion: diagram.version, verdict: result.verdict })
  setResponseStatus(event, 201)
  return checkView(row, user.name)
})
