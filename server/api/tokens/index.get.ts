import { and, desc, eq, isNull } from 'drizzle-orm'

// The caller's tokens that still work (never the secret: only its hash is stored).
export default defineEventHandler(async (event) => {
  const user = await requireSessionUser(event)
  const rows = await useDB().select().from(tables.apiTokens)
    .where(and(eq(tables.apiTokens.userId, user.id), isNull(tables.apiTokens.revokedAt)))
    .orderBy(desc(tables.apiTokens.createdAt), desc(tables.apiTokens.id))
  return rows.map(tokenView)
})
