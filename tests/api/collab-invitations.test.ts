import { describe, expect, it } from 'vitest'
import { createHash } from 'node:crypto'
import { Client, newUser, signIn, demo, uniqueEmail, projectWithRoles } from '../helpers/api'
import { linkIn, mailsTo, testDb, waitForMail } from './collab-support'

const sha256 = (s: string) => createHash('sha256').update(s).digest('hex')

async function invite(owner: Client, projectId: number, role = 'editor', email = uniqueEmail('invitee')) {
  const before = mailsTo(email).length
  const res = await owner.post(`/api/projects/${projectId}/members`, { email, role })
  expect(res.status).toBe(202)
  const mail = await waitForMail(email, before + 1)
  return { email, res, mail, ...linkIn(mail, 'invitations') }
}

async function register(email: string, name = 'Invited Person') {
  const c = new Client()
  const res = await c.post('/api/auth/register', { email, password: 'correct-horse-1', name })
  expect(res.status).toBe(201)
  return c
}

describe('invitations by e-mail', () => {
  it('an unknown address gets an e-mail saying who invited, to what, as what; the link joins with that role', async () => {
    const { owner, project } = await projectWithRoles()
    const { email, res, mail, token, path } = await invite(owner, project.id, 'editor')
    expect(res.body.invitation).toMatchObject({ email, role: 'editor', status: 'pending' })
    // Who sent it and why, in both parts; the subject carries no user-written text.
    expect(mail.subject).toBe('An invitation to a project on Polewright')
    for (const part of [mail.text, mail.html]) {
      expect(part).toContain('Owner Person')
      expect(part).toContain(owner.email)
      expect(part).toContain(project.name)
      expect(part).toMatch(/editor/)
      expect(part).toContain(`/invitations/${token}`)
    }
    expect(mail.text).toMatch(/You get this message because/)
    expect(mail.html).toMatch(/<a href="http[^"]+\/invitations\//)

    // Stored hashed: the database holds the SHA-256, never the token itself.
    const rows = await testDb().execute({ sql: 'SELECT token_hash FROM invitations WHERE email = ?', args: [email] })
    expect(rows.rows.map(r => r.token_hash)).toEqual([sha256(token)])

    // The public view of the link.
    const view = await new Client().get(`/api/invitations/${token}`)
    expect(view.status).toBe(200)
    expect(view.body).toMatchObject({
      email, role: 'editor', status: 'pending', valid: true, accountExists: false,
      project: { id: project.id, name: project.name }, invitedBy: { name: 'Owner Person', email: owner.email },
    })

    // The owner sees it pending; the invitee page exists.
    const pending = await owner.get(`/api/projects/${project.id}/invitations`)
    expect(pending.body.map((i: { email: string }) => i.email)).toContain(email)
    expect((await new Client().req('GET', path)).status).toBe(200)

    // Accept needs a session.
    expect((await new Client().post(`/api/invitations/${token}/accept`)).status).toBe(401)
    const invitee = await register(email)
    const accepted = await invitee.post(`/api/invitations/${token}/accept`)
    expect(accepted.status).toBe(200)
    expect(accepted.body).toMatchObject({ projectId: project.id, role: 'editor', alreadyMember: false })
    expect((await invitee.get(`/api/projects/${project.id}`)).body.role).toBe('editor')
    // An editor may now create a diagram there.
    expect((await invitee.post(`/api/projects/${project.id}/diagrams`, { title: 'From the invitee', graph: { nodes: [], edges: [] } })).status).toBe(201)

    // Single use: a second use (by anyone) is refused with 410.
    const again = await invitee.post(`/api/invitations/${token}/accept`)
    expect(again.status).toBe(410)
    expect(again.body.data).toMatchObject({ field: 'token', status: 'accepted' })
    expect(again.body.message).toMatch(/^token: .*already used/)
    const stranger = await newUser('stranger')
    expect((await stranger.post(`/api/invitations/${token}/accept`)).status).toBe(410)
    expect((await stranger.get(`/api/projects/${project.id}`)).status).toBe(404)
    expect((await new Client().get(`/api/invitations/${token}`)).body).toMatchObject({ status: 'accepted', valid: false })
    expect((await owner.get(`/api/projects/${project.id}/invitations`)).body.map((i: { email: string }) => i.email)).not.toContain(email)

    // Audit trail.
    const actions = (await owner.get(`/api/projects/${project.id}/activity`)).body.map((e: { action: string }) => e.action)
    expect(actions).toEqual(expect.arrayContaining(['invitation.create', 'invitation.accept']))
  })

  it('an expired link is refused with 410 and shown as expired', async () => {
    const { owner, project } = await projectWithRoles()
    const { email, token } = await invite(owner, project.id, 'viewer')
    await testDb().execute({ sql: 'UPDATE invitations SET expires_at = ? WHERE email = ?', args: [Date.now() - 1000, email] })
    expect((await new Client().get(`/api/invitations/${token}`)).body).toMatchObject({ status: 'expired', valid: false })
    const invitee = await register(email)
    const res = await invitee.post(`/api/invitations/${token}/accept`)
    expect(res.status).toBe(410)
    expect(res.body.data.status).toBe('expired')
    expect(res.body.message).toMatch(/^token: this invitation has expired/)
    expect((await invitee.get(`/api/projects/${project.id}`)).status).toBe(404)
    // Listed as expired so the owner can tidy up.
    const list = (await owner.get(`/api/projects/${project.id}/invitations`)).body
    expect(list.find((i: { email: string }) => i.email === email)?.status).toBe('expired')
  })

  it('the validity window is 7 days', async () => {
    const { owner, project } = await projectWithRoles()
    const { res } = await invite(owner, project.id)
    const days = (new Date(res.body.invitation.expiresAt).getTime() - new Date(res.body.invitation.createdAt).getTime()) / 86_400_000
    expect(days).toBeCloseTo(7, 2)
  })

  it('owners revoke; the link stops working; only owners list or revoke', async () => {
    const { owner, editor, viewer, outsider, project } = await projectWithRoles()
    const { email, token, res } = await invite(owner, project.id, 'viewer')
    const id = res.body.invitation.id
    for (const c of [editor, viewer]) {
      expect((await c.get(`/api/projects/${project.id}/invitations`)).status).toBe(403)
      expect((await c.del(`/api/projects/${project.id}/invitations/${id}`)).status).toBe(403)
    }
    expect((await outsider.del(`/api/projects/${project.id}/invitations/${id}`)).status).toBe(404)
    expect((await owner.del(`/api/projects/${project.id}/invitations/${id}`)).status).toBe(204)
    expect((await owner.del(`/api/projects/${project.id}/invitations/999999`)).status).toBe(404)
    const invitee = await register(email)
    const used = await invitee.post(`/api/invitations/${token}/accept`)
    expect(used.status).toBe(410)
    expect(used.body.data.status).toBe('revoked')
    const actions = (await owner.get(`/api/projects/${project.id}/activity`)).body.map((e: { action: string }) => e.action)
    expect(actions).toContain('invitation.revoke')
  })

  it('an invitation of another project cannot be revoked through this one', async () => {
    const a = await projectWithRoles()
    const other = (await a.owner.post('/api/projects', { name: 'Second' })).body
    const { res } = await invite(a.owner, a.project.id)
    expect((await a.owner.del(`/api/projects/${other.id}/invitations/${res.body.invitation.id}`)).status).toBe(404)
  })

  it('inviting the same address again replaces the earlier link', async () => {
    const { owner, project } = await projectWithRoles()
    const email = uniqueEmail('twice')
    const first = await invite(owner, project.id, 'viewer', email)
    const second = await owner.post(`/api/projects/${project.id}/members`, { email, role: 'editor' })
    expect(second.status).toBe(202)
    const secondLink = linkIn(await waitForMail(email, 2), 'invitations')
    expect(secondLink.token).not.toBe(first.token)
    const invitee = await register(email)
    expect((await invitee.post(`/api/invitations/${first.token}/accept`)).status).toBe(410)
    expect((await invitee.post(`/api/invitations/${secondLink.token}/accept`)).body.role).toBe('editor')
  })

  it('two accepts of one link at the same moment (two browsers of the invitee): one joins, the other gets 410', async () => {
    const { owner, project } = await projectWithRoles()
    const { email, token } = await invite(owner, project.id, 'editor')
    const invitee = await register(email)
    const second = new Client()
    expect((await second.post('/api/auth/login', { email, password: 'correct-horse-1' })).status).toBe(200)
    const results = await Promise.all([invitee.post(`/api/invitations/${token}/accept`), second.post(`/api/invitations/${token}/accept`)])
    expect(results.map(r => r.status).sort()).toEqual([200, 410])
    const members = (await owner.get(`/api/projects/${project.id}/members`)).body.map((m: { email: string }) => m.email)
    expect(members.filter((m: string) => m === email)).toHaveLength(1)
  })

  it('an unknown or mangled token → 404 naming the token', async () => {
    const res = await new Client().get('/api/invitations/not-a-real-token')
    expect(res.status).toBe(404)
    expect(res.body.data.field).toBe('token')
    const u = await newUser('mangled')
    expect((await u.post('/api/invitations/not-a-real-token/accept')).status).toBe(404)
  })

  it('accepting as a member already in the project never demotes', async () => {
    const { owner, project } = await projectWithRoles()
    const { email, token } = await invite(owner, project.id, 'viewer')
    const invitee = await register(email)
    // Meanwhile the owner adds the new account directly, as an editor.
    expect((await owner.post(`/api/projects/${project.id}/members`, { email, role: 'editor' })).status).toBe(201)
    const res = await invitee.post(`/api/invitations/${token}/accept`)
    expect(res.status).toBe(200)
    expect(res.body).toMatchObject({ role: 'editor', alreadyMember: true })
  })

  it('a read-only token cannot accept an invitation', async () => {
    const { owner, project } = await projectWithRoles()
    const { email, token } = await invite(owner, project.id)
    const invitee = await register(email)
    const t = (await invitee.post('/api/tokens', { name: 'ro', scope: 'read' })).body.token
    const bearer = new Client()
    bearer.token = t
    expect((await bearer.post(`/api/invitations/${token}/accept`)).status).toBe(403)
  })

  it('an existing user is added at once (201) and notified by e-mail', async () => {
    const { owner, project } = await projectWithRoles()
    const known = await newUser('known', 'Known Person')
    const res = await owner.post(`/api/projects/${project.id}/members`, { email: known.email, role: 'viewer' })
    expect(res.status).toBe(201)
    const mail = await waitForMail(known.email)
    expect(mail.subject).toBe('You were added to a project on Polewright')
    expect(mail.text).toContain(project.name)
    expect(mail.text).toContain('Owner Person')
    expect(mail.text).toMatch(/as a viewer/)
    expect(mail.html).toContain(`/projects/${project.id}`)
  })

  it('site admins read the captured outbox; members may not', async () => {
    const { owner, project } = await projectWithRoles()
    const { email } = await invite(owner, project.id)
    const admin = await signIn(demo.owner)
    const box = await admin.get('/api/admin/outbox')
    expect(box.status).toBe(200)
    expect(box.body.capturing).toBe(true)
    expect(box.body.messages.some((m: { to: string[] }) => m.to.includes(email))).toBe(true)
    expect((await owner.get('/api/admin/outbox')).status).toBe(403)
  })
})
