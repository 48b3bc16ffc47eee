// Invitations by e-mail: a one-time link whose token is stored only as its SHA-256, valid 7 days.
import { and, desc, eq, gt, isNull } from 'drizzle-orm'
import type { InvitationRow, ProjectRole } from '#shared/types/db'

export const INVITATION_DAYS = 7
const WEEK = INVITATION_DAYS * 24 * 3600 * 1000

export type InvitationStatus = 'pending' | 'accepted' | 'revoked' | 'expired'

export function invitationStatus(row: InvitationRow, now = Date.now()): InvitationStatus {
  if (row.acceptedAt) return 'accepted'
  if (row.revokedAt) return 'revoked'
  if (row.expiresAt.getTime() <= now) return 'expired'
  return 'pending'
}

/** What an owner sees in the list of pending invitations. */
export function invitationView(row: InvitationRow, invitedByName?: string | null) {
  return {
    id: row.id,
    projectId: row.projectId,
    email: row.email,
    role: row.role,
    invitedBy: row.invitedBy,
    invitedByName: invitedByName ?? null,
    createdAt: row.createdAt,
    expiresAt: row.expiresAt,
    status: invitationStatus(row),
  }
}

/**
 * Stores a one-time invitation (token hashed) and e-mails its link. An earlier open invitation
 * of the same address to the same project is revoked, so only the newest link works.
 */
export async function createInvitation(access: ProjectAccess, email: string, role: ProjectRole) {
  const origin = requireAppUrl()
  await consumeInvitation(access.project.id, access.user.id)
  const db = useDB()
  const token = newSecret()
  const row = await db.transaction(async (tx) => {
    await tx.update(tables.invitations).set({ revokedAt: new Date() }).where(and(
      eq(tables.invitations.projectId, access.project.id),
      eq(tables.invitations.email, email),
      isNull(tables.invitations.acceptedAt),
      isNull(tables.invitations.revokedAt),
    ))
    return tx.insert(tables.invitations).values({
      projectId: access.project.id,
      email,
      role,
      tokenHash: hashSecret(token),
      invitedBy: access.user.id,
      expiresAt: new Date(Date.now() + WEEK),
    }).returning().get()
  })
  const link = `${origin}/invitations/${token}`
  const mailed = await sendMail(composeMail({
    to: email,
    replyTo: access.user.email,
    // Subjects carry no user-written text (names, project titles): the mail must not become a
    // way to send a stranger a headline of someone's choosing.
    subject: 'An invitation to a project on Polewright',
    paragraphs: [
      `${access.user.name} (${access.user.email}) invites you to join the project "${access.project.name}" on Polewright as ${articled(role)}.`,
      roleMeaning(role),
      `Polewright is the group's shared workbench for building tree-level amplitudes by on-shell recursion and checking them against independent formulas. Open the link to create an account with this address (or sign in) and join. The link works once and expires in ${INVITATION_DAYS} days.`,
    ],
    action: { label: `Join "${access.project.name}"`, url: link },
    why: `You get this message because ${access.user.name} entered ${email} as a new member of "${access.project.name}". If you did not expect it, ignore it: nothing happens unless the link is opened and accepted. Replies go to ${access.user.email}.`,
  }))
  await audit(access.project.id, access.user.id, 'invitation.create', 'invitation', row.id, { email, role })
  return { ...invitationView(row, access.user.name), mailed }
}

/** Tells an existing user that an owner added them to a project. */
export async function notifyMemberAdded(access: ProjectAccess, user: { email: string, name: string }, role: ProjectRole) {
  const origin = appUrl()
  if (!origin) return false
  const link = `${origin}/projects/${access.project.id}`
  return sendMail(composeMail({
    to: user.email,
    replyTo: access.user.email,
    subject: 'You were added to a project on Polewright',
    paragraphs: [
      `Hello ${user.name},`,
      `${access.user.name} (${access.user.email}) added you to the project "${access.project.name}" as ${articled(role)}.`,
      roleMeaning(role),
    ],
    action: { label: 'Open the project', url: link },
    why: `You get this message because you have a Polewright account with ${user.email} and an owner of "${access.project.name}" added it to the project. Replies go to ${access.user.email}.`,
  }))
}

function articled(role: ProjectRole) {
  return role === 'owner' ? 'an owner' : role === 'editor' ? 'an editor' : 'a viewer'
}

