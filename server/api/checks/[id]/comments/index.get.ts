export default defineEventHandler(async (event) => {
  const { check, ...access } = await requireCheckRole(event, routeId(event), 'viewer')
  return listComments({ checkId: check.id }, access)
})
