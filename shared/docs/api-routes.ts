// The routes the API page documents. Each request body is described by the zod schema the route
// validates with (the page renders its fields and JSON Schema from it), and each example is
// typed as that schema's input and parsed by it (tests/unit/docs-examples.test.ts), so an example
// cannot drift from what the server accepts. curl and fetch snippets are generated from these.
// Later features add their routes to a section here (or a new section).
import { z } from 'zod'
import { AccountUpdateSchema, LoginSchema, PasswordChangeSchema, RegisterSchema } from '../schemas/auth'
import { DiagramCreateSchema, DiagramUpdateSchema, MemberAddSchema, ProjectCreateSchema } from '../schemas/projects'
import { EvaluateRequestSchema } from '../schemas/evaluate'
import { CheckRunSchema, CrossShiftRequestSchema, DrawingCheckSchema, ShiftsRequestSchema } from '../schemas/service'
import { LimitCheckRequestSchema } from '../schemas/limit-checks'
import { LoopCutRequestSchema } from '../schemas/loop-cuts'
import { LoopCutDrawingCheckSchema } from '../schemas/loop-cut-drawing'

export type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE'

export interface ApiExample {
  label: string
  body: unknown
}

export interface ApiRoute {
  id: string
  method: Method
  /** With `:name` parameters. */
  path: string
  /** Who may call it. */
  access: string
  summary: string
  schema?: z.ZodType
  examples?: ApiExample[]
  /** Path parameters in the snippets. */
  params?: Record<string, string | number>
  /** Query parameters, documented beside the body. */
  query?: { name: string, meaning: string }[]
  /** What a 2xx answer holds. */
  response: string
  statuses: [number, string][]
  /** Safe to run from the page with the reader's own session (writes nothing). */
  runnable?: boolean
}

export interface ApiSection {
  id: string
  title: string
  intro: string
  routes: ApiRoute[]
}

/** An example typed as the schema's input, so a wrong field fails the typecheck as well as the test. */
function example<S extends z.ZodType>(_schema: S, label: string, body: z.input<S>): ApiExample {
  return { label, body }
}

const MHV5 = [-1, -1, 1, 1, 1]
const commonErrors: [number, string][] = [[401, 'no session and no valid token']]

