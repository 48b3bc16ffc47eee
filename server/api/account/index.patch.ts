import { eq } from 'drizzle-orm'
import { AccountUpdateSchema } from '#shared/schemas/auth'

// Changes the caller's display name. Session only: a token cannot change the account.
export default defineEventHandler(async (event) => {
  const auth = await requireSession(event, 'change the account')
  const body = await readValid(event, AccountUpdateSchema)
  const user = await useDB().update(tables.users).set({ name: body.name }).where(eq(tables.users.id, auth.user.id)).returning().get()
  if (!user) throw httpError(404, 'user: not found')
  await audit(null, user.id, 'account.name', 'user', user.id, { from: auth.user.name.slice(0, 120), to: user.name })
  return { id: user.id, email: user.email, name: user.name, role: user.role }
})
