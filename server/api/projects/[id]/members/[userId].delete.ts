import { and, eq } from 'drizzle-orm'

export default defineEventHandler(async (event) => {
  const access = await requireProjectRole(event, routeId(event), 'owner')
  const userId = routeId(event, 'userId')
  const db = useDB()
  const where = and(eq(tables.memberships.projectId, access.project.id), eq(tables.memberships.userId, userId))
  const current = await db.select().from(tables.memberships).where(where).get()
  if (!current) throw httpError(404, 'userId: not a member of this project')
  if (current.role === 'owner' && await ownerCount(access.project.id) <= 1) {
    throw fieldError(422, 'userId', 'the last owner cannot be removed')
  }
  await db.delete(tables.memberships).where(where)
  await audit(access.project.id, access.user.id, 'member.remove', 'user', userId, { role: current.role })
  setResponseStatus(event, 204)
  return null
})
