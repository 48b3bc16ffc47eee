import { and, eq, sql } from 'drizzle-orm'
import { DiagramUpdateSchema } from '#shared/schemas/projects'

// Optimistic concurrency: one atomic UPDATE … WHERE id = ? AND version = ? decides who wins;
// a stale version gets 409 and nothing is overwritten. Every saved version is kept as a revision.
export default defineEventHandler(async (event) => {
  const id = routeId(event)
  const { diagram, user, project } = await requireDiagramRole(event, id, 'editor')
  const body = await readValid(event, DiagramUpdateSchema)
  const db = useDB()
  const saved = await db.transaction(async (tx) => {
    const row = await tx.update(tables.diagrams)
      .set({
        ...(body.title !== undefined && { title: body.title }),
        ...(body.graph !== undefined && { graph: body.graph }),
        version: sql`${tables.diagrams.version} + 1`,
        updatedBy: user.id,
        updatedAt: new Date(),
      })
      .where(and(eq(tables.diagrams.id, id), eq(tables.diagrams.version, body.version)))
      .returning().get()
    if (!row) return null
    await tx.insert(tables.diagramRevisions).values({
      diagramId: id, version: row.version, title: row.title, graph: row.graph, savedBy: user.id, note: body.note ?? '',
    })
    return row
  })
  if (!saved) {
    const current = await db.select({ version: tables.diagrams.version, updatedBy: tables.diagrams.updatedBy }).from(tables.diagrams).where(eq(tables.diagrams.id, id)).get()
    throw fieldError(409, 'version', `the diagram is now at version ${current?.version ?? '?'}, not ${body.version}; someone saved in between, and nothing of theirs or yours was overwritten`, { current: current?.version ?? null })
  }
  await audit(project.id, user.id, 'diagram.save', 'diagram', diagram.id, { version: saved.version, title: saved.title })
  return diagramView(saved)
})
