// The per-point table as CSV: one row per point (re/im of value and target, deviation, verdict).
// `point` counts from 1, as the pages number points (the JSON views keep the 0-based `idx`).
import Papa from 'papaparse'
import { csvUnparseSafe } from '#shared/csv-safe'

export default defineEventHandler(async (event) => {
  const { check } = await requireCheckRole(event, routeId(event), 'viewer')
  const fields = ['point', 'label', 'value_re', 'value_im', 'target_re', 'target_im', 'deviation', 'verdict', 'min_invariant', 'message']
  const parts: string[] = [Papa.unparse({ fields, data: [] }, csvUnparseSafe).trimEnd()]
  for await (const rows of checkPointPages(check.id, check.pointSetId)) {
    parts.push(Papa.unparse(rows.map((r) => {
      const v = r.value as [number, number] | null
      const t = r.target as [number, number] | null
      return [r.idx + 1, r.label, v?.[0] ?? '', v?.[1] ?? '', t?.[0] ?? '', t?.[1] ?? '', r.deviation ?? '', r.verdict, r.minInvariant ?? '', r.message ?? '']
    }), csvUnparseSafe))
  }
  attachment(event, `check-${check.id}-points.csv`, 'text/csv; charset=utf-8')
  return `${parts.join('\n')}\n`
})
