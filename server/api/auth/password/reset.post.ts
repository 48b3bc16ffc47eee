import { and, eq, gt, isNull } from 'drizzle-orm'
import { ResetPasswordSchema } from '#shared/schemas/collab'

// Sets a new password from a one-time link, marks the link (and any other open link of the
// account) used, ends every session and revokes every API token of the account (a reset is how a
// stolen account is recovered). The caller gets a fresh session; a notice is mailed after answering.
export default defineEventHandler(async (event) => {
  const body = await readValid(event, ResetPasswordSchema)
  const row = await findPasswordReset(body.token)
  if (!row) throw fieldError(404, 'token', 'this reset link is not valid (check that the whole link was copied)')
  const status = passwordResetStatus(row)
  if (status !== 'pending') throw passwordResetGoneError(status)
  const owner = await useDB().select().from(tables.users).where(eq(tables.users.id, row.userId)).get()
  assertStrongPassword(body.password, owner ? [owner.email, owner.name] : [])
  const passwordHash = await hashPassword(body.password)
  const db = useDB()
  const now = new Date()
  const done = await db.transaction(async (tx) => {
    const claimed = await tx.update(tables.passwordResets).set({ usedAt: now })
      .where(and(eq(tables.passwordResets.id, row.id), isNull(tables.passwordResets.usedAt), gt(tables.passwordResets.expiresAt, now)))
      .returning().get()
    if (!claimed) return null
    await tx.update(tables.passwordResets).set({ usedAt: now })
      .where(and(eq(tables.passwordResets.userId, row.userId), isNull(tables.passwordResets.usedAt)))
    const user = await tx.update(tables.users).set({ passwordHash }).where(eq(tables.users.id, row.userId)).returning().get()
    const tokensRevoked = await revokeCredentials(row.userId, { tokens: true }, tx)
    return { user, tokensRevoked }
  })
  if (!done) throw passwordResetGoneError('used')
  const { user, tokensRevoked } = done
  await clearFailedLogins(user.email)
  await audit(null, user.id, 'password.reset', 'user', user.id, { tokensRevoked })
  afterResponse(event, () => sendMail(composeMail({
    to: user.email,
    subject: 'Your Polewright password was changed',
    paragraphs: [
      `Hello ${user.name},`,
      `The password of the Polewright account ${user.email} was just changed with a reset link. Every session of the account was signed out${tokensRevoked ? ` and its ${tokensRevoked} API token(s) were revoked; create new ones on the account page` : ''}.`,
      'If this was not you, ask for a new reset link at once and tell a site administrator.',
    ],
    why: `You get this message because the password of ${user.email} was changed.`,
  })))
  if (user.disabled) return { id: user.id, email: user.email, name: user.name, role: user.role, signedIn: false, tokensRevoked }
  await startSession(event, user)
  return { id: user.id, email: user.email, name: user.name, role: user.role, signedIn: true, tokensRevoked }
})
