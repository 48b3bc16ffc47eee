// The one access rule of Polewright. Every route inside a project goes through here.
// Non-members get 404 (the project's existence is not revealed); a role too low gets 403.
import type { H3Event } from 'h3'
import { and, eq } from 'drizzle-orm'
import type { ProjectRole } from '#shared/types/db'

export const roleRank: Record<ProjectRole, number> = { viewer: 1, editor: 2, owner: 3 }

export interface ProjectAccess {
  auth: AuthContext
  user: AuthUser
  role: ProjectRole
  project: typeof tables.projects.$inferSelect
}

export async function requireProjectRole(event: H3Event, projectId: number, min: ProjectRole): Promise<ProjectAccess> {
  const auth = await requireAuth(event)
  const row = await useDB().select({ project: tables.projects, role: tables.memberships.role })
    .from(tables.projects)
    .innerJoin(tables.memberships, and(eq(tables.memberships.projectId, tables.projects.id), eq(tables.memberships.userId, auth.user.id)))
    .where(eq(tables.projects.id, projectId))
    .get()
  if (!row) throw httpError(404, 'project: not found')
  if (roleRank[row.role] < roleRank[min]) {
    throw httpError(403, `This needs the ${min} role in project "${row.project.name}"; you are a ${row.role}.`, { role: row.role, required: min })
  }
  if (min !== 'viewer' && !event.method.match(/^(GET|HEAD)$/)) requireWriteScope(auth)
  return { auth, user: auth.user, role: row.role, project: row.project }
}

/** Access to a row that belongs to a project: a missing row and a non-member both get 404. */
async function requireRowInProject<T extends { projectId: number }>(event: H3Event, row: T | undefined, label: string, min: ProjectRole) {
  if (!row) {
    await requireAuth(event)
    throw httpError(404, `${label}: not found`)
  }
  try {
    return { ...(await requireProjectRole(event, row.projectId, min)), row }
  }
  catch (e) {
    if ((e as { statusCode?: number }).statusCode === 404) throw httpError(404, `${label}: not found`)
    throw e
  }
}

export async function requireDiagramRole(event: H3Event, diagramId: number, min: ProjectRole) {
  const row = await useDB().select().from(tables.diagrams).where(eq(tables.diagrams.id, diagramId)).get()
  const { row: diagram, ...access } = await requireRowInProject(event, row, 'diagram', min)
  return { ...access, diagram }
}

export async function requireCheckRole(event: H3Event, checkId: number, min: ProjectRole) {
  const row = await useDB().select().from(tables.checks).where(eq(tables.checks.id, checkId)).get()
  const { row: check, ...access } = await requireRowInProject(event, row, 'check', min)
  return { ...access, check }
}

export async function requirePointSetRole(event: H3Event, pointSetId: number, min: ProjectRole) {
  const row = await useDB().select().from(tables.pointSets).where(eq(tables.pointSets.id, pointSetId)).get()
  const { row: pointSet, ...access } = await requireRowInProject(event, row, 'point set', min)
  return { ...access, pointSet }
}

export async function requireSiteAdmin(event: H3Event) {
  const auth = await requireAuth(event)
  if (auth.user.role !== 'admin') throw httpError(403, 'This page is for site administrators.')
  return auth
}

/** Records who did what to which project, for the activity list. */
export async function audit(projectId: number | null, userId: number | null, action: string, subjectType = '', subjectId: number | null = null, detail: Record<string, unknown> | null = null) {
  await useDB().insert(tables.auditEvents).values({ projectId, userId, action, subjectType, subjectId, detail })
}
