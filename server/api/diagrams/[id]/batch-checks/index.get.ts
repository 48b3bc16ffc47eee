import { and, desc, eq } from 'drizzle-orm'

export default defineEventHandler(async (event) => {
  const { diagram } = await requireDiagramRole(event, routeId(event), 'viewer')
  const rows = await useDB().select().from(tables.checks)
    .where(and(eq(tables.checks.diagramId, diagram.id), eq(tables.checks.kind, 'batch')))
    .orderBy(desc(tables.checks.createdAt), desc(tables.checks.id))
  return Promise.all(rows.map(batchView))
})
