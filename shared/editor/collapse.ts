// Keeps a big expansion readable: "Expand fully" opens sub-amplitudes only while the canvas holds at
// most READABLE_NODES vertices and Blocks; the rest stay collapsed Blocks (each one a sub-amplitude the
// check evaluates under its own default shift, docs/drawing.md), which open one at a time. Every spec
// list here comes from expandSpec, so the drawn sum stays the recursion however far it is opened.
import type { WireSubAmplitude, WireTerm } from '../schemas/evaluate'
import { blockPaths, expandSpec, nodeAt, specKey, type CompSpec, type TreeNode } from './expand'

/** Vertices and Blocks (legs not counted) a canvas may hold and still be read at a glance. */
export const READABLE_NODES = 20

const isVertex = (x: TreeNode): boolean => 'kind' in x

/** Vertices and Blocks one component shows. */
function countOf(terms: WireTerm[], spec: CompSpec): number {
  let n = 0
  const walk = (node: TreeNode, path: string) => {
    if (isVertex(node)) { n++; return }
    const sub = node as WireSubAmplitude
    const c = spec.choices[path]
    const t = c === undefined ? undefined : sub.terms[c]
    if (!t?.children) { n++; return }
    walk(t.children.left, `${path}.${c}.L`)
    walk(t.children.right, `${path}.${c}.R`)
  }
  const t = terms[spec.term]
  if (!t?.children) return 0
  walk(t.children.left, 'L')
  walk(t.children.right, 'R')
  return n
}

/** Vertices and Blocks the specs put on the canvas. */
export function shownCount(terms: WireTerm[], specs: CompSpec[]): number {
  return specs.reduce((s, x) => s + countOf(terms, x), 0)
}

/** Blocks still collapsed (sub-amplitudes with channel terms of their own). */
export function collapsedCount(terms: WireTerm[], specs: CompSpec[]): number {
  return specs.reduce((s, x) => s + blockPaths(terms, x).length, 0)
}

/**
 * Opens Blocks while the count stays within `limit`: each step opens the Block that adds the fewest
 * nodes (ties: canvas order), so small sub-amplitudes open and big ones stay labelled Blocks.
 * `where` restricts it to some Blocks (openOne: the ones under the Block just opened).
 */
function openWhileReadable(terms: WireTerm[], specs: CompSpec[], limit: number, where: (spec: CompSpec, path: string) => boolean = () => true): CompSpec[] {
  let cur = specs
  let count = shownCount(terms, cur)
  for (;;) {
    let best: { specs: CompSpec[], count: number } | null = null
    for (const s of cur) {
      for (const p of blockPaths(terms, s)) {
        if (!where(s, p)) continue
        const node = nodeAt(terms, s.term, p) as WireSubAmplitude
        // One component becomes one per channel term of the Block: count what that adds first.
        const own = countOf(terms, s)
        const grown = node.terms.reduce((sum, _, t) => sum + countOf(terms, { term: s.term, choices: { ...s.choices, [p]: t } }), 0)
        const next = count - own + grown
        if (next > limit || (best && next >= best.count)) continue
        best = { specs: expandSpec(terms, cur, s, p), count: next }
      }
    }
    if (!best) return cur
    cur = best.specs
    count = best.count
  }
}

/**
 * The specs of an expansion: the top-level channel terms, and for `full` every sub-amplitude that
 * still fits the readable bound opened (an already shown expansion `from` is opened further).
 */
export function readableSpecs(terms: WireTerm[], full: boolean, from?: CompSpec[], limit = READABLE_NODES): CompSpec[] {
  const top = from ?? terms.map((_, term) => ({ term, choices: {} }))
  return full ? openWhileReadable(terms, top, limit) : top
}

/**
 * Opens the Block at `path` of `spec` into its channel terms; Blocks inside it then open as far as
 * the readable bound allows. Nothing else on the canvas is collapsed or opened.
 */
export function openOne(terms: WireTerm[], specs: CompSpec[], spec: CompSpec, path: string, limit = READABLE_NODES): CompSpec[] {
  const opened = expandSpec(terms, specs, spec, path)
  if (opened === specs) return specs
  const before = new Set(specs.map(specKey))
  return openWhileReadable(terms, opened, limit, (s, p) => !before.has(specKey(s)) && p.startsWith(`${path}.`))
}

const SUB = '₀₁₂₃₄₅₆₇₈₉'
const sub = (n: number) => String(n).split('').map(d => SUB[Number(d)]).join('')
const sup = (h: number) => (h > 0 ? '⁺' : h < 0 ? '⁻' : '⁰')

export interface BlockLabel {
  /** Which side of its channel: A_L or A_R. */
  side: 'A_L' | 'A_R'
  /** External legs of the Block (the channel it stands for), in its leg order. */
  channel: number[]
  /** The Block's legs with helicities: external labels, internal lines as P̂ with their line number. */
  legs: string
  /** Channel terms of its own recursion (what opening it shows). */
  terms: number
  /** One line: "A_L{1,2,3}: 1⁻ 2⁻ 3⁻ P̂₁⁺ · 3 terms". */
  text: string
}

/** The label of a Block from its data (legs, helicities, path). */
export function blockLabel(b: { legs?: string[], helicities: number[], path?: string, terms?: number }): BlockLabel {
  const side = b.path?.endsWith('R') ? 'A_R' : 'A_L'
  const names = b.helicities.map((h, k) => {
    const l = b.legs?.[k] ?? String(k + 1)
    const m = /^L(\d+)$/.exec(l)
    return `${m ? `P̂${sub(Number(m[1]))}` : l}${sup(h)}`
  })
  const channel = (b.legs ?? []).filter(l => /^\d+$/.test(l)).map(Number)
  const terms = b.terms ?? 0
  const text = `${side}{${channel.join(',')}}: ${names.join(' ')}${terms ? ` · ${terms} term${terms === 1 ? '' : 's'}` : ''}`
  return { side, channel, legs: names.join(' '), terms, text }
}
