// Our CSV layout for point sets (documented in DEVELOPERS.md and on the API page): one row per leg,
// header required, columns `point, leg, E, px, py, pz` in any order and an optional `code`
// (particle code); all momenta outgoing. Lines starting with # are comments. Parsed by papaparse.
import Papa from 'papaparse'
import { csvUnparseSafe } from '../csv-safe'
import { PointFileError, TooManyPointsError, lineColumn } from './errors'
import { MAX_LEGS, MAX_POINTS, type Momentum, type ParsedFile, type PointData, type Rejection } from './types'

export const CSV_COLUMNS = ['point', 'leg', 'E', 'px', 'py', 'pz'] as const
const OPTIONAL = ['code'] as const
const KNOWN = [...CSV_COLUMNS, ...OPTIONAL]

interface Row { fields: string[], line: number, lineText: string }

/** Character column (1-based) of field k in a line without quotes; the field number otherwise. */
function columnOf(row: Row, k: number): number {
  if (row.lineText.includes('"')) return k + 1
  let col = 1
  const parts = row.lineText.split(',')
  for (let i = 0; i < k && i < parts.length; i++) col += parts[i]!.length + 1
  // Leading spaces of the field are not the problem.
  return col + (parts[k]?.length ?? 0) - (parts[k]?.trimStart().length ?? 0)
}

function readRows(text: string): Row[] {
  const lines = text.split('\n')
  const rows: Row[] = []
  let failure: PointFileError | null = null
  // Rows come in order: track the line number incrementally (a scan from the start per row is quadratic).
  let seenOffset = 0
  let seenLine = 1
  const lineAt = (offset: number) => {
    for (; seenOffset < offset; seenOffset++) if (text.charCodeAt(seenOffset) === 10) seenLine++
    return seenLine
  }
  Papa.parse<string[]>(text, {
    delimiter: ',',
    comments: '#',
    skipEmptyLines: false,
    step: (r, parser) => {
      if (r.errors.length) {
        const e = r.errors[0]!
        // For an unterminated quote, point at the quote itself.
        const index = e.index === undefined ? undefined : e.code === 'MissingQuotes' ? Math.max(0, text.lastIndexOf('"', e.index)) : e.index
        const at = index !== undefined ? lineColumn(text, index) : { line: lineColumn(text, Math.max(0, r.meta.cursor - 1)).line, column: null }
        failure = new PointFileError(at.line, at.column, e.message.replace(/\.$/, '').toLowerCase())
        parser.abort()
        return
      }
      const fields = r.data
      if (fields.length === 1 && fields[0]!.trim() === '') return
      const line = lineAt(Math.max(0, r.meta.cursor - 1))
      rows.push({ fields, line, lineText: (lines[line - 1] ?? '').replace(/\r$/, '') })
    },
  })
  if (failure) throw failure
  return rows
}

