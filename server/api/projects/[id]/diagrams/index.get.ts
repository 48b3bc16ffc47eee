import { desc, eq } from 'drizzle-orm'

export default defineEventHandler(async (event) => {
  const { project } = await requireProjectRole(event, routeId(event), 'viewer')
  const rows = await useDB().select({
    id: tables.diagrams.id,
    projectId: tables.diagrams.projectId,
    title: tables.diagrams.title,
    version: tables.diagrams.version,
    graph: tables.diagrams.graph,
    updatedAt: tables.diagrams.updatedAt,
    updatedBy: tables.diagrams.updatedBy,
  }).from(tables.diagrams).where(eq(tables.diagrams.projectId, project.id)).orderBy(desc(tables.diagrams.updatedAt))
  // The list carries the process (for a summary line), not the whole canvas.
  return rows.map(({ graph, ...d }) => ({ ...d, process: (graph as { process?: unknown }).process ?? null, nodes: ((graph as { nodes?: unknown[] }).nodes ?? []).length }))
})
