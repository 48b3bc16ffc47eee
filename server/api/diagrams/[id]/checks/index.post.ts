import { CheckRunSchema } from '#shared/schemas/service'
import { LoopCutCheckRunSchema } from '#shared/schemas/loop-cut-drawing'
import { diagramKindOf } from '#shared/editor/loop-cut'
import type { EvaluateRequest } from '#shared/schemas/evaluate'
import { hasDrawnTerms, type CheckedResponse } from '#shared/editor/drawing/evaluate'
import { packDrawingGraph } from '#shared/editor/drawing/handoff'
import type { EditorEdge, EditorNode } from '#shared/editor/types'

// Runs a check: the diagram's process (theory, spin, helicities, colour order, shift) at the
// point in the body, stored with its provenance (engine version, arithmetic, seed, duration, who).
// A diagram whose graph has drawn terms is checked as drawn: the value, deviation and verdict are
// the drawing's residue sum against the target, with the comparison in `result.drawing`.
// A loop-cut diagram's saved rings are checked as POST /api/diagrams/:id/check-loop-cut does, and stored.
export default defineEventHandler(async (event) => {
  const id = routeId(event)
  const { diagram, user, project } = await requireDiagramRole(event, id, 'editor')
  type Columns = Pick<typeof tables.checks.$inferInsert, 'request' | 'result' | 'summary' | 'verdict' | 'engineVersion' | 'arithmetic' | 'seed'>
  // One stored row per run (tree or loop cut), its audit entry, and 201.
  async function store(columns: Columns, t0: number, auditExtra: Record<string, unknown> = {}) {
    const row = await useDB().insert(tables.checks).values({
      projectId: project.id, diagramId: diagram.id, diagramVersion: diagram.version, kind: 'single', status: 'done', ...columns,
      durationMs: Math.round((performance.now() - t0) * 1000) / 1000, done: 1, total: 1, createdBy: user.id,
    }).returning().get()
    await audit(project.id, user.id, 'check.run', 'check', row.id, { diagramId: diagram.id, diagramVersion: diagram.version, title: diagram.title, verdict: row.verdict, ...auditExtra })
    setResponseStatus(event, 201)
    return row
  }
  if (diagramKindOf(diagram.graph) === 'loop-cut') {
    const settings = await readValid(event, LoopCutCheckRunSchema)
    const t0 = performance.now()
    const columns = loopCutCheckColumns(await checkLoopCutGraph(event, diagram.graph, undefined, settings))
    return checkView(await store(columns, t0, { kind: 'loop-cut' }), user.name)
  }
  const body = await readValid(event, CheckRunSchema)
  const process = diagramProcess(diagram.graph)
  const req: EvaluateRequest = {
    ...body,
    theory: process.theory,
    ...(process.spin !== undefined ? { spin: process.spin } : {}),
    helicities: process.helicities,
    ...(process.species ? { species: process.species } : {}),
    ...(process.shift ? { shift: process.shift } : {}),
  }
  precheckProcess(req, 'graph.process.')
  const t0 = performance.now()
  // Saved through GraphSchema (node kinds checked, not each kind's data); drawingGraph keeps only what it reads.
  const graph = diagram.graph as { nodes?: EditorNode[], edges?: EditorEdge[] }
  const drawn = hasDrawnTerms(graph.nodes ?? [])
  const order = process.order ? { order: process.order } : {}
  let result: CheckedResponse
  try {
    result = drawn
      ? (await runInPool<CheckedResponse>({ kind: 'checkDrawing', req, ...order, process, graph: packDrawingGraph(graph) }, poolOptions(event))).value
      : (await runInPool<CheckedResponse>({ kind: 'evaluate', req, ...order }, poolOptions(event))).value
  }
  catch (e) {
    throw evaluationHttpError(e, processField)
  }
  const seed = 'seed' in req.kinematics && typeof req.kinematics.seed === 'number' ? req.kinematics.seed : null
  const row = await store({
    request: { ...req, ...(process.order ? { order: process.order } : {}) },
    result,
    summary: checkSummary(req, process, result),
    verdict: result.verdict,
    engineVersion: result.engine.version,
    arithmetic: result.arithmetic,
    seed,
  }, t0)
  // The result as evaluated (the row holds the same), typed as never null.
  return { ...checkView(row, user.name), result }
})
