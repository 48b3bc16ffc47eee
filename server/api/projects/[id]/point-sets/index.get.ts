import { desc, eq } from 'drizzle-orm'

export default defineEventHandler(async (event) => {
  const { project } = await requireProjectRole(event, routeId(event), 'viewer')
  const rows = await useDB().select().from(tables.pointSets)
    .where(eq(tables.pointSets.projectId, project.id)).orderBy(desc(tables.pointSets.createdAt), desc(tables.pointSets.id))
  return rows.map(pointSetView)
})
