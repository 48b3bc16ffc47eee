import { and, eq, isNull, ne } from 'drizzle-orm'
import { PasswordChangeSchema } from '#shared/schemas/auth'

// Changes the password of a signed-in account. The current password is required (a borrowed,
// unlocked browser is not enough) and goes through the sign-in throttle, so a stolen session
// cannot guess it fast. The new one follows the sign-up rule. Every other session ends; this
// browser stays signed in; API tokens stay (they are listed on the same page to revoke).
export default defineEventHandler(async (event) => {
  const auth = await requireSession(event, 'change the password')
  const body = await readValid(event, PasswordChangeSchema)
  const db = useDB()
  const row = await db.select().from(tables.users).where(eq(tables.users.id, auth.user.id)).get()
  if (!row) throw httpError(404, 'user: not found')
  const ticket = await consumeLoginAttempt(row.email, clientAddress(event))
  if (!await verifyPassword(row.passwordHash, body.currentPassword)) throw fieldError(400, 'currentPassword', 'is not your current password')
  await loginSucceeded(ticket)
  if (body.password === body.currentPassword) throw fieldError(400, 'password', 'is the same as the current password')
  assertStrongPassword(body.password, [row.email, row.name])
  const passwordHash = await hashPassword(body.password)
  const now = new Date()
  const ended = await db.transaction(async (tx) => {
    await tx.update(tables.users).set({ passwordHash }).where(eq(tables.users.id, row.id))
    const others = and(eq(tables.sessions.userId, row.id), isNull(tables.sessions.revokedAt), auth.sessionId ? ne(tables.sessions.id, auth.sessionId) : undefined)
    return (await tx.update(tables.sessions).set({ revokedAt: now }).where(others).returning({ id: tables.sessions.id })).length
  })
  await audit(null, row.id, 'password.change', 'user', row.id, { sessionsEnded: ended })
  afterResponse(event, () => sendMail(composeMail({
    to: row.email,
    subject: 'Your Polewright password was changed',
    paragraphs: [
      `Hello ${row.name},`,
      `The password of the Polewright account ${row.email} was just changed on the account page. ${ended ? `The ${ended} other signed-in browser(s) were signed out.` : 'No other browser was signed in.'}`,
      'If this was not you, ask for a reset link at once (it ends every session and token) and tell a site administrator.',
    ],
    why: `You get this message because the password of ${row.email} was changed.`,
  })))
  return { sessionsEnded: ended }
})
