// Point sets and batch checks against the real server: uploads (CSV, JSON, Les Houches event
// files after hep-ph/0609017), refusals with line/column and per-point reasons, round trips,
// seeded sets, and a batch over a few hundred points with its progress stream and stored summary.
import { beforeAll, describe, expect, it } from 'vitest'
import { readFileSync } from 'node:fs'
import { resolve } from 'node:path'
import type { Client } from '../helpers/api'
import { baseURL, projectWithRoles } from '../helpers/api'

const lhe = readFileSync(resolve(import.meta.dirname, '../fixtures/gluons.lhe'), 'utf8')

async function upload(client: Client, projectId: number, filename: string, text: string | Uint8Array, fields: Record<string, string> = {}) {
  const form = new FormData()
  form.append('file', new Blob([text as BlobPart]), filename)
  for (const [k, v] of Object.entries(fields)) form.append(k, v)
  const res = await fetch(`${baseURL()}/api/projects/${projectId}/point-sets`, { method: 'POST', headers: { cookie: client.cookie }, body: form })
  return { status: res.status, body: await res.json() as any }
}

/** Reads a batch's SSE stream to its end; returns the events in order. */
async function events(client: Client, checkId: number) {
  const res = await fetch(`${baseURL()}/api/batch-checks/${checkId}/events`, { headers: { cookie: client.cookie } })
  expect(res.headers.get('content-type')).toMatch(/text\/event-stream/)
  const text = await res.text()
  return text.split('\n\n').filter(Boolean).map((block) => {
    const event = /^event: (.*)$/m.exec(block)?.[1]
    const data = /^data: (.*)$/m.exec(block)?.[1]
    return { event, data: data ? JSON.parse(data) : null }
  })
}

async function waitDone(client: Client, checkId: number) {
  for (let i = 0; i < 600; i++) {
    const r = await client.get(`/api/batch-checks/${checkId}`)
    if (['done', 'failed', 'cancelled'].includes(r.body.status)) return r.body
    await new Promise(r => setTimeout(r, 100))
  }
  throw new Error('batch did not finish')
}

let ctx: Awaited<ReturnType<typeof projectWithRoles>>
let pid: number
async function diagram(title: string, process: Record<string, unknown> | null) {
  const graph = { schemaVersion: 1, nodes: [], edges: [], ...(process ? { process } : {}) }
  return (await ctx.owner.post(`/api/projects/${pid}/diagrams`, { title, graph })).body.id as number
}

beforeAll(async () => {
  ctx = await projectWithRoles()
  pid = ctx.project.id
})

