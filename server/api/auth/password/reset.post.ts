import { and, eq, gt, isNull, sql } from 'drizzle-orm'
import { ResetPasswordSchema } from '../../../../shared/schemas/collab'

// Sets a new password from a one-time link, marks the link (and any other open link of the
// account) used, and bumps sessionVersion so every existing session stops working. The caller
// gets a fresh session.
export default defineEventHandler(async (event) => {
  const body = await readValid(event, ResetPasswordSchema)
  const row = await findPasswordReset(body.token)
  if (!row) throw fieldError(404, 'token', 'this reset link is not valid (check that the whole link was copied)')
  const status = passwordResetStatus(row)
  if (status !== 'pending') throw passwordResetGoneError(status)
  const passwordHash = await hashPassword(body.password)
  const db = useDB()
  const now = new Date()
  const user = await db.transaction(async (tx) => {
    const claimed = await tx.update(tables.passwordResets).set({ usedAt: now })
      .where(and(eq(tables.passwordResets.id, row.id), isNull(tables.passwordResets.usedAt), gt(tables.passwordResets.expiresAt, now)))
      .returning().get()
    if (!claimed) return null
    await tx.update(tables.passwordResets).set({ usedAt: now })
      .where(and(eq(tables.passwordResets.userId, row.userId), isNull(tables.passwordResets.usedAt)))
    return tx.update(tables.users)
      .set({ passwordHash, sessionVersion: sql`${tables.users.sessionVersion} + 1` })
      .where(eq(tables.users.id, row.userId))
      .returning().get()
  })
  if (!user) throw passwordResetGoneError('used')
  await clearFailedLogins(user.email)
  await audit(null, user.id, 'password.reset', 'user', user.id, null)
  if (user.disabled) return { id: user.id, email: user.email, name: user.name, role: user.role, signedIn: false }
  await startSession(event, user)
  return { id: user.id, email: user.email, name: user.name, role: user.role, signedIn: true }
})
