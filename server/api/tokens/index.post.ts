import { TOKEN_PREFIX, TokenCreateSchema } from '#shared/schemas/collab'

// 201 with the token itself: shown this once, stored only as its SHA-256.
export default defineEventHandler(async (event) => {
  const user = await requireSessionUser(event)
  const body = await readValid(event, TokenCreateSchema)
  const token = newSecret(TOKEN_PREFIX)
  const row = await useDB().insert(tables.apiTokens).values({
    userId: user.id, name: body.name, scope: body.scope, tokenHash: hashSecret(token),
  }).returning().get()
  await audit(null, user.id, 'token.create', 'token', row.id, { name: row.name, scope: row.scope })
  setResponseStatus(event, 201)
  return { ...tokenView(row), token }
})
