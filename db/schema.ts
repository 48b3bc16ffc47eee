// Polewright's data model. Every table a later feature needs is here so migrations stay linear.
import { sql } from 'drizzle-orm'
import { integer, real, sqliteTable, text, primaryKey, index, uniqueIndex } from 'drizzle-orm/sqlite-core'
import type { Graph } from '../shared/schemas/graph'
import type { PointData } from '../shared/pointsets/types'
import type { CheckedResponse } from '../shared/editor/drawing/evaluate'
import type { CheckRequest, CheckSummary } from '../shared/schemas/service'
import type { LoopCutDrawingResult } from '../shared/editor/loop-cut-check'

const now = sql`(unixepoch() * 1000)`
const createdAt = () => integer('created_at', { mode: 'timestamp_ms' }).notNull().default(now)

export const users = sqliteTable('users', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  email: text('email').notNull().unique(),
  name: text('name').notNull(),
  passwordHash: text('password_hash').notNull(),
  role: text('role', { enum: ['admin', 'member'] }).notNull().default('member'),
  disabled: integer('disabled', { mode: 'boolean' }).notNull().default(false),
  createdAt: createdAt(),
})

export const projects = sqliteTable('projects', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  name: text('name').notNull(),
  description: text('description').notNull().default(''),
  createdBy: integer('created_by').notNull().references(() => users.id),
  createdAt: createdAt(),
  updatedAt: integer('updated_at', { mode: 'timestamp_ms' }).notNull().default(now),
})

export const memberships = sqliteTable('memberships', {
  projectId: integer('project_id').notNull().references(() => projects.id, { onDelete: 'cascade' }),
  userId: integer('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  role: text('role', { enum: ['owner', 'editor', 'viewer'] }).notNull(),
  createdAt: createdAt(),
}, t => [primaryKey({ columns: [t.projectId, t.userId] }), index('memberships_user').on(t.userId)])

export const diagrams = sqliteTable('diagrams', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  projectId: integer('project_id').notNull().references(() => projects.id, { onDelete: 'cascade' }),
  title: text('title').notNull(),
  graph: text('graph', { mode: 'json' }).notNull().$type<Graph>(),
  version: integer('version').notNull().default(1),
  createdBy: integer('created_by').notNull().references(() => users.id),
  updatedBy: integer('updated_by').notNull().references(() => users.id),
  createdAt: createdAt(),
  updatedAt: integer('updated_at', { mode: 'timestamp_ms' }).notNull().default(now),
}, t => [index('diagrams_project').on(t.projectId)])

export const diagramRevisions = sqliteTable('diagram_revisions', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  diagramId: integer('diagram_id').notNull().references(() => diagrams.id, { onDelete: 'cascade' }),
  version: integer('version').notNull(),
  title: text('title').notNull(),
  graph: text('graph', { mode: 'json' }).notNull().$type<Graph>(),
  note: text('note').notNull().default(''),
  savedBy: integer('saved_by').notNull().references(() => users.id),
  savedAt: integer('saved_at', { mode: 'timestamp_ms' }).notNull().default(now),
}, t => [uniqueIndex('revisions_diagram_version').on(t.diagramId, t.version)])

export const auditEvents = sqliteTable('audit_events', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  projectId: integer('project_id').references(() => projects.id, { onDelete: 'cascade' }),
  userId: integer('user_id').references(() => users.id, { onDelete: 'set null' }),
  action: text('action').notNull(),
  subjectType: text('subject_type').notNull().default(''),
  subjectId: integer('subject_id'),
  detail: text('detail', { mode: 'json' }).$type<Record<string, unknown>>(),
  createdAt: createdAt(),
}, t => [index('audit_project').on(t.projectId, t.createdAt)])

export const pointSets = sqliteTable('point_sets', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  projectId: integer('project_id').notNull().references(() => projects.id, { onDelete: 'cascade' }),
  name: text('name').notNull(),
  source: text('source', { enum: ['csv', 'json', 'lhe', 'physical', 'random'] }).notNull(),
  n: integer('n').notNull(),
  count: integer('count').notNull(),
  seed: integer('seed'),
  energy: real('energy'),
  meta: text('meta', { mode: 'json' }).$type<Record<string, unknown>>(),
  createdBy: integer('created_by').notNull().references(() => users.id),
  createdAt: createdAt(),
}, t => [index('point_sets_project').on(t.projectId)])

export const points = sqliteTable('points', {
  pointSetId: integer('point_set_id').notNull().references(() => pointSets.id, { onDelete: 'cascade' }),
  idx: integer('idx').notNull(),
  // { momenta } or { lambda, lambdaTilde }, plus particle codes for event files.
  data: text('data', { mode: 'json' }).notNull().$type<PointData>(),
}, t => [primaryKey({ columns: [t.pointSetId, t.idx] })])

