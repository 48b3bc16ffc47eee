// The drawn terms against the full recursion of the process under the same shift, structurally:
// which (channel, internal helicity) terms are missing, drawn twice, not channels of the shift, or
// drawn with the internal helicity the wrong way round; and, inside a channel, whether its expanded
// sub-amplitudes cover their own recursions once. Expanding a Block distributes (A_L = Σ_t term_t),
// so the components of one channel must add up to A_L · A_R exactly once.
import type { Process } from '../../physics/theories'
import type { Process as GraphProcess } from '../../schemas/graph'
import { helicityText } from '../types'
import { codeOf, processSpecies } from '../species'
import { channelText, engineProcess, liveChannels, type DrawnPart, type DrawingStructure } from './structure'

export interface ChannelRef {
  /** Sorted labels on the side of the shifted leg i. */
  left: number[]
  /** Internal helicity at leg i's side (docs/api.md "Evaluation response", the term's `helicity`). */
  helicity: number
  /** Ids of the drawn components (terms) concerned; empty for a missing channel. */
  terms: string[]
  message: string
}

export interface DrawingComparison {
  /** Terms of the recursion that are not drawn. */
  missing: ChannelRef[]
  /** Terms drawn more than once (or whose expansion covers a sub-term twice). */
  duplicated: ChannelRef[]
  /** Drawn terms that are not a term of this shift (no channel, or a vanishing one). */
  foreign: ChannelRef[]
  /** Channels drawn with the internal helicity that the recursion does not have. */
  wrongHelicity: ChannelRef[]
  /** Channels whose expanded sub-amplitudes miss some of their own terms. */
  incomplete: ChannelRef[]
  /** Components that cannot be read as a term, with the reason. */
  invalid: { term: string, message: string }[]
  /** Everything above in words, the most important first. */
  messages: string[]
  /** The drawing holds every term of the recursion exactly once and nothing else. */
  complete: boolean
}

interface Problem { type: 'missing' | 'duplicated' | 'foreign', message: string }

const legName = (l: DrawnPart['legs'][number], lineName: (e: string) => string) => ('label' in l ? String(l.label) : lineName(l.edge))

/**
 * Canonical keys of drawn parts (the same structure gives the same key), short: a term's key names
 * its children by number, so keys stay a few characters however deep the tree (hashing whole
 * nested strings was most of a comparison). One keyer per comparison.
 */
export function partKeyer(): (x: DrawnPart) => string {
  const keys = new Map<DrawnPart, string>()
  const ids = new Map<string, string>()
  const key = (x: DrawnPart): string => {
    if (x.kind === 'vertex') return x.vertexKind === 'angle' ? 'Va' : 'Vs'
    if (x.kind === 'block') return 'B'
    let k = keys.get(x)
    if (k === undefined) {
      let mask = 0
      for (const u of x.L) mask |= 1 << u
      const full = `T${x.shift[0]},${x.shift[1]},${mask},${x.helicity}(${key(x.left)})(${key(x.right)})`
      k = ids.get(full)
      if (k === undefined) ids.set(full, (k = `#${ids.size}`))
      keys.set(x, k)
    }
    return k
  }
  return key
}

/** What the cover rule reads: the process, Line names, and the comparison's part keys. */
interface Cx {
  p: Process
  lineName: (e: string) => string
  key: (x: DrawnPart) => string
}

/** A (channel, internal helicity) as one number: the bit mask of the channel's positions or labels (≤ 16 legs), then 2h (|h| ≤ 12). */
function chKey(L: readonly number[], h: number): number {
  let mask = 0
  for (const u of L) mask |= 1 << u
  return mask * 64 + 2 * h + 32
}

// The keys of a live-channel list (liveChannels hands out the same list for the same amplitude).
const liveKeySets = new WeakMap<readonly { L: readonly number[], helicity: number }[], Set<number>>()
function liveKeysOf(live: readonly { L: readonly number[], helicity: number }[]): Set<number> {
  let k = liveKeySets.get(live)
  if (!k) liveKeySets.set(live, (k = new Set(live.map(c => chKey(c.L, c.helicity)))))
  return k
}

function times(k: number): string {
  return k === 2 ? 'twice' : `${k} times`
}

