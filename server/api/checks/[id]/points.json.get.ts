// The per-point table as JSON: the check's provenance and summary, then one object per point.
export default defineEventHandler(async (event) => {
  const { check } = await requireCheckRole(event, routeId(event), 'viewer')
  const points: unknown[] = []
  for await (const rows of checkPointPages(check.id, check.pointSetId)) points.push(...rows)
  attachment(event, `check-${check.id}-points.json`, 'application/json; charset=utf-8')
  const view = await batchView(check)
  return JSON.stringify({
    check: { id: view.id, diagramId: view.diagramId, diagramVersion: view.diagramVersion, pointSetId: view.pointSetId, status: view.status, engineVersion: view.engineVersion, arithmetic: view.arithmetic, request: view.request, summary: view.summary, createdAt: view.createdAt },
    points,
  })
})
