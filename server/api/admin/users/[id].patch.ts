import { eq } from 'drizzle-orm'
import { z } from 'zod'

const AdminUserUpdate = z.object({
  disabled: z.boolean().optional(),
  role: z.enum(['admin', 'member'], { error: 'must be admin or member' }).optional(),
})

export default defineEventHandler(async (event) => {
  const auth = await requireSiteAdmin(event)
  requireWriteScope(auth)
  const id = routeId(event)
  const body = await readValid(event, AdminUserUpdate)
  if (id === auth.user.id && (body.disabled || body.role === 'member')) {
    throw fieldError(422, body.disabled ? 'disabled' : 'role', 'you cannot lock yourself out; ask another administrator')
  }
  // Disabling ends every session at its next request and revokes the API tokens for good:
  // re-enabling the account later does not bring them back.
  const row = await useDB().transaction(async (tx) => {
    const updated = Object.keys(body).length
      ? await tx.update(tables.users).set(body).where(eq(tables.users.id, id)).returning().get()
      : await tx.select().from(tables.users).where(eq(tables.users.id, id)).get()
    if (updated && body.disabled) await revokeCredentials(id, { tokens: true }, tx)
    return updated
  })
  if (!row) throw httpError(404, 'id: no such user')
  await audit(null, auth.user.id, body.disabled ? 'user.disable' : 'user.update', 'user', id, body)
  return { id: row.id, email: row.email, name: row.name, role: row.role, disabled: row.disabled }
})
