import { and, eq, inArray } from 'drizzle-orm'

// Deleting a project removes its diagrams, point sets, checks, comments and memberships (the
// foreign keys cascade). Running batch checks are stopped first so no runner writes into rows that
// are gone. The audit entry has no project (it would cascade away with it).
export default defineEventHandler(async (event) => {
  const { project, user } = await requireProjectRole(event, routeId(event), 'owner')
  const db = useDB()
  const active = await db.select({ id: tables.checks.id }).from(tables.checks)
    .where(and(eq(tables.checks.projectId, project.id), inArray(tables.checks.status, ['queued', 'running'])))
  await cancelBatchesById(active.map(c => c.id))
  await db.delete(tables.projects).where(eq(tables.projects.id, project.id))
  await audit(null, user.id, 'project.delete', 'project', project.id, { name: project.name })
  setResponseStatus(event, 204)
  return null
})
