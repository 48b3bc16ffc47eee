// A batch check with its progress (for polling) and, once finished, its summary.
export default defineEventHandler(async (event) => {
  const { check, role } = await requireCheckRole(event, routeId(event), 'viewer')
  return { ...(await batchView(check)), role }
})
