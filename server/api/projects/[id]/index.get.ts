export default defineEventHandler(async (event) => {
  const { project, role } = await requireProjectRole(event, routeId(event), 'viewer')
  return projectView(project, role)
})
