import { desc, eq } from 'drizzle-orm'

export default defineEventHandler(async (event) => {
  const user = await requireUser(event)
  const rows = await useDB().select({ project: tables.projects, role: tables.memberships.role })
    .from(tables.memberships)
    .innerJoin(tables.projects, eq(tables.projects.id, tables.memberships.projectId))
    .where(eq(tables.memberships.userId, user.id))
    .orderBy(desc(tables.projects.updatedAt))
  return rows.map(r => projectView(r.project, r.role))
})