export const API_SECTIONS: ApiSection[] = [
  {
    id: 'auth',
    title: 'Sign-in',
    intro: 'Pages use a session cookie. Scripts send `Authorization: Bearer <token>` instead (create a token under your account); a read-only token may call every GET route and POST /api/evaluate, /api/shifts, /api/cross-shift, /api/limit-checks and /api/loop-cuts, which write nothing.',
    routes: [
      {
        id: 'register', method: 'POST', path: '/api/auth/register', access: 'anyone', summary: 'Creates an account and signs in.',
        schema: RegisterSchema, examples: [example(RegisterSchema, 'a new account', { email: 'ada.quill@example.test', password: 'a long passphrase', name: 'Ada Quill' })],
        response: 'The user `{ id, email, name, role }` and a session cookie.', statuses: [[201, 'created'], [400, 'a field is missing or malformed, or the password is too easy to guess (the message says why)'], [409, 'the e-mail is already registered']],
      },
      {
        id: 'login', method: 'POST', path: '/api/auth/login', access: 'anyone', summary: 'Signs in.',
        schema: LoginSchema, examples: [example(LoginSchema, 'sign in', { email: 'ada.quill@example.test', password: 'a long passphrase' })],
        response: 'The user and a session cookie.', statuses: [[200, 'signed in'], [401, 'wrong e-mail or password'], [429, 'too many failed attempts for this account from this address, for this account, or from this address (the message gives the minutes)']],
      },
      { id: 'logout', method: 'POST', path: '/api/auth/logout', access: 'anyone', summary: 'Ends the session on the server: a copy of the cookie stops working too.', response: 'Nothing.', statuses: [[204, 'signed out']] },
      { id: 'me', method: 'GET', path: '/api/auth/me', access: 'signed in', summary: 'Who is calling.', response: '`{ id, email, name, role }`.', statuses: [[200, 'the caller'], ...commonErrors], runnable: true },
      {
        id: 'sessions', method: 'GET', path: '/api/account/sessions', access: 'a signed-in session (not a token)', summary: 'The browsers signed in to your account.',
        response: '`[{ id, userAgent, createdAt, lastSeenAt, expiresAt, current }]`, most recently seen first.', statuses: [[200, 'the open sessions'], [401, 'not signed in'], [403, 'called with an API token']],
      },
      {
        id: 'session-end', method: 'DELETE', path: '/api/account/sessions/:id', params: { id: 12 }, access: 'a signed-in session (not a token)', summary: 'Ends one of your sessions; that browser is signed out at its next request.',
        response: 'Nothing.', statuses: [[204, 'ended'], [404, 'not one of your sessions'], [403, 'called with an API token']],
      },
      {
        id: 'account-update', method: 'PATCH', path: '/api/account', access: 'a signed-in session (not a token)', summary: 'Changes your display name (the e-mail address does not change).',
        schema: AccountUpdateSchema, examples: [example(AccountUpdateSchema, 'a new name', { name: 'Ada M. Quill' })],
        response: 'The user `{ id, email, name, role }`.', statuses: [[200, 'changed'], [400, 'the name is empty or longer than 120 characters'], [401, 'not signed in'], [403, 'called with an API token']],
      },
      {
        id: 'password-change', method: 'POST', path: '/api/account/password', access: 'a signed-in session (not a token)', summary: 'Changes your password; every other session ends, this one stays, API tokens stay.',
        schema: PasswordChangeSchema, examples: [example(PasswordChangeSchema, 'a new password', { currentPassword: 'a long passphrase', password: 'seven quiet lanterns drift east' })],
        response: '`{ sessionsEnded }`: how many other browsers were signed out.', statuses: [[200, 'changed'], [400, '`currentPassword` is wrong, or `password` is too short, too easy to guess (the message says why) or unchanged'], [401, 'not signed in'], [403, 'called with an API token'], [429, 'too many wrong current passwords (the sign-in throttle)']],
      },
    ],
  },
  {
    id: 'projects',
    title: 'Projects and members',
    intro: 'A project holds diagrams, point sets and checks. Roles: owner, editor, viewer. A non-member gets 404 for anything inside a project; a role too low gets 403.',
    routes: [
      {
        id: 'project-create', method: 'POST', path: '/api/projects', access: 'signed in', summary: 'Creates a project; the caller becomes its owner.',
        schema: ProjectCreateSchema, examples: [example(ProjectCreateSchema, 'a project', { name: 'Six-gluon checks', description: 'NMHV against Berends–Giele' })],
        response: 'The project `{ id, name, description, role, … }`.', statuses: [[201, 'created'], [400, 'a field is missing or malformed'], ...commonErrors],
      },
      { id: 'project-list', method: 'GET', path: '/api/projects', access: 'signed in', summary: 'The caller\'s projects.', response: 'A JSON array of projects with the caller\'s role.', statuses: [[200, 'the list'], ...commonErrors], runnable: true },
      { id: 'project-get', method: 'GET', path: '/api/projects/:id', params: { id: 1 }, access: 'viewer', summary: 'One project.', response: 'The project.', statuses: [[200, 'the project'], [404, 'no such project, or not a member'], ...commonErrors] },
      {
        id: 'member-add', method: 'POST', path: '/api/projects/:id/members', params: { id: 1 }, access: 'owner', summary: 'Adds a member, or invites an address that has no account yet.',
        schema: MemberAddSchema, examples: [example(MemberAddSchema, 'an editor', { email: 'rui.tanaka@example.test', role: 'editor' })],
        response: 'The membership (201) or the invitation (202).', statuses: [[201, 'member added'], [202, 'invitation e-mailed'], [403, 'not an owner'], [404, 'no such project'], ...commonErrors],
      },
    ],
  },
  {
    id: 'diagrams',
    title: 'Diagrams',
    intro: 'A diagram\'s `graph` is the canvas document. It may be empty; its `process` (theory, spin, helicities, colour order, shift) is needed only when a check runs. Saves carry the version you edited: a stale one gets 409 and nothing is overwritten.',
    routes: [
      {
        id: 'diagram-create', method: 'POST', path: '/api/projects/:id/diagrams', params: { id: 1 }, access: 'editor', summary: 'Creates a diagram.',
        schema: DiagramCreateSchema,
        examples: [
          example(DiagramCreateSchema, 'an empty diagram', { title: 'Five gluons', graph: { nodes: [], edges: [] } }),
          example(DiagramCreateSchema, 'with its process', { title: 'Five gluons, MHV', graph: { schemaVersion: 1, process: { theory: 'gluon', helicities: MHV5, shift: [1, 2] }, nodes: [], edges: [] } }),
        ],
        response: 'The diagram `{ id, projectId, title, graph, version, … }`.', statuses: [[201, 'created'], [400, 'the graph fails its schema (the message names the field)'], [403, 'a viewer'], [404, 'no such project'], ...commonErrors],
      },
      { id: 'diagram-get', method: 'GET', path: '/api/diagrams/:id', params: { id: 1 }, access: 'viewer', summary: 'One diagram.', response: 'The diagram.', statuses: [[200, 'the diagram'], [404, 'no such diagram, or not a member'], ...commonErrors] },
      {
        id: 'diagram-save', method: 'PUT', path: '/api/diagrams/:id', params: { id: 1 }, access: 'editor', summary: 'Saves a new version (kept as a revision).',
        schema: DiagramUpdateSchema, examples: [example(DiagramUpdateSchema, 'rename', { title: 'Five gluons, [2,3⟩ shift', version: 1 })],
        response: 'The diagram with its new `version`.', statuses: [[200, 'saved'], [409, 'someone saved in between; nothing was overwritten'], [403, 'a viewer'], ...commonErrors],
      },
    ],
  },
  {
    id: 'evaluation',
    title: 'Evaluation',
    intro: 'Evaluations run in a pool of worker threads with a time budget per request (the catalogue gives it); a request over budget gets 503. `?budgetMs=` lowers the budget for one request (a script that would rather fail fast); it cannot raise it. Limits are checked before any work. Errors: 400 when the body fails its schema, 422 when it is well-formed but physically invalid; the message starts with the field path and `data.field` holds it.',
    routes: [
      {
        id: 'evaluate', method: 'POST', path: '/api/evaluate', access: 'signed in (read-only tokens too)', summary: 'Evaluates one amplitude by on-shell recursion and compares it with a target.',
        schema: EvaluateRequestSchema,
        query: [{ name: 'budgetMs', meaning: 'a smaller time budget for this request, in ms' }],
        examples: [
          example(EvaluateRequestSchema, 'five gluons, MHV, seeded point', { theory: 'gluon', helicities: MHV5, kinematics: { kind: 'random', seed: 7 } }),
          example(EvaluateRequestSchema, 'exact arithmetic, a typed target', {
            theory: 'gluon', helicities: MHV5, kinematics: { kind: 'rational', seed: 3 }, arithmetic: 'exact',
            target: { formula: '<1 2>^4/(<1 2><2 3><3 4><4 5><5 1>)' },
          }),
          example(EvaluateRequestSchema, 'exact, with the big-rational reference instead of primes (same fractions, slower)', {
            theory: 'gluon', helicities: [-1, 1, -1, 1, 1, 1], kinematics: { kind: 'rational', seed: 1 }, arithmetic: 'exact', exact: { backend: 'rational' },
          }),
          example(EvaluateRequestSchema, 'six gluons, NMHV, physical point, falloff probed', {
            theory: 'gluon', helicities: [-1, 1, -1, 1, -1, 1], kinematics: { kind: 'physical', seed: 1, energy: 500 }, shift: [1, 2], target: 'berends-giele', probeFalloff: true,
          }),
          example(EvaluateRequestSchema, 'four gluons from momenta', {
            theory: 'gluon', helicities: [-1, -1, 1, 1], kinematics: { kind: 'momenta', momenta: [[-1, 0, 0, -1], [-1, 0, 0, 1], [1, 1, 0, 0], [1, -1, 0, 0]] },
          }),
          example(EvaluateRequestSchema, 'gravitons, KLT, with the term tree', { theory: 'graviton', helicities: [-2, -2, 2, 2, 2], kinematics: { kind: 'random', seed: 2 }, target: 'klt', tree: true }),
          example(EvaluateRequestSchema, 'a quark line and four gluons (species per leg)', {
            theory: 'qcd', species: ['qbar1', 'q1', 'g', 'g', 'g', 'g'], helicities: [-0.5, 0.5, -1, 1, -1, 1], kinematics: { kind: 'random', seed: 5 },
          }),
        ],
        response: '`{ n, theory, shift, arithmetic, value, terms[], target, deviation, verdict, falloff, warnings, kinematics, engine, ms }`: the residue sum, one term per channel and internal helicity, the target\'s value, the verdict, and the point actually used.',
        statuses: [[200, 'evaluated (a singular point is a 200 with verdict "singular point")'], [400, 'the body fails the schema'], [422, 'physically invalid input, or a limit exceeded'], [503, 'the evaluation exceeded its time budget'], ...commonErrors],
        runnable: true,
      },
      { id: 'showcase', method: 'GET', path: '/api/showcase', access: 'anyone', summary: 'The landing page\'s worked example: five gluons (−−+++) under [1,2⟩ expanded to three-point vertices, as an SVG, with its float and exact verdicts against Parke–Taylor.', response: '`{ process, svg, vertices, checks: [{ arithmetic, verdict, deviation, target, tolerance, seed, terms, ms }], engine }`.', statuses: [[200, 'the example'], [503, 'the evaluation did not finish within its budget']] },
      { id: 'catalogue', method: 'GET', path: '/api/catalogue', access: 'signed in', summary: 'What the engine offers: theories and their helicities, targets per theory, limits, kinematics kinds, arithmetics and tolerances, verdicts, the formula syntax, the time budget.', response: '`{ engine, theories[], targets[], limits[], kinematics[], arithmetics[], verdicts[], formula, shifts, service }`.', statuses: [[200, 'the catalogue'], ...commonErrors], runnable: true },
      {
        id: 'shifts', method: 'POST', path: '/api/shifts', access: 'signed in', summary: 'Every [i,j⟩ shift of a process with its large-z falloff exponent and validity — from the table of valid shifts (docs/conventions.md "Falloff"), or measured exactly with `measure: true` (n ≤ 7 gluons, 6 gravitons, 8 cubic scalars; the catalogue lists the limits).',
        schema: ShiftsRequestSchema,
        examples: [
          example(ShiftsRequestSchema, 'the table for six gluons', { theory: 'gluon', helicities: [-1, -1, 1, -1, 1, 1] }),
          example(ShiftsRequestSchema, 'measured, spin 3', { theory: 'spin', spin: 3, helicities: [-3, -3, 3, 3], measure: true }),
          example(ShiftsRequestSchema, 'a quark line and three gluons (species per leg)', { theory: 'qcd', helicities: [-0.5, 0.5, -1, 1, 1], species: ['qbar1', 'q1', 'g', 'g', 'g'] }),
        ],
        response: '`{ theory, n, helicities, species?, defaultShift, rows: [{ shift: [i, j], exponent, valid, source: "table" | "measured" }], ms }`.',
        statuses: [[200, 'the shifts'], [400, 'the body fails the schema'], [422, 'invalid process, or n over the limit'], [503, 'over the time budget'], ...commonErrors], runnable: true,
      },
      {
        id: 'cross-shift', method: 'POST', path: '/api/cross-shift', access: 'signed in', summary: 'The same amplitude under every [i,j⟩ shift at one point; for a consistent theory all valid shifts agree. At n = 4 this is the four-particle test.',
        schema: CrossShiftRequestSchema,
        examples: [
          example(CrossShiftRequestSchema, 'four gravitons (consistent)', { theory: 'graviton', helicities: [-2, -2, 2, 2] }),
          example(CrossShiftRequestSchema, 'q̄ q g g (species per leg)', { theory: 'qcd', helicities: [-0.5, 0.5, -1, 1], species: ['qbar1', 'q1', 'g', 'g'] }),
          example(CrossShiftRequestSchema, 'spin 3, exact (inconsistent)', { theory: 'spin', spin: 3, helicities: [-3, -3, 3, 3], kinematics: { kind: 'rational', seed: 2 }, arithmetic: 'exact' }),
        ],
        response: '`{ theory, n, arithmetic, rows: [{ shift, valid, value }], spread, agree, test, poles?, tolerance, kinematics, warnings, ms }`; `spread` is the largest |v_a − v_b| / max |v| among valid shifts; `test` is `shifts`, or `factorisation` for a single scalar species (spin 0), whose every shift has a boundary term: then `poles` lists each pole with whether the sum of all cubic diagrams has the residue A_L·A_R there.',
        statuses: [[200, 'evaluated'], [400, 'the body fails the schema'], [422, 'invalid process or point'], [503, 'over the time budget'], ...commonErrors], runnable: true,
      },
      {
        id: 'limit-checks', method: 'POST', path: '/api/limit-checks', access: 'signed in', summary: 'Limit and identity checks of a process. `soft`: leg s scaled λ → √ε λ, λ̃ → √ε λ̃ along ε = 10⁻¹ … 10⁻⁸ and A_n / (S × A_{n−1}) → 1 with the leading soft factor (gluons, gravitons; n ≥ 5), or for gravitons with `order: \'subleading\'` the leading plus the subleading factor (Cachazo–Strominger). `collinear`: adjacent gluons a, a+1 with momentum fraction z and offset δ, A_n / Σ_h Split × A_{n−1} → 1 (n ≥ 5). `identity`: cyclicity, reflection, U(1) decoupling, Kleiss–Kuijf or the fundamental BCJ relation among colour-ordered gluon amplitudes, with its residual and tolerance. Writes nothing.',
        schema: LimitCheckRequestSchema,
        examples: [
          example(LimitCheckRequestSchema, 'soft gluon', { check: 'soft', theory: 'gluon', helicities: [-1, 1, -1, 1, 1], soft: 2 }),
          example(LimitCheckRequestSchema, 'soft graviton', { check: 'soft', theory: 'graviton', helicities: [-2, -2, 2, 2, 2], soft: 4 }),
          example(LimitCheckRequestSchema, 'soft graviton, subleading', { check: 'soft', theory: 'graviton', helicities: [-2, -2, -2, 2, 2], soft: 1, order: 'subleading' }),
          example(LimitCheckRequestSchema, 'collinear gluons 3 ∥ 4', { check: 'collinear', theory: 'gluon', helicities: [-1, -1, 1, -1, 1, 1], leg: 3, z: 0.4 }),
          example(LimitCheckRequestSchema, 'Kleiss–Kuijf, exact', { check: 'identity', theory: 'gluon', helicities: [-1, 1, -1, 1, -1, 1], identity: 'kleiss-kuijf', alpha: [2, 3], arithmetic: 'exact' }),
        ],
        response: 'Soft and collinear: `{ check, theory, n, helicities, legs, order (soft), rows: [{ x, ratio, deviation }], rate, expectedRate, holds, factor, source, ms }` — `deviation` is |ratio − 1|, `rate` the fitted r of deviation ~ x^r (expected 1: the next term of each expansion is one power down; 2 with the subleading soft factor). Identity: `{ check, theory, n, helicities, identity, arithmetic, relation, terms: [{ order, coefficient, value }], sum, residual, tolerance, holds, source, ms }` — `residual` = |Σ| / max |term|, `holds` when it is ≤ `tolerance` (1e-12; floats run in double-double) or exactly 0 in exact arithmetic.',
        statuses: [[200, 'checked'], [400, 'the body fails the schema'], [422, 'invalid process, a leg that does not exist, or a limit whose A_{n−1} vanishes identically'], [503, 'over the time budget'], ...commonErrors], runnable: true,
      },
      {
        id: 'loop-cuts', method: 'POST', path: '/api/loop-cuts', access: 'signed in', summary: 'Every box of the one-loop colour-ordered gluon amplitude (four corners of consecutive legs, C(n, 4) boxes, n = 4..8) with its coefficient by the quadruple cut: ½ Σ over the two cut solutions and the states on the four cut lines of the product of the corner amplitudes. `states: "n4"` (default) sums the N = 4 multiplet — gluons, four gluinos, six scalars — by Grassmann integration over the lines (corners as MHV and anti-MHV super-amplitudes); `"gluons"` keeps gluons only. For MHV helicities each box is compared with the N = 4 coefficient (Bern, Dixon, Dunbar, Kosower, hep-ph/9403226): −½ (st − P²Q²) A_tree for one-mass and two-mass-easy boxes, −st A_tree at four points, 0 otherwise; for any helicities the set is checked against the infrared conditions of the N = 4 amplitude (`infrared`). `?format=csv` or `?format=json` answers the box table as a download. Exact arithmetic works for every box with a massless corner; four-mass boxes need a square root (float only). Writes nothing.',
        schema: LoopCutRequestSchema,
        examples: [
          example(LoopCutRequestSchema, 'the four-point box', { helicities: [-1, -1, 1, 1] }),
          example(LoopCutRequestSchema, 'six-gluon MHV, exact', { helicities: [-1, -1, 1, 1, 1, 1], arithmetic: 'exact' }),
          example(LoopCutRequestSchema, 'split NMHV, Berends–Giele corners', { helicities: [-1, -1, -1, 1, 1, 1], corners: 'berends-giele', target: 'none' }),
          example(LoopCutRequestSchema, 'alternating NMHV, N = 4 multiplet and infrared conditions, exact', { helicities: [-1, 1, -1, 1, -1, 1], arithmetic: 'exact', states: 'n4' }),
          example(LoopCutRequestSchema, 'non-adjacent MHV, gluons only', { helicities: [-1, 1, -1, 1, 1, 1], states: 'gluons' }),
        ],
        response: '`{ theory, n, helicities, arithmetic, corners, states, tree, boxes: [{ corners, kind, states, solutions: [{ threePoint, onShell, loopMomentum, states }], terms: [{ solution, helicities, multiplicity, value }], value, target, targetRule, deviation, verdict, note? }], sum, targetSum, counts, infrared: { rows: [{ invariant, value, target, deviation, verdict }], verdict, note } | null, verdict, tolerance, source, warnings, ms }` — a box\'s `states` says in words what was summed (`N = 4 multiplet: gluons, four gluinos, six scalars` or `gluons only: exact for this box because …`); `helicities` of a term are h₁..h₄ of the lines ℓ₁..ℓ₄ at their outgoing end (±1 gluons, ±½ gluinos, 0 scalars; line k runs from corner k−1 into corner k), `multiplicity` the SU(4) routings summed in it; the overall `verdict` is `singular point` if any box is, else `disagrees` if any box or the infrared check disagrees, else `agrees` if anything was compared. With `?format=csv`: a CSV download (rows term, box, sum, infrared); `?format=json`: `{ format: "polewright-loop-cuts", formatVersion: 1, request, result }`.',
        query: [{ name: 'format', meaning: 'csv or json: the box table as a download' }],
        statuses: [[200, 'the boxes'], [400, 'the body fails the schema, or a format other than csv or json'], [422, 'invalid helicities, fewer than 4 or more than 8 legs, or a point that does not fit the arithmetic'], [503, 'over the time budget'], ...commonErrors], runnable: true,
      },
    ],
  },
  {
    id: 'checks',
    title: 'Checks',
    intro: 'A check is a stored evaluation of a diagram\'s process with its provenance: request, result, verdict, engine version, arithmetic, seed, duration, who ran it and when, and the diagram version.',
    routes: [
      {
        id: 'check-run', method: 'POST', path: '/api/diagrams/:id/checks', params: { id: 1 }, access: 'editor', summary: 'Evaluates the diagram\'s process (theory, spin, helicities, colour order, shift) at the point given and stores the check. When the saved graph has drawn terms (vertices or Blocks), the check evaluates the drawing: each connected component is one term whose top-level Line must separate a channel of the shift, and the verdict is about the drawn sum against the target — an incomplete or wrong drawing never agrees. On a loop-cut diagram the body is that of check-loop-cut without `graph`: the saved rings are checked as check-loop-cut does and stored, `result` being its box table.',
        schema: CheckRunSchema,
        query: [{ name: 'budgetMs', meaning: 'a smaller time budget for this request, in ms' }],
        examples: [
          example(CheckRunSchema, 'a seeded point', { kinematics: { kind: 'random', seed: 1 } }),
          example(CheckRunSchema, 'exact, with the falloff probed', { kinematics: { kind: 'rational', seed: 4 }, arithmetic: 'exact', probeFalloff: true }),
        ],
        response: 'The check in full, as GET /api/checks/:id returns it. With drawn terms, `result.value`, `result.deviation` and `result.verdict` are the drawing\'s, and `result.drawing` is `{ sum, terms: [{ id, channel, internalHelicity, label, lineId, zStar, pole, value, problems }], comparison: { missing, duplicated, foreign, wrongHelicity, incomplete, invalid, messages, complete }, recursion: { value, deviation, verdict }, message }`: each comparison entry is `{ left, helicity, terms, message }` with the message in words ("channel {1,6} with internal helicity − is not drawn"); `recursion` is the process\'s full recursion under the same shift; `summary.drawing` is `{ terms, complete, message }`. Without drawn terms the result is the process\'s recursion, as before.',
        statuses: [[201, 'stored'], [400, 'the body fails the schema'], [422, 'the diagram has no process (`graph.process`), or the process or point is invalid'], [403, 'a viewer'], [404, 'no such diagram'], [503, 'over the time budget'], ...commonErrors],
      },
      {
        id: 'check-drawing', method: 'POST', path: '/api/diagrams/:id/check-drawing', params: { id: 1 }, access: 'viewer', summary: 'Checks the graph in the body as drawn, the way a stored check reads a saved drawing, and stores nothing: what a viewer has on the canvas after opening or folding Blocks (never saved) is checked as it is. The process is `graph.process`, else the diagram\'s saved one. Writes nothing, so any member and read-scope tokens may call it.',
        schema: DrawingCheckSchema,
        query: [{ name: 'budgetMs', meaning: 'a smaller time budget for this request, in ms' }],
        examples: [example(DrawingCheckSchema, 'an empty canvas: the process\'s recursion', { kinematics: { kind: 'random', seed: 1 }, graph: { process: { theory: 'gluon', helicities: [-1, -1, 1, 1, 1] }, nodes: [], edges: [] } })],
        response: 'The evaluation response (as POST /api/evaluate) in the diagram\'s labels; with drawn terms `value`, `deviation` and `verdict` are the drawing\'s and `drawing` holds the terms and the comparison, as in a stored check\'s `result`. Nothing is stored.',
        statuses: [[200, 'checked'], [400, 'the body fails the schema (`graph.nodes[3].id`, …)'], [422, 'no process in the graph or the diagram (`graph.process`), or the process or point is invalid'], [404, 'no such diagram, or not a member'], [503, 'over the time budget'], ...commonErrors],
      },
      {
        id: 'check-loop-cut', method: 'POST', path: '/api/diagrams/:id/check-loop-cut', params: { id: 1 }, access: 'viewer', summary: 'Checks the rings drawn on a loop-cut diagram (the body\'s `graph`, else the saved one): each ring of four corners joined by four Lines is read as a box of the process (gluons, 4..8 legs, colour order 1..n), stands for the quadruple-cut terms its Lines allow (open Lines: both cut solutions and every internal helicity; drawn ones: only those), and the rings of each box are summed and compared with the box\'s N = 4 MHV coefficient (Bern, Dixon, Dunbar, Kosower, hep-ph/9403226). Writes nothing.',
        schema: LoopCutDrawingCheckSchema,
        query: [{ name: 'budgetMs', meaning: 'a smaller time budget for this request, in ms' }],
        examples: [example(LoopCutDrawingCheckSchema, 'the saved rings at seed 2', { kinematics: { kind: 'random', seed: 2 } })],
        response: '`{ kind: \'loop-cut\', n, helicities, arithmetic, tree, rings: [{ ring, box, corners, kind, helicities, summed, terms, value }], boxes: [{ box, corners, kind, rings, value, engineValue, target, targetRule, deviation, verdict, note }], missing, sum, targetSum, deviation, verdict, tolerance, counts, source, warnings, ms }`: `summed` is `open`, `drawn` or `partly`; `missing` lists the boxes of the process not drawn; `sum` and `targetSum` run over the drawn boxes with a target.',
        statuses: [[200, 'checked'], [400, 'the body fails the schema'], [422, 'a tree diagram (`graph.kind`), a process that is not 4..8 gluons (`graph.process.helicities`, …), a broken ring named by its node (`graph.nodes[3]`) or line (`graph.edges[5]`), or nothing drawn (`graph.nodes`)'], [404, 'no such diagram, or not a member'], [503, 'over the time budget'], ...commonErrors],
      },
      { id: 'check-list', method: 'GET', path: '/api/diagrams/:id/checks', params: { id: 1 }, access: 'viewer', summary: 'The diagram\'s checks, newest first.', query: [{ name: 'limit', meaning: 'at most this many (default 50, at most 200)' }], response: 'An array of `{ id, diagramVersion, kind, status, verdict, arithmetic, seed, engineVersion, durationMs, summary, createdBy, createdByName, createdAt }` — without the payloads.', statuses: [[200, 'the list'], [404, 'no such diagram'], ...commonErrors] },
      { id: 'check-get', method: 'GET', path: '/api/checks/:id', params: { id: 1 }, access: 'viewer', summary: 'One check in full.', response: 'The list fields plus `request` and `result` (the evaluation response).', statuses: [[200, 'the check'], [404, 'no such check'], ...commonErrors] },
    ],
  },
]

