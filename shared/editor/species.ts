// Species on the canvas (theory qcd): legs carry a species name, Lines the species leaving their
// source end (the target end carries the antiparticle), so fermion flow has a direction on every
// quark Line (docs/conventions.md "Fermion flow on the canvas"). Framework-free.
import type { Process } from '../schemas/graph'
import { GLUON_PDG, MAX_FLAVOUR, checkQcdSpecies, isQuarkCode, pdgOfSpecies, speciesOfPdg } from '../physics/quarks'
import { PhysicsError } from '../physics/errors'
import { THEORIES, isValidShift, processOf } from '../physics/theories'
import type { EditorEdge, EditorNode, LineData } from './types'

// The colour order (process.ts has the same; imported from there it would be a cycle via validate.ts).
function orderOf(p: Process): number[] {
  const n = p.helicities.length
  return p.order && p.order.length === n ? p.order : Array.from({ length: n }, (_, t) => t + 1)
}

/** Every species name of the qcd theory, gluon first. */
export const QCD_SPECIES_NAMES: string[] = ['g', ...Array.from({ length: MAX_FLAVOUR }, (_, t) => [`q${t + 1}`, `qbar${t + 1}`]).flat()]

/** Whether a theory has several species (its legs need a species control). */
export const hasSpecies = (theory: Process['theory']): boolean => THEORIES[theory].species.length > 1

/** "g", "q₁", "q̄₁": a species as the canvas writes it. */
export function speciesText(name: string | undefined): string {
  if (!name || name === 'g' || name === 'gluon') return 'g'
  const sub = (f: string) => [...f].map(c => '₀₁₂₃₄₅₆₇₈₉'[Number(c)]).join('')
  const m = /^q(bar)?(\d)$/.exec(name)
  return m ? `${m[1] ? 'q̄' : 'q'}${sub(m[2]!)}` : name
}

/** |h| of a species (½ for quarks, 1 for gluons). */
export const speciesSpin = (name: string | undefined): number => (name && /^q(bar)?\d$/.test(name) ? 1 / 2 : 1)

/** The species of the process's legs by label (gluons where none is given); null for single-species theories. */
export function processSpecies(p: Process | undefined): string[] | null {
  if (!p || !hasSpecies(p.theory)) return null
  return p.helicities.map((_, t) => p.species?.[t] ?? 'g')
}

/** The PDG code of a species name (gluon for anything unknown: the validation names it). */
export function codeOf(name: string | undefined): number {
  try {
    return name ? pdgOfSpecies(name) : GLUON_PDG
  }
  catch {
    return GLUON_PDG
  }
}

/** The antiparticle's code (a gluon is its own). */
export const antiCode = (c: number): number => (c === GLUON_PDG ? c : -c)

/** The species code leaving `nodeId` into `edge` (outgoing from the node), like the helicity at a slot. */
export function codeAt(edge: EditorEdge, nodeId: string, nodes: Map<string, EditorNode>): number {
  const otherId = edge.source === nodeId ? edge.target : edge.source
  const other = nodes.get(otherId)
  if (other?.type === 'leg') return codeOf(other.data.species)
  const c = codeOf(((edge.data ?? {}) as LineData).species)
  return edge.source === nodeId ? c : antiCode(c)
}

/**
 * Direction of fermion flow on an edge: 'forward' from source to target, 'backward', or null for a
 * gluon. An outgoing quark carries the flow out of its vertex, an outgoing antiquark into it.
 */
export function fermionFlow(edge: EditorEdge, nodes: Map<string, EditorNode>): 'forward' | 'backward' | null {
  const src = nodes.get(edge.source)
  if (!src) return null
  // Code leaving the source node's side into the edge: for a leg source, the vertex end carries the leg's species outward.
  const c = src.type === 'leg' ? antiCode(codeOf(src.data.species)) : codeAt(edge, edge.source, nodes)
  if (!isQuarkCode(c)) return null
  return c > 0 ? 'forward' : 'backward'
}