export const checks = sqliteTable('checks', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  projectId: integer('project_id').notNull().references(() => projects.id, { onDelete: 'cascade' }),
  diagramId: integer('diagram_id').references(() => diagrams.id, { onDelete: 'cascade' }),
  diagramVersion: integer('diagram_version'),
  pointSetId: integer('point_set_id').references(() => pointSets.id, { onDelete: 'set null' }),
  kind: text('kind', { enum: ['single', 'batch'] }).notNull().default('single'),
  status: text('status', { enum: ['queued', 'running', 'done', 'failed', 'cancelled'] }).notNull().default('done'),
  request: text('request', { mode: 'json' }).notNull().$type<CheckRequest>(),
  // A single check's response (batch checks keep theirs per point in check_points); a loop-cut
  // diagram's check keeps its box table (kind 'loop-cut' in the result).
  result: text('result', { mode: 'json' }).$type<CheckedResponse | LoopCutDrawingResult>(),
  summary: text('summary', { mode: 'json' }).$type<CheckSummary>(),
  verdict: text('verdict'),
  engineVersion: text('engine_version').notNull(),
  arithmetic: text('arithmetic', { enum: ['float', 'exact'] }).notNull(),
  seed: integer('seed'),
  durationMs: real('duration_ms'),
  done: integer('done').notNull().default(0),
  total: integer('total').notNull().default(1),
  createdBy: integer('created_by').notNull().references(() => users.id),
  createdAt: createdAt(),
}, t => [index('checks_diagram').on(t.diagramId, t.createdAt), index('checks_project').on(t.projectId)])

export const checkPoints = sqliteTable('check_points', {
  checkId: integer('check_id').notNull().references(() => checks.id, { onDelete: 'cascade' }),
  idx: integer('idx').notNull(),
  value: text('value', { mode: 'json' }).$type<unknown>(),
  target: text('target', { mode: 'json' }).$type<unknown>(),
  deviation: real('deviation'),
  verdict: text('verdict').notNull(),
  minInvariant: real('min_invariant'),
  message: text('message'),
}, t => [primaryKey({ columns: [t.checkId, t.idx] })])

// One row per stored chunk of a batch run on the job queue: a retried chunk finds its row and
// stores nothing twice (unique check + chunk); the row's id orders chunks for the progress tally.
export const batchChunks = sqliteTable('batch_chunks', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  checkId: integer('check_id').notNull().references(() => checks.id, { onDelete: 'cascade' }),
  chunk: integer('chunk').notNull(),
  points: integer('points').notNull(),
  counts: text('counts', { mode: 'json' }).notNull().$type<Record<string, number>>(),
  worker: text('worker').notNull(),
  evalMs: real('eval_ms').notNull(),
  createdAt: createdAt(),
}, t => [uniqueIndex('batch_chunks_check_chunk').on(t.checkId, t.chunk)])

export const comments = sqliteTable('comments', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  projectId: integer('project_id').notNull().references(() => projects.id, { onDelete: 'cascade' }),
  diagramId: integer('diagram_id').references(() => diagrams.id, { onDelete: 'cascade' }),
  checkId: integer('check_id').references(() => checks.id, { onDelete: 'cascade' }),
  userId: integer('user_id').notNull().references(() => users.id),
  body: text('body').notNull(),
  createdAt: createdAt(),
  updatedAt: integer('updated_at', { mode: 'timestamp_ms' }).notNull().default(now),
}, t => [index('comments_diagram').on(t.diagramId), index('comments_check').on(t.checkId)])

export const invitations = sqliteTable('invitations', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  projectId: integer('project_id').notNull().references(() => projects.id, { onDelete: 'cascade' }),
  email: text('email').notNull(),
  role: text('role', { enum: ['owner', 'editor', 'viewer'] }).notNull(),
  tokenHash: text('token_hash').notNull().unique(),
  invitedBy: integer('invited_by').notNull().references(() => users.id),
  createdAt: createdAt(),
  expiresAt: integer('expires_at', { mode: 'timestamp_ms' }).notNull(),
  acceptedAt: integer('accepted_at', { mode: 'timestamp_ms' }),
  acceptedBy: integer('accepted_by').references(() => users.id),
  revokedAt: integer('revoked_at', { mode: 'timestamp_ms' }),
}, t => [index('invitations_project').on(t.projectId)])

export const passwordResets = sqliteTable('password_resets', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  userId: integer('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  tokenHash: text('token_hash').notNull().unique(),
  createdAt: createdAt(),
  expiresAt: integer('expires_at', { mode: 'timestamp_ms' }).notNull(),
  usedAt: integer('used_at', { mode: 'timestamp_ms' }),
})

export const apiTokens = sqliteTable('api_tokens', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  userId: integer('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  name: text('name').notNull(),
  tokenHash: text('token_hash').notNull().unique(),
  scope: text('scope', { enum: ['read', 'read-write'] }).notNull(),
  createdAt: createdAt(),
  lastUsedAt: integer('last_used_at', { mode: 'timestamp_ms' }),
  revokedAt: integer('revoked_at', { mode: 'timestamp_ms' }),
})

// One row per signed-in browser. The sealed cookie carries a random id whose SHA-256 is stored here;
// logout, a password reset and a disable set revoked_at, and the next request with that cookie fails.
export const sessions = sqliteTable('sessions', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  userId: integer('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  tokenHash: text('token_hash').notNull().unique(),
  userAgent: text('user_agent').notNull().default(''),
  createdAt: createdAt(),
  lastSeenAt: integer('last_seen_at', { mode: 'timestamp_ms' }).notNull().default(now),
  expiresAt: integer('expires_at', { mode: 'timestamp_ms' }).notNull(),
  revokedAt: integer('revoked_at', { mode: 'timestamp_ms' }),
}, t => [index('sessions_user').on(t.userId)])