/** The path with its example parameters filled in. */
export function examplePath(route: ApiRoute): string {
  return route.path.replace(/:(\w+)/g, (_m, name: string) => String(route.params?.[name] ?? 1))
}

const shellQuote = (s: string) => `'${s.replace(/'/g, `'\\''`)}'`

/** JSON with two-space indents, short arrays and objects kept on one line. */
export function compactJson(value: unknown, indent = ''): string {
  const flat = JSON.stringify(value)
  if (flat === undefined) return 'null'
  if (value === null || typeof value !== 'object' || flat.length + indent.length <= 76) return flat
  const inner = indent + '  '
  if (Array.isArray(value)) return `[\n${value.map(v => inner + compactJson(v, inner)).join(',\n')}\n${indent}]`
  const entries = Object.entries(value as Record<string, unknown>).filter(([, v]) => v !== undefined)
  return `{\n${entries.map(([k, v]) => `${inner}${JSON.stringify(k)}: ${compactJson(v, inner)}`).join(',\n')}\n${indent}}`
}

/** A copy-paste curl command (token in $POLEWRIGHT_TOKEN). */
export function curlSnippet(origin: string, route: ApiRoute, body?: unknown): string {
  const lines = [`curl -X ${route.method} ${shellQuote(origin + examplePath(route))}`, '  -H "Authorization: Bearer $POLEWRIGHT_TOKEN"']
  if (body !== undefined) {
    lines.push('  -H "Content-Type: application/json"')
    lines.push(`  -d ${shellQuote(JSON.stringify(body))}`)
  }
  return lines.join(' \\\n')
}

/** The same call with fetch (Node 18+ or a browser). */
export function fetchSnippet(origin: string, route: ApiRoute, body?: unknown): string {
  const headers = body !== undefined ? '{ \'Content-Type\': \'application/json\', Authorization: `Bearer ${token}` }' : '{ Authorization: `Bearer ${token}` }'
  const init = [`  method: '${route.method}',`, `  headers: ${headers},`]
  if (body !== undefined) init.push(`  body: JSON.stringify(${compactJson(body).replace(/\n/g, '\n  ')}),`)
  return [
    'const token = process.env.POLEWRIGHT_TOKEN',
    `const res = await fetch('${origin}${examplePath(route)}', {`,
    ...init,
    '})',
    route.method === 'DELETE' || route.id === 'logout' ? 'console.log(res.status)' : 'console.log(res.status, await res.json())',
  ].join('\n')
}

export interface FieldRow {
  path: string
  type: string
  required: boolean
  default?: string
  note?: string
}

type JsonSchema = Record<string, unknown> & { type?: string | string[], properties?: Record<string, JsonSchema>, required?: string[], items?: JsonSchema | false, prefixItems?: JsonSchema[], oneOf?: JsonSchema[], anyOf?: JsonSchema[], enum?: unknown[], const?: unknown, default?: unknown }

/** A short type for a JSON Schema node: `"gluon" | "graviton"`, `number[]`, `[number, number]`. */
function typeOf(s: JsonSchema): string {
  if (s.const !== undefined) return JSON.stringify(s.const)
  if (s.enum) return s.enum.map(v => JSON.stringify(v)).join(' | ')
  const alts = s.oneOf ?? s.anyOf
  if (alts) {
    // A discriminated union: name the tag and its values.
    const tags = alts.map(a => Object.entries(a.properties ?? {}).find(([, p]) => p.const !== undefined))
    if (tags.every(Boolean) && tags.every(t => t![0] === tags[0]![0])) return `object with ${tags[0]![0]}: ${tags.map(t => JSON.stringify(t![1].const)).join(' | ')}`
    return alts.map(typeOf).join(' | ')
  }
  if (s.type === 'array') {
    if (s.prefixItems) return `[${s.prefixItems.map(typeOf).join(', ')}]`
    return s.items ? `${wrap(typeOf(s.items))}[]` : 'array'
  }
  if (s.type === 'object') return s.properties ? 'object' : 'object (any keys)'
  if (s.type === 'integer') return 'integer'
  if (s.format === 'email') return 'string (e-mail)'
  // RationalString (shared/schemas/evaluate.ts): digits, optionally over digits.
  if (typeof s.pattern === 'string' && s.pattern.includes('\\d+') && s.pattern.includes('/')) return 'string (integer or "p/q")'
  if (s.pattern) return 'string (pattern)'
  return Array.isArray(s.type) ? s.type.join(' | ') : (s.type ?? 'any')
}
const wrap = (t: string) => (t.includes(' | ') ? `(${t})` : t)

/** The JSON Schema of a request body (input side: defaults optional). */
export function jsonSchemaOf(schema: z.ZodType): JsonSchema {
  return z.toJSONSchema(schema, { io: 'input', unrepresentable: 'any' }) as JsonSchema
}

/** One row per field, nested objects and union variants flattened; the same field in several variants is one row. */
export function fieldRows(schema: JsonSchema): FieldRow[] {
  const out: FieldRow[] = []
  for (const row of flatRows(schema)) {
    const prev = out.find(r => r.path === row.path && r.type === row.type && r.default === row.default && r.required === row.required)
    if (prev && prev.note?.startsWith('with ') && row.note?.startsWith('with ')) {
      const [tag, ...rest] = row.note.split('; ')
      prev.note = prev.note.replace(/^([^;]*)/, `$1, ${tag!.replace(/^with \w+ /, '')}`) + (rest.length && !prev.note.includes(rest.join('; ')) ? `; ${rest.join('; ')}` : '')
      continue
    }
    out.push(row)
  }
  return out
}

function flatRows(schema: JsonSchema, prefix = '', required = true, when?: string): FieldRow[] {
  const rows: FieldRow[] = []
  const props = schema.properties ?? {}
  for (const [name, s] of Object.entries(props)) {
    const path = prefix ? `${prefix}.${name}` : name
    const req = required && (schema.required ?? []).includes(name)
    const row: FieldRow = { path, type: typeOf(s), required: req }
    if (s.default !== undefined) row.default = JSON.stringify(s.default)
    const bounds = [
      when,
      s.minItems !== undefined && !s.prefixItems && `≥ ${s.minItems} items`,
      s.maxItems !== undefined && !s.prefixItems && `≤ ${s.maxItems} items`,
      s.maxLength !== undefined && `≤ ${s.maxLength} characters`,
      s.exclusiveMinimum !== undefined && `> ${s.exclusiveMinimum}`,
    ].filter(Boolean)
    if (bounds.length) row.note = bounds.join('; ')
    rows.push(row)
    if (s.type === 'object' && s.properties) rows.push(...flatRows(s, path, req, when))
    for (const v of (s.oneOf ?? s.anyOf ?? []).filter(v => v.type === 'object' && v.properties)) {
      const tag = Object.entries(v.properties ?? {}).find(([, p]) => p.const !== undefined)
      const rest = { ...v, properties: Object.fromEntries(Object.entries(v.properties ?? {}).filter(([k]) => k !== tag?.[0])) }
      rows.push(...flatRows(rest, path, req, tag ? `with ${tag[0]} ${JSON.stringify(tag[1].const)}` : 'as an object'))
    }
  }
  return rows
}

/** Splits prose on `backticks` so the page can set code in monospace. */
export function inlineCode(text: string): { code: boolean, text: string }[] {
  return text.split('`').map((t, k) => ({ code: k % 2 === 1, text: t })).filter(p => p.text)
}
