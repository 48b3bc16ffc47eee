// Point sets on the server: reading an upload, storing a set in one transaction, reading points
// back page by page. The parsing and physics validation live in shared/pointsets (pure, unit-tested).
import type { H3Event } from 'h3'
import { and, asc, eq, gte, lt } from 'drizzle-orm'
import { gunzipSync } from 'node:zlib'
import {
  MAX_BYTES, MAX_POINTS, PointFileError, TooManyPointsError, UploadFieldsSchema, detectFormat, generatePoints, parseFile, toCsv, validatePoints,
  type PointData, type PointSetView, type Rejection, type UploadFormat,
} from '#shared/pointsets'

type PointSetRow = typeof tables.pointSets.$inferSelect

export function pointSetView(row: PointSetRow): PointSetView {
  const meta = (row.meta ?? {}) as Record<string, unknown>
  return {
    id: row.id,
    projectId: row.projectId,
    name: row.name,
    source: row.source,
    n: row.n,
    count: row.count,
    seed: row.seed,
    energy: row.energy,
    kinematics: meta.kinematics === 'spinors' || meta.kinematics === 'mixed' ? meta.kinematics : 'momenta',
    meta,
    createdBy: row.createdBy,
    createdAt: row.createdAt,
  }
}

const mb = (bytes: number) => `${(bytes / 1024 / 1024).toFixed(1)} MB`

/** The multipart upload: the file's text (gunzipped if needed) and the validated text fields. */
export async function readPointUpload(event: H3Event) {
  const declared = Number(getRequestHeader(event, 'content-length') ?? 0)
  // The multipart envelope adds a little; anything far above the cap is refused before reading.
  if (declared > MAX_BYTES + 64 * 1024) throw fieldError(413, 'file', `the upload is ${mb(declared)}; the limit is ${mb(MAX_BYTES)}`, { limit: MAX_BYTES })
  const type = getRequestHeader(event, 'content-type') ?? ''
  if (!type.startsWith('multipart/form-data')) {
    throw fieldError(400, 'file', 'send the file as multipart/form-data with a field named "file" (and optionally name, format, n)')
  }
  let parts: Awaited<ReturnType<typeof readMultipartFormData>>
  try {
    parts = await readMultipartFormData(event)
  }
  catch {
    throw fieldError(400, 'file', 'the multipart body could not be read')
  }
  const file = parts?.find(p => p.name === 'file')
  if (!file || file.filename === undefined) throw fieldError(400, 'file', 'is missing: send the point file in a multipart field named "file"')
  const fields: Record<string, string> = {}
  for (const p of parts ?? []) if (p.name && p.name !== 'file' && p.filename === undefined) fields[p.name] = p.data.toString('utf8')
  const opts = parseWith(Object.fromEntries(Object.entries(fields).filter(([, v]) => v !== '')), UploadFieldsSchema, 'body')
  let data = file.data
  if (data.length > MAX_BYTES) throw fieldError(413, 'file', `is ${mb(data.length)}; the limit is ${mb(MAX_BYTES)}`, { limit: MAX_BYTES })
  if (data[0] === 0x1f && data[1] === 0x8b) {
    try {
      data = gunzipSync(data, { maxOutputLength: MAX_BYTES + 1 })
    }
    catch (e) {
      if ((e as { code?: string }).code === 'ERR_BUFFER_TOO_LARGE') throw fieldError(413, 'file', `unpacks to more than ${mb(MAX_BYTES)}; the limit is ${mb(MAX_BYTES)}`, { limit: MAX_BYTES })
      throw fieldError(400, 'file', 'looks gzipped but could not be unpacked')
    }
    if (data.length > MAX_BYTES) throw fieldError(413, 'file', `unpacks to more than ${mb(MAX_BYTES)}; the limit is ${mb(MAX_BYTES)}`, { limit: MAX_BYTES })
  }
  const text = data.toString('utf8').replace(/^\uFEFF/, '')
  if (text.includes('\u0000')) throw fieldError(400, 'file', 'is binary, not a CSV, JSON or Les Houches text file')
  return { text, filename: file.filename, ...opts }
}

/** Maps a reader's failure to the API's error shape (400 with line and column, 422 over the limit). */
function fileError(e: unknown): never {
  if (e instanceof PointFileError) throw fieldError(400, e.field, e.message.slice(e.field.length + 2), { line: e.line, column: e.column })
  if (e instanceof TooManyPointsError) throw fieldError(422, 'file', `holds more than ${MAX_POINTS.toLocaleString('en-US')} points; the limit per point set is ${MAX_POINTS.toLocaleString('en-US')}`, { limit: MAX_POINTS })
  throw e
}

const VALIDATE_SLICE = 500

export interface UploadResult {
  format: UploadFormat
  n: number
  valid: PointData[]
  rejected: Rejection[]
  read: number
  meta: Record<string, unknown>
  name?: string
}

