// The per-point table as CSV: one row per point (re/im of value and target, deviation, verdict).
import Papa from 'papaparse'
import { csvUnparseSafe } from '../../../../shared/csv-safe'

export default defineEventHandler(async (event) => {
  const { check } = await requireCheckRole(event, routeId(event), 'viewer')
  const fields = ['idx', 'label', 'value_re', 'value_im', 'target_re', 'target_im', 'deviation', 'verdict', 'min_invariant', 'message']
  const parts: string[] = [Papa.unparse({ fields, data: [] }, csvUnparseSafe).trimEnd()]
  for await (const rows of checkPointPages(check.id, check.pointSetId)) {
    parts.push(Papa.unparse(rows.map((r) => {
      const v = r.value as [number, number] | null
      const t = r.target as [number, number] | null
      return [r.idx, r.label, v?.[0] ?? '', v?.[1] ?? '', t?.[0] ?? '', t?.[1] ?? '', r.deviation ?? '', r.verdict, r.minInvariant ?? '', r.message ?? '']
    }), csvUnparseSafe))
  }
  attachment(event, `check-${check.id}-points.csv`, 'text/csv; charset=utf-8')
  return `${parts.join('\n')}\n`
})
