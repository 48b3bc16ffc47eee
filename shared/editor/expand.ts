// Turns the server's term tree (POST /api/evaluate with tree: true) into canvas components.
// Each component is one product term of the residue sum: a top-level channel term, with some of
// its sub-amplitudes shown as Blocks and others expanded into one of their own channel terms.
// Expanding a Block distributes: the component is replaced by one component per channel term of
// that Block (A_L = Σ_t term_t, so A_L·A_R/P² = Σ_t term_t·A_R/P²). Collapsing merges them back.
import type { WireLeg, WireSubAmplitude, WireTerm, WireVertex } from '../schemas/evaluate'
import type { BlockData, EditorEdge, EditorNode, LegData, LineData, VertexData } from './types'
import { nodeOf } from './types'
import { bestRotation } from './geometry'
import { codeOf, lineCodes, type SlotSpec } from './species'
import { speciesOfPdg } from '../physics/quarks'

export interface CompSpec {
  /** Index of the top-level term. */
  term: number
  /** Expanded sub-amplitudes: path → index of the chosen channel term. */
  choices: Record<string, number>
}

export type TreeNode = WireSubAmplitude | WireVertex

const isVertex = (x: TreeNode): x is WireVertex => 'kind' in x

/** Canonical key of a component spec (choices sorted by path). */
export function specKey(s: CompSpec): string {
  const parts = Object.keys(s.choices).sort().map(p => `${p}=${s.choices[p]}`)
  return [`t${s.term}`, ...parts].join('|')
}

/** Short stable id from a key (FNV-1a, 32 bit): node ids must stay under 64 characters. */
export function shortId(key: string): string {
  let h = 0x811C9DC5
  for (let t = 0; t < key.length; t++) {
    h ^= key.charCodeAt(t)
    h = Math.imul(h, 0x01000193) >>> 0
  }
  return h.toString(36)
}

export const compId = (s: CompSpec) => `c${shortId(specKey(s))}`

/** The sub-amplitude (or vertex) at a path of top-level term `term`. */
export function nodeAt(terms: WireTerm[], term: number, path: string): TreeNode | null {
  const t = terms[term]
  if (!t?.children) return null
  const parts = path.split('.')
  let cur: TreeNode = parts[0] === 'L' ? t.children.left : t.children.right
  for (let k = 1; k + 1 < parts.length; k += 2) {
    if (isVertex(cur)) return null
    const sub: WireTerm | undefined = cur.terms[Number(parts[k])]
    if (!sub?.children) return null
    cur = parts[k + 1] === 'L' ? sub.children.left : sub.children.right
  }
  return cur
}

/** One spec per top-level term: the channel terms with their two sides as blocks or vertices. */
export function topSpecs(terms: WireTerm[]): CompSpec[] {
  return terms.map((_, term) => ({ term, choices: {} }))
}

/** Replaces the component `spec` by one component per channel term of the block at `path`. */
export function expandSpec(terms: WireTerm[], specs: CompSpec[], spec: CompSpec, path: string): CompSpec[] {
  const node = nodeAt(terms, spec.term, path)
  if (!node || isVertex(node) || node.terms.length === 0) return specs
  const key = specKey(spec)
  const out: CompSpec[] = []
  for (const s of specs) {
    if (specKey(s) !== key) { out.push(s); continue }
    node.terms.forEach((_, t) => out.push({ term: s.term, choices: { ...s.choices, [path]: t } }))
  }
  return out
}

/** Collapses the expansion at `path` of `spec`: every component differing only below it merges back. */
export function collapseSpec(specs: CompSpec[], spec: CompSpec, path: string): CompSpec[] {
  const strip = (s: CompSpec): CompSpec => ({
    term: s.term,
    choices: Object.fromEntries(Object.entries(s.choices).filter(([p]) => p !== path && !p.startsWith(`${path}.`))),
  })
  const target = specKey(strip(spec))
  const out: CompSpec[] = []
  const seen = new Set<string>()
  for (const s of specs) {
    const st = strip(s)
    const k = specKey(st)
    const merged = s.term === spec.term && k === target
    const key = merged ? k : specKey(s)
    if (seen.has(key)) continue
    seen.add(key)
    out.push(merged ? st : s)
  }
  return out
}

/** Paths of the blocks a component shows (sub-amplitudes not expanded, with terms below). */
export function blockPaths(terms: WireTerm[], spec: CompSpec): string[] {
  const out: string[] = []
  const walk = (node: TreeNode, path: string) => {
    if (isVertex(node)) return
    const c = spec.choices[path]
    const sub = c === undefined ? undefined : node.terms[c]
    if (!sub?.children) {
      if (node.terms.length) out.push(path)
      return
    }
    walk(sub.children.left, `${path}.${c}.L`)
    walk(sub.children.right, `${path}.${c}.R`)
  }
  const t = terms[spec.term]
  if (t?.children) {
    walk(t.children.left, 'L')
    walk(t.children.right, 'R')
  }
  return out
}

