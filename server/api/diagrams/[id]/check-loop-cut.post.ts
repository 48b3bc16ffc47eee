import { LoopCutDrawingCheckSchema } from '#shared/schemas/loop-cut-drawing'

// A check of the rings drawn on a loop-cut diagram (the body's graph, else the saved one): each
// ring read as a box of the process, its terms summed and compared with the box's target. Writes
// nothing, so any member and read-scope tokens may call it; POST /api/diagrams/:id/checks stores one.
export default defineEventHandler(async (event) => {
  const { diagram } = await requireDiagramRole(event, routeId(event), 'viewer')
  const { graph, ...settings } = await readValid(event, LoopCutDrawingCheckSchema)
  return (await checkLoopCutGraph(event, diagram.graph, graph, settings)).result
})
