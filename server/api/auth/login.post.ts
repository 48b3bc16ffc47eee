import { eq } from 'drizzle-orm'
import { LoginSchema } from '#shared/schemas/auth'

// The attempt is taken from the throttle before anything is checked (see throttle.ts). An unknown
// address is verified against a dummy hash, so it costs the same time as a wrong password; a
// disabled account is told so only after the right password.
export default defineEventHandler(async (event) => {
  const body = await readValid(event, LoginSchema)
  const ticket = await consumeLoginAttempt(body.email, clientAddress(event))
  const user = await useDB().select().from(tables.users).where(eq(tables.users.email, body.email)).get()
  const ok = await verifyPassword(user?.passwordHash ?? await dummyPasswordHash(), body.password)
  if (!user || !ok) throw fieldError(401, 'password', 'the e-mail or the password is wrong')
  await loginSucceeded(ticket)
  if (user.disabled) throw fieldError(401, 'email', 'this account is disabled; ask a site administrator')
  await startSession(event, user)
  return { id: user.id, email: user.email, name: user.name, role: user.role }
})