/** Parses and validates an uploaded file; refuses the whole file when nothing is readable or valid. */
export async function checkUpload(text: string, filename: string | undefined, format?: UploadFormat, n?: number): Promise<UploadResult> {
  let parsed: ReturnType<typeof parseFile>
  let fmt: UploadFormat
  try {
    fmt = detectFormat(filename, text, format)
    parsed = parseFile(fmt, text)
  }
  catch (e) {
    fileError(e)
  }
  const setN = n ?? parsed.n ?? (parsed.points[0] ? (parsed.points[0].momenta ?? parsed.points[0].lambda!).length : 0)
  // Validated in slices, yielding to the event loop between them so other requests are served.
  const valid: PointData[] = []
  const rejected: Rejection[] = []
  for (let from = 0; from < parsed.points.length; from += VALIDATE_SLICE) {
    const part = validatePoints(parsed.points.slice(from, from + VALIDATE_SLICE), setN)
    valid.push(...part.valid)
    rejected.push(...part.rejected)
    if (from + VALIDATE_SLICE < parsed.points.length) await new Promise(resolve => setImmediate(resolve))
  }
  const allRejected = [...parsed.rejected, ...rejected]
  const read = parsed.points.length + parsed.rejected.length
  if (!valid.length) {
    const first = allRejected[0]
    // Every point refused for its leg count: the problem is the typed leg count (or the file's
    // mixture of sizes), so the headline says that rather than quoting one point.
    const sizes = new Set(parsed.points.map(p => (p.momenta ?? p.lambda ?? []).length))
    if (read && rejected.length === parsed.points.length && !parsed.rejected.length && sizes.size === 1 && !sizes.has(setN)) {
      const legs = [...sizes][0]
      throw fieldError(422, n !== undefined ? 'n' : 'file', `${n !== undefined ? `is ${n}, but` : 'every'} the file's ${read} point${read === 1 ? '' : 's'} ${read === 1 ? 'has' : 'have'} ${legs} legs`, { rejected: allRejected.slice(0, 1000), read })
    }
    throw fieldError(422, 'file', read
      ? `none of the ${read} points is valid; point ${first!.point}: ${first!.reason}`
      : 'holds no points', { rejected: allRejected.slice(0, 1000), read })
  }
  const kinds = new Set(valid.map(p => (p.momenta ? 'momenta' : 'spinors')))
  const meta: Record<string, unknown> = { ...parsed.meta, format: fmt, kinematics: kinds.size === 1 ? [...kinds][0] : 'mixed' }
  if (valid.some(p => p.codes)) meta.codeSets = codeSets(valid)
  return { format: fmt, n: setN, valid, rejected: allRejected, read, meta, name: parsed.name }
}

/** The distinct particle-code lists of a set with their counts (at most 20 listed). */
function codeSets(points: PointData[]) {
  const counts = new Map<string, number>()
  for (const p of points) {
    const key = (p.codes ?? []).join(',')
    counts.set(key, (counts.get(key) ?? 0) + 1)
  }
  return [...counts.entries()].sort((a, b) => b[1] - a[1]).slice(0, 20)
    .map(([k, count]) => ({ codes: k ? k.split(',').map(Number) : [], count }))
}

const INSERT_CHUNK = 500

/** Stores a point set and its points in ONE transaction: on any error nothing is written. */
export async function storePointSet(input: {
  projectId: number
  userId: number
  name: string
  source: PointSetRow['source']
  n: number
  seed?: number | null
  energy?: number | null
  meta: Record<string, unknown>
  points: Iterable<PointData>
}) {
  return useDB().transaction(async (tx) => {
    const set = await tx.insert(tables.pointSets).values({
      projectId: input.projectId, name: input.name, source: input.source, n: input.n, count: 0,
      seed: input.seed ?? null, energy: input.energy ?? null, meta: input.meta, createdBy: input.userId,
    }).returning().get()
    let idx = 0
    let batch: { pointSetId: number, idx: number, data: PointData }[] = []
    for (const data of input.points) {
      batch.push({ pointSetId: set.id, idx: idx++, data })
      if (batch.length === INSERT_CHUNK) {
        await tx.insert(tables.points).values(batch)
        batch = []
      }
    }
    if (batch.length) await tx.insert(tables.points).values(batch)
    return tx.update(tables.pointSets).set({ count: idx }).where(eq(tables.pointSets.id, set.id)).returning().get()
  })
}

/** Points idx ∈ [from, to) of a set, in order. */
export async function pointsInRange(pointSetId: number, from: number, to: number) {
  const rows = await useDB().select().from(tables.points)
    .where(and(eq(tables.points.pointSetId, pointSetId), gte(tables.points.idx, from), lt(tables.points.idx, to)))
    .orderBy(asc(tables.points.idx))
  return rows.map(r => ({ idx: r.idx, data: r.data }))
}

/** A download: sets the file name and type. */
export function attachment(event: H3Event, filename: string, type: string) {
  setResponseHeader(event, 'content-type', type)
  setResponseHeader(event, 'content-disposition', `attachment; filename="${filename.replace(/[^\w.-]+/g, '_')}"`)
}

export const DEMO_POINT_SET = 'Five-gluon phase-space points (uploaded CSV)'

/**
 * Demo data: a small uploaded CSV set for the five-gluon diagram, read through the same reader
 * as a real upload. The momenta are invented (our RAMBO at √s = 91.2, seed 2026). Idempotent.
 */
export async function seedDemoPointSet(projectId: number, ownerId: number) {
  const exists = await useDB().select({ id: tables.pointSets.id }).from(tables.pointSets)
    .where(and(eq(tables.pointSets.projectId, projectId), eq(tables.pointSets.name, DEMO_POINT_SET))).get()
  if (exists) return
  const points = [...generatePoints({ kind: 'physical', n: 5, count: 40, seed: 2026, energy: 91.2 })]
  const csv = toCsv(points.map((data, idx) => ({ idx, data: { ...data, label: `ev${String(idx + 1).padStart(3, '0')}` } })))
  const result = await checkUpload(csv, 'brackenridge-5g.csv', 'csv')
  const set = await storePointSet({
    projectId, userId: ownerId, name: DEMO_POINT_SET, source: 'csv', n: result.n,
    meta: { ...result.meta, filename: 'brackenridge-5g.csv', read: result.read, rejected: 0 }, points: result.valid,
  })
  await audit(projectId, ownerId, 'pointset.upload', 'point-set', set.id, { name: set.name, count: set.count, rejected: 0 })
}
