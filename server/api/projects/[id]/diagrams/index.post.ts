import { DiagramCreateSchema } from '#shared/schemas/projects'

export default defineEventHandler(async (event) => {
  const { project, user } = await requireProjectRole(event, routeId(event), 'editor')
  const body = await readValid(event, DiagramCreateSchema)
  const diagram = await useDB().transaction(async (tx) => {
    const d = await tx.insert(tables.diagrams).values({
      projectId: project.id, title: body.title, graph: body.graph, version: 1, createdBy: user.id, updatedBy: user.id,
    }).returning().get()
    await tx.insert(tables.diagramRevisions).values({ diagramId: d.id, version: 1, title: d.title, graph: d.graph, savedBy: user.id, note: 'created' })
    return d
  })
  await audit(project.id, user.id, 'diagram.create', 'diagram', diagram.id, { title: diagram.title })
  setResponseStatus(event, 201)
  return diagramView(diagram)
})
