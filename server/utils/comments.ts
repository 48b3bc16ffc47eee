// Comments on diagrams and checks. Any member may read and write them (reviewing is a viewer's
// job); authors edit their own; authors and owners delete.
import { and, asc, eq, isNull } from 'drizzle-orm'
import type { H3Event } from 'h3'
import { CommentBodySchema } from '#shared/schemas/collab'
import type { CommentRow, ProjectRole } from '#shared/types/db'

export function commentView(row: CommentRow, authorName: string | null, me: { id: number, role: ProjectRole }) {
  return {
    id: row.id,
    projectId: row.projectId,
    diagramId: row.diagramId,
    checkId: row.checkId,
    body: row.body,
    author: { id: row.userId, name: authorName ?? 'a former member' },
    createdAt: row.createdAt,
    updatedAt: row.updatedAt,
    edited: row.updatedAt.getTime() > row.createdAt.getTime(),
    canEdit: row.userId === me.id,
    canDelete: row.userId === me.id || me.role === 'owner',
  }
}

/** The thread of one diagram (its own comments, not those on its checks) or of one check. */
export async function listComments(target: { diagramId: number } | { checkId: number }, access: ProjectAccess) {
  const where = 'checkId' in target
    ? eq(tables.comments.checkId, target.checkId)
    : and(eq(tables.comments.diagramId, target.diagramId), isNull(tables.comments.checkId))
  const rows = await useDB().select({ comment: tables.comments, name: tables.users.name })
    .from(tables.comments)
    .leftJoin(tables.users, eq(tables.users.id, tables.comments.userId))
    .where(and(eq(tables.comments.projectId, access.project.id), where))
    .orderBy(asc(tables.comments.createdAt), asc(tables.comments.id))
    .limit(1000)
  return rows.map(r => commentView(r.comment, r.name, { id: access.user.id, role: access.role }))
}

export async function createComment(event: H3Event, access: ProjectAccess, target: { diagramId: number | null, checkId: number | null, title: string }) {
  // Viewers may comment, so requireProjectRole(…, 'viewer') did not check the token's scope.
  requireWriteScope(access.auth)
  const { body } = await readValid(event, CommentBodySchema)
  // Both stamps in milliseconds and equal, so any later edit shows as one.
  const now = new Date()
  const row = await useDB().insert(tables.comments).values({
    projectId: access.project.id, diagramId: target.diagramId, checkId: target.checkId, userId: access.user.id, body, createdAt: now, updatedAt: now,
  }).returning().get()
  await audit(access.project.id, access.user.id, 'comment.create', 'comment', row.id, {
    diagramId: target.diagramId, checkId: target.checkId, title: target.title, excerpt: excerpt(body),
  })
  setResponseStatus(event, 201)
  return commentView(row, access.user.name, { id: access.user.id, role: access.role })
}

/** A comment and the caller's access to its project; a missing comment and a non-member both get 404. */
export async function requireCommentAccess(event: H3Event, commentId: number) {
  const row = await useDB().select().from(tables.comments).where(eq(tables.comments.id, commentId)).get()
  if (!row) {
    await requireAuth(event)
    throw httpError(404, 'comment: not found')
  }
  try {
    const access = await requireProjectRole(event, row.projectId, 'viewer')
    requireWriteScope(access.auth)
    return { ...access, comment: row }
  }
  catch (e) {
    if ((e as { statusCode?: number }).statusCode === 404) throw httpError(404, 'comment: not found')
    throw e
  }
}

function excerpt(body: string) {
  const flat = body.replace(/\s+/g, ' ').trim()
  return flat.length > 80 ? `${flat.slice(0, 79)}…` : flat
}

/** Demo review comments (invented people and words), once per demo project. */
export async function seedDemoComments(projectId: number, userIds: number[]) {
  const db = useDB()
  if (await db.select({ id: tables.comments.id }).from(tables.comments).where(eq(tables.comments.projectId, projectId)).get()) return
  const [ines, tomas, mira] = userIds
  const diagrams = await db.select({ id: tables.diagrams.id, title: tables.diagrams.title }).from(tables.diagrams).where(eq(tables.diagrams.projectId, projectId))
  const byTitle = (start: string) => diagrams.find(d => d.title.startsWith(start))
  const notes: { diagram?: { id: number, title: string }, userId?: number, body: string }[] = [
    { diagram: byTitle('Five gluons'), userId: tomas, body: 'Against Parke–Taylor at a handful of seeded points: agrees every time. Only one channel contributes under this shift.' },
    { diagram: byTitle('Five gluons'), userId: mira, body: 'Could we also run it at physical kinematics before it goes into the draft? I would like to see $\\langle 1 2\\rangle^4$ over the Parke–Taylor denominator checked there too.' },
    { diagram: byTitle('Bad shift'), userId: ines, body: 'Cautionary example for the students: under this shift the amplitude does not fall off at large $z$, so the residue sum misses a boundary term. Keep it out of the draft.' },
  ]
  for (const n of notes) {
    if (!n.diagram || !n.userId) continue
    const row = await db.insert(tables.comments).values({ projectId, diagramId: n.diagram.id, userId: n.userId, body: n.body }).returning().get()
    await audit(projectId, n.userId, 'comment.create', 'comment', row.id, { diagramId: n.diagram.id, checkId: null, title: n.diagram.title, excerpt: excerpt(n.body) })
  }
}
