// Generated bodies over every JSON route of the access matrix, sent as the project's owner with
// real ids, plus generated query strings on the list routes: whatever comes in, the answer is never
// a 5xx (OWASP ASVS 4.0 V5.1.x input validation, V13.2.x REST input, V7.4.1 errors handled).
// Bounded: a fixed number of runs per route and a time cap per route.
import { beforeAll, describe, expect, it } from 'vitest'
import fc from 'fast-check'
import { Client, newUser } from '../helpers/api'
import { matrix, requestFor, fixtureMakers, type Ids } from './access-matrix'

const RUNS_PER_ROUTE = Number(process.env.POLEWRIGHT_FUZZ_RUNS) || 90
const MS_PER_ROUTE = 1200

// Field names the schemas use, so generated objects reach past the first "is required".
const KEYS = ['name', 'title', 'graph', 'version', 'theory', 'helicities', 'kinematics', 'target', 'arithmetic', 'shift',
  'email', 'password', 'kind', 'n', 'count', 'seed', 'energy', 'pointSetId', 'body', 'scope', 'process', 'nodes', 'edges',
  'order', 'spin', 'formula', 'measure', 'settings', 'data', 'lambda', 'lambdaTilde', 'momenta', 'points', 'token', 'expiresInDays']

const value = fc.jsonValue({ maxDepth: 4 })
const body = fc.oneof(
  { weight: 3, arbitrary: fc.dictionary(fc.constantFrom(...KEYS), value, { maxKeys: 6 }) },
  { weight: 2, arbitrary: value },
  { weight: 1, arbitrary: fc.dictionary(fc.constantFrom(...KEYS), fc.dictionary(fc.constantFrom(...KEYS), value, { maxKeys: 4 }), { maxKeys: 3 }) },
)
const raw = fc.oneof(fc.string({ maxLength: 80 }), fc.constantFrom('{', '[1,', '{"a":', 'null', '"x"', '1e999999', '{"__proto__":{"x":1}}'))
const queryValue = fc.oneof(fc.string({ maxLength: 12 }), fc.constantFrom('1.5', '0x10', '1e3', '-1', '999999999999999999999', 'NaN', '', '%00'))

let owner: Awaited<ReturnType<typeof newUser>>
let ids: Ids

beforeAll(async () => {
  owner = await newUser('fuzz-owner')
  const member = await newUser('fuzz-viewer')
  const project = (await owner.post('/api/projects', { name: 'Fuzz' })).body
  await owner.post(`/api/projects/${project.id}/members`, { email: member.email, role: 'viewer' })
  const diagram = (await owner.post(`/api/projects/${project.id}/diagrams`, { title: 'Fuzz', graph: { nodes: [], edges: [] } })).body
  ids = { project: project.id, diagram: diagram.id, member: member.id }
  for (const make of fixtureMakers) await make(owner, ids)
}, 60_000)

// Writes with a JSON body; logout would end the owner's session, uploads take multipart.
const jsonRoutes = matrix
  .filter(r => /\.(post|put|patch)\.ts$/.test(r.file))
  .filter(r => !['auth/logout.post.ts', 'projects/[id]/point-sets/index.post.ts'].includes(r.file))
const listRoutes = matrix.filter(r => /\.get\.ts$/.test(r.file) && !r.file.includes('events'))

describe('fuzz: no 5xx from generated input', () => {
  it.each(jsonRoutes.map(r => [r.file, r] as const))('V5.1.x body of %s', async (_f, route) => {
    const { method, path } = requestFor(route, ids)
    // Sign-in and registration are tried anonymously, so the owner's session stays.
    const client = route.access === 'public' ? new Client() : owner
    await fc.assert(fc.asyncProperty(fc.oneof({ weight: 4, arbitrary: body.map(b => ({ b })) }, { weight: 1, arbitrary: raw.map(r => ({ r })) }), async (input) => {
      const res = 'r' in input ? await client.req(method, path, undefined, { raw: input.r }) : await client.req(method, path, input.b)
      expect(res.status, `${method} ${path} ${JSON.stringify(input).slice(0, 300)} → ${JSON.stringify(res.body).slice(0, 300)}`).toBeLessThan(500)
    }), { numRuns: RUNS_PER_ROUTE, interruptAfterTimeLimit: MS_PER_ROUTE, markInterruptAsFailure: false })
  }, 30_000)

  it('V5.1.3 query strings of the read routes', async () => {
    await fc.assert(fc.asyncProperty(fc.constantFrom(...listRoutes), fc.dictionary(fc.constantFrom('limit', 'offset', 'format', 'verdict', 'sort', 'view', 'spinors', 'invariants', 'budgetMs'), queryValue, { maxKeys: 3 }), async (route, query) => {
      const { path } = requestFor(route, ids)
      const qs = new URLSearchParams(query).toString()
      const res = await owner.get(`${path}?${qs}`)
      expect(res.status, `GET ${path}?${qs} → ${JSON.stringify(res.body).slice(0, 300)}`).toBeLessThan(500)
    }), { numRuns: 600, interruptAfterTimeLimit: 10_000, markInterruptAsFailure: false })
  }, 40_000)
})
