import { and, eq } from 'drizzle-orm'
import { MemberUpdateSchema } from '#shared/schemas/projects'

export default defineEventHandler(async (event) => {
  const access = await requireProjectRole(event, routeId(event), 'owner')
  const userId = routeId(event, 'userId')
  const body = await readValid(event, MemberUpdateSchema)
  const db = useDB()
  const where = and(eq(tables.memberships.projectId, access.project.id), eq(tables.memberships.userId, userId))
  const current = await db.select().from(tables.memberships).where(where).get()
  if (!current) throw httpError(404, 'userId: not a member of this project')
  if (current.role === 'owner' && body.role !== 'owner' && await ownerCount(access.project.id) <= 1) {
    throw fieldError(422, 'role', 'a project needs at least one owner; make someone else owner first')
  }
  await db.update(tables.memberships).set({ role: body.role }).where(where)
  await audit(access.project.id, access.user.id, 'member.role', 'user', userId, { from: current.role, to: body.role })
  return { userId, role: body.role }
})
