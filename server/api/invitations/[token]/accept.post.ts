// The signed-in caller joins the project with the invited role. Single use: a second use → 410.
export default defineEventHandler(async (event) => {
  const auth = await requireAuth(event)
  requireWriteScope(auth)
  return acceptInvitation(getRouterParam(event, 'token') ?? '', auth.user)
})
