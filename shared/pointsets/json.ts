// Our JSON layout for point sets (documented on the API page): an object with `points`, each point
// either real momenta `[E, px, py, pz]` per leg or complex spinors `lambda`/`lambdaTilde` per leg in
// the API's `[re, im]` format; all legs outgoing. Validated with zod.
import { z } from 'zod'
import { formatPath } from '../schemas/common'
import { PointFileError, TooManyPointsError, lineColumn } from './errors'
import { MAX_POINTS, type ParsedFile, type PointData } from './types'

const num = z.number({ error: 'must be a finite number' })
const momentum = z.tuple([num, num, num, num], { error: 'must be [E, px, py, pz]' })
const complex = z.tuple([num, num], { error: 'must be a complex number [re, im]' })
const spinor = z.tuple([complex, complex], { error: 'must be a 2-spinor [[re, im], [re, im]]' })

export const JsonPointSchema = z.strictObject({
  label: z.union([z.string().max(200), z.number()]).optional(),
  momenta: z.array(momentum).min(3, { error: 'needs at least 3 legs' }).max(64).optional(),
  lambda: z.array(spinor).min(3, { error: 'needs at least 3 legs' }).max(64).optional(),
  lambdaTilde: z.array(spinor).min(3, { error: 'needs at least 3 legs' }).max(64).optional(),
  codes: z.array(z.number().int()).max(64).optional(),
}).superRefine((p, ctx) => {
  const spinors = p.lambda !== undefined || p.lambdaTilde !== undefined
  if (p.momenta && spinors) ctx.addIssue({ code: 'custom', path: ['momenta'], message: 'give momenta or spinors (lambda, lambdaTilde), not both' })
  else if (!p.momenta && !spinors) ctx.addIssue({ code: 'custom', path: [], message: 'needs momenta, or lambda and lambdaTilde' })
  else if (spinors && (!p.lambda || !p.lambdaTilde)) ctx.addIssue({ code: 'custom', path: [p.lambda ? 'lambdaTilde' : 'lambda'], message: 'is missing (spinors need both lambda and lambdaTilde)' })
})

export const JsonPointFileSchema = z.strictObject({
  format: z.literal('polewright.points', { error: 'must be "polewright.points"' }).optional(),
  version: z.literal(1, { error: 'must be 1' }).optional(),
  name: z.string().max(200).optional(),
  n: z.number().int().min(3).max(64).optional(),
  points: z.array(JsonPointSchema),
})

export type JsonPointFile = z.infer<typeof JsonPointFileSchema>

/** Reads a JSON point file; syntax errors carry line and column, schema errors the path. */
export function parseJson(text: string): ParsedFile & { n?: number, name?: string } {
  let raw: unknown
  try {
    raw = JSON.parse(text)
  }
  catch (e) {
    const msg = (e as Error).message
    const pos = /at position (\d+)/.exec(msg)
    const offset = pos ? Number(pos[1]) : text.length
    const { line, column } = lineColumn(text, offset)
    throw new PointFileError(line, column, `not valid JSON: ${msg.replace(/ in JSON at position \d+.*$/, '').replace(/^Unexpected end of JSON input$/, 'unexpected end of input')}`)
  }
  if (raw && typeof raw === 'object' && Array.isArray((raw as { points?: unknown }).points) && (raw as { points: unknown[] }).points.length > MAX_POINTS) {
    throw new TooManyPointsError((raw as { points: unknown[] }).points.length, MAX_POINTS)
  }
  const parsed = JsonPointFileSchema.safeParse(raw)
  if (!parsed.success) {
    const issue = parsed.error.issues[0]!
    const path = formatPath(issue.path)
    const at = offsetOfPath(text, issue.path)
    const where = at === null ? { line: null, column: null } : lineColumn(text, at)
    throw new PointFileError(where.line, where.column, `${path ? `${path}: ` : ''}${issue.message}`)
  }
  const points: PointData[] = parsed.data.points.map((p, i) => ({
    label: p.label === undefined ? String(i + 1) : String(p.label),
    ...(p.momenta ? { momenta: p.momenta } : { lambda: p.lambda, lambdaTilde: p.lambdaTilde }),
    ...(p.codes ? { codes: p.codes } : {}),
  }))
  return { format: 'json', points, rejected: [], meta: {}, n: parsed.data.n, name: parsed.data.name }
}

/** A point set in our JSON layout (the inverse of parseJson). */
export function toJsonFile(name: string, n: number, points: { idx: number, data: PointData }[]): JsonPointFile {
  return {
    format: 'polewright.points',
    version: 1,
    name,
    n,
    points: points.map(({ idx, data: d }) => ({
      label: d.label ?? String(idx + 1),
      ...(d.momenta ? { momenta: d.momenta } : { lambda: d.lambda!, lambdaTilde: d.lambdaTilde! }),
      ...(d.codes ? { codes: d.codes } : {}),
    })),
  }
}

/**
 * Where the value at a path starts in a JSON text that parses (so a schema error can name its line
 * and column too); null when the path leads nowhere (e.g. a missing key: then its parent).
 */
export function offsetOfPath(text: string, path: readonly PropertyKey[]): number | null {
  let i = 0
  const ws = () => {
    while (i < text.length && /\s/.test(text[i]!)) i++
  }
  const skipString = () => {
    i++
    while (i < text.length && text[i] !== '"') i += text[i] === '\\' ? 2 : 1
    i++
  }
  const skipValue = (): void => {
    ws()
    const c = text[i]
    if (c === '"') return skipString()
    if (c === '{' || c === '[') {
      const close = c === '{' ? '}' : ']'
      i++
      ws()
      if (text[i] === close) {
        i++
        return
      }
      for (;;) {
        if (c === '{') {
          ws()
          skipString()
          ws()
          i++ // the colon
        }
        skipValue()
        ws()
        if (text[i++] === close) return
      }
    }
    while (i < text.length && !/[\s,\]}]/.test(text[i]!)) i++
  }
  let found = 0
  ws()
  for (const seg of path) {
    ws()
    const c = text[i]
    if (typeof seg === 'number' && c === '[') {
      i++
      for (let k = 0; k < seg; k++) {
        skipValue()
        ws()
        if (text[i] !== ',') return found
        i++
      }
      ws()
      if (text[i] === ']') return found
    }
    else if (typeof seg === 'string' && c === '{') {
      i++
      let hit = false
      for (;;) {
        ws()
        if (text[i] !== '"') return found
        const start = i
        skipString()
        const key = JSON.parse(text.slice(start, i)) as string
        ws()
        i++ // the colon
        ws()
        if (key === seg) {
          hit = true
          break
        }
        skipValue()
        ws()
        if (text[i] !== ',') return found
        i++
      }
      if (!hit) return found
    }
    else return found
    ws()
    found = i
  }
  ws()
  return i
}