function roleMeaning(role: ProjectRole) {
  return {
    owner: 'As an owner you can edit diagrams, run checks, comment, and manage the members of the project.',
    editor: 'As an editor you can build and save diagrams, run checks and comment.',
    viewer: 'As a viewer you can open every diagram and check, re-read the results and comment on them.',
  }[role]
}

/** The invitation a link token names, with its project and inviter; undefined for an unknown token. */
export async function findInvitation(token: string) {
  if (!token || token.length > 200) return undefined
  return useDB().select({ invitation: tables.invitations, project: tables.projects, inviter: tables.users })
    .from(tables.invitations)
    .innerJoin(tables.projects, eq(tables.projects.id, tables.invitations.projectId))
    .innerJoin(tables.users, eq(tables.users.id, tables.invitations.invitedBy))
    .where(eq(tables.invitations.tokenHash, hashSecret(token)))
    .get()
}

export function invitationGoneError(status: Exclude<InvitationStatus, 'pending'>) {
  const message = {
    accepted: 'this invitation link was already used; a link works only once. Ask the project owner for a new one if you still need it.',
    revoked: 'this invitation was withdrawn by the project owner.',
    expired: `this invitation has expired (links are valid for ${INVITATION_DAYS} days). Ask the project owner for a new one.`,
  }[status]
  return fieldError(410, 'token', message, { status })
}

/**
 * Accepts an invitation for the signed-in user. The single UPDATE … WHERE still-open decides who
 * wins when the link is used twice at once; the membership is written in the same transaction.
 */
export async function acceptInvitation(token: string, user: AuthUser) {
  const found = await findInvitation(token)
  if (!found) throw fieldError(404, 'token', 'this invitation link is not valid (check that the whole link was copied)')
  const status = invitationStatus(found.invitation)
  if (status !== 'pending') throw invitationGoneError(status)
  // The link was mailed to one address; only the account with that address may use it (a link
  // forwarded or leaked does not let another account in).
  if (user.email.toLowerCase() !== found.invitation.email.toLowerCase()) {
    throw fieldError(403, 'token', `this invitation is for ${found.invitation.email}; sign in with that address (or ask the owner to add your account)`, { invitedEmail: found.invitation.email })
  }
  const now = new Date()
  const result = await useDB().transaction(async (tx) => {
    const claimed = await tx.update(tables.invitations)
      .set({ acceptedAt: now, acceptedBy: user.id })
      .where(and(
        eq(tables.invitations.id, found.invitation.id),
        isNull(tables.invitations.acceptedAt),
        isNull(tables.invitations.revokedAt),
        gt(tables.invitations.expiresAt, now),
      ))
      .returning().get()
    if (!claimed) return null
    const existing = await tx.select().from(tables.memberships)
      .where(and(eq(tables.memberships.projectId, claimed.projectId), eq(tables.memberships.userId, user.id))).get()
    // Someone already in the project keeps the higher of the two roles; an invitation never demotes.
    let role: ProjectRole = claimed.role
    if (!existing) {
      await tx.insert(tables.memberships).values({ projectId: claimed.projectId, userId: user.id, role })
    }
    else if (roleRank[existing.role] >= roleRank[claimed.role]) role = existing.role
    else {
      await tx.update(tables.memberships).set({ role })
        .where(and(eq(tables.memberships.projectId, claimed.projectId), eq(tables.memberships.userId, user.id)))
    }
    return { claimed, role, wasMember: Boolean(existing) }
  })
  if (!result) {
    const again = await findInvitation(token)
    const s = again ? invitationStatus(again.invitation) : 'revoked'
    throw invitationGoneError(s === 'pending' ? 'accepted' : s)
  }
  await audit(found.project.id, user.id, 'invitation.accept', 'invitation', found.invitation.id, {
    email: found.invitation.email, role: result.role, invitedBy: found.inviter.name, asEmail: user.email,
  })
  return { projectId: found.project.id, projectName: found.project.name, role: result.role, alreadyMember: result.wasMember }
}

/** Open (not accepted, not revoked) invitations of a project, newest first; expired ones are marked. */
export async function listOpenInvitations(projectId: number) {
  const rows = await useDB().select({ invitation: tables.invitations, inviterName: tables.users.name })
    .from(tables.invitations)
    .leftJoin(tables.users, eq(tables.users.id, tables.invitations.invitedBy))
    .where(and(eq(tables.invitations.projectId, projectId), isNull(tables.invitations.acceptedAt), isNull(tables.invitations.revokedAt)))
    .orderBy(desc(tables.invitations.createdAt), desc(tables.invitations.id))
  return rows.map(r => invitationView(r.invitation, r.inviterName))
}
