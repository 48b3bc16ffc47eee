// The point-set and batch-check routes for the API page (rendered by components/docs/DocsPointSets.vue
// with the page's own DocsRoute), described by the zod schemas the routes validate with.
import type { z } from 'zod'
import type { ApiExample, ApiSection } from '../docs/api-routes'
import { BatchStartSchema, GenerateSchema } from './schemas'
import { MAX_POINTS } from './types'

function example<S extends z.ZodType>(_schema: S, label: string, body: z.input<S>): ApiExample {
  return { label, body }
}

const auth: [number, string][] = [[401, 'no session and no valid token']]

export const POINT_SET_SECTION: ApiSection = {
  id: 'point-sets',
  title: 'Point sets and batch checks',
  intro: `A point set is a list of phase-space points (at most ${MAX_POINTS.toLocaleString('en-US')}) in a project, all legs outgoing: uploaded as CSV, JSON or a Les Houches event file, or generated from a seed. A batch check evaluates a diagram's process at every point in the worker pool and stores each point's value, target, deviation and verdict.`,
  routes: [
    {
      id: 'point-set-upload', method: 'POST', path: '/api/projects/:id/point-sets', params: { id: 1 }, access: 'editor',
      summary: 'Uploads a point file as `multipart/form-data`: `file` (CSV, JSON or `.lhe`, gzipped allowed, at most 10 MB), and optionally `name`, `format` (`csv` | `json` | `lhe`, else from the file name) and `n` (legs; else the first point\'s). Each point is checked for momentum conservation and masslessness (1e-8 of its scale) and its leg count; the valid ones are stored in one transaction.',
      response: '`{ pointSet, report: { format, read, stored, rejectedCount, rejected: [{ point, reason, size }] } }`; `size` is the relative violation (|p²|/E²max or |Σp|/Emax).',
      statuses: [[201, 'stored'], [400, 'an unreadable file: the message gives line and column, `data.line` and `data.column` hold them'], [413, 'over 10 MB'], [422, `no valid point, or more than ${MAX_POINTS.toLocaleString('en-US')} points`], [403, 'a viewer'], ...auth],
    },
    {
      id: 'point-set-generate', method: 'POST', path: '/api/projects/:id/point-sets/generate', params: { id: 1 }, access: 'editor',
      summary: 'A seeded set: `physical` points by RAMBO at centre-of-mass energy `energy` (legs 1, 2 incoming along ±z, crossed to outgoing) or `random` complex points. Point i uses the seed `"<seed>:<i>"`, so the set is reproducible. Physical sets have at most 14 legs. Drawn in the worker pool within the evaluation budget.',
      schema: GenerateSchema,
      examples: [
        example(GenerateSchema, 'six legs, physical', { kind: 'physical', n: 6, count: 1000, seed: 42, energy: 91.2 }),
        example(GenerateSchema, 'random complex', { kind: 'random', n: 7, count: 200, seed: 1 }),
      ],
      response: 'The point set `{ id, name, source, n, count, seed, energy, kinematics, meta, … }`.',
      statuses: [[201, 'stored'], [400, 'a field fails the schema'], [403, 'a viewer'], [422, '`n` over 14 for physical points'], [503, 'over the time budget'], ...auth],
    },
    { id: 'point-set-list', method: 'GET', path: '/api/projects/:id/point-sets', params: { id: 1 }, access: 'viewer', summary: 'The project\'s point sets, newest first.', response: 'An array of point sets.', statuses: [[200, 'the list'], [404, 'no such project'], ...auth] },
    { id: 'point-set-get', method: 'GET', path: '/api/point-sets/:id', params: { id: 1 }, access: 'viewer', summary: 'One point set.', response: 'The point set and the caller\'s `role`.', statuses: [[200, 'the set'], [404, 'no such set'], ...auth] },
    {
      id: 'point-set-points', method: 'GET', path: '/api/point-sets/:id/points', params: { id: 1 }, access: 'viewer', summary: 'A page of points.',
      query: [{ name: 'offset', meaning: 'first point (default 0)' }, { name: 'limit', meaning: 'page size (default 50, at most 500)' }, { name: 'spinors', meaning: '1: add the spinors of momentum points' }, { name: 'invariants', meaning: '1: add the matrix s_ij as [re, im]' }],
      response: '`{ total, offset, limit, n, items: [{ idx, label, momenta | lambda + lambdaTilde, codes?, weight?, minInvariant, spinors?, invariants? }] }`; `minInvariant` = min |s_ij| / max |s_ij|.',
      statuses: [[200, 'the page'], [400, 'a bad query parameter'], [404, 'no such set'], ...auth],
    },
    { id: 'point-set-export', method: 'GET', path: '/api/point-sets/:id/export', params: { id: 1 }, access: 'viewer', summary: 'The whole set as a file that uploads again unchanged.', query: [{ name: 'format', meaning: '`json` (default) or `csv` (momentum sets only)' }], response: 'A file download.', statuses: [[200, 'the file'], [422, 'CSV asked for a set of complex spinors'], [404, 'no such set'], ...auth] },
    { id: 'point-set-delete', method: 'DELETE', path: '/api/point-sets/:id', params: { id: 1 }, access: 'editor', summary: 'Deletes the set and its points; running batch checks over it stop, stored checks stay.', response: 'Nothing.', statuses: [[204, 'deleted'], [403, 'a viewer'], [404, 'no such set'], ...auth] },
    { id: 'point-set-checks', method: 'GET', path: '/api/point-sets/:id/batch-checks', params: { id: 1 }, access: 'viewer', summary: 'The batch checks run over this set.', response: 'An array of batch checks.', statuses: [[200, 'the list'], ...auth] },
    {
      id: 'batch-start', method: 'POST', path: '/api/diagrams/:id/batch-checks', params: { id: 1 }, access: 'editor',
      summary: 'Starts a batch check of the diagram\'s process (theory, spin, helicities, colour order, shift) over a point set of the same project. The set\'s leg count must match the process; event-file points must carry gluon codes (21) for a gluon process, graviton codes (39) for gravitons. Points are evaluated in chunks of 250 and stored as they finish.',
      schema: BatchStartSchema,
      examples: [example(BatchStartSchema, 'a point set', { pointSetId: 1 }), example(BatchStartSchema, 'another target and shift', { pointSetId: 1, target: 'berends-giele', shift: [1, 2] })],
      response: 'The batch check `{ id, status: "queued" | "running", done, total, progress, request, … }`; follow it with the events route.',
      statuses: [[202, 'started'], [400, 'the body fails the schema'], [422, 'no process (`graph.process`), no such set (`pointSetId`), legs or particle codes that do not fit, a target that does not apply'], [403, 'a viewer'], ...auth],
    },
    { id: 'batch-list', method: 'GET', path: '/api/diagrams/:id/batch-checks', params: { id: 1 }, access: 'viewer', summary: 'The diagram\'s batch checks, newest first.', response: 'An array of batch checks.', statuses: [[200, 'the list'], ...auth] },
    { id: 'batch-get', method: 'GET', path: '/api/batch-checks/:id', params: { id: 1 }, access: 'viewer', summary: 'A batch check with its progress (poll it, or use the events route) and, once finished, its summary.', response: '`{ id, status, done, total, verdict, summary: { counts, evaluated, median, worst, smallestMinInvariant, verdict, message? }, progress: { done, total, rate, etaSeconds, elapsedMs, counts }, request, … }`. The overall verdict is the first of disagrees, boundary term suspected, agrees, singular point, not evaluated that occurs.', statuses: [[200, 'the check'], [404, 'no such check'], ...auth] },
    { id: 'batch-events', method: 'GET', path: '/api/batch-checks/:id/events', params: { id: 1 }, access: 'viewer', summary: 'Server-sent events: `progress` after each stored chunk, then one `end` (done, failed or cancelled) and the stream closes; a finished batch sends `end` at once. Each `data` is the progress object.', response: '`text/event-stream`.', statuses: [[200, 'the stream'], [404, 'no such check'], ...auth] },
    { id: 'batch-cancel', method: 'POST', path: '/api/batch-checks/:id/cancel', params: { id: 1 }, access: 'editor', summary: 'Stops a running or queued batch; the points evaluated so far stay stored with their summary.', response: 'The batch check, status `cancelled`.', statuses: [[200, 'cancelled'], [409, 'already finished'], [403, 'a viewer'], ...auth] },
    {
      id: 'batch-points', method: 'GET', path: '/api/checks/:id/points', params: { id: 1 }, access: 'viewer', summary: 'The per-point table of a batch check.',
      query: [{ name: 'offset, limit', meaning: 'paging (default 0, 50; at most 500)' }, { name: 'verdict', meaning: 'only points with this verdict' }, { name: 'sort', meaning: '`idx` (default), `deviation` (worst first) or `minInvariant` (smallest first)' }, { name: 'view', meaning: '`columns`: every point as parallel arrays `idx, deviation, minInvariant, verdict` (for plots)' }],
      response: '`{ total, offset, limit, items: [{ idx, label, value, target, deviation, verdict, minInvariant, message }] }`.',
      statuses: [[200, 'the page'], [400, 'a bad query parameter'], [404, 'no such check'], ...auth],
    },
    { id: 'batch-export-csv', method: 'GET', path: '/api/checks/:id/points.csv', params: { id: 1 }, access: 'viewer', summary: 'The per-point table as CSV: `point` (from 1, as the pages number points), `label, value_re, value_im, target_re, target_im, deviation, verdict, min_invariant, message`.', response: 'A file download.', statuses: [[200, 'the file'], ...auth] },
    { id: 'batch-export-json', method: 'GET', path: '/api/checks/:id/points.json', params: { id: 1 }, access: 'viewer', summary: 'The per-point table as JSON, with the check\'s request and summary.', response: '`{ check, points: [...] }`.', statuses: [[200, 'the file'], ...auth] },
  ],
}
