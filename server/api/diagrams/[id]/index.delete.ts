import { eq } from 'drizzle-orm'

export default defineEventHandler(async (event) => {
  const { diagram, user, project } = await requireDiagramRole(event, routeId(event), 'editor')
  await useDB().delete(tables.diagrams).where(eq(tables.diagrams.id, diagram.id))
  await audit(project.id, user.id, 'diagram.delete', 'diagram', diagram.id, { title: diagram.title })
  setResponseStatus(event, 204)
  return null
})