/** Expands every block of every component, down to three-point vertices (bounded). */
export function expandAllSpecs(terms: WireTerm[], specs: CompSpec[], maxComponents = 5000): CompSpec[] {
  let cur = specs
  for (;;) {
    const next: CompSpec[] = []
    let changed = false
    for (const s of cur) {
      const paths = blockPaths(terms, s)
      if (!paths.length) { next.push(s); continue }
      changed = true
      const p = paths[0]!
      const node = nodeAt(terms, s.term, p) as WireSubAmplitude
      node.terms.forEach((_, t) => next.push({ term: s.term, choices: { ...s.choices, [p]: t } }))
    }
    if (!changed) return next
    if (next.length > maxComponents) throw new Error(`expanding fully gives more than ${maxComponents} terms`)
    cur = next
  }
}

interface Shown { id: string, kind: 'angle' | 'square' | 'block', legs: WireLeg[], helicities: number[], path: string, node: TreeNode }

/**
 * The nodes and edges of the components (positions 0,0: the layout function places them).
 * `labelOf` maps the server's leg positions 1..n to the diagram's labels (colour order); `species`
 * (by label, theory qcd) puts species on legs and on quark Lines.
 */
export function specsToGraph(terms: WireTerm[], specs: CompSpec[], labelOf: (pos: number) => number = p => p, species?: readonly string[]): { nodes: EditorNode[], edges: EditorEdge[] } {
  const nodes: EditorNode[] = []
  const edges: EditorEdge[] = []
  for (const spec of specs) {
    const t = terms[spec.term]
    if (!t?.children) continue
    const comp = compId(spec)
    const shown: Shown[] = []
    let count = 0
    const walk = (node: TreeNode, path: string) => {
      if (isVertex(node)) {
        shown.push({ id: `${comp}-v${count++}`, kind: node.kind, legs: node.legs, helicities: node.helicities, path, node })
        return
      }
      const c = spec.choices[path]
      const sub = c === undefined ? undefined : node.terms[c]
      if (!sub?.children) {
        shown.push({ id: `${comp}-b${count++}`, kind: 'block', legs: node.legs, helicities: node.helicities, path, node })
        return
      }
      walk(sub.children.left, `${path}.${c}.L`)
      walk(sub.children.right, `${path}.${c}.R`)
    }
    walk(t.children.left, 'L')
    walk(t.children.right, 'R')
    const origin = { comp, term: spec.term }
    const lineEnds = new Map<string, { id: string, slot: number, h: number }[]>()
    for (const x of shown) {
      const legs = x.legs.map(l => ('label' in l ? String(labelOf(l.label)) : l.line))
      if (x.kind === 'block') {
        const sub = x.node as WireSubAmplitude
        const data: BlockData = { ...origin, path: x.path, helicities: x.helicities, legs, terms: sub.terms.length, shift: sub.shift, value: sub.value }
        nodes.push(nodeOf(x.id, 'block', { x: 0, y: 0 }, data))
      }
      else {
        const data: VertexData = { ...origin, path: x.path, legs, value: (x.node as WireVertex).value }
        nodes.push(nodeOf(x.id, x.kind, { x: 0, y: 0 }, data))
      }
      x.legs.forEach((l, slot) => {
        if ('label' in l) {
          const label = labelOf(l.label)
          const legId = `${comp}-l${label}`
          const data: LegData = { ...origin, label, helicity: x.helicities[slot]!, ...(species ? { species: species[label - 1] ?? 'g' } : {}) }
          nodes.push(nodeOf(legId, 'leg', { x: 0, y: 0 }, data))
          edges.push({ id: `${legId}-e`, source: legId, target: x.id, sourceHandle: 'p', targetHandle: `h${slot}`, type: 'line', data: { ...origin, external: true } satisfies LineData })
        }
        else {
          const list = lineEnds.get(l.line) ?? []
          list.push({ id: x.id, slot, h: x.helicities[slot]! })
          lineEnds.set(l.line, list)
        }
      })
    }
    // Turn each node so a line's end faces its partner: the first end (left in the layout) on the right.
    const want = new Map<string, (('left' | 'right') | null)[]>()
    for (const [, ends] of lineEnds) {
      if (ends.length !== 2) continue
      ends.forEach((e, k) => {
        const x = shown.find(s => s.id === e.id)!
        const list = want.get(e.id) ?? x.legs.map(() => null)
        list[e.slot] = k === 0 ? 'right' : 'left'
        want.set(e.id, list)
      })
    }
    for (const nd of nodes) {
      const w = want.get(nd.id)
      if (!w) continue
      const rot = bestRotation(nd.type, w.length, w)
      if (rot) nd.data = { ...nd.data, rot }
    }
    const codes = species ? lineCodes(new Map(shown.map(x => [x.id, x.legs.map((l, slot): SlotSpec => ('label' in l ? { code: codeOf(species[labelOf(l.label) - 1]) } : { line: l.line, h: x.helicities[slot]! }))])), lineEnds) : null
    for (const [line, ends] of lineEnds) {
      if (ends.length !== 2) continue
      const [a, b] = ends as [typeof ends[0], typeof ends[0]]
      const code = codes?.get(line)
      const ed = { ...origin, line, helicity: a.h, targetHelicity: b.h, ...(code !== undefined && code !== 21 ? { species: speciesOfPdg(code) } : {}) } satisfies LineData
      edges.push({ id: `${comp}-${line}`, source: a.id, target: b.id, sourceHandle: `h${a.slot}`, targetHandle: `h${b.slot}`, type: 'line', data: ed })
    }
  }
  return { nodes, edges }
}

/** The seed of the point the editor asks for a term tree at (its structure is kinematics-independent). */
export const STRUCTURE_SEED = 'polewright-structure'
