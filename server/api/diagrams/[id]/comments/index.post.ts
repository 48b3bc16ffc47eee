// Any member, viewers included, may comment; a read-only token may not.
export default defineEventHandler(async (event) => {
  const { diagram, ...access } = await requireDiagramRole(event, routeId(event), 'viewer')
  return createComment(event, access, { diagramId: diagram.id, checkId: null, title: diagram.title })
})
