import { desc, eq } from 'drizzle-orm'

export default defineEventHandler(async (event) => {
  const { pointSet } = await requirePointSetRole(event, routeId(event), 'viewer')
  const rows = await useDB().select().from(tables.checks)
    .where(eq(tables.checks.pointSetId, pointSet.id)).orderBy(desc(tables.checks.createdAt), desc(tables.checks.id))
  return Promise.all(rows.filter(r => r.kind === 'batch').map(batchView))
})
