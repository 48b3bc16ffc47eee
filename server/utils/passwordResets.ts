// One-time password reset links: the token is stored only as its SHA-256 and works for one hour.
import { eq } from 'drizzle-orm'

export type PasswordResetStatus = 'pending' | 'used' | 'expired'

export async function findPasswordReset(token: string) {
  if (!token || token.length > 200) return undefined
  return useDB().select().from(tables.passwordResets).where(eq(tables.passwordResets.tokenHash, hashSecret(token))).get()
}

export function passwordResetStatus(row: typeof tables.passwordResets.$inferSelect, now = Date.now()): PasswordResetStatus {
  if (row.usedAt) return 'used'
  if (row.expiresAt.getTime() <= now) return 'expired'
  return 'pending'
}

export function passwordResetGoneError(status: Exclude<PasswordResetStatus, 'pending'>) {
  return fieldError(410, 'token', status === 'used'
    ? 'this reset link was already used; a link works only once. Ask for a new one on the sign-in page.'
    : 'this reset link has expired (links are valid for one hour). Ask for a new one on the sign-in page.', { status })
}