/** Whether `parts` (all standing for one amplitude) add up to it exactly once. */
function cover(cx: Cx, parts: DrawnPart[], context: () => string): Problem[] {
  const { p, lineName } = cx
  if (parts.length === 1 && parts[0]!.kind !== 'term') return []
  const whereOf = () => `${context()}, sub-amplitude (${parts[0]!.legs.map(l => legName(l, lineName)).join(', ')})`
  const keys = parts.map(cx.key)
  const distinct = new Set(keys)
  if (distinct.size < keys.length) {
    const k = keys.find((x, t) => keys.indexOf(x) !== t)!
    return [{ type: 'duplicated', message: `${whereOf()} is drawn ${times(keys.filter(x => x === k).length)} in the same form` }]
  }
  if (parts.some(x => x.kind !== 'term')) return [{ type: 'duplicated', message: `${whereOf()} is drawn both as one ${parts.find(x => x.kind !== 'term')!.kind === 'block' ? 'Block' : 'vertex'} and expanded: it is counted more than once` }]
  const terms = parts as Extract<DrawnPart, { kind: 'term' }>[]
  const first = terms[0]!
  const shifts = terms.length === 1 ? null : new Set(terms.map(t => t.shift.join(',')))
  if (shifts && shifts.size > 1) return [{ type: 'duplicated', message: `${whereOf()} is expanded under ${shifts.size} different shifts: expand it under one` }]
  const [a, b] = first.shift
  const names = () => first.legs.map(l => legName(l, lineName))
  const sh = () => `[${names()[a]}, ${names()[b]}⟩`
  const out: Problem[] = []
  const live = liveChannels(p, first.helicities, first.shift, first.pdg)
  const groups = new Map<number, typeof terms>()
  for (const t of terms) {
    const k = chKey(t.L, t.helicity)
    const g = groups.get(k) ?? []
    g.push(t)
    groups.set(k, g)
  }
  const chName = (L: readonly number[], h: number) => `{${[...L].map(u => names()[u]).join(',')}} | ${helicityText(h)}`
  for (const c of live) {
    if (!groups.has(chKey(c.L, c.helicity))) out.push({ type: 'missing', message: `${whereOf()}: its term ${chName(c.L, c.helicity)} under ${sh()} is not drawn` })
  }
  const liveKeys = liveKeysOf(live)
  for (const [k, g] of groups) {
    const t0 = g[0]!
    if (!liveKeys.has(k)) {
      out.push({ type: 'foreign', message: `${whereOf()}: ${chName(t0.L, t0.helicity)} is not a term of its recursion under ${sh()} (it vanishes)` })
      continue
    }
    out.push(...coverPairs(cx, g, () => `${whereOf()}, term ${chName(t0.L, t0.helicity)}`))
  }
  return out
}

/** The (A_L, A_R) pairs drawn for one channel must add up to A_L · A_R once. */
function coverPairs(cx: Cx, g: Extract<DrawnPart, { kind: 'term' }>[], where: () => string): Problem[] {
  const wl = where
  const wr = where
  if (g.length === 1) return [...cover(cx, [g[0]!.left], wl), ...cover(cx, [g[0]!.right], wr)]
  const attempt = (by: 'left' | 'right'): Problem[] => {
    const other = by === 'left' ? 'right' : 'left'
    const groups = new Map<string, { part: DrawnPart, others: DrawnPart[] }>()
    for (const t of g) {
      const k = cx.key(t[by])
      const e = groups.get(k) ?? { part: t[by], others: [] }
      e.others.push(t[other])
      groups.set(k, e)
    }
    const probs = cover(cx, [...groups.values()].map(e => e.part), by === 'left' ? wl : wr)
    for (const e of groups.values()) probs.push(...cover(cx, e.others, by === 'left' ? wr : wl))
    return probs
  }
  const byRight = attempt('right')
  if (!byRight.length) return []
  const byLeft = attempt('left')
  if (!byLeft.length) return []
  return byLeft.length < byRight.length ? byLeft : byRight
}

