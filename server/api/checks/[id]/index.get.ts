import { eq } from 'drizzle-orm'

// One check in full: its request, result and provenance.
export default defineEventHandler(async (event) => {
  const { check } = await requireCheckRole(event, routeId(event), 'viewer')
  const user = await useDB().select({ name: tables.users.name }).from(tables.users).where(eq(tables.users.id, check.createdBy)).get()
  return checkView(check, user?.name ?? null)
})
