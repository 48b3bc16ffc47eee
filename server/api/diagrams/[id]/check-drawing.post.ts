import { DrawingCheckSchema } from '#shared/schemas/service'
import type { EvaluateRequest } from '#shared/schemas/evaluate'
import { hasDrawnTerms, type CheckedResponse } from '#shared/editor/drawing/evaluate'
import { packDrawingGraph } from '#shared/editor/drawing/handoff'
import type { EditorEdge, EditorNode } from '#shared/editor/types'

// A check of what is drawn, from the graph in the body, that stores nothing: a viewer exploring an
// expansion (opened Blocks are never saved) checks the canvas it sees. Any member may call it; it
// writes nothing, so read-scope tokens may too. Same evaluation as a stored check (docs/drawing.md).
export default defineEventHandler(async (event) => {
  const id = routeId(event)
  const { diagram } = await requireDiagramRole(event, id, 'viewer')
  const body = await readValid(event, DrawingCheckSchema)
  refuseLoopCut(body.graph.kind ? body.graph : diagram.graph)
  const process = diagramProcess(body.graph.process ? body.graph : diagram.graph)
  const req: EvaluateRequest = {
    kinematics: body.kinematics,
    target: body.target,
    arithmetic: body.arithmetic,
    probeFalloff: false,
    tree: false,
    theory: process.theory,
    ...(process.spin !== undefined ? { spin: process.spin } : {}),
    helicities: process.helicities,
    ...(process.shift ? { shift: process.shift } : {}),
  }
  precheckProcess(req, 'graph.process.')
  // GraphSchema checked node kinds, not each kind's data; drawingGraph keeps only what the drawing reads.
  const graph = body.graph as { nodes: EditorNode[], edges: EditorEdge[] }
  const order = process.order ? { order: process.order } : {}
  try {
    const task = hasDrawnTerms(graph.nodes)
      ? { kind: 'checkDrawing' as const, req, ...order, process, graph: packDrawingGraph(graph) }
      : { kind: 'evaluate' as const, req, ...order }
    const { value } = await runInPool<CheckedResponse>(task, poolOptions(event))
    return value
  }
  catch (e) {
    throw evaluationHttpError(e, processField)
  }
})
