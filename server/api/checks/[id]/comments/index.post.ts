import { eq } from 'drizzle-orm'

// Any member, viewers included, may comment on a check; a read-only token may not.
export default defineEventHandler(async (event) => {
  const { check, ...access } = await requireCheckRole(event, routeId(event), 'viewer')
  const diagram = check.diagramId
    ? await useDB().select({ title: tables.diagrams.title }).from(tables.diagrams).where(eq(tables.diagrams.id, check.diagramId)).get()
    : undefined
  return createComment(event, access, { diagramId: check.diagramId, checkId: check.id, title: diagram?.title ?? '' })
})
