import { eq } from 'drizzle-orm'
import { CommentBodySchema } from '#shared/schemas/collab'

// Only the author edits a comment (an owner may delete it, not put words in someone's mouth).
export default defineEventHandler(async (event) => {
  const access = await requireCommentAccess(event, routeId(event))
  if (access.comment.userId !== access.user.id) throw httpError(403, 'Only the author can edit a comment.')
  const { body } = await readValid(event, CommentBodySchema)
  const row = await useDB().update(tables.comments).set({ body, updatedAt: new Date() })
    .where(eq(tables.comments.id, access.comment.id)).returning().get()
  if (!row) throw httpError(404, 'comment: not found')
  return commentView(row, access.user.name, { id: access.user.id, role: access.role })
})
