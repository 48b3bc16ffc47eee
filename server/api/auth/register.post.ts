import { eq } from 'drizzle-orm'
import { RegisterSchema } from '#shared/schemas/auth'

export default defineEventHandler(async (event) => {
  const body = await readValid(event, RegisterSchema)
  assertStrongPassword(body.password, [body.email, body.name])
  const db = useDB()
  const existing = await db.select({ id: tables.users.id }).from(tables.users).where(eq(tables.users.email, body.email)).get()
  if (existing) throw fieldError(409, 'email', 'an account with this e-mail already exists')
  const passwordHash = await hashPassword(body.password)
  const user = await db.insert(tables.users)
    .values({ email: body.email, name: body.name, passwordHash })
    .onConflictDoNothing()
    .returning()
    .get()
  if (!user) throw fieldError(409, 'email', 'an account with this e-mail already exists')
  await startSession(event, user)
  setResponseStatus(event, 201)
  return { id: user.id, email: user.email, name: user.name, role: user.role }
})
