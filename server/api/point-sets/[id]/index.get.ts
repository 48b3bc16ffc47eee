export default defineEventHandler(async (event) => {
  const { pointSet, role } = await requirePointSetRole(event, routeId(event), 'viewer')
  return { ...pointSetView(pointSet), role }
})
