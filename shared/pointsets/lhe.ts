// Les Houches event files: the open standard of Alwall et al., "A standard format for Les Houches
// Event Files", Comput. Phys. Commun. 176 (2007) 300, hep-ph/0609017. Layout used here:
//   <LesHouchesEvents version="…"> [<header>…</header>] <init> … </init> <event> … </event> … </LesHouchesEvents>
//   <init>, first line: IDBMUP1 IDBMUP2 EBMUP1 EBMUP2 PDFGUP1 PDFGUP2 PDFSUP1 PDFSUP2 IDWTUP NPRUP,
//           then NPRUP lines: XSECUP XERRUP XMAXUP LPRUP.
//   <event>, first line: NUP IDPRUP XWGTUP SCALUP AQEDUP AQCDUP,
//           then NUP lines: IDUP ISTUP MOTHUP1 MOTHUP2 ICOLUP1 ICOLUP2 PUP1 PUP2 PUP3 PUP4 PUP5 VTIMUP SPINUP
//           (PUP = px, py, pz, E, m); further lines before </event> are optional information.
// Each event becomes one point: its incoming (ISTUP = −1) and outgoing (ISTUP = +1) particles,
// incoming first, then outgoing, each group in file order; incoming momenta are crossed to
// outgoing, p → −p (docs/conventions.md: all momenta outgoing). Particle codes IDUP are kept per leg.
import { PointFileError, TooManyPointsError } from './errors'
import { MAX_POINTS, type Momentum, type ParsedFile, type PointData } from './types'

const INIT_FIELDS = ['IDBMUP1', 'IDBMUP2', 'EBMUP1', 'EBMUP2', 'PDFGUP1', 'PDFGUP2', 'PDFSUP1', 'PDFSUP2', 'IDWTUP', 'NPRUP']
const PROCESS_FIELDS = ['XSECUP', 'XERRUP', 'XMAXUP', 'LPRUP']
const EVENT_FIELDS = ['NUP', 'IDPRUP', 'XWGTUP', 'SCALUP', 'AQEDUP', 'AQCDUP']
export const PARTICLE_FIELDS = ['IDUP', 'ISTUP', 'MOTHUP1', 'MOTHUP2', 'ICOLUP1', 'ICOLUP2', 'PUP1', 'PUP2', 'PUP3', 'PUP4', 'PUP5', 'VTIMUP', 'SPINUP']
const INTEGER_FIELDS = new Set(['IDBMUP1', 'IDBMUP2', 'PDFGUP1', 'PDFGUP2', 'PDFSUP1', 'PDFSUP2', 'IDWTUP', 'NPRUP', 'LPRUP', 'NUP', 'IDPRUP', 'IDUP', 'ISTUP', 'MOTHUP1', 'MOTHUP2', 'ICOLUP1', 'ICOLUP2'])

interface Token { text: string, column: number }

function tokens(line: string): Token[] {
  const out: Token[] = []
  const re = /\S+/g
  let m: RegExpExecArray | null
  while ((m = re.exec(line))) out.push({ text: m[0], column: m.index + 1 })
  return out
}

/** Fortran writers may use a D exponent (1.5D+02): common practice, accepted. */
function toNumber(t: string): number {
  return t.length && /^[+-]?(\d+\.?\d*|\.\d+)([eEdD][+-]?\d+)?$/.test(t) ? Number(t.replace(/[dD]/, 'e')) : Number.NaN
}

/** Reads a record of named numeric fields from one line (line numbers are 1-based). */
function record(line: string, lineNo: number, names: string[], what: string): Record<string, number> {
  const toks = tokens(line)
  if (toks.length < names.length) {
    throw new PointFileError(lineNo, line.trimEnd().length + 1, `${what} needs ${names.length} fields (${names.join(' ')}), found ${toks.length}; ${names[toks.length]} is missing`)
  }
  if (toks.length > names.length) {
    throw new PointFileError(lineNo, toks[names.length]!.column, `${what} has ${toks.length} fields, expected ${names.length} (${names.join(' ')})`)
  }
  const out: Record<string, number> = {}
  names.forEach((name, k) => {
    const x = toNumber(toks[k]!.text)
    if (!Number.isFinite(x)) throw new PointFileError(lineNo, toks[k]!.column, `${name} must be a number, got "${toks[k]!.text}"`)
    if (INTEGER_FIELDS.has(name) && !Number.isInteger(x)) throw new PointFileError(lineNo, toks[k]!.column, `${name} must be an integer, got "${toks[k]!.text}"`)
    out[name] = x
  })
  return out
}

