import { eq } from 'drizzle-orm'

// The author or an owner of the project deletes a comment.
export default defineEventHandler(async (event) => {
  const access = await requireCommentAccess(event, routeId(event))
  const own = access.comment.userId === access.user.id
  if (!own && access.role !== 'owner') throw httpError(403, 'Only the author or a project owner can delete a comment.')
  await useDB().delete(tables.comments).where(eq(tables.comments.id, access.comment.id))
  if (!own) {
    await audit(access.project.id, access.user.id, 'comment.delete', 'comment', access.comment.id, {
      diagramId: access.comment.diagramId, checkId: access.comment.checkId, author: access.comment.userId,
    })
  }
  setResponseStatus(event, 204)
  return null
})