/** Compares the drawn terms with the recursion of `process` under the structure's shift. */
export function compareDrawing(process: GraphProcess, s: DrawingStructure, lineName: (edge: string) => string = e => e): DrawingComparison {
  const cmp: DrawingComparison = { missing: [], duplicated: [], foreign: [], wrongHelicity: [], incomplete: [], invalid: [], messages: [], complete: false }
  const p = engineProcess(process)
  if (!p || !s.shift) {
    cmp.messages.push('the process has no valid shift: the drawing cannot be compared with its recursion')
    return cmp
  }
  const order = p.colourOrdered && process.order?.length === process.helicities.length ? process.order : process.helicities.map((_, t) => t + 1)
  const pos = new Map(order.map((l, k) => [l, k]))
  const h = order.map(l => process.helicities[l - 1]!)
  const shift: [number, number] = [pos.get(s.shift[0])!, pos.get(s.shift[1])!]
  const sh = `[${s.shift[0]}, ${s.shift[1]}⟩`
  const species = processSpecies(process)
  const live = liveChannels(p, h, shift, species ? order.map(l => codeOf(species[l - 1])) : undefined).map(c => ({ left: c.L.map(t => order[t]!).sort((a, b) => a - b), helicity: c.helicity }))
  const key = chKey
  const liveKeys = new Set(live.map(c => key(c.left, c.helicity)))
  const liveChannelsOnly = new Set(live.map(c => key(c.left, 0)))
  const cx: Cx = { p, lineName, key: partKeyer() }
  const groups = new Map<number, { left: number[], helicity: number, ids: string[], plans: DrawnPart[] }>()
  for (const t of s.terms) {
    if (!t.channel || !t.plan) {
      cmp.invalid.push({ term: t.id, message: `a drawn term cannot be read as a channel term of ${sh}: ${t.problems[0] ?? 'see its nodes'}` })
      continue
    }
    const k = key(t.channel.left, t.channel.helicity)
    const g = groups.get(k) ?? { left: t.channel.left, helicity: t.channel.helicity, ids: [], plans: [] }
    g.ids.push(t.id)
    g.plans.push(t.plan)
    groups.set(k, g)
    if (!t.valid && t.problems.length) cmp.invalid.push({ term: t.id, message: `channel ${channelText(t.channel.left)} with internal helicity ${helicityText(t.channel.helicity)}: ${t.problems[0]}` })
  }
  const word = (hh: number) => helicityText(hh)
  for (const c of live) {
    const g = groups.get(key(c.left, c.helicity))
    if (g) continue
    const flipped = groups.get(key(c.left, -c.helicity))
    cmp.missing.push({ left: c.left, helicity: c.helicity, terms: [], message: `channel ${channelText(c.left)} with internal helicity ${word(c.helicity)} is not drawn${flipped ? ` (it is drawn with internal helicity ${word(-c.helicity)})` : ''}` })
  }
  for (const g of groups.values()) {
    const k = key(g.left, g.helicity)
    if (!liveKeys.has(k)) {
      if (liveChannelsOnly.has(key(g.left, 0)) || liveKeys.has(key(g.left, -g.helicity))) {
        cmp.wrongHelicity.push({ left: g.left, helicity: g.helicity, terms: g.ids, message: `channel ${channelText(g.left)} is drawn with internal helicity ${word(g.helicity)}, the wrong way round: its term has internal helicity ${word(-g.helicity)}` })
      }
      else {
        cmp.foreign.push({ left: g.left, helicity: g.helicity, terms: g.ids, message: `channel ${channelText(g.left)} with internal helicity ${word(g.helicity)} is not a term of ${sh}: it vanishes for these helicities` })
      }
      continue
    }
    const where = `channel ${channelText(g.left)} with internal helicity ${word(g.helicity)}`
    const probs = g.plans.length === 1 && g.plans[0]!.kind === 'term'
      ? coverPairs(cx, [g.plans[0] as Extract<DrawnPart, { kind: 'term' }>], () => where)
      : coverTop(cx, g.plans, where)
    const dup = probs.filter(x => x.type === 'duplicated')
    const rest = probs.filter(x => x.type !== 'duplicated')
    if (dup.length) cmp.duplicated.push({ left: g.left, helicity: g.helicity, terms: g.ids, message: dup[0]!.message })
    if (rest.length) cmp.incomplete.push({ left: g.left, helicity: g.helicity, terms: g.ids, message: rest[0]!.message })
  }
  cmp.messages = [
    ...cmp.missing.map(x => x.message),
    ...cmp.wrongHelicity.map(x => x.message),
    ...cmp.duplicated.map(x => x.message),
    ...cmp.foreign.map(x => x.message),
    ...cmp.incomplete.map(x => x.message),
    ...cmp.invalid.map(x => x.message),
  ]
  cmp.complete = cmp.messages.length === 0
  return cmp
}

/** Several components of one top-level channel: the same (A_L, A_R) cover rule. */
function coverTop(cx: Cx, plans: DrawnPart[], where: string): Problem[] {
  const keys = plans.map(cx.key)
  if (new Set(keys).size < keys.length) {
    const k = keys.find((x, t) => keys.indexOf(x) !== t)!
    return [{ type: 'duplicated', message: `${where} is drawn ${times(keys.filter(x => x === k).length)}` }]
  }
  return coverPairs(cx, plans as Extract<DrawnPart, { kind: 'term' }>[], () => where)
}
