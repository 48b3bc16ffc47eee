import { and, eq, isNull } from 'drizzle-orm'

// Revokes an open invitation: its link stops working at once (410 on use).
export default defineEventHandler(async (event) => {
  const { project, user } = await requireProjectRole(event, routeId(event), 'owner')
  const id = routeId(event, 'invitationId')
  const db = useDB()
  const row = await db.select().from(tables.invitations)
    .where(and(eq(tables.invitations.id, id), eq(tables.invitations.projectId, project.id))).get()
  if (!row) throw httpError(404, 'invitation: not found')
  if (row.acceptedAt) throw fieldError(409, 'invitation', 'was already accepted; remove the member instead')
  if (!row.revokedAt) {
    const revoked = await db.update(tables.invitations).set({ revokedAt: new Date() })
      .where(and(eq(tables.invitations.id, id), isNull(tables.invitations.acceptedAt), isNull(tables.invitations.revokedAt)))
      .returning({ id: tables.invitations.id }).get()
    if (!revoked) throw fieldError(409, 'invitation', 'was accepted or revoked a moment ago; reload the list')
    await audit(project.id, user.id, 'invitation.revoke', 'invitation', id, { email: row.email, role: row.role })
  }
  setResponseStatus(event, 204)
  return null
})