const isOptional = (t: string) => t.startsWith('#') || t.startsWith('<')

export type LheMeta = {
  version: string | null
  beams: { id: [number, number], energy: [number, number] } | null
  processes: { id: number, crossSection: number, error: number }[]
  events: number
  /** How many legs of each point came in (crossed), per distinct count. */
  incoming: number[]
}

/** Reads a Les Houches event file into points; a malformed file throws PointFileError (line, column). */
export function parseLhe(text: string): ParsedFile & { meta: LheMeta } {
  const lines = text.split(/\r?\n/)
  const meta: LheMeta = { version: null, beams: null, processes: [], events: 0, incoming: [] }
  const points: PointData[] = []
  let i = 0
  const at = () => i + 1
  const skipComment = () => {
    const start = at()
    while (i < lines.length && !lines[i]!.includes('-->')) i++
    if (i >= lines.length) throw new PointFileError(start, 1, 'a comment <!-- is not closed')
  }

  // The root element, after an optional XML declaration and comments.
  for (; i < lines.length; i++) {
    const t = lines[i]!.trim()
    if (!t || t.startsWith('<?xml')) continue
    if (t.startsWith('<!--')) {
      skipComment()
      continue
    }
    if (!t.startsWith('<LesHouchesEvents')) {
      throw new PointFileError(at(), lines[i]!.indexOf(t) + 1, 'not a Les Houches event file: expected the root element <LesHouchesEvents>')
    }
    meta.version = /version\s*=\s*["']([^"']*)["']/.exec(t)?.[1] ?? null
    i++
    break
  }
  if (meta.version === null && i >= lines.length) throw new PointFileError(1, 1, 'not a Les Houches event file: the root element <LesHouchesEvents> is missing')

  let sawInit = false
  let closed = false
  for (; i < lines.length; i++) {
    const raw = lines[i]!
    const t = raw.trim()
    if (!t) continue
    if (t.startsWith('<!--')) {
      skipComment()
      continue
    }
    if (t.startsWith('</LesHouchesEvents')) {
      closed = true
      break
    }
    if (/^<header[\s>]/.test(t)) {
      const start = at()
      while (i < lines.length && !lines[i]!.includes('</header>')) i++
      if (i >= lines.length) throw new PointFileError(start, 1, '<header> is not closed by </header>')
      continue
    }
    if (/^<init[\s>]/.test(t)) {
      if (sawInit) throw new PointFileError(at(), 1, 'a second <init> block; the standard allows one')
      sawInit = true
      i = readInit(i)
      continue
    }
    if (/^<event[\s>]/.test(t)) {
      if (!sawInit) throw new PointFileError(at(), raw.indexOf('<') + 1, '<event> before <init>; the standard puts <init> first')
      if (points.length >= MAX_POINTS) throw new TooManyPointsError(points.length + 1, MAX_POINTS)
      i = readEvent(i)
      continue
    }
    // Other elements directly under the root (e.g. from newer writers) are skipped whole.
    const other = /^<([A-Za-z_][\w.-]*)/.exec(t)
    if (other) {
      if (!t.endsWith('/>') && !t.includes(`</${other[1]}>`)) {
        const start = at()
        while (i < lines.length && !lines[i]!.includes(`</${other[1]}>`)) i++
        if (i >= lines.length) throw new PointFileError(start, raw.indexOf('<') + 1, `<${other[1]}> is not closed`)
      }
      continue
    }
    throw new PointFileError(at(), raw.indexOf(t) + 1, `unexpected text outside <init> and <event>: "${t.slice(0, 40)}"`)
  }
  if (!closed) throw new PointFileError(lines.length, 1, 'the file ends without </LesHouchesEvents> (is it truncated?)')
  if (!sawInit) throw new PointFileError(lines.length, 1, 'the file has no <init> block')
  meta.events = points.length
  meta.incoming = [...new Set(meta.incoming)].sort()
  return { format: 'lhe', points, rejected: [], meta }

  function readInit(open: number): number {
    let j = open + 1
    const next = () => {
      while (j < lines.length && (!lines[j]!.trim() || (isOptional(lines[j]!.trim()) && !lines[j]!.trim().startsWith('</init')))) j++
      if (j >= lines.length) throw new PointFileError(open + 1, 1, '<init> is not closed by </init>')
      return lines[j]!
    }
    let line = next()
    if (line.trim().startsWith('</init')) throw new PointFileError(j + 1, 1, `<init> needs a first line ${INIT_FIELDS.join(' ')}`)
    const head = record(line, j + 1, INIT_FIELDS, 'the <init> line')
    meta.beams = { id: [head.IDBMUP1!, head.IDBMUP2!], energy: [head.EBMUP1!, head.EBMUP2!] }
    for (let k = 0; k < head.NPRUP!; k++) {
      j++
      line = next()
      if (line.trim().startsWith('</init')) throw new PointFileError(j + 1, 1, `<init> announces NPRUP = ${head.NPRUP} processes but lists ${k}`)
      const p = record(line, j + 1, PROCESS_FIELDS, 'a process line of <init>')
      meta.processes.push({ id: p.LPRUP!, crossSection: p.XSECUP!, error: p.XERRUP! })
    }
    while (j < lines.length && !lines[j]!.includes('</init>')) j++
    if (j >= lines.length) throw new PointFileError(open + 1, 1, '<init> is not closed by </init>')
    return j
  }

  function readEvent(open: number): number {
    let j = open + 1
    const ordinal = points.length + 1
    const unclosed = () => new PointFileError(open + 1, 1, `event ${ordinal}: <event> is not closed by </event>`)
    while (j < lines.length && !lines[j]!.trim()) j++
    if (j >= lines.length) throw unclosed()
    if (lines[j]!.trim().startsWith('</event')) throw new PointFileError(j + 1, 1, `event ${ordinal}: an empty event; the first line must be ${EVENT_FIELDS.join(' ')}`)
    const head = record(lines[j]!, j + 1, EVENT_FIELDS, `event ${ordinal}: the event line`)
    if (head.NUP! < 1) throw new PointFileError(j + 1, tokens(lines[j]!)[0]!.column, `event ${ordinal}: NUP must be at least 1, got ${head.NUP}`)
    const legsIn: Momentum[] = []
    const legsOut: Momentum[] = []
    const codesIn: number[] = []
    const codesOut: number[] = []
    for (let k = 0; k < head.NUP!; k++) {
      j++
      if (j >= lines.length) throw unclosed()
      const line = lines[j]!
      if (line.trim().startsWith('</event') || isOptional(line.trim())) {
        throw new PointFileError(j + 1, 1, `event ${ordinal}: NUP = ${head.NUP} particles announced, ${k} given`)
      }
      const p = record(line, j + 1, PARTICLE_FIELDS, `event ${ordinal}: a particle line`)
      const momentum: Momentum = [p.PUP4!, p.PUP1!, p.PUP2!, p.PUP3!]
      if (p.ISTUP === -1) {
        legsIn.push(momentum.map(x => (x === 0 ? 0 : -x)) as Momentum)
        codesIn.push(p.IDUP!)
      }
      else if (p.ISTUP === 1) {
        legsOut.push(momentum)
        codesOut.push(p.IDUP!)
      }
    }
    j++
    while (j < lines.length && !lines[j]!.trim().startsWith('</event')) {
      const t = lines[j]!.trim()
      // A further particle line means NUP was too small.
      if (t && !isOptional(t) && tokens(t).length === PARTICLE_FIELDS.length && tokens(t).every(x => Number.isFinite(toNumber(x.text)))) {
        throw new PointFileError(j + 1, 1, `event ${ordinal}: more particle lines than NUP = ${head.NUP}`)
      }
      if (t.startsWith('<event')) throw unclosed()
      j++
    }
    if (j >= lines.length) throw unclosed()
    meta.incoming.push(legsIn.length)
    points.push({ label: `event ${ordinal}`, momenta: [...legsIn, ...legsOut], codes: [...codesIn, ...codesOut], weight: head.XWGTUP })
    return j
  }
}
