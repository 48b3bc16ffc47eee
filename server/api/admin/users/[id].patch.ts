import { eq, sql } from 'drizzle-orm'
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
  const row = await useDB().update(tables.users).set({
    ...body,
    // Disabling ends every existing session at its next request.
    ...(body.disabled && { sessionVersion: sql`${tables.users.sessionVersion} + 1` }),
  }).where(eq(tables.users.id, id)).returning().get()
  if (!row) throw httpError(404, 'id: no such user')
  await audit(null, auth.user.id, body.disabled ? 'user.disable' : 'user.update', 'user', id, body)
  return { id: row.id, email: row.email, name: row.name, role: row.role, disabled: row.disabled }
})
