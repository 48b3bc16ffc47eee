import { and, eq, isNull } from 'drizzle-orm'

// Revokes one of the caller's tokens; it stops working on its next request. Someone else's → 404.
export default defineEventHandler(async (event) => {
  const user = await requireSessionUser(event)
  const id = routeId(event)
  const db = useDB()
  const row = await db.select().from(tables.apiTokens).where(and(eq(tables.apiTokens.id, id), eq(tables.apiTokens.userId, user.id))).get()
  if (!row) throw httpError(404, 'token: not found')
  if (!row.revokedAt) {
    await db.update(tables.apiTokens).set({ revokedAt: new Date() }).where(and(eq(tables.apiTokens.id, id), isNull(tables.apiTokens.revokedAt)))
    await audit(null, user.id, 'token.revoke', 'token', id, { name: row.name })
  }
  setResponseStatus(event, 204)
  return null
})
