import { and, eq, inArray } from 'drizzle-orm'

// Deleting a diagram deletes its revisions, comments and checks with it (the foreign keys cascade);
// its running batch checks are stopped first. Point sets belong to the project and stay.
export default defineEventHandler(async (event) => {
  const { diagram, user, project } = await requireDiagramRole(event, routeId(event), 'editor')
  const db = useDB()
  const active = await db.select({ id: tables.checks.id }).from(tables.checks)
    .where(and(eq(tables.checks.diagramId, diagram.id), inArray(tables.checks.status, ['queued', 'running'])))
  await cancelBatchesById(active.map(c => c.id))
  await db.delete(tables.diagrams).where(eq(tables.diagrams.id, diagram.id))
  await audit(project.id, user.id, 'diagram.delete', 'diagram', diagram.id, { title: diagram.title })
  setResponseStatus(event, 204)
  return null
})
