import { desc, eq } from 'drizzle-orm'

export default defineEventHandler(async (event) => {
  const { diagram } = await requireDiagramRole(event, routeId(event), 'viewer')
  return useDB().select({
    version: tables.diagramRevisions.version,
    title: tables.diagramRevisions.title,
    note: tables.diagramRevisions.note,
    savedAt: tables.diagramRevisions.savedAt,
    savedBy: tables.diagramRevisions.savedBy,
    savedByName: tables.users.name,
  }).from(tables.diagramRevisions)
    .leftJoin(tables.users, eq(tables.users.id, tables.diagramRevisions.savedBy))
    .where(eq(tables.diagramRevisions.diagramId, diagram.id))
    .orderBy(desc(tables.diagramRevisions.version))
})
