// What changed between two saved revisions of a diagram: title, process fields, evaluation
// settings, drawn channel terms (by their term index), and nodes and lines by kind. Pure.

export interface RevisionLike {
  title: string
  graph: {
    process?: Record<string, unknown>
    settings?: Record<string, unknown>
    nodes?: { id: string, type: string, position?: { x: number, y: number }, data?: Record<string, unknown> }[]
    edges?: { id: string }[]
  }
}

export interface FieldChange { field: string, from: unknown, to: unknown }

export interface RevisionDiff {
  title: FieldChange | null
  process: FieldChange[]
  settings: FieldChange[]
  /** Top-level channel terms (the expansion's term index) drawn in one revision and not the other. */
  termsAdded: number[]
  termsRemoved: number[]
  /** Nodes by kind (leg, angle, square, block) added or removed, matched by id. */
  nodesAdded: Record<string, number>
  nodesRemoved: Record<string, number>
  nodesMoved: number
  linesAdded: number
  linesRemoved: number
  /** Nothing but positions or the viewport changed. */
  layoutOnly: boolean
}

const PROCESS_FIELDS = ['theory', 'spin', 'helicities', 'order', 'shift'] as const

const same = (a: unknown, b: unknown) => JSON.stringify(a) === JSON.stringify(b)

function changes(a: Record<string, unknown>, b: Record<string, unknown>, keys: readonly string[]): FieldChange[] {
  return keys.filter(k => !same(a[k], b[k])).map(k => ({ field: k, from: a[k], to: b[k] }))
}

function terms(nodes: NonNullable<RevisionLike['graph']['nodes']>) {
  return new Set(nodes.map(n => n.data?.term).filter((t): t is number => typeof t === 'number'))
}

function countByKind(nodes: NonNullable<RevisionLike['graph']['nodes']>) {
  const out: Record<string, number> = {}
  for (const n of nodes) out[n.type] = (out[n.type] ?? 0) + 1
  return out
}

export function diffRevisions(older: RevisionLike, newer: RevisionLike): RevisionDiff {
  const a = older.graph
  const b = newer.graph
  const pa = a.process ?? {}
  const pb = b.process ?? {}
  const sa = a.settings ?? {}
  const sb = b.settings ?? {}
  const settingKeys = [...new Set([...Object.keys(sa), ...Object.keys(sb)])].sort()
  const na = a.nodes ?? []
  const nb = b.nodes ?? []
  const byIdA = new Map(na.map(n => [n.id, n]))
  const byIdB = new Map(nb.map(n => [n.id, n]))
  const ta = terms(na)
  const tb = terms(nb)
  const ea = new Set((a.edges ?? []).map(e => e.id))
  const eb = new Set((b.edges ?? []).map(e => e.id))
  const nodesMoved = nb.filter(n => byIdA.has(n.id) && !same(byIdA.get(n.id)!.position, n.position)).length
  const diff: RevisionDiff = {
    title: older.title === newer.title ? null : { field: 'title', from: older.title, to: newer.title },
    process: changes(pa, pb, PROCESS_FIELDS),
    settings: changes(sa, sb, settingKeys),
    termsAdded: [...tb].filter(t => !ta.has(t)).sort((x, y) => x - y),
    termsRemoved: [...ta].filter(t => !tb.has(t)).sort((x, y) => x - y),
    nodesAdded: countByKind(nb.filter(n => !byIdA.has(n.id))),
    nodesRemoved: countByKind(na.filter(n => !byIdB.has(n.id))),
    nodesMoved,
    linesAdded: [...eb].filter(id => !ea.has(id)).length,
    linesRemoved: [...ea].filter(id => !eb.has(id)).length,
    layoutOnly: false,
  }
  const nodeDataChanged = nb.some(n => byIdA.has(n.id) && (!same(byIdA.get(n.id)!.data ?? {}, n.data ?? {}) || byIdA.get(n.id)!.type !== n.type))
  diff.layoutOnly = !diff.title && !diff.process.length && !diff.settings.length && !Object.keys(diff.nodesAdded).length
    && !Object.keys(diff.nodesRemoved).length && !diff.linesAdded && !diff.linesRemoved && !nodeDataChanged
  return diff
}

/** A field's value as a short text: helicities as ±, shifts as [i,j⟩, lists joined. */
export function showValue(field: string, v: unknown): string {
  if (v === undefined || v === null) return '—'
  if (field === 'helicities' && Array.isArray(v)) return v.map(x => (x > 0 ? '+' : x < 0 ? '−' : '0')).join('')
  if (field === 'shift' && Array.isArray(v)) return `[${v[0]},${v[1]}⟩`
  if (Array.isArray(v)) return v.join(' ')
  if (typeof v === 'object') return JSON.stringify(v)
  return String(v)
}
