import { eq } from 'drizzle-orm'
import { MemberAddSchema } from '#shared/schemas/projects'

// 201 for an existing user (added at once and notified); 202 for an address without an account
// (an invitation is e-mailed).
export default defineEventHandler(async (event) => {
  const access = await requireProjectRole(event, routeId(event), 'owner')
  const body = await readValid(event, MemberAddSchema)
  const db = useDB()
  const user = await db.select().from(tables.users).where(eq(tables.users.email, body.email)).get()
  if (!user) {
    const invitation = await createInvitation(access, body.email, body.role)
    setResponseStatus(event, 202)
    return { invited: true, invitation }
  }
  const inserted = await db.insert(tables.memberships)
    .values({ projectId: access.project.id, userId: user.id, role: body.role })
    .onConflictDoNothing()
    .returning().get()
  if (!inserted) throw fieldError(409, 'email', `${body.email} is already a member of this project`)
  await audit(access.project.id, access.user.id, 'member.add', 'user', user.id, { email: user.email, role: body.role })
  await notifyMemberAdded(access, user, body.role)
  setResponseStatus(event, 201)
  return { userId: user.id, email: user.email, name: user.name, role: body.role }
})
