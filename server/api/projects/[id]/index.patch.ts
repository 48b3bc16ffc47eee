import { eq } from 'drizzle-orm'
import { ProjectUpdateSchema } from '#shared/schemas/projects'

export default defineEventHandler(async (event) => {
  const { project, user, role } = await requireProjectRole(event, routeId(event), 'owner')
  const body = await readValid(event, ProjectUpdateSchema)
  const updated = await useDB().update(tables.projects)
    .set({ ...body, updatedAt: new Date() })
    .where(eq(tables.projects.id, project.id))
    .returning().get()
  await audit(project.id, user.id, 'project.update', 'project', project.id, body)
  return projectView(updated!, role)
})
