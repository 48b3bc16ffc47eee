export default defineEventHandler(async (event) => {
  const { diagram, role } = await requireDiagramRole(event, routeId(event), 'viewer')
  return { ...diagramView(diagram), role }
})
