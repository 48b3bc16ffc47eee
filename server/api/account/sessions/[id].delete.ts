import { and, eq, isNull } from 'drizzle-orm'

// Ends one of the caller's sessions (this one too, if asked): its cookie stops working at the next
// request. Someone else's session → 404.
export default defineEventHandler(async (event) => {
  const auth = await requireSession(event, 'end sessions')
  const id = routeId(event)
  const db = useDB()
  const row = await db.select().from(tables.sessions).where(and(eq(tables.sessions.id, id), eq(tables.sessions.userId, auth.user.id))).get()
  if (!row) throw httpError(404, 'id: no such session')
  if (!row.revokedAt) {
    await db.update(tables.sessions).set({ revokedAt: new Date() }).where(and(eq(tables.sessions.id, id), isNull(tables.sessions.revokedAt)))
    await audit(null, auth.user.id, 'session.revoke', 'session', id, { userAgent: row.userAgent.slice(0, 120) })
  }
  if (id === auth.sessionId) await endSession(event)
  setResponseStatus(event, 204)
  return null
})
