// Who may call which route. The inventory test fails when a file under server/api is missing here;
// the matrix test calls every route as each role and checks 401 / 404 / 403 / allowed.
import type { Client } from '../helpers/api'

export type Access = 'public' | 'user' | 'admin' | 'viewer' | 'editor' | 'owner'
export type Scope = 'none' | 'project' | 'diagram' | 'check' | 'point-set'

export interface Ids { project: number, diagram: number, check?: number, pointSet?: number, member: number }

export interface RouteAccess {
  /** Path of the file under server/api. */
  file: string
  access: Access
  scope: Scope
  /** Body sent by the matrix test (validation errors are fine: they show access was granted). */
  body?: unknown
  /** Skips the allowed-role call (e.g. it would log the caller out). */
  skipAllowed?: boolean
}

export const matrix: RouteAccess[] = [
  { file: '[...].ts', access: 'public', scope: 'none', skipAllowed: true },
  { file: 'auth/register.post.ts', access: 'public', scope: 'none', skipAllowed: true },
  { file: 'auth/login.post.ts', access: 'public', scope: 'none', skipAllowed: true },
  { file: 'auth/logout.post.ts', access: 'public', scope: 'none', skipAllowed: true },
  { file: 'auth/me.get.ts', access: 'user', scope: 'none' },
  { file: 'projects/index.get.ts', access: 'user', scope: 'none' },
  { file: 'projects/index.post.ts', access: 'user', scope: 'none', body: {} },
  { file: 'projects/[id]/index.get.ts', access: 'viewer', scope: 'project' },
  { file: 'projects/[id]/index.patch.ts', access: 'owner', scope: 'project', body: {} },
  { file: 'projects/[id]/index.delete.ts', access: 'owner', scope: 'project' },
  { file: 'projects/[id]/checks.get.ts', access: 'viewer', scope: 'project' },
  { file: 'projects/[id]/activity.get.ts', access: 'viewer', scope: 'project' },
  { file: 'projects/[id]/members/index.get.ts', access: 'viewer', scope: 'project' },
  { file: 'projects/[id]/members/index.post.ts', access: 'owner', scope: 'project', body: {} },
  { file: 'projects/[id]/members/[userId].patch.ts', access: 'owner', scope: 'project', body: {} },
  { file: 'projects/[id]/members/[userId].delete.ts', access: 'owner', scope: 'project' },
  { file: 'projects/[id]/diagrams/index.get.ts', access: 'viewer', scope: 'project' },
  { file: 'projects/[id]/diagrams/index.post.ts', access: 'editor', scope: 'project', body: {} },
  { file: 'diagrams/[id]/index.get.ts', access: 'viewer', scope: 'diagram' },
  { file: 'diagrams/[id]/index.put.ts', access: 'editor', scope: 'diagram', body: {} },
  { file: 'diagrams/[id]/index.delete.ts', access: 'editor', scope: 'diagram' },
  { file: 'diagrams/[id]/duplicate.post.ts', access: 'editor', scope: 'diagram', body: {} },
  { file: 'diagrams/[id]/revisions/index.get.ts', access: 'viewer', scope: 'diagram' },
  { file: 'diagrams/[id]/revisions/[version].get.ts', access: 'viewer', scope: 'diagram' },
  { file: 'admin/users/index.get.ts', access: 'admin', scope: 'none' },
  { file: 'admin/users/[id].patch.ts', access: 'admin', scope: 'none', body: {} },
  // Evaluation service.
  { file: 'evaluate.post.ts', access: 'user', scope: 'none', body: {} },
  { file: 'catalogue.get.ts', access: 'user', scope: 'none' },
  { file: 'shifts.post.ts', access: 'user', scope: 'none', body: {} },
  { file: 'cross-shift.post.ts', access: 'user', scope: 'none', body: {} },
  { file: 'limit-checks.post.ts', access: 'user', scope: 'none', body: {} },
  { file: 'loop-cuts.post.ts', access: 'user', scope: 'none', body: {} },
  { file: 'diagrams/[id]/checks/index.post.ts', access: 'editor', scope: 'diagram', body: {} },
  { file: 'diagrams/[id]/checks/index.get.ts', access: 'viewer', scope: 'diagram' },
  { file: 'diagrams/[id]/check-drawing.post.ts', access: 'viewer', scope: 'diagram', body: {} },
  { file: 'diagrams/[id]/check-loop-cut.post.ts', access: 'viewer', scope: 'diagram', body: {} },
  { file: 'checks/[id]/index.get.ts', access: 'viewer', scope: 'check' },
  // Collaboration. Token and invitation ids in these paths name nothing, so the
  // allowed call would be a correct 404: tests/api/collab*.test.ts cover the allowed cases.
  { file: 'admin/outbox.get.ts', access: 'admin', scope: 'none' },
  { file: 'auth/password/forgot.post.ts', access: 'public', scope: 'none', skipAllowed: true },
  { file: 'auth/password/reset.post.ts', access: 'public', scope: 'none', skipAllowed: true },
  { file: 'auth/password/reset/[token].get.ts', access: 'public', scope: 'none', skipAllowed: true },
  { file: 'invitations/[token]/index.get.ts', access: 'public', scope: 'none', skipAllowed: true },
  { file: 'invitations/[token]/accept.post.ts', access: 'user', scope: 'none', skipAllowed: true },
  { file: 'projects/[id]/invitations/index.get.ts', access: 'owner', scope: 'project' },
  { file: 'projects/[id]/invitations/[invitationId].delete.ts', access: 'owner', scope: 'project', skipAllowed: true },
  { file: 'diagrams/[id]/comments/index.get.ts', access: 'viewer', scope: 'diagram' },
  { file: 'diagrams/[id]/comments/index.post.ts', access: 'viewer', scope: 'diagram', body: {} },
  { file: 'checks/[id]/comments/index.get.ts', access: 'viewer', scope: 'check' },
  { file: 'checks/[id]/comments/index.post.ts', access: 'viewer', scope: 'check', body: {} },
  { file: 'comments/[id].patch.ts', access: 'viewer', scope: 'none', body: {}, skipAllowed: true },
  { file: 'comments/[id].delete.ts', access: 'viewer', scope: 'none', skipAllowed: true },
  { file: 'tokens/index.get.ts', access: 'user', scope: 'none' },
  { file: 'tokens/index.post.ts', access: 'user', scope: 'none', body: {} },
  { file: 'tokens/[id].delete.ts', access: 'user', scope: 'none', skipAllowed: true },
  // Server-side sessions: the caller's own; ending one would sign the matrix client out.
  { file: 'account/sessions/index.get.ts', access: 'user', scope: 'none' },
  { file: 'account/sessions/[id].delete.ts', access: 'user', scope: 'none', skipAllowed: true },
  // The caller's own name and password (a change would alter the matrix client's account).
  { file: 'account/index.patch.ts', access: 'user', scope: 'none', body: {}, skipAllowed: true },
  { file: 'account/password.post.ts', access: 'user', scope: 'none', body: {}, skipAllowed: true },
  // Point sets and batch checks.
  { file: 'projects/[id]/point-sets/index.get.ts', access: 'viewer', scope: 'project' },
  { file: 'projects/[id]/point-sets/index.post.ts', access: 'editor', scope: 'project', body: {} },
  { file: 'projects/[id]/point-sets/generate.post.ts', access: 'editor', scope: 'project', body: {} },
  { file: 'point-sets/[id]/index.get.ts', access: 'viewer', scope: 'point-set' },
  { file: 'point-sets/[id]/index.delete.ts', access: 'editor', scope: 'point-set' },
  { file: 'point-sets/[id]/points.get.ts', access: 'viewer', scope: 'point-set' },
  { file: 'point-sets/[id]/export.get.ts', access: 'viewer', scope: 'point-set' },
  { file: 'point-sets/[id]/batch-checks.get.ts', access: 'viewer', scope: 'point-set' },
  { file: 'diagrams/[id]/batch-checks/index.get.ts', access: 'viewer', scope: 'diagram' },
  { file: 'diagrams/[id]/batch-checks/index.post.ts', access: 'editor', scope: 'diagram', body: {} },
  { file: 'batch-checks/[id]/index.get.ts', access: 'viewer', scope: 'check' },
  { file: 'batch-checks/[id]/events.get.ts', access: 'viewer', scope: 'check' },
  { file: 'batch-checks/[id]/cancel.post.ts', access: 'editor', scope: 'check' },
  // Job queue: the health route and the queue page's routes.
  { file: 'health.get.ts', access: 'public', scope: 'none', skipAllowed: true },
  // The landing page's worked example (the same for everyone).
  { file: 'showcase.get.ts', access: 'public', scope: 'none', skipAllowed: true },
  { file: 'admin/queue/index.get.ts', access: 'admin', scope: 'none' },
  { file: 'admin/queue/retry.post.ts', access: 'admin', scope: 'none', body: {} },
  { file: 'checks/[id]/points.get.ts', access: 'viewer', scope: 'check' },
  { file: 'checks/[id]/points.csv.get.ts', access: 'viewer', scope: 'check' },
  { file: 'checks/[id]/points.json.get.ts', access: 'viewer', scope: 'check' },
]

