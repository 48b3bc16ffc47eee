import type { H3Event } from 'h3'
import type { ProjectRole } from '../../shared/types/db'

const WEEK = 7 * 24 * 3600 * 1000

/** Stores a one-time invitation (token hashed) and e-mails its link. */
export async function createInvitation(event: H3Event, access: ProjectAccess, email: string, role: ProjectRole) {
  const token = newSecret()
  const row = await useDB().insert(tables.invitations).values({
    projectId: access.project.id,
    email,
    role,
    tokenHash: hashSecret(token),
    invitedBy: access.user.id,
    expiresAt: new Date(Date.now() + WEEK),
  }).returning().get()
  const link = `${appUrl(event)}/invitations/${token}`
  const who = `${access.user.name} <${access.user.email}>`
  await sendMail({
    to: email,
    subject: `${access.user.name} invites you to "${access.project.name}" on Polewright`,
    text: `${who} invites you to join the project "${access.project.name}" as ${role}.\n\nPolewright is the group's workbench for on-shell recursion checks. Open this link to register or sign in and join (valid for 7 days, once):\n${link}\n\nIf you did not expect this, ignore the message.`,
    html: `<p>${escapeHtml(who)} invites you to join the project <strong>${escapeHtml(access.project.name)}</strong> as <strong>${role}</strong>.</p><p>Polewright is the group's workbench for on-shell recursion checks. <a href="${link}">Register or sign in and join</a> (valid for 7 days, once).</p><p>If you did not expect this, ignore the message.</p>`,
  })
  await audit(access.project.id, access.user.id, 'invitation.create', 'invitation', row.id, { email, role })
  return { id: row.id, email, role, expiresAt: row.expiresAt }
}

export async function notifyMemberAdded(event: H3Event, access: ProjectAccess, user: { email: string, name: string }, role: ProjectRole) {
  const link = `${appUrl(event)}/projects/${access.project.id}`
  await sendMail({
    to: user.email,
    subject: `You were added to "${access.project.name}" on Polewright`,
    text: `${access.user.name} <${access.user.email}> added you to the project "${access.project.name}" as ${role}.\n${link}`,
    html: `<p>${escapeHtml(access.user.name)} added you to the project <strong>${escapeHtml(access.project.name)}</strong> as <strong>${role}</strong>.</p><p><a href="${link}">Open the project</a></p>`,
  })
}
