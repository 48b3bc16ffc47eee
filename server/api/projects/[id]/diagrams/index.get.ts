import { desc, eq, sql } from 'drizzle-orm'
import { diagramKindOf } from '#shared/editor/loop-cut'

export default defineEventHandler(async (event) => {
  const { project } = await requireProjectRole(event, routeId(event), 'viewer')
  const db = useDB()
  const rows = await db.select({
    id: tables.diagrams.id,
    projectId: tables.diagrams.projectId,
    title: tables.diagrams.title,
    version: tables.diagrams.version,
    graph: tables.diagrams.graph,
    updatedAt: tables.diagrams.updatedAt,
    updatedBy: tables.diagrams.updatedBy,
    updatedByName: tables.users.name,
  }).from(tables.diagrams)
    .leftJoin(tables.users, eq(tables.users.id, tables.diagrams.updatedBy))
    .where(eq(tables.diagrams.projectId, project.id)).orderBy(desc(tables.diagrams.updatedAt))
  // The newest finished check of each diagram (SQLite takes the bare columns from the max row).
  const c = tables.checks
  const latest = await db.select({
    diagramId: c.diagramId,
    id: c.id,
    kind: c.kind,
    verdict: c.verdict,
    diagramVersion: c.diagramVersion,
    createdAt: sql<number>`max(${c.createdAt})`,
  }).from(c).where(sql`${c.projectId} = ${project.id} and ${c.diagramId} is not null and ${c.verdict} is not null`).groupBy(c.diagramId)
  const byDiagram = new Map(latest.map(l => [l.diagramId, { id: l.id, kind: l.kind, verdict: l.verdict, diagramVersion: l.diagramVersion, createdAt: new Date(Number(l.createdAt)) }]))
  // The list carries the kind and the process (for a summary line), not the whole canvas.
  return rows.map(({ graph, ...d }) => ({
    ...d,
    kind: diagramKindOf(graph),
    process: graph.process ?? null,
    nodes: (graph.nodes ?? []).length,
    latestCheck: byDiagram.get(d.id) ?? null,
  }))
})
