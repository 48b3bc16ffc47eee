import { eq } from 'drizzle-orm'

// Deleting a set stops its running batch checks; their stored results stay (checks keep their rows).
export default defineEventHandler(async (event) => {
  const { pointSet, project, user } = await requirePointSetRole(event, routeId(event), 'editor')
  await cancelBatchesOfPointSet(pointSet.id)
  await useDB().delete(tables.pointSets).where(eq(tables.pointSets.id, pointSet.id))
  await audit(project.id, user.id, 'pointset.delete', 'point-set', pointSet.id, { name: pointSet.name, count: pointSet.count })
  setResponseStatus(event, 204)
  return null
})