describe('uploads', () => {
  it('stores the valid events of a Les Houches file and reports the refused ones', async () => {
    const r = await upload(ctx.editor, pid, 'gluons.lhe', lhe, { n: '6' })
    expect(r.status, JSON.stringify(r.body)).toBe(201)
    expect(r.body.pointSet).toMatchObject({ source: 'lhe', n: 6, count: 2, name: 'gluons.lhe', kinematics: 'momenta' })
    expect(r.body.pointSet.meta.codeSets).toEqual([{ codes: [21, 21, 21, 21, 21, 21], count: 2 }])
    expect(r.body.report).toMatchObject({ format: 'lhe', read: 5, stored: 2, rejectedCount: 3 })
    expect(r.body.report.rejected.map((x: any) => x.point)).toEqual(['event 3', 'event 4', 'event 5'])
    expect(r.body.report.rejected[0].reason).toMatch(/^leg 3 is not massless/)
    expect(r.body.report.rejected[0].size).toBeCloseTo(173 ** 2 / 500 ** 2, 6)
    const pts = (await ctx.viewer.get(`/api/point-sets/${r.body.pointSet.id}/points?invariants=1&spinors=1`)).body
    expect(pts.total).toBe(2)
    // Incoming beams crossed to outgoing: leg 1 was (E, 0, 0, +E) incoming.
    expect(pts.items[0].momenta[0]).toEqual([-500, 0, 0, -500])
    expect(pts.items[0].codes).toEqual([21, 21, 21, 21, 21, 21])
    expect(pts.items[0].invariants[0][1][0]).toBeCloseTo(1e6, 3)
    expect(pts.items[0].spinors.lambda).toHaveLength(6)
  })

  it('refuses an unreadable file whole, with line and column, and stores nothing', async () => {
    const before = (await ctx.owner.get(`/api/projects/${pid}/point-sets`)).body.length
    const r = await upload(ctx.editor, pid, 'bad.csv', 'point,leg,E,px,py,pz\n1,1,1,0,0,1\n1,2,1,0,oops,-1\n')
    expect(r.status).toBe(400)
    expect(r.body.message).toBe('file: line 3, column 9: py must be a finite number, got "oops"')
    expect(r.body.data).toMatchObject({ field: 'file', line: 3, column: 9 })
    const bad = await upload(ctx.editor, pid, 'bad.lhe', lhe.replace('<init>', '<init>\n 2212 2212 500'))
    expect(bad.status).toBe(400)
    expect(bad.body.data.line).toBe(10)
    const none = await upload(ctx.editor, pid, 'massive.csv', 'point,leg,E,px,py,pz\nq,1,-1,0,0,-1\nq,2,-1,0,0,1\nq,3,1,0.6,0,0\nq,4,1,-0.6,0,0\n')
    expect(none.status).toBe(422)
    expect(none.body.message).toMatch(/^file: none of the 1 points is valid; point q: leg 3 is not massless: p² = 0.64/)
    expect((await ctx.owner.get(`/api/projects/${pid}/point-sets`)).body.length).toBe(before)
  })

  it('refuses files over the limits with the limit in the message', async () => {
    const rows = ['point,leg,E,px,py,pz']
    for (let p = 0; p <= 10_000; p++) rows.push(`${p},1,1,0,0,1`, `${p},2,1,0,0,-1`, `${p},3,-1,0,1,0`, `${p},4,-1,0,-1,0`)
    const many = await upload(ctx.editor, pid, 'many.csv', rows.join('\n'))
    expect(many.status).toBe(422)
    expect(many.body.message).toMatch(/^file: holds more than 10,000 points; the limit per point set is 10,000/)
    const big = await upload(ctx.editor, pid, 'big.csv', new Uint8Array(10 * 1024 * 1024 + 10).fill(32))
    expect(big.status).toBe(413)
    expect(big.body.message).toMatch(/^file: .*the limit is 10.0 MB/)
    // Far over the cap: refused on the declared length, before the body is read, still naming the field.
    const huge = await upload(ctx.editor, pid, 'huge.csv', new Uint8Array(13 * 1024 * 1024).fill(32))
    expect(huge.status).toBe(413)
    expect(huge.body.message).toMatch(/^file: the upload is 13.0 MB; the limit is 10.0 MB/)
  })

  it('names the field for a missing file and a bad form field', async () => {
    const r = await ctx.editor.post(`/api/projects/${pid}/point-sets`, {})
    expect(r.status).toBe(400)
    expect(r.body.data.field).toBe('file')
    const n = await upload(ctx.editor, pid, 'x.csv', 'point,leg,E,px,py,pz\n', { n: 'six' })
    expect(n.status).toBe(400)
    expect(n.body.message).toMatch(/^n: /)
  })
})

