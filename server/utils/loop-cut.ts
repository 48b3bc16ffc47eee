import { diagramKindOf } from '#shared/editor/loop-cut'

/** Tree checks refuse a loop-cut diagram: its rings are checked by POST /api/diagrams/:id/check-loop-cut. */
export function refuseLoopCut(graph: unknown) {
  if (diagramKindOf(graph as { kind?: unknown } | null) === 'loop-cut') throw fieldError(422, 'graph.kind', 'this is a loop-cut diagram: its rings are checked by POST /api/diagrams/:id/check-loop-cut')
}
