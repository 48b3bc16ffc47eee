import { eq } from 'drizzle-orm'
import { LoginSchema } from '../../../shared/schemas/auth'

export default defineEventHandler(async (event) => {
  const body = await readValid(event, LoginSchema)
  await assertLoginAllowed(body.email)
  const user = await useDB().select().from(tables.users).where(eq(tables.users.email, body.email)).get()
  const ok = user ? await verifyPassword(user.passwordHash, body.password) : false
  if (!user || !ok) {
    await recordFailedLogin(body.email)
    throw fieldError(401, 'password', 'the e-mail or the password is wrong')
  }
  if (user.disabled) throw fieldError(401, 'email', 'this account is disabled; ask a site administrator')
  await clearFailedLogins(body.email)
  await startSession(event, user)
  return { id: user.id, email: user.email, name: user.name, role: user.role }
})