describe('round trips and seeds', () => {
  it('CSV: export → upload gives the same points', async () => {
    const gen = await ctx.editor.post(`/api/projects/${pid}/point-sets/generate`, { kind: 'physical', n: 5, count: 30, seed: 7, energy: 13 })
    expect(gen.status).toBe(201)
    const csv = await ctx.viewer.get(`/api/point-sets/${gen.body.id}/export?format=csv`)
    expect(csv.headers.get('content-disposition')).toMatch(/attachment; filename="point-set-\d+\.csv"/)
    const up = await upload(ctx.editor, pid, 'again.csv', csv.body as string)
    expect(up.status).toBe(201)
    expect(up.body.report.rejectedCount).toBe(0)
    const a = (await ctx.viewer.get(`/api/point-sets/${gen.body.id}/points?limit=30`)).body.items
    const b = (await ctx.viewer.get(`/api/point-sets/${up.body.pointSet.id}/points?limit=30`)).body.items
    expect(b.map((p: any) => p.momenta)).toEqual(a.map((p: any) => p.momenta))
  })

  it('JSON: spinor sets round-trip; CSV export of spinors is refused naming the format', async () => {
    const gen = (await ctx.editor.post(`/api/projects/${pid}/point-sets/generate`, { kind: 'random', n: 6, count: 12, seed: 3 })).body
    expect(gen.kinematics).toBe('spinors')
    const refused = await ctx.viewer.get(`/api/point-sets/${gen.id}/export?format=csv`)
    expect(refused.status).toBe(422)
    expect(refused.body.data.field).toBe('format')
    const json = await ctx.viewer.get(`/api/point-sets/${gen.id}/export?format=json`)
    expect(json.body.format).toBe('polewright.points')
    const up = await upload(ctx.editor, pid, 'again.json', JSON.stringify(json.body))
    expect(up.status).toBe(201)
    expect(up.body.pointSet).toMatchObject({ n: 6, count: 12, kinematics: 'spinors' })
    const a = (await ctx.viewer.get(`/api/point-sets/${gen.id}/points`)).body.items
    const b = (await ctx.viewer.get(`/api/point-sets/${up.body.pointSet.id}/points`)).body.items
    expect(b.map((p: any) => [p.lambda, p.lambdaTilde])).toEqual(a.map((p: any) => [p.lambda, p.lambdaTilde]))
  })

  it('a seeded set reproduces point for point, and stores its seed', async () => {
    const body = { kind: 'physical', n: 6, count: 8, seed: 99, energy: 2 }
    const a = (await ctx.editor.post(`/api/projects/${pid}/point-sets/generate`, body)).body
    const b = (await ctx.editor.post(`/api/projects/${pid}/point-sets/generate`, body)).body
    expect(a).toMatchObject({ seed: 99, energy: 2, source: 'physical', count: 8 })
    const pa = (await ctx.viewer.get(`/api/point-sets/${a.id}/points`)).body.items
    const pb = (await ctx.viewer.get(`/api/point-sets/${b.id}/points`)).body.items
    expect(pb.map((p: any) => p.momenta)).toEqual(pa.map((p: any) => p.momenta))
    const bad = await ctx.editor.post(`/api/projects/${pid}/point-sets/generate`, { ...body, count: 20000 })
    expect(bad.status).toBe(400)
    expect(bad.body.message).toMatch(/^count: at most 10000/)
  })
})

