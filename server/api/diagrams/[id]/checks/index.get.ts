import { and, desc, eq, getTableColumns } from 'drizzle-orm'
import { limitQuery } from '#shared/schemas/common'

// The diagram's checks, newest first, without their request and result payloads.
export default defineEventHandler(async (event) => {
  const { diagram } = await requireDiagramRole(event, routeId(event), 'viewer')
  const { limit } = parseWith(getQuery(event), limitQuery(200, 50), 'query')
  const { request: _request, result: _result, ...columns } = getTableColumns(tables.checks)
  const rows = await useDB().select({ ...columns, createdByName: tables.users.name })
    .from(tables.checks)
    .leftJoin(tables.users, eq(tables.users.id, tables.checks.createdBy))
    .where(and(eq(tables.checks.diagramId, diagram.id), eq(tables.checks.projectId, diagram.projectId)))
    .orderBy(desc(tables.checks.createdAt), desc(tables.checks.id))
    .limit(limit)
  return rows.map(({ createdByName, ...row }) => checkListView(row, createdByName))
})
