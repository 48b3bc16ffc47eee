import { desc, eq } from 'drizzle-orm'
import { limitQuery } from '#shared/schemas/common'

export default defineEventHandler(async (event) => {
  const { project } = await requireProjectRole(event, routeId(event), 'viewer')
  const { limit } = parseWith(getQuery(event), limitQuery(200, 50), 'query')
  return useDB().select({
    id: tables.auditEvents.id,
    action: tables.auditEvents.action,
    subjectType: tables.auditEvents.subjectType,
    subjectId: tables.auditEvents.subjectId,
    detail: tables.auditEvents.detail,
    createdAt: tables.auditEvents.createdAt,
    userId: tables.auditEvents.userId,
    userName: tables.users.name,
  }).from(tables.auditEvents)
    .leftJoin(tables.users, eq(tables.users.id, tables.auditEvents.userId))
    .where(eq(tables.auditEvents.projectId, project.id))
    .orderBy(desc(tables.auditEvents.createdAt), desc(tables.auditEvents.id))
    .limit(limit)
})