/** Turns a route file into a request path and method for the given fixture ids. */
export function requestFor(route: RouteAccess, ids: Ids): { method: string, path: string } {
  const m = route.file.match(/\.(get|post|put|patch|delete)\.ts$/)
  const method = m ? m[1]!.toUpperCase() : 'GET'
  let path = route.file.replace(/\.(get|post|put|patch|delete)?\.?ts$/, '').replace(/\/index$/, '').replace(/^index$/, '')
  const scopeId: Record<Scope, number | undefined> = { 'none': ids.member, 'project': ids.project, 'diagram': ids.diagram, 'check': ids.check, 'point-set': ids.pointSet }
  path = path
    .replace('[...]', 'no-such-route')
    .replace('[id]', String(scopeId[route.scope] ?? 1))
    .replace('[userId]', String(ids.member))
    .replace('[version]', '1')
    .replace(/\[(\w+)\]/g, '1')
  return { method, path: `/api/${path}` }
}

/** Extra fixtures later features need (a check, a point set), created by an owner client. */
export const fixtureMakers: ((owner: Client, ids: Ids) => Promise<void>)[] = []

// Evaluation service: a stored check on ids.diagram, after saving a process into its graph.
fixtureMakers.push(async (owner, ids) => {
  const diagram = (await owner.get(`/api/diagrams/${ids.diagram}`)).body
  await owner.put(`/api/diagrams/${ids.diagram}`, { version: diagram.version, graph: { ...diagram.graph, process: { theory: 'gluon', helicities: [-1, -1, 1, 1] } } })
  const check = await owner.post(`/api/diagrams/${ids.diagram}/checks`, { kinematics: { kind: 'random', seed: 1 } })
  if (check.status !== 201) throw new Error(`check fixture: ${check.status} ${JSON.stringify(check.body)}`)
  ids.check = check.body.id
})

// Point sets: a small generated set in the fixture project (ids.pointSet).
fixtureMakers.push(async (owner, ids) => {
  const set = await owner.post(`/api/projects/${ids.project}/point-sets/generate`, { kind: 'physical', n: 4, count: 3, seed: 1 })
  if (set.status !== 201) throw new Error(`point-set fixture: ${set.status} ${JSON.stringify(set.body)}`)
  ids.pointSet = set.body.id
})
