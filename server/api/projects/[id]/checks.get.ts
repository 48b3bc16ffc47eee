import { desc, eq } from 'drizzle-orm'

/** The shift [i, j⟩ a check used, from its summary (single) or request (batch). */
function shiftOf(summary: Record<string, unknown> | null, request: Record<string, unknown>): number[] | null {
  const s = (summary?.shift ?? request.shift) as unknown
  if (Array.isArray(s)) return s as number[]
  if (s && typeof s === 'object' && Array.isArray((s as { legs?: unknown }).legs)) return (s as { legs: number[] }).legs
  return null
}

function targetOf(summary: Record<string, unknown> | null, request: Record<string, unknown>): string | null {
  if (typeof summary?.target === 'string') return summary.target
  const t = request.target as unknown
  if (typeof t === 'string') return t
  if (t && typeof t === 'object') {
    const o = t as { name?: unknown, formula?: unknown, kind?: unknown }
    if (typeof o.name === 'string') return o.name
    if (typeof o.formula === 'string') return `formula: ${o.formula}`
    if (typeof o.kind === 'string') return o.kind
  }
  return null
}

// Every stored check and batch of the project, newest first: the group's record of what has been
// verified. Payloads stay out; the row carries what the table shows.
export default defineEventHandler(async (event) => {
  const { project } = await requireProjectRole(event, routeId(event), 'viewer')
  const limit = Math.min(1000, Math.max(1, Number(getQuery(event).limit) || 500))
  const c = tables.checks
  const rows = await useDB().select({
    id: c.id, kind: c.kind, status: c.status, diagramId: c.diagramId, diagramVersion: c.diagramVersion,
    diagramTitle: tables.diagrams.title, pointSetId: c.pointSetId, pointSetName: tables.pointSets.name,
    request: c.request, summary: c.summary, verdict: c.verdict, arithmetic: c.arithmetic, seed: c.seed,
    done: c.done, total: c.total, createdByName: tables.users.name, createdAt: c.createdAt,
  }).from(c)
    .leftJoin(tables.users, eq(tables.users.id, c.createdBy))
    .leftJoin(tables.diagrams, eq(tables.diagrams.id, c.diagramId))
    .leftJoin(tables.pointSets, eq(tables.pointSets.id, c.pointSetId))
    .where(eq(c.projectId, project.id))
    .orderBy(desc(c.createdAt), desc(c.id))
    .limit(limit)
  return rows.map(({ request, summary, ...r }) => {
    const req = (request ?? {}) as Record<string, unknown>
    const sum = summary as Record<string, unknown> | null
    const proc = (req.process ?? req) as { theory?: string, helicities?: number[] }
    const worst = sum?.worst as { deviation?: number | null } | null | undefined
    return {
      ...r,
      pointSetName: r.pointSetName ?? (typeof req.pointSetName === 'string' ? req.pointSetName : null),
      process: proc.theory && Array.isArray(proc.helicities) ? { theory: proc.theory, helicities: proc.helicities } : null,
      // a loop-cut diagram's check: boxes are cut, no shift
      loopCut: sum?.kind === 'loop-cut',
      shift: shiftOf(sum, req),
      target: targetOf(sum, req),
      // A single check's deviation; a batch's worst one over its points.
      deviation: typeof sum?.deviation === 'number' ? sum.deviation : (worst?.deviation ?? null),
    }
  })
})