describe('batch checks', () => {
  it('evaluates 300 six-gluon NMHV points with progress events and a stored summary', async () => {
    const set = (await ctx.editor.post(`/api/projects/${pid}/point-sets/generate`, { kind: 'physical', n: 6, count: 300, seed: 11, energy: 1 })).body
    const d = await diagram('Six gluons NMHV', { theory: 'gluon', helicities: [-1, -1, -1, 1, 1, 1], shift: [1, 2] })
    const start = await ctx.editor.post(`/api/diagrams/${d}/batch-checks`, { pointSetId: set.id })
    expect(start.status, JSON.stringify(start.body)).toBe(202)
    expect(start.body).toMatchObject({ kind: 'batch', total: 300, pointSetId: set.id })
    const evs = await events(ctx.viewer, start.body.id)
    const progress = evs.filter(e => e.event === 'progress')
    const end = evs.at(-1)!
    expect(end.event).toBe('end')
    expect(end.data).toMatchObject({ status: 'done', done: 300, total: 300 })
    expect(progress.length).toBeGreaterThanOrEqual(1)
    const dones = progress.map(e => e.data.done)
    expect([...dones].sort((a, b) => a - b)).toEqual(dones)
    const view = (await ctx.viewer.get(`/api/batch-checks/${start.body.id}`)).body
    expect(view.status).toBe('done')
    expect(view.summary.counts.agrees).toBe(300)
    expect(view.summary.evaluated).toBe(300)
    expect(view.summary.median).toBeLessThan(1e-12)
    expect(view.summary.worst.deviation).toBeLessThan(1e-9)
    expect(view.verdict).toBe('agrees')
    const rows = (await ctx.viewer.get(`/api/checks/${start.body.id}/points?sort=deviation&limit=5`)).body
    expect(rows.total).toBe(300)
    expect(rows.items[0].deviation).toBe(view.summary.worst.deviation)
    expect(rows.items[0]).toMatchObject({ verdict: 'agrees', target: expect.any(Array), value: expect.any(Array) })
    const cols = (await ctx.viewer.get(`/api/checks/${start.body.id}/points?view=columns`)).body
    expect(cols.deviation).toHaveLength(300)
    expect(cols.minInvariant.every((x: number) => x > 0 && x <= 1)).toBe(true)
    const csv = await ctx.viewer.get(`/api/checks/${start.body.id}/points.csv`)
    const lines = (csv.body as string).trim().split('\n')
    expect(lines[0]).toBe('point,label,value_re,value_im,target_re,target_im,deviation,verdict,min_invariant,message')
    expect(lines).toHaveLength(301)
    // Numbered from 1, as the page numbers the points.
    expect(lines[1]!.split(',')[0]).toBe('1')
    const json = (await ctx.viewer.get(`/api/checks/${start.body.id}/points.json`)).body
    expect(json.points).toHaveLength(300)
    expect(json.check.summary.counts.agrees).toBe(300)
    // The list on the point set and on the diagram.
    expect((await ctx.viewer.get(`/api/point-sets/${set.id}/batch-checks`)).body.map((c: any) => c.id)).toContain(start.body.id)
    expect((await ctx.viewer.get(`/api/diagrams/${d}/batch-checks`)).body[0].id).toBe(start.body.id)
  })

  it('marks a bad shift per point and evaluates event-file points of a gluon process', async () => {
    const up = (await upload(ctx.editor, pid, 'g.lhe', lhe, { n: '6' })).body.pointSet
    const d = await diagram('Six gluons, alternating', { theory: 'gluon', helicities: [-1, 1, -1, 1, -1, 1], shift: [1, 2] })
    const start = await ctx.editor.post(`/api/diagrams/${d}/batch-checks`, { pointSetId: up.id })
    expect(start.status).toBe(202)
    const done = await waitDone(ctx.viewer, start.body.id)
    expect(done.summary.counts.agrees).toBe(2)
    const bad = await diagram('Bad shift', { theory: 'gluon', helicities: [-1, -1, 1, 1, 1, 1], shift: [3, 1] })
    const b = await waitDone(ctx.viewer, (await ctx.editor.post(`/api/diagrams/${bad}/batch-checks`, { pointSetId: up.id })).body.id)
    expect(b.summary.counts['boundary term suspected']).toBe(2)
    expect(b.verdict).toBe('boundary term suspected')
  })

  it('refuses what cannot run, naming the field', async () => {
    const set = (await ctx.editor.post(`/api/projects/${pid}/point-sets/generate`, { kind: 'physical', n: 5, count: 3, seed: 1 })).body
    const empty = await diagram('Empty', null)
    const r1 = await ctx.editor.post(`/api/diagrams/${empty}/batch-checks`, { pointSetId: set.id })
    expect([r1.status, r1.body.data.field]).toEqual([422, 'graph.process'])
    const six = await diagram('Six', { theory: 'gluon', helicities: [-1, -1, -1, 1, 1, 1] })
    const r2 = await ctx.editor.post(`/api/diagrams/${six}/batch-checks`, { pointSetId: set.id })
    expect([r2.status, r2.body.data.field]).toEqual([422, 'pointSetId'])
    expect(r2.body.message).toMatch(/has 5 legs per point; the process has 6/)
    const five = await diagram('Five', { theory: 'gluon', helicities: [-1, -1, 1, 1, 1] })
    const r3 = await ctx.editor.post(`/api/diagrams/${five}/batch-checks`, { pointSetId: set.id, target: 'hodges' })
    expect([r3.status, r3.body.data.field]).toEqual([422, 'target'])
    const r4 = await ctx.editor.post(`/api/diagrams/${five}/batch-checks`, { pointSetId: 'x' })
    expect([r4.status, r4.body.data.field]).toEqual([400, 'pointSetId'])
    const r5 = await ctx.editor.post(`/api/diagrams/${five}/batch-checks`, { pointSetId: 999999 })
    expect([r5.status, r5.body.data.field]).toEqual([422, 'pointSetId'])
    const quarks = 'point,leg,E,px,py,pz,code\nq,1,-1,0,0,-1,2\nq,2,-1,0,0,1,-2\nq,3,1,0.6,0.8,0,21\nq,4,1,-0.6,-0.8,0,21\n'
    const qs = (await upload(ctx.editor, pid, 'quarks.csv', quarks)).body.pointSet
    const four = await diagram('Four', { theory: 'gluon', helicities: [-1, -1, 1, 1] })
    const r6 = await ctx.editor.post(`/api/diagrams/${four}/batch-checks`, { pointSetId: qs.id })
    expect([r6.status, r6.body.data.field]).toEqual([422, 'pointSetId'])
    expect(r6.body.message).toMatch(/leg 1 has particle code 2; a gluon process needs code 21/)
    // A viewer reads but does not run.
    expect((await ctx.viewer.post(`/api/diagrams/${five}/batch-checks`, { pointSetId: set.id })).status).toBe(403)
  })

  it('cancels a running batch; the points done so far stay', async () => {
    const set = (await ctx.editor.post(`/api/projects/${pid}/point-sets/generate`, { kind: 'physical', n: 8, count: 3000, seed: 5 })).body
    const d = await diagram('Eight gluons', { theory: 'gluon', helicities: [-1, -1, -1, -1, 1, 1, 1, 1] })
    const start = (await ctx.editor.post(`/api/diagrams/${d}/batch-checks`, { pointSetId: set.id })).body
    await new Promise(r => setTimeout(r, 300))
    expect((await ctx.viewer.post(`/api/batch-checks/${start.id}/cancel`)).status).toBe(403)
    const c = await ctx.editor.post(`/api/batch-checks/${start.id}/cancel`)
    expect(c.status, JSON.stringify(c.body)).toBe(200)
    expect(c.body.status).toBe('cancelled')
    expect(c.body.done).toBeLessThan(3000)
    expect(c.body.summary.message).toMatch(/^cancelled after \d+ of 3000 points/)
    const rows = (await ctx.viewer.get(`/api/checks/${start.id}/points?limit=1`)).body
    expect(rows.total).toBe(c.body.done)
    expect((await ctx.editor.post(`/api/batch-checks/${start.id}/cancel`)).status).toBe(409)
  })

  it('deletes a point set for editors, not viewers; its checks stay', async () => {
    const set = (await ctx.editor.post(`/api/projects/${pid}/point-sets/generate`, { kind: 'physical', n: 4, count: 5, seed: 2 })).body
    const d = await diagram('Four gluons', { theory: 'gluon', helicities: [-1, -1, 1, 1] })
    const chk = await waitDone(ctx.editor, (await ctx.editor.post(`/api/diagrams/${d}/batch-checks`, { pointSetId: set.id })).body.id)
    expect((await ctx.viewer.del(`/api/point-sets/${set.id}`)).status).toBe(403)
    expect((await ctx.outsider.get(`/api/point-sets/${set.id}`)).status).toBe(404)
    expect((await ctx.editor.del(`/api/point-sets/${set.id}`)).status).toBe(204)
    expect((await ctx.viewer.get(`/api/point-sets/${set.id}`)).status).toBe(404)
    const after = (await ctx.viewer.get(`/api/batch-checks/${chk.id}`)).body
    expect(after, JSON.stringify(after)).toMatchObject({ status: 'done', pointSetId: null })
    expect((await ctx.viewer.get(`/api/checks/${chk.id}/points`)).body.total).toBe(5)
  })
})
