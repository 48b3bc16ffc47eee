import type { H3Event } from 'h3'
import { diagramKindOf, loopCutProcessProblem, validateLoopCut } from '#shared/editor/loop-cut'
import { compileRings, type LoopCutDrawingResult } from '#shared/editor/loop-cut-check'
import type { LoopCutDrawingCheck } from '#shared/schemas/loop-cut-drawing'
import type { EditorEdge, EditorNode } from '#shared/editor/types'
import type { Graph } from '#shared/schemas/graph'
import { ENGINE_VERSION } from '#shared/physics/index'

/** Tree checks refuse a loop-cut diagram: its rings are checked by POST /api/diagrams/:id/check-loop-cut. */
export function refuseLoopCut(graph: unknown) {
  if (diagramKindOf(graph as { kind?: unknown } | null) === 'loop-cut') throw fieldError(422, 'graph.kind', 'this is a loop-cut diagram: its rings are checked by POST /api/diagrams/:id/check-loop-cut')
}

export type LoopCutSettings = Omit<LoopCutDrawingCheck, 'graph'>

/**
 * The check of a loop-cut drawing (graph, else the saved one): each ring read as a box of the
 * process, its terms summed and compared with the box's target, in the worker pool. Refusals name
 * their place in the graph (422).
 */
export async function checkLoopCutGraph(event: H3Event, saved: Graph, graphIn: Graph | undefined, settings: LoopCutSettings) {
  const graph = graphIn ?? saved
  if (diagramKindOf(graphIn?.kind ? graphIn : saved) !== 'loop-cut') throw fieldError(422, 'graph.kind', 'this is a tree diagram: its drawing is checked by POST /api/diagrams/:id/check-drawing')
  const process = graph.process ?? saved.process
  const problem = loopCutProcessProblem(process)
  if (problem) throw fieldError(422, problem.field, problem.message)
  const nodes = graph.nodes as EditorNode[]
  const edges: EditorEdge[] = graph.edges
  const v = validateLoopCut(nodes, edges, process)
  // the first thing wrong, named by its place in the graph: Lines first (a corner's complaint may follow from one)
  for (const [i, e] of edges.entries()) {
    const issue = v.edges[e.id]?.[0]
    if (issue) throw fieldError(422, `graph.edges[${i}]`, `line ${e.id}: ${issue.message}`, { edgeId: e.id })
  }
  for (const [i, n] of nodes.entries()) {
    const issue = v.nodes[n.id]?.find(x => x.level === 'error')
    if (issue) throw fieldError(422, `graph.nodes[${i}]`, `${n.type === 'leg' ? 'leg' : `${n.type === 'block' ? 'Block' : `${n.type} vertex`} ${n.id}`}: ${issue.message}`, { nodeId: n.id })
  }
  if (!v.rings.length) throw fieldError(422, 'graph.nodes', 'no ring is drawn: place four corners joined by four Lines with the legs on them, or generate the boxes')
  const req = { helicities: process!.helicities, arithmetic: settings.arithmetic, corners: settings.corners, target: settings.target, ...(settings.kinematics ? { kinematics: settings.kinematics } : {}) }
  precheckProcess({ theory: 'gluon', helicities: req.helicities, arithmetic: req.arithmetic }, 'graph.process.')
  try {
    const result = (await runInPool<LoopCutDrawingResult>({ kind: 'loopCutDrawing', req, rings: compileRings(v.rings) }, poolOptions(event))).value
    return { req, result, rings: v.rings.length }
  }
  catch (e) {
    throw evaluationHttpError(e, processField)
  }
}

/** The stored row's columns of a loop-cut check: what was asked, the summary the lists show. */
export function loopCutCheckColumns(run: Awaited<ReturnType<typeof checkLoopCutGraph>>) {
  const { req, result: r } = run
  const kin = req.kinematics
  const seed = kin && 'seed' in kin && typeof kin.seed === 'number' ? kin.seed : null
  return {
    request: { kind: 'loop-cut' as const, theory: 'gluon' as const, ...req },
    result: r,
    summary: {
      kind: 'loop-cut' as const,
      theory: 'gluon' as const,
      n: r.n,
      helicities: r.helicities,
      target: 'N = 4 box coefficients',
      kinematics: kin?.kind ?? 'random',
      ...(seed !== null ? { seed } : {}),
      corners: req.corners ?? 'closed',
      rings: run.rings,
      boxes: r.boxes.length,
      missing: r.missing.length,
      counts: r.counts,
      value: r.sum,
      deviation: r.deviation,
      warnings: r.warnings.length,
      engineMs: r.ms,
    },
    verdict: r.verdict,
    engineVersion: ENGINE_VERSION,
    arithmetic: r.arithmetic,
    seed,
  }
}
