import { and, desc, eq, gt, isNull } from 'drizzle-orm'

// The caller's open sessions (browser, last seen), the current one marked. Session only: a token
// cannot see or end sessions.
export default defineEventHandler(async (event) => {
  const auth = await requireSession(event, 'list sessions')
  const now = Date.now()
  const rows = await useDB().select().from(tables.sessions)
    .where(and(eq(tables.sessions.userId, auth.user.id), isNull(tables.sessions.revokedAt), gt(tables.sessions.expiresAt, new Date(now))))
    .orderBy(desc(tables.sessions.lastSeenAt), desc(tables.sessions.id))
  return rows.filter(r => sessionOpen(r, now)).map(r => ({
    id: r.id,
    userAgent: r.userAgent,
    createdAt: r.createdAt,
    lastSeenAt: r.lastSeenAt,
    expiresAt: r.expiresAt,
    current: r.id === auth.sessionId,
  }))
})
