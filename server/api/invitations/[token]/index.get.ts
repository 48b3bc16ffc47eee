import { eq } from 'drizzle-orm'

// Public: what an invitation link offers (project, who invited, role) and whether it still works.
// Only the holder of the link (sent to the invited address) can ask, so the project name may show.
export default defineEventHandler(async (event) => {
  const found = await findInvitation(getRouterParam(event, 'token') ?? '')
  if (!found) throw fieldError(404, 'token', 'this invitation link is not valid (check that the whole link was copied)')
  const { invitation, project, inviter } = found
  const status = invitationStatus(invitation)
  // Tells the page whether to offer "sign in" or "create an account" first.
  const account = await useDB().select({ id: tables.users.id }).from(tables.users).where(eq(tables.users.email, invitation.email)).get()
  return {
    email: invitation.email,
    role: invitation.role,
    project: { id: project.id, name: project.name, description: project.description },
    invitedBy: { name: inviter.name, email: inviter.email },
    createdAt: invitation.createdAt,
    expiresAt: invitation.expiresAt,
    status,
    valid: status === 'pending',
    accountExists: Boolean(account),
  }
})
