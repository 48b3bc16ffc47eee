import { DiagramDuplicateSchema } from '#shared/schemas/projects'

// A copy of the diagram's current canvas with all its settings (process, shift, target, colour
// order and layout live in the graph), as a new diagram at version 1 in the same project.
// Checks, comments and revisions stay with the original.
export default defineEventHandler(async (event) => {
  const { diagram, user, project } = await requireDiagramRole(event, routeId(event), 'editor')
  const body = await readValid(event, DiagramDuplicateSchema)
  const title = body.title ?? `${diagram.title} (copy)`.slice(0, 200)
  const copy = await useDB().transaction(async (tx) => {
    const d = await tx.insert(tables.diagrams).values({
      projectId: project.id, title, graph: diagram.graph, version: 1, createdBy: user.id, updatedBy: user.id,
    }).returning().get()
    await tx.insert(tables.diagramRevisions).values({ diagramId: d.id, version: 1, title, graph: d.graph, savedBy: user.id, note: `copied from "${diagram.title}" v${diagram.version}` })
    return d
  })
  await audit(project.id, user.id, 'diagram.duplicate', 'diagram', copy.id, { title, from: diagram.id, fromVersion: diagram.version })
  setResponseStatus(event, 201)
  return diagramView(copy)
})
