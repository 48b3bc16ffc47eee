// Point sets, the pure part: readers of our CSV and JSON layouts and of Les Houches event files,
// validation with the engine's validators, generated sets, invariants. No Nuxt imports here.
import { parseCsv } from './csv'
import { parseJson } from './json'
import { parseLhe } from './lhe'
import { PointFileError } from './errors'
import type { ParsedFile, UploadFormat } from './types'

export * from './types'
export * from './errors'
export { parseCsv, toCsv, CSV_COLUMNS } from './csv'
export { parseJson, toJsonFile, JsonPointFileSchema, JsonPointSchema } from './json'
export { parseLhe, PARTICLE_FIELDS } from './lhe'
export type { LheMeta } from './lhe'
export { validatePoint, validatePoints, momentumViolations } from './validate'
export { generatePoint, generatePoints, pointSeed, PHYSICAL_MAX_LEGS } from './generate'
export { kinOf, invariantMatrix, minInvariantRatio } from './invariants'

/** The format of an upload: the `format` field if given, else the file name's ending, else the content. */
export function detectFormat(filename: string | undefined, text: string, given?: string): UploadFormat {
  if (given) {
    if (given === 'csv' || given === 'json' || given === 'lhe') return given
    throw new PointFileError(null, null, `unknown format "${given}"; use csv, json or lhe`, 'format')
  }
  const ext = (filename ?? '').toLowerCase().replace(/\.gz$/, '').split('.').pop()
  if (ext === 'csv') return 'csv'
  if (ext === 'json') return 'json'
  if (ext === 'lhe' || ext === 'lhef') return 'lhe'
  const head = text.trimStart().slice(0, 200)
  if (head.startsWith('{') || head.startsWith('[')) return 'json'
  if (head.startsWith('<')) return 'lhe'
  return 'csv'
}

export function parseFile(format: UploadFormat, text: string): ParsedFile & { n?: number, name?: string } {
  if (format === 'csv') return parseCsv(text)
  if (format === 'json') return parseJson(text)
  return parseLhe(text)
}
export * from './schemas'
export * from './plots'
