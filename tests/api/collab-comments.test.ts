import { beforeAll, describe, expect, it } from 'vitest'
import { Client, projectWithRoles } from '../helpers/api'
import { insertCheck } from './collab-support'

type Setup = Awaited<ReturnType<typeof projectWithRoles>> & { diagram: { id: number }, checkId: number }

describe('comments on diagrams and checks', () => {
  let s: Setup
  beforeAll(async () => {
    const base = await projectWithRoles()
    const diagram = (await base.owner.post(`/api/projects/${base.project.id}/diagrams`, { title: 'Five gluons under review', graph: { nodes: [], edges: [] } })).body
    const checkId = await insertCheck(base.project.id, diagram.id, base.owner.id)
    s = { ...base, diagram, checkId }
  })

  const threads = () => [
    ['diagram', `/api/diagrams/${s.diagram.id}/comments`],
    ['check', `/api/checks/${s.checkId}/comments`],
  ] as const

  it('every member, viewers included, comments and reads; outsiders get 404, anonymous 401', async () => {
    for (const [, url] of threads()) {
      for (const [who, c] of [['viewer', s.viewer], ['editor', s.editor], ['owner', s.owner]] as const) {
        const res = await c.post(url, { body: `${who} says: the pole at $\\langle 1 2\\rangle = 0$ cancels` })
        expect(res.status, `${who} on ${url}`).toBe(201)
        expect(res.body).toMatchObject({ author: { id: c.id }, canEdit: true, canDelete: true })
      }
      const list = await s.viewer.get(url)
      expect(list.status).toBe(200)
      expect(list.body.length).toBeGreaterThanOrEqual(3)
      expect((await s.outsider.get(url)).status).toBe(404)
      expect((await s.outsider.post(url, { body: 'hi' })).status).toBe(404)
      expect((await new Client().get(url)).status).toBe(401)
      expect((await new Client().post(url, { body: 'hi' })).status).toBe(401)
    }
  })

  it('the diagram thread and the check thread are separate', async () => {
    const d = (await s.viewer.get(threads()[0][1])).body
    const c = (await s.viewer.get(threads()[1][1])).body
    expect(d.every((x: { checkId: number | null }) => x.checkId === null)).toBe(true)
    expect(c.every((x: { checkId: number }) => x.checkId === s.checkId)).toBe(true)
  })

  it('authors edit their own comments only; authors and owners delete', async () => {
    const url = threads()[0][1]
    const mine = (await s.viewer.post(url, { body: 'typo here' })).body
    const editorsComment = (await s.editor.post(url, { body: 'editor comment' })).body

    const edited = await s.viewer.patch(`/api/comments/${mine.id}`, { body: 'fixed: $s_{12}$' })
    expect(edited.status).toBe(200)
    expect(edited.body.body).toBe('fixed: $s_{12}$')
    expect((await s.owner.patch(`/api/comments/${mine.id}`, { body: 'owner rewrites' })).status).toBe(403)
    expect((await s.editor.patch(`/api/comments/${mine.id}`, { body: 'x' })).status).toBe(403)
    expect((await s.outsider.patch(`/api/comments/${mine.id}`, { body: 'x' })).status).toBe(404)

    // Seen from others: not editable; deletable only by the owner.
    const asEditor = (await s.editor.get(url)).body.find((c: { id: number }) => c.id === mine.id)
    expect(asEditor).toMatchObject({ canEdit: false, canDelete: false })
    const asOwner = (await s.owner.get(url)).body.find((c: { id: number }) => c.id === mine.id)
    expect(asOwner).toMatchObject({ canEdit: false, canDelete: true })

    expect((await s.viewer.del(`/api/comments/${editorsComment.id}`)).status).toBe(403)
    expect((await s.editor.del(`/api/comments/${mine.id}`)).status).toBe(403)
    expect((await s.owner.del(`/api/comments/${editorsComment.id}`)).status).toBe(204)
    expect((await s.viewer.del(`/api/comments/${mine.id}`)).status).toBe(204)
    expect((await s.viewer.del(`/api/comments/${mine.id}`)).status).toBe(404)
    const ids = (await s.owner.get(url)).body.map((c: { id: number }) => c.id)
    expect(ids).not.toContain(mine.id)
    expect(ids).not.toContain(editorsComment.id)
  })

  it.each([
    ['an empty body', { body: '   ' }],
    ['no body', {}],
    ['a number', { body: 42 }],
    ['a body over 5000 characters', { body: 'x'.repeat(5001) }],
  ])('%s → 400 naming body', async (_label, body) => {
    const res = await s.viewer.post(threads()[0][1], body)
    expect(res.status).toBe(400)
    expect(res.body.data.field).toBe('body')
    expect(res.body.message).toMatch(/^body: /)
  })

  it('comments are stored as typed text (markup is not interpreted by the server)', async () => {
    const raw = '<img src=x onerror=alert(1)> and $\\href{javascript:alert(1)}{x}$'
    const res = await s.viewer.post(threads()[0][1], { body: raw })
    expect(res.status).toBe(201)
    expect(res.body.body).toBe(raw)
  })

  it('comment.create lands in the activity list', async () => {
    const events = (await s.viewer.get(`/api/projects/${s.project.id}/activity?limit=200`)).body
    const created = events.filter((e: { action: string }) => e.action === 'comment.create')
    expect(created.length).toBeGreaterThan(0)
    expect(created.some((e: { detail: { checkId: number | null } }) => e.detail.checkId === s.checkId)).toBe(true)
    expect(created.some((e: { detail: { title: string } }) => e.detail.title === 'Five gluons under review')).toBe(true)
  })

  it('a missing diagram, check or comment → 404', async () => {
    expect((await s.owner.get('/api/diagrams/99999999/comments')).status).toBe(404)
    expect((await s.owner.get('/api/checks/99999999/comments')).status).toBe(404)
    expect((await s.owner.patch('/api/comments/99999999', { body: 'x' })).status).toBe(404)
  })
})
