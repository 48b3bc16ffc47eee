// Checks a hand-assembled (or generated) canvas node by node and says in words what is wrong,
// on the node that is wrong. The rules are the trade's (docs/conventions.md "Amplitudes and normalisations"):
// a three-point vertex's helicities decide its kind (Σh < 0 angle, Σh > 0 square), pure gluon
// and graviton theories have no all-equal three-point vertex, an internal line joins opposite
// helicities, and momentum routing closes only on a tree holding every external leg once.
import type { Process } from '../schemas/graph'
import { THEORIES, spinOf } from '../physics/theories'
import type { EditorEdge, EditorNode, LineData } from './types'
import { handleIds, helicityText, sign } from './types'
import { compileStructure, type DrawingStructure, type Slot } from './drawing/structure'
import { codeAt, codeOf, processSpecies, speciesSpin, speciesText, vertexFlowProblem } from './species'

export interface Issue {
  level: 'error' | 'warning'
  message: string
}

export interface SlotInfo {
  handle: string
  edges: EditorEdge[]
  /** Helicity arriving at this slot (outgoing from the node), or null if unknown/unconnected. */
  helicity: number | null
  /** What sits at the other end: a leg label, a line, or nothing. */
  other: { kind: 'leg', label: number, nodeId: string } | { kind: 'line', nodeId: string, edgeId: string } | null
  /** Theory qcd: PDG code of the species leaving the node at this slot (species.ts codeAt). */
  code?: number
}

export interface Component {
  id: string
  nodeIds: string[]
  legIds: string[]
  labels: number[]
  /** Internal lines (edges between vertices and blocks). */
  lineIds: string[]
  isTree: boolean
}

export interface Validation {
  nodes: Record<string, Issue[]>
  edges: Record<string, Issue[]>
  components: Component[]
  /** Slots of every vertex and block, by node id. */
  slots: Record<string, SlotInfo[]>
  errorCount: number
  /** The drawn terms: channel, top-level Line, sides and structure of each component (see drawing/structure.ts). */
  drawing: DrawingStructure
}

/** |h| of the process's particles, or null when no process is set. */
export function particleSpin(p: Process | undefined): number | null {
  return p ? spinOf(p.theory, p.spin) : null
}

/** The helicity an edge brings to the given end (node, handle). */
export function helicityAt(edge: EditorEdge, nodeId: string, nodes: Map<string, EditorNode>): number | null {
  const d = (edge.data ?? {}) as LineData
  const otherId = edge.source === nodeId ? edge.target : edge.source
  const other = nodes.get(otherId)
  if (other?.type === 'leg') return other.data.helicity
  if (d.helicity === undefined) return null
  if (edge.source === nodeId && edge.target !== nodeId) return d.helicity
  return d.targetHelicity ?? -d.helicity
}

export function isExternal(edge: EditorEdge, nodes: Map<string, EditorNode>): boolean {
  return nodes.get(edge.source)?.type === 'leg' || nodes.get(edge.target)?.type === 'leg'
}

export interface ValidateOptions {
  /** false: leave `slots` empty (a check reads only the drawing; the canvas and inspector read slots). */
  slots?: boolean
}

