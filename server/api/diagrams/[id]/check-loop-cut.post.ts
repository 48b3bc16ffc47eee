import { LoopCutDrawingCheckSchema } from '#shared/schemas/loop-cut-drawing'
import { diagramKindOf, loopCutProcessProblem, validateLoopCut } from '#shared/editor/loop-cut'
import { compileRings, type LoopCutDrawingResult } from '#shared/editor/loop-cut-check'
import type { EditorEdge, EditorNode } from '#shared/editor/types'
import type { Graph } from '#shared/schemas/graph'

// A check of the rings drawn on a loop-cut diagram (the body's graph, else the saved one): each
// ring read as a box of the process, its terms summed and compared with the box's target. Writes
// nothing, so any member and read-scope tokens may call it.
export default defineEventHandler(async (event) => {
  const { diagram } = await requireDiagramRole(event, routeId(event), 'viewer')
  const body = await readValid(event, LoopCutDrawingCheckSchema)
  const saved = diagram.graph as Graph
  const graph = body.graph ?? saved
  if (diagramKindOf(body.graph?.kind ? body.graph : saved) !== 'loop-cut') throw fieldError(422, 'graph.kind', 'this is a tree diagram: its drawing is checked by POST /api/diagrams/:id/check-drawing')
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
  const req = { helicities: process!.helicities, arithmetic: body.arithmetic, corners: body.corners, target: body.target, ...(body.kinematics ? { kinematics: body.kinematics } : {}) }
  precheckProcess({ theory: 'gluon', helicities: req.helicities, arithmetic: req.arithmetic }, 'graph.process.')
  try {
    return (await runInPool<LoopCutDrawingResult>({ kind: 'loopCutDrawing', req, rings: compileRings(v.rings) }, poolOptions(event))).value
  }
  catch (e) {
    throw evaluationHttpError(e, processField)
  }
})
