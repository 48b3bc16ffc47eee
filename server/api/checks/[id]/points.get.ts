// The per-point table of a batch check, paged (view=rows), or every point as parallel arrays for
// the plots (view=columns: idx, deviation, minInvariant, verdict; at most 10,000 points per set).
import { and, asc, count, desc, eq, sql } from 'drizzle-orm'
import { CheckPointsQuerySchema } from '#shared/pointsets'

export default defineEventHandler(async (event) => {
  const { check } = await requireCheckRole(event, routeId(event), 'viewer')
  const q = parseWith(getQuery(event), CheckPointsQuerySchema, 'query')
  const cp = tables.checkPoints
  const db = useDB()
  if (q.view === 'columns') {
    const rows = await db.select({ idx: cp.idx, deviation: cp.deviation, minInvariant: cp.minInvariant, verdict: cp.verdict })
      .from(cp).where(eq(cp.checkId, check.id)).orderBy(asc(cp.idx))
    return {
      total: rows.length,
      idx: rows.map(r => r.idx),
      deviation: rows.map(r => r.deviation),
      minInvariant: rows.map(r => r.minInvariant),
      verdict: rows.map(r => r.verdict),
    }
  }
  const where = q.verdict ? and(eq(cp.checkId, check.id), eq(cp.verdict, q.verdict)) : eq(cp.checkId, check.id)
  const order = q.sort === 'deviation' ? [sql`${cp.deviation} is null`, desc(cp.deviation)] : q.sort === 'minInvariant' ? [asc(cp.minInvariant)] : [asc(cp.idx)]
  const [rows, total] = await Promise.all([
    db.select().from(cp).where(where).orderBy(...order, asc(cp.idx)).limit(q.limit).offset(q.offset),
    db.select({ c: count() }).from(cp).where(where).get(),
  ])
  const labels = await pointLabels(check.pointSetId, rows.map(r => r.idx))
  return {
    total: total?.c ?? 0,
    offset: q.offset,
    limit: q.limit,
    items: rows.map(({ checkId: _c, ...r }) => ({ ...r, label: labels.get(r.idx) ?? String(r.idx + 1) })),
  }
})