export function validateGraph(nodesIn: EditorNode[], edges: EditorEdge[], process?: Process, opts: ValidateOptions = {}): Validation {
  const wantSlots = opts.slots !== false
  // By id, and the index of each id (an id names its last node, as a Map built from the list does).
  const nodes = new Map<string, EditorNode>()
  const uid = new Map<string, number>()
  for (let k = 0; k < nodesIn.length; k++) {
    const nd = nodesIn[k]!
    nodes.set(nd.id, nd)
    uid.set(nd.id, k)
  }
  const issues: Record<string, Issue[]> = {}
  const edgeIssues: Record<string, Issue[]> = {}
  // Errors that keep a component from being read as a term (open slots, loops, missing legs, …);
  // kind and helicity errors do not: the drawing compiler still names the channel they spoil.
  const blocking = new Set<string>()
  const add = (id: string, level: Issue['level'], message: string, blocks = true) => {
    ;(issues[id] ??= []).push({ level, message })
    if (level === 'error' && blocks) blocking.add(id)
  }
  const addEdge = (id: string, level: Issue['level'], message: string, blocks = true) => {
    ;(edgeIssues[id] ??= []).push({ level, message })
    if (level === 'error' && blocks) blocking.add(id)
  }
  /** Kind messages from the helicity sum, replaced by the structural ones where a term is read. */
  const kindIssues = new Map<string, Issue>()
  const addKind = (id: string, message: string) => {
    add(id, 'error', message, false)
    kindIssues.set(id, issues[id]!.at(-1)!)
  }
  const species = processSpecies(process)
  // Several species: |h| follows each leg's or Line's species, not one spin.
  const s = species ? null : particleSpin(process)
  const n = process?.helicities.length ?? 0

  // Edges at each (node, handle).
  // node id → handle → edges (handle '' when none); the handles each node is reached at.
  const atNode = new Map<string, Map<string, EditorEdge[]>>()
  const handlesOf = new Map<string, (string | null | undefined)[]>()
  const attach = (id: string, h: string | null | undefined, e: EditorEdge) => {
    let m = atNode.get(id)
    if (!m) atNode.set(id, (m = new Map()))
    const list = m.get(h ?? '')
    if (list) list.push(e)
    else m.set(h ?? '', [e])
    let hs = handlesOf.get(id)
    if (!hs) handlesOf.set(id, (hs = []))
    hs.push(h)
  }
  const at = (id: string, h: string) => atNode.get(id)?.get(h)
  // Edges between two different existing nodes, with their ends' indices and whether a leg is at an end.
  const validEdges: EditorEdge[] = []
  const ends: number[] = []
  const externalAt: boolean[] = []
  for (const e of edges) {
    const a = nodes.get(e.source)
    const b = nodes.get(e.target)
    if (!a || !b) continue
    if (e.source === e.target) { add(e.source, 'error', 'a line from this node back to itself: glue two different nodes'); continue }
    const external = a.type === 'leg' || b.type === 'leg'
    validEdges.push(e)
    ends.push(uid.get(e.source)!, uid.get(e.target)!)
    externalAt.push(external)
    attach(e.source, e.sourceHandle, e)
    attach(e.target, e.targetHandle, e)
    if (a.type === 'leg' && b.type === 'leg') addEdge(e.id, 'error', 'two legs joined directly: attach legs to a vertex or a block')
    const d = (e.data ?? {}) as LineData
    if (!external && d.helicity !== undefined) {
      if (d.targetHelicity !== undefined && d.targetHelicity !== -d.helicity) {
        const msg = `line ${d.line ?? ''} joins ${sign(d.helicity)} to ${sign(d.targetHelicity)}: an internal line joins opposite helicities`.replace('  ', ' ')
        addEdge(e.id, 'error', msg, false)
        add(e.target, 'error', msg, false)
      }
      if (species && Math.abs(d.helicity) !== speciesSpin(d.species)) addEdge(e.id, 'error', `helicity ${helicityText(d.helicity)} on a ${d.species ? 'quark' : 'gluon'} line, whose helicities are ${d.species ? '±1/2' : '±1'}`, false)
      if (s !== null && Math.abs(d.helicity) !== s) addEdge(e.id, 'error', `helicity ${helicityText(d.helicity)} on a line of ${THEORIES[process!.theory].particles}, whose helicities are ${s === 0 ? '0' : `±${s}`}`)
    }
  }

  const slots: Record<string, SlotInfo[]> = {}
  // The same slots as the drawing compiler reads them.
  const slotRows = new Map<string, Slot[]>()
  for (const node of nodesIn) {
    if (node.type === 'leg') {
      const d = node.data
      const list = at(node.id, 'p') ?? edges.filter(e => (e.source === node.id || e.target === node.id) && e.source !== e.target)
      if (list.length === 0) add(node.id, 'error', `leg ${d.label} is not attached: connect it to a vertex or a block`)
      if (list.length > 1) add(node.id, 'error', `leg ${d.label} is attached ${list.length} times: an external leg enters exactly one vertex`)
      if (process) {
        if (!Number.isInteger(d.label) || d.label < 1 || d.label > n) add(node.id, 'error', `leg ${d.label} does not exist (legs are 1..${n})`)
        else if (process.helicities[d.label - 1] !== d.helicity) add(node.id, 'error', `leg ${d.label} is ${helicityText(d.helicity)} here but ${helicityText(process.helicities[d.label - 1]!)} in the process`)
        else if (species && codeOf(d.species) !== codeOf(species[d.label - 1])) add(node.id, 'error', `leg ${d.label} is ${speciesText(d.species)} here but ${speciesText(species[d.label - 1])} in the process`)
      }
      if (s !== null && Math.abs(d.helicity) !== s) add(node.id, 'error', `helicity ${helicityText(d.helicity)} does not belong to ${THEORIES[process!.theory].particles} (${s === 0 ? '0' : `±${s}`})`)
      if (species && Math.abs(d.helicity) !== speciesSpin(d.species)) add(node.id, 'error', `helicity ${helicityText(d.helicity)} does not belong to a ${d.species && speciesSpin(d.species) < 1 ? 'quark' : 'gluon'} (${speciesSpin(d.species) < 1 ? '±1/2' : '±1'})`)
      continue
    }
    const info: SlotInfo[] = []
    const rows: Slot[] = []
    const own = handleIds(node)
    const byHandle = atNode.get(node.id)
    const total = own.length
    const hs: (number | null)[] = new Array(total)
    // Theory qcd: the codes at the slots, null when one is open.
    let codes: number[] | null = species ? [] : null
    let open = 0
    let crowded: { handle: string, count: number }[] | null = null
    for (let t = 0; t < total; t++) {
      const h = own[t]!
      const list = byHandle?.get(h)
      const first = list?.[0]
      const helicity = first ? helicityAt(first, node.id, nodes) : null
      const code = species && first ? codeAt(first, node.id, nodes) : null
      hs[t] = helicity
      if (codes) {
        if (code === null) codes = null
        else codes.push(code)
      }
      let other: SlotInfo['other'] = null
      if (first) {
        if (list!.length > 1) (crowded ??= []).push({ handle: h, count: list!.length })
        const oid = first.source === node.id ? first.target : first.source
        const o = nodes.get(oid)!
        if (o.type === 'leg') {
          if (wantSlots) other = { kind: 'leg', label: o.data.label, nodeId: oid }
          rows.push({ leg: o.data.label, edge: null, to: null, helicity, code })
        }
        else {
          if (wantSlots) other = { kind: 'line', nodeId: oid, edgeId: first.id }
          rows.push({ leg: null, edge: first.id, to: oid, helicity, code })
        }
      }
      else {
        open++
        rows.push({ leg: null, edge: null, to: null, helicity, code })
      }
      if (wantSlots) info.push({ handle: h, edges: list ?? [], helicity, other, ...(species && first ? { code: code! } : {}) })
    }
    if (wantSlots) slots[node.id] = info
    slotRows.set(node.id, rows)
    // A connection to a slot the node does not have (a Block with fewer legs, a stale handle).
    for (const h of handlesOf.get(node.id) ?? []) if (!own.includes(h ?? '')) add(node.id, 'error', `a connection to slot ${h ?? '(none)'}, which this ${node.type === 'block' ? 'Block' : 'vertex'} does not have: reconnect it`)
    if (open) add(node.id, 'error', `${total - open} of ${total} ${node.type === 'block' ? 'legs' : 'slots'} connected: every slot takes one leg or line`)
    for (const c of crowded ?? []) add(node.id, 'error', `slot ${Number(c.handle.slice(1)) + 1} has ${c.count} connections: one leg or line per slot`)
    if (node.type === 'angle' || node.type === 'square') {
      const flow = codes ? vertexFlowProblem(codes) : null
      if (flow) add(node.id, 'error', flow, false)
      if (hs.every(h => h !== null)) {
        const hv = hs as number[]
        const sum = hv[0]! + hv[1]! + hv[2]!
        const txt = () => `(${hv.map(sign).join(',')})`
        const allSame = hv.every(h => h > 0) || hv.every(h => h < 0)
        if (((s !== null && s > 0) || species) && allSame) addKind(node.id, `helicities ${txt()}: ${THEORIES[process!.theory].particles} have no three-point amplitude with all helicities equal`)
        else if (sum < 0 && node.type === 'square') addKind(node.id, `helicities ${txt()} sum to −${Math.abs(sum)} < 0: this is an angle vertex, not a square vertex`)
        else if (sum > 0 && node.type === 'angle') addKind(node.id, `helicities ${txt()} sum to +${sum} > 0: this is a square vertex, not an angle vertex`)
        else if (sum === 0 && s !== 0 && (s !== null || species)) addKind(node.id, `helicities ${txt()} sum to 0: only scalars have such a vertex`)
      }
    }
    else if (node.type === 'block') {
      const want = node.data.helicities ?? []
      hs.forEach((x, t) => {
        if (x !== null && want[t] !== undefined && x !== want[t])
          add(node.id, 'error', `slot ${t + 1} expects ${helicityText(want[t]!)} but receives ${helicityText(x)}`, false)
      })
      if (want.length < 4) add(node.id, 'warning', `a block of ${want.length} legs: use a vertex for three-point amplitudes`)
      if (s !== null && s > 0 && want.length >= 4) {
        const minus = want.filter(h => h < 0).length
        if (minus < 2 || want.length - minus < 2) add(node.id, 'warning', `this block vanishes at tree level (${minus < 2 ? 'fewer than two −' : 'fewer than two +'} helicities)`)
      }
    }
  }

  // Connected components: momentum routing closes on a tree holding every leg once.
  // Union-find over node indices (an id names its last node, as the Map above does).
  // A plain array: a small typed array costs more to allocate than this whole pass.
  const parent: number[] = []
  for (let k = 0; k < nodesIn.length; k++) parent.push(k)
  const find = (x: number): number => {
    let r = x
    while (parent[r] !== r) r = parent[r]!
    // Full path compression: unions without rank otherwise build chains (quadratic on big canvases).
    for (let y = x; y !== r;) {
      const up = parent[y]!
      parent[y] = r
      y = up
    }
    return r
  }
  for (let t = 0; t < validEdges.length; t++) parent[find(ends[2 * t]!)] = find(ends[2 * t + 1]!)
  const groups = new Map<number, string[]>()
  for (const x of nodesIn) {
    const r = find(uid.get(x.id)!)
    const g = groups.get(r)
    if (g) g.push(x.id)
    else groups.set(r, [x.id])
  }
  const edgeCount = new Map<number, number>()
  // Internal lines per component, found in one pass (a filter per component was quadratic).
  const linesByRoot = new Map<number, string[]>()
  for (let t = 0; t < validEdges.length; t++) {
    const r = find(ends[2 * t]!)
    edgeCount.set(r, (edgeCount.get(r) ?? 0) + 1)
    if (!externalAt[t]) (linesByRoot.get(r) ?? linesByRoot.set(r, []).get(r)!).push(validEdges[t]!.id)
  }
  const components: Component[] = []
  for (const [root, ids] of groups) {
    const legs = ids.map(id => nodes.get(id)!).filter(nd => nd.type === 'leg')
    const legIds = legs.map(nd => nd.id)
    const inner = ids.filter(id => nodes.get(id)!.type !== 'leg')
    const labels = legs.map(nd => nd.data.label)
    const lineIds = linesByRoot.get(root) ?? []
    const isTree = (edgeCount.get(root) ?? 0) === ids.length - 1
    components.push({ id: inner[0] ?? ids[0]!, nodeIds: ids, legIds, labels, lineIds, isTree })
    if (!inner.length) continue
    const anchor = inner[0]!
    if (!isTree) add(anchor, 'error', 'a closed loop of lines: a tree-level term has no loops, so momentum routing cannot be fixed')
    const seen = new Map<number, string>()
    for (const { id, data: { label: l } } of legs) {
      if (seen.has(l)) add(id, 'error', `leg ${l} appears twice in this term`)
      seen.set(l, id)
    }
    if (process) {
      const missing: number[] = []
      for (let l = 1; l <= n; l++) if (!seen.has(l)) missing.push(l)
      if (missing.length) add(anchor, 'error', `momentum does not close: leg${missing.length > 1 ? 's' : ''} ${missing.join(', ')} of the process ${missing.length > 1 ? 'are' : 'is'} missing from this term`)
    }
  }
  const drawing = compileStructure({ nodes: nodesIn, byId: nodes, edges: validEdges, process, components, slots: slotRows, errorIds: blocking })
  for (const x of drawing.issues) {
    if (x.on === 'edge') { (edgeIssues[x.id] ??= []).push({ level: x.level, message: x.message }); continue }
    // The structural message says more than the helicity-sum one (which side of which line).
    const k = kindIssues.get(x.id)
    if (k) issues[x.id] = issues[x.id]!.filter(i => i !== k)
    ;(issues[x.id] ??= []).push({ level: x.level, message: x.message })
  }
  const compById = new Map(components.map(c => [c.id, c]))
  // Ids with an error: most canvases have few, so a term's ids are not each looked up in the records.
  const withError = new Set<string>()
  for (const byId of [issues, edgeIssues]) for (const id in byId) if (byId[id]!.some(i => i.level === 'error')) withError.add(id)
  for (const t of drawing.terms) {
    const comp = compById.get(t.id)
    const msgs = new Set<string>()
    if (withError.size) {
      for (const id of t.nodeIds) if (withError.has(id)) for (const i of issues[id] ?? []) if (i.level === 'error') msgs.add(i.message)
      for (const id of comp?.lineIds ?? []) if (withError.has(id)) for (const i of edgeIssues[id] ?? []) if (i.level === 'error') msgs.add(i.message)
    }
    for (const m of t.problems) msgs.add(m)
    t.problems = [...msgs]
    t.valid = t.valid && t.plan !== null && msgs.size === 0
  }
  let errorCount = 0
  for (const byId of [issues, edgeIssues]) for (const id in byId) for (const i of byId[id]!) if (i.level === 'error') errorCount++
  return { nodes: issues, edges: edgeIssues, components, slots, errorCount, drawing }
}
