import { ProjectCreateSchema } from '#shared/schemas/projects'

export default defineEventHandler(async (event) => {
  const auth = await requireAuth(event)
  requireWriteScope(auth)
  const body = await readValid(event, ProjectCreateSchema)
  const db = useDB()
  const project = await db.transaction(async (tx) => {
    const p = await tx.insert(tables.projects).values({ name: body.name, description: body.description ?? '', createdBy: auth.user.id }).returning().get()
    await tx.insert(tables.memberships).values({ projectId: p.id, userId: auth.user.id, role: 'owner' })
    return p
  })
  await audit(project.id, auth.user.id, 'project.create', 'project', project.id, { name: project.name })
  setResponseStatus(event, 201)
  return projectView(project, 'owner')
})
