import { asc } from 'drizzle-orm'

export default defineEventHandler(async (event) => {
  await requireSiteAdmin(event)
  return useDB().select({
    id: tables.users.id, email: tables.users.email, name: tables.users.name, role: tables.users.role,
    disabled: tables.users.disabled, createdAt: tables.users.createdAt,
  }).from(tables.users).orderBy(asc(tables.users.email))
})