/** Fermion-flow continuity at a three-point vertex from the codes of its slots; a message or null. */
export function vertexFlowProblem(codes: readonly number[]): string | null {
  const q = codes.filter(isQuarkCode)
  if (q.length === 0) return null
  if (q.length === 1) return 'a quark line stops at this vertex: it must run on through it (q̄, q and a gluon), so one of the other lines or legs here is a quark too'
  if (q.length !== 2 || codes.length !== 3) return `${q.length} quark ends meet at this vertex: a three-point vertex holds one quark line (q̄, q and a gluon) or three gluons`
  const [a, b] = q as [number, number]
  if (a > 0 && b > 0) return `the quark line flows out of this vertex twice (two outgoing quarks ${speciesText(speciesOfPdg(a))}, ${speciesText(speciesOfPdg(b))}): fermion flow enters a vertex once and leaves it once`
  if (a < 0 && b < 0) return `the quark line flows into this vertex twice (two outgoing antiquarks ${speciesText(speciesOfPdg(a))}, ${speciesText(speciesOfPdg(b))}): fermion flow enters a vertex once and leaves it once`
  if (a !== -b) return `quark lines of flavours ${Math.abs(a)} and ${Math.abs(b)} meet here: a gluon vertex keeps the flavour along a quark line`
  return null
}

/** What is wrong with a qcd process's species and shift, in words (the engine's own rules); null when nothing. */
export function speciesProblem(p: Process | undefined): string | null {
  const species = processSpecies(p)
  if (!p || !species) return null
  const order = orderOf(p)
  try {
    checkQcdSpecies(order.map(l => ({ species: species[l - 1]!, h: p.helicities[l - 1]! })))
  }
  catch (e) {
    if (!(e instanceof PhysicsError)) throw e
    // The engine's field is a position in the colour order: name the leg label instead.
    const m = /^(species|helicities)\[(\d+)\]$/.exec(e.field)
    const text = e.message.replace(/^[\w.[\]]+: /, '')
    return m ? `leg ${order[Number(m[2])]}: ${text}` : text
  }
  if (p.shift) {
    const pos = (l: number) => order.indexOf(l)
    const ep = processOf(p.theory)
    const codes = order.map(l => codeOf(species[l - 1]))
    const h = order.map(l => p.helicities[l - 1]!)
    if (pos(p.shift[0]) >= 0 && pos(p.shift[1]) >= 0 && !isValidShift(ep, h, pos(p.shift[0]), pos(p.shift[1]), codes))
      return `the shift [${p.shift[0]},${p.shift[1]}⟩ is not valid for these species and helicities: A(z) does not fall off, so the residue sum would miss a boundary term`
  }
  return null
}

/** One slot of a generated node: an external leg's code, or a Line with its helicity magnitude. */
export type SlotSpec = { code: number } | { line: string, h: number }

/**
 * The code leaving the first end of each Line (ends[0] in `lines`), from the external legs: a
 * line of |h| = 1 is a gluon; a quark line's end completes the one open quark line at a node
 * (a tree: every Line is settled once one of its sides is). Unsettled lines are left out.
 */
export function lineCodes(nodes: Map<string, SlotSpec[]>, lines: Map<string, { id: string }[]>): Map<string, number> {
  const out = new Map<string, number>()
  const endAt = (line: string, node: string) => (lines.get(line)?.[0]?.id === node ? 0 : 1)
  const codeAt = (line: string, node: string) => {
    const c = out.get(line)
    return c === undefined ? undefined : endAt(line, node) === 0 ? c : antiCode(c)
  }
  for (const slots of nodes.values()) for (const s of slots) if ('line' in s && Math.abs(s.h) === 1) out.set(s.line, GLUON_PDG)
  for (let changed = true; changed;) {
    changed = false
    for (const [id, slots] of nodes) {
      const open: string[] = []
      const known: number[] = []
      for (const s of slots) {
        const c = 'code' in s ? s.code : codeAt(s.line, id)
        if (c === undefined) open.push((s as { line: string }).line)
        else if (isQuarkCode(c)) known.push(c)
      }
      if (open.length !== 1) continue
      const unpaired = known.filter(c => !known.includes(-c))
      if (unpaired.length !== 1) continue
      const line = open[0]!
      const here = -unpaired[0]!
      out.set(line, endAt(line, id) === 0 ? here : antiCode(here))
      changed = true
    }
  }
  return out
}
