export default defineEventHandler(async (event) => {
  const { diagram, ...access } = await requireDiagramRole(event, routeId(event), 'viewer')
  return listComments({ diagramId: diagram.id }, access)
})