/** Reads a CSV point file. Unreadable content throws PointFileError (line, column). */
export function parseCsv(text: string): ParsedFile {
  const rows = readRows(text)
  if (!rows.length) throw new PointFileError(1, 1, `the file is empty; the first row must name the columns ${CSV_COLUMNS.join(', ')}`)
  const header = rows[0]!
  const names = header.fields.map(f => f.trim())
  const index: Record<string, number> = {}
  names.forEach((name, k) => {
    const known = KNOWN.find(c => c.toLowerCase() === name.toLowerCase())
    if (!known) {
      const hint = /^[\d.+-]/.test(name) ? 'the header row is missing; ' : ''
      throw new PointFileError(header.line, columnOf(header, k), `${hint}unknown column "${name}"; the columns are ${CSV_COLUMNS.join(', ')} and optionally code`)
    }
    if (index[known] !== undefined) throw new PointFileError(header.line, columnOf(header, k), `column "${known}" appears twice`)
    index[known] = k
  })
  const missing = CSV_COLUMNS.filter(c => index[c] === undefined)
  if (missing.length) throw new PointFileError(header.line, null, `the header lacks the column${missing.length > 1 ? 's' : ''} ${missing.join(', ')}`)
  const hasCode = index.code !== undefined

  interface Acc { label: string, legs: Map<number, { p: Momentum, code?: number, line: number }>, duplicate?: string }
  const byPoint = new Map<string, Acc>()
  for (const row of rows.slice(1)) {
    if (row.fields.length !== names.length) {
      throw new PointFileError(row.line, null, `expected ${names.length} fields (${names.join(', ')}), found ${row.fields.length}`)
    }
    const cell = (name: string) => row.fields[index[name]!]!.trim()
    const num = (name: string) => {
      const raw = cell(name)
      const x = raw === '' ? Number.NaN : Number(raw)
      if (!Number.isFinite(x)) throw new PointFileError(row.line, columnOf(row, index[name]!), `${name} must be a finite number, got "${raw}"`)
      return x
    }
    const label = cell('point')
    if (!label) throw new PointFileError(row.line, columnOf(row, index.point!), 'point must name the point (an id), got an empty field')
    const leg = num('leg')
    if (!Number.isInteger(leg) || leg < 1) throw new PointFileError(row.line, columnOf(row, index.leg!), `leg must be a label 1, 2, …, got "${cell('leg')}"`)
    if (leg > MAX_LEGS) throw new PointFileError(row.line, columnOf(row, index.leg!), `leg ${leg} is beyond the limit of ${MAX_LEGS} legs per point`)
    let code: number | undefined
    if (hasCode) {
      code = num('code')
      if (!Number.isInteger(code)) throw new PointFileError(row.line, columnOf(row, index.code!), `code must be an integer particle code, got "${cell('code')}"`)
    }
    let acc = byPoint.get(label)
    if (!acc) {
      if (byPoint.size >= MAX_POINTS) throw new TooManyPointsError(byPoint.size + 1, MAX_POINTS)
      acc = { label, legs: new Map() }
      byPoint.set(label, acc)
    }
    const prev = acc.legs.get(leg)
    if (prev) acc.duplicate ??= `leg ${leg} is given twice (lines ${prev.line} and ${row.line})`
    else acc.legs.set(leg, { p: [num('E'), num('px'), num('py'), num('pz')], code, line: row.line })
  }

  const points: PointData[] = []
  const rejected: Rejection[] = []
  for (const acc of byPoint.values()) {
    if (acc.duplicate) {
      rejected.push({ point: acc.label, reason: acc.duplicate, size: null })
      continue
    }
    const labels = [...acc.legs.keys()].sort((a, b) => a - b)
    const gap = labels.findIndex((l, i) => l !== i + 1)
    if (gap >= 0) {
      rejected.push({ point: acc.label, reason: `leg ${gap + 1} is missing (legs given: ${labels.join(', ')})`, size: null })
      continue
    }
    const legs = labels.map(l => acc.legs.get(l)!)
    points.push({
      label: acc.label,
      momenta: legs.map(l => l.p),
      ...(hasCode ? { codes: legs.map(l => l.code!) } : {}),
    })
  }
  return { format: 'csv', points, rejected, meta: { columns: names } }
}

/** The points of a momentum set in our CSV layout (the inverse of parseCsv). */
export function toCsv(points: { idx: number, data: PointData }[]): string {
  const withCodes = points.some(p => p.data.codes)
  const fields = [...CSV_COLUMNS, ...(withCodes ? ['code'] : [])]
  const data: (string | number)[][] = []
  for (const { idx, data: d } of points) {
    d.momenta!.forEach((p, i) => {
      data.push([d.label ?? String(idx + 1), i + 1, ...p, ...(withCodes ? [d.codes?.[i] ?? ''] : [])])
    })
  }
  return Papa.unparse({ fields, data }, csvUnparseSafe)
}
