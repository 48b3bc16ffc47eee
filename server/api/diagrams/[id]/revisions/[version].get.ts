import { and, eq } from 'drizzle-orm'
import type { GraphView } from '#shared/schemas/graph'

export default defineEventHandler(async (event) => {
  const { diagram } = await requireDiagramRole(event, routeId(event), 'viewer')
  const version = routeId(event, 'version')
  const row = await useDB().select().from(tables.diagramRevisions)
    .where(and(eq(tables.diagramRevisions.diagramId, diagram.id), eq(tables.diagramRevisions.version, version))).get()
  if (!row) throw httpError(404, `version: diagram ${diagram.id} has no version ${version}`)
  const graph: GraphView = row.graph
  return { ...row, graph }
})
