// Starts a batch check: the diagram's process over a point set of the same project, in the pool.
// Answers 202 with the check at once; progress comes from GET /api/batch-checks/:id/events.
import { and, eq } from 'drizzle-orm'
import { BatchStartSchema } from '#shared/pointsets'

export default defineEventHandler(async (event) => {
  const { diagram, project, user } = await requireDiagramRole(event, routeId(event), 'editor')
  const body = await readValid(event, BatchStartSchema)
  const process = diagramProcess(diagram.graph)
  const pointSet = await useDB().select().from(tables.pointSets)
    .where(and(eq(tables.pointSets.id, body.pointSetId), eq(tables.pointSets.projectId, project.id))).get()
  if (!pointSet) throw fieldError(422, 'pointSetId', `no point set ${body.pointSetId} in this project`)
  if (pointSet.count === 0) throw fieldError(422, 'pointSetId', `the point set "${pointSet.name}" holds no points`)
  const plan = { process, target: body.target, ...(body.shift ? { shift: body.shift } : {}) }
  precheckProcess({ ...process, ...(body.shift ? { shift: body.shift } : {}) }, 'graph.process.')
  checkPlan(plan, pointSet)
  // One point first, so a target that does not apply (or the like) is a 422 before anything is stored.
  const [first] = await pointsInRange(pointSet.id, 0, 1)
  try {
    await evaluateInPool(requestFor(plan, first!.data))
  }
  catch (e) {
    const err = e as { status?: number, field?: string }
    // A problem of this one point (not of the process) is the batch's business: it will be listed.
    if (!(err.status === 422 && err.field?.startsWith('kinematics'))) throw evaluationHttpError(e, processField)
  }
  const row = await startBatch({ projectId: project.id, diagram, pointSet, plan, userId: user.id })
  await audit(project.id, user.id, 'check.batch', 'check', row.id, { diagramId: diagram.id, title: diagram.title, pointSetId: pointSet.id, pointSet: pointSet.name, points: pointSet.count })
  setResponseStatus(event, 202)
  return batchView(row)
})
