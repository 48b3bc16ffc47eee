export default defineEventHandler(async (event) => {
  const { project } = await requireProjectRole(event, routeId(event), 'viewer')
  return listMembers(project.id)
})
