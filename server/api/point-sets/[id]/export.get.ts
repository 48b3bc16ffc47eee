// The whole set as a file in our CSV or JSON layout (re-uploadable). Read page by page.
import { ExportQuerySchema, toCsv, toJsonFile, type PointData } from '#shared/pointsets'

const PAGE = 1000

export default defineEventHandler(async (event) => {
  const { pointSet } = await requirePointSetRole(event, routeId(event), 'viewer')
  const { format } = parseWith(getQuery(event), ExportQuerySchema, 'query')
  const view = pointSetView(pointSet)
  if (format === 'csv' && view.kinematics !== 'momenta') {
    throw fieldError(422, 'format', `this point set holds ${view.kinematics === 'mixed' ? 'some points as complex spinors' : 'complex spinors'}; the CSV layout holds real momenta only, so export it as JSON`)
  }
  const all: { idx: number, data: PointData }[] = []
  for (let from = 0; from < pointSet.count; from += PAGE) all.push(...await pointsInRange(pointSet.id, from, from + PAGE))
  const base = `point-set-${pointSet.id}`
  if (format === 'csv') {
    attachment(event, `${base}.csv`, 'text/csv; charset=utf-8')
    return toCsv(all)
  }
  attachment(event, `${base}.json`, 'application/json; charset=utf-8')
  return JSON.stringify(toJsonFile(pointSet.name, pointSet.n, all))
})
