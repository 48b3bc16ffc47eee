// Request schemas of the point-set and batch-check routes, shared by the pages and the routes.
import { z } from 'zod'
import { FormulaTarget, TARGET_WORDS, TargetNameEnum } from '../schemas/evaluate'
import { MAX_POINTS } from './types'
import { wholeNumber } from '../schemas/common'

const MAX_OFFSET = 1e12

/** The text fields of a multipart upload (besides `file`). */
export const UploadFieldsSchema = z.object({
  name: z.string().trim().min(1, { error: 'must not be empty' }).max(200, { error: 'at most 200 characters' }).optional(),
  format: z.enum(['csv', 'json', 'lhe'], { error: 'must be csv, json or lhe' }).optional(),
  n: wholeNumber(3, 64, { min: 'needs at least 3 legs', max: 'at most 64 legs' }).optional(),
})

export const PointsQuerySchema = z.object({
  offset: wholeNumber(0, MAX_OFFSET, { min: 'must be 0 or more' }).default(0),
  limit: wholeNumber(1, 500, { max: 'at most 500 per page' }).default(50),
  spinors: z.enum(['0', '1', 'true', 'false']).optional().transform(v => v === '1' || v === 'true'),
  invariants: z.enum(['0', '1', 'true', 'false']).optional().transform(v => v === '1' || v === 'true'),
})

export const ExportQuerySchema = z.object({
  format: z.enum(['csv', 'json'], { error: 'must be csv or json' }).default('json'),
})

export const BatchStartSchema = z.object({
  pointSetId: z.number({ error: 'must be the id of a point set' }).int({ error: 'must be the id of a point set' }).positive({ error: 'must be the id of a point set' }),
  target: z.union([TargetNameEnum, FormulaTarget], { error: `must be ${TARGET_WORDS}` }).default('auto'),
  /** Overrides the diagram's shift for this run. */
  shift: z.tuple([z.number().int().positive(), z.number().int().positive()], { error: 'must be two leg labels [i, j]' }).optional(),
})
export type BatchStart = z.input<typeof BatchStartSchema>

export const CheckPointsQuerySchema = z.object({
  offset: wholeNumber(0, MAX_OFFSET, { min: 'must be 0 or more' }).default(0),
  limit: wholeNumber(1, 500, { max: 'at most 500 per page' }).default(50),
  verdict: z.enum(['agrees', 'disagrees', 'boundary term suspected', 'singular point', 'not evaluated'], { error: 'must be a verdict' }).optional(),
  sort: z.enum(['idx', 'deviation', 'minInvariant'], { error: 'must be idx, deviation or minInvariant' }).default('idx'),
  /** `columns`: every point as parallel arrays (idx, deviation, minInvariant, verdict) for the plots. */
  view: z.enum(['rows', 'columns'], { error: 'must be rows or columns' }).default('rows'),
})

export const VERDICTS = ['agrees', 'disagrees', 'boundary term suspected', 'singular point', 'not evaluated'] as const
export type Verdict = typeof VERDICTS[number]

/** A seeded set (POST /api/projects/:id/point-sets/generate). */
export const GenerateSchema = z.object({
  name: z.string().trim().min(1, { error: 'must not be empty' }).max(200).optional(),
  kind: z.enum(['physical', 'random'], { error: 'must be physical or random' }),
  n: z.number().int({ error: 'must be a whole number' }).min(4, { error: 'needs at least 4 legs' }).max(16, { error: 'at most 16 legs' }),
  count: z.number().int({ error: 'must be a whole number' }).min(1, { error: 'must be at least 1' }).max(MAX_POINTS, { error: `at most ${MAX_POINTS} points per point set` }),
  seed: z.number().int({ error: 'must be a whole number' }).min(0).max(2 ** 31 - 1),
  energy: z.number().positive({ error: 'must be positive' }).max(1e12).optional(),
})
export type GenerateInput = z.infer<typeof GenerateSchema>
