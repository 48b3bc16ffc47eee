// POST /api/loop-cuts with the N = 4 multiplet on the cut lines: non-adjacent MHV boxes agree with
// Bern, Dixon, Dunbar, Kosower (hep-ph/9403226) only summed over gluinos and scalars; six-gluon
// NMHV against the infrared conditions (docs/engine.md "Quadruple cuts"); the CSV and JSON exports.
import { beforeAll, describe, expect, it } from 'vitest'
import type { Client } from '../helpers/api'
import { newUser } from '../helpers/api'

let u: Client
beforeAll(async () => {
  u = await newUser('loopmultiplet')
})

describe('POST /api/loop-cuts: the N = 4 multiplet', () => {
  it('−+−+++ exact: every box agrees, the multiplet boxes say so and carry gluino and scalar terms', async () => {
    const res = await u.post('/api/loop-cuts', { helicities: [-1, 1, -1, 1, 1, 1], arithmetic: 'exact' })
    expect(res.status).toBe(200)
    expect(res.body).toMatchObject({ states: 'n4', verdict: 'agrees', counts: { agrees: 15 } })
    const multi = res.body.boxes.filter((b: { states: string }) => b.states.startsWith('N = 4 multiplet: gluons, four gluinos, six scalars'))
    expect(multi.length).toBeGreaterThan(0)
    const hs = multi.flatMap((b: { terms: { helicities: number[], multiplicity: number }[] }) => b.terms)
    expect(hs.some((t: { helicities: number[], multiplicity: number }) => t.helicities.includes(0.5) && t.multiplicity === 4)).toBe(true)
    expect(res.body.boxes.some((b: { states: string }) => b.states.startsWith('gluons only: exact for this box because'))).toBe(true)
    expect(res.body.infrared.verdict).toBe('agrees')
    expect(res.body.sum).toEqual(res.body.targetSum)
  })
  it('states gluons: the multiplet cuts are not compared and no infrared check is made', async () => {
    const res = await u.post('/api/loop-cuts', { helicities: [-1, 1, -1, 1, 1, 1], states: 'gluons' })
    expect(res.status).toBe(200)
    expect(res.body.states).toBe('gluons')
    expect(res.body.counts['not evaluated']).toBeGreaterThan(0)
    expect(res.body.infrared).toBeNull()
  })
  it('six-gluon NMHV exact: ten infrared conditions, all exact', async () => {
    const res = await u.post('/api/loop-cuts', { helicities: [-1, -1, -1, 1, 1, 1], arithmetic: 'exact' })
    expect(res.status).toBe(200)
    expect(res.body.verdict).toBe('agrees')
    expect(res.body.infrared.rows).toHaveLength(10)
    expect(res.body.infrared.rows[0]).toMatchObject({ invariant: '1/ε²', deviation: 0, verdict: 'agrees' })
  })
  it('?format=csv: the box table with full exact values, neutralised cells, as a download', async () => {
    const res = await u.req('POST', '/api/loop-cuts?format=csv', { helicities: [-1, 1, -1, 1], arithmetic: 'exact' })
    expect(res.status).toBe(200)
    expect(res.headers.get('content-type')).toContain('text/csv')
    expect(res.headers.get('content-disposition')).toContain('loop-cuts.csv')
    const lines = (res.body as string).trim().split('\n')
    expect(lines[0]).toMatch(/^# loop cuts, helicities \(-1 1 -1 1\), exact arithmetic/)
    expect(lines[1]).toBe('row,box,corners,kind,states,solution,helicities,multiplicity,value_re,value_im,target_re,target_im,deviation,verdict')
    const box = lines.find((l) => l.startsWith('box,'))!
    expect(box).toContain(',agrees')
    // the gluino terms: helicities with halves, multiplicity 4
    expect(lines.some((l) => l.startsWith('term,') && l.includes('1/2') && l.includes(',4,'))).toBe(true)
    // no cell starts with a spreadsheet formula character
    for (const l of lines.slice(1)) for (const c of l.split(',')) expect(/^[=+@]/.test(c)).toBe(false)
  })
  it('?format=json: the response named and versioned with its request', async () => {
    const res = await u.req('POST', '/api/loop-cuts?format=json', { helicities: [-1, -1, 1, 1] })
    expect(res.status).toBe(200)
    expect(res.headers.get('content-disposition')).toContain('loop-cuts.json')
    expect(res.body).toMatchObject({ format: 'polewright-loop-cuts', formatVersion: 1, request: { helicities: [-1, -1, 1, 1], states: 'n4' }, result: { verdict: 'agrees' } })
  })
  it.each([
    ['/api/loop-cuts?format=xml', { helicities: [-1, -1, 1, 1] }, 400, 'format'],
    ['/api/loop-cuts', { helicities: [-1, -1, 1, 1], states: 'quarks' }, 400, 'states'],
  ])('%s %j → %i on %s', async (path, body, status, field) => {
    const res = await u.req('POST', path, body)
    expect(res.status).toBe(status)
    expect(res.body.data.field).toBe(field)
    expect(res.body.message.startsWith(field)).toBe(true)
  })
})
