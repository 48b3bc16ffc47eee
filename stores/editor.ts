// The editor's browser-only state (STYLE.md: Pinia for what lives only in the browser): the graph
// being edited, selection, the undo/redo stack and the unsaved draft in localStorage. Server calls
// stay in the page; the store only takes their results, so it is unit-tested in node.
import { defineStore } from 'pinia'
import { computed, markRaw, ref, shallowRef, toRaw } from 'vue'
import { useManualRefHistory } from '@vueuse/core'
import type { Graph, Process } from '#shared/schemas/graph'
import { GRAPH_SCHEMA_VERSION } from '#shared/schemas/graph'
import type { EvaluateResponse, WireTerm } from '#shared/schemas/evaluate'
import type { BlockData, EditorEdge, EditorNode, LegData, LineData, NodeKind } from '#shared/editor/types'
import { nodeOf } from '#shared/editor/types'
import { validateGraph, particleSpin } from '#shared/editor/validate'
import { blockPaths, collapseSpec, compId, expandAllSpecs, specsToGraph, type CompSpec } from '#shared/editor/expand'
import { matchTerms, processFromCanvas, processKey } from '#shared/editor/process'
import { layoutGraph } from '#shared/editor/layout'
import { collapsedCount, openOne, readableSpecs } from '#shared/editor/collapse'
import { boxRings, diagramKindOf, tidyRings, validateLoopCut, type DiagramKind, type LoopCutValidation } from '#shared/editor/loop-cut'
import type { LoopCutDrawingResult } from '#shared/editor/loop-cut-check'
import { processSpecies } from '#shared/editor/species'

export interface Expansion {
  /** processKey() of the process it was made for. */
  key: string
  seed: string
  specs: CompSpec[]
  /** Blocks left collapsed to keep the canvas readable (READABLE_NODES); 0 or absent: none. */
  collapsed?: number
}

interface Snapshot { process?: Process, nodes: EditorNode[], edges: EditorEdge[], expansion: Expansion | null, title: string }

export interface DiagramDoc { id: number, projectId: number, title: string, graph: Graph, version: number, role?: 'owner' | 'editor' | 'viewer' }

export interface Draft { baseVersion: number, title: string, graph: Graph, savedAt: number }

const UNDO_LIMIT = 200
export const draftKey = (id: number) => `polewright:draft:${id}`

/**
 * Plain data from whatever the caller holds: a spread of reactive state keeps proxies inside
 * (the shift array), which structuredClone refuses with a DataCloneError.
 */
export function plain<T>(x: T): T {
  return x === undefined ? x : JSON.parse(JSON.stringify(toRaw(x))) as T
}

let seq = 0
const newId = (prefix: string) => `${prefix}${Date.now().toString(36)}${(seq++).toString(36)}`

export const useEditorStore = defineStore('editor', () => {
  const diagramId = ref<number | null>(null)
  const projectId = ref<number | null>(null)
  const title = ref('')
  const version = ref(0)
  const role = ref<'owner' | 'editor' | 'viewer'>('viewer')
  const process = ref<Process | undefined>()
  /** 'loop-cut': the canvas holds rings of quadruple cuts (shared/editor/loop-cut.ts). */
  const kind = ref<DiagramKind>('tree')
  const settings = ref<Record<string, unknown>>({})
  const nodes = shallowRef<EditorNode[]>([])
  const edges = shallowRef<EditorEdge[]>([])
  const expansion = ref<Expansion | null>(null)
  /** The term tree of the expansion (not saved; fetched again when needed). */
  const tree = shallowRef<WireTerm[] | null>(null)
  const selection = ref<string[]>([])
  const selectedEdges = ref<string[]>([])
  /** JSON of the last saved or loaded document, to tell whether there are unsaved changes. */
  const savedJson = ref('')
  const result = shallowRef<EvaluateResponse | null>(null)
  /** The process the result was computed for (key), to mark stale results. */
  const resultKey = ref<string | null>(null)
  const highlightTerm = ref<number | null>(null)
  /** Two-click shift picking: the first leg label chosen, or null. */
  const shiftPick = ref<number | null>(null)
  const pickingShift = ref(false)
  /** Bumped when the canvas should fit its view (after an expansion, a load, an import). */
  const fitToken = ref(0)
  /** Milliseconds of the last expand + layout (for the benchmark). */
  const lastLayoutMs = ref(0)

  const readOnly = computed(() => role.value === 'viewer')
  const validation = computed<ReturnType<typeof validateGraph> & Partial<LoopCutValidation>>(() => (kind.value === 'loop-cut' ? validateLoopCut(nodes.value, edges.value, process.value) : validateGraph(nodes.value, edges.value, process.value)))
  const nodeById = computed(() => new Map(nodes.value.map(n => [n.id, n])))
  const expansionStale = computed(() => !!expansion.value && !!process.value && expansion.value.key !== processKey(process.value))

  /** Top-level term index → component ids on the canvas that realise it. */
  const termComponents = computed(() => {
    const r = result.value
    const p = process.value
    if (!r || !p) return new Map<number, string[]>()
    return matchTerms(p, r.terms, validation.value.components, nodes.value, edges.value, expansion.value?.key ?? null)
  })

  /** Node ids highlighted for the hovered term. */
  const highlighted = computed(() => {
    const k = highlightTerm.value
    if (k === null) return new Set<string>()
    const comps = new Set(termComponents.value.get(k) ?? [])
    const out = new Set<string>()
    for (const c of validation.value.components) if (comps.has(c.id)) for (const id of c.nodeIds) out.add(id)
    return out
  })

  /** The drawn term the term list focuses (component id): the view zooms to it, the rest dims. */
  const focusTerm = ref<string | null>(null)
  const dimmed = computed(() => {
    const c = focusTerm.value ? validation.value.components.find(x => x.id === focusTerm.value) : null
    if (!c) return new Set<string>()
    const keep = new Set([...c.nodeIds, ...c.legIds])
    return new Set(nodes.value.filter(n => !keep.has(n.id)).map(n => n.id))
  })

  function toGraph(): Graph {
    const s = { ...settings.value }
    if (expansion.value) s.expansion = expansion.value
    else delete s.expansion
    return {
      schemaVersion: GRAPH_SCHEMA_VERSION,
      ...(kind.value === 'loop-cut' ? { kind: 'loop-cut' as const } : {}),
      ...(process.value ? { process: process.value } : {}),
      settings: s,
      nodes: nodes.value.map(n => ({ id: n.id, type: n.type, position: { x: n.position.x, y: n.position.y }, data: n.data })),
      edges: edges.value.map(e => ({ id: e.id, source: e.source, target: e.target, sourceHandle: e.sourceHandle ?? null, targetHandle: e.targetHandle ?? null, type: e.type ?? 'line', data: e.data ?? {} })),
    }
  }

  const docJson = () => JSON.stringify({ title: title.value, graph: toGraph() })
  /** The document as it would be saved now (title and graph), as JSON. */
  const currentJson = computed(() => docJson())
  const dirty = computed(() => currentJson.value !== savedJson.value)

  function setGraph(g: Graph) {
    process.value = g.process ? plain(g.process) : undefined
    kind.value = diagramKindOf(g)
    const s = { ...(g.settings ?? {}) }
    const exp = s.expansion as Expansion | undefined
    delete s.expansion
    settings.value = s
    expansion.value = exp && Array.isArray(exp.specs) ? exp : null
    nodes.value = (g.nodes ?? []).map(n => nodeOf(n.id, n.type, { ...n.position }, { ...(n.data ?? {}) }))
    edges.value = (g.edges ?? []).map(e => ({ id: e.id, source: e.source, target: e.target, sourceHandle: e.sourceHandle ?? null, targetHandle: e.targetHandle ?? null, type: e.type ?? 'line', data: { ...(e.data ?? {}) } }))
  }

  function load(doc: DiagramDoc) {
    diagramId.value = doc.id
    projectId.value = doc.projectId
    title.value = doc.title
    loopResult.value = null
    version.value = doc.version
    role.value = doc.role ?? 'viewer'
    setGraph(doc.graph)
    tree.value = null
    result.value = null
    resultKey.value = null
    selection.value = []
    selectedEdges.value = []
    resetHistory()
    savedJson.value = docJson()
    fitToken.value++
  }

  /** After a successful save: the server's version becomes the base; the draft is dropped. */
  function markSaved(doc: { version: number, title?: string }) {
    version.value = doc.version
    if (doc.title !== undefined) title.value = doc.title
    savedJson.value = docJson()
  }

  const snap = (): string => JSON.stringify({ process: process.value, nodes: nodes.value, edges: edges.value, expansion: expansion.value, title: title.value } satisfies Snapshot)
  function restore(json: string) {
    const s = JSON.parse(json) as Snapshot
    process.value = s.process
    nodes.value = s.nodes
    edges.value = s.edges
    expansion.value = s.expansion
    title.value = s.title
    const ids = new Set(s.nodes.map(n => n.id))
    selection.value = selection.value.filter(id => ids.has(id))
  }

  // Undo and redo: snapshots of the document as JSON. `recorded` is the state as last recorded;
  // changes made outside commit() (a load, a fetched tree) are taken in before the next step.
  const recorded = shallowRef('')
  const history = useManualRefHistory(recorded, {
    capacity: UNDO_LIMIT,
    setSource: (src, json) => {
      src.value = json
      restore(json)
    },
  })
  const { undoStack, redoStack, canUndo, canRedo } = history
  function syncHistory() {
    const now = snap()
    if (recorded.value === now) return
    recorded.value = now
    history.last.value = markRaw({ snapshot: now, timestamp: Date.now() })
  }
  function resetHistory() {
    history.clear()
    recorded.value = ''
    syncHistory()
  }

  /** Every change goes through here: one undo step, redo cleared, draft written. */
  function commit(change: () => void) {
    if (readOnly.value) return
    syncHistory()
    change()
    const after = snap()
    if (after === recorded.value) return
    recorded.value = after
    history.commit()
  }
  function undo() {
    if (readOnly.value) return
    syncHistory()
    if (!canUndo.value) return
    history.undo()
  }
  function redo() {
    if (readOnly.value || !canRedo.value) return
    history.redo()
  }
  /** Opening and folding Blocks: viewers explore too, straight on the canvas (no undo, never saved). */
  function explore(change: () => void) {
    if (readOnly.value) change()
    else commit(change)
  }

  // ---- the process ----
  function setProcess(p: Process | undefined) {
    commit(() => { process.value = p ? plain(p) : undefined })
  }
  function setShift(shift: [number, number] | undefined) {
    commit(() => {
      if (!process.value) {
        // A hand-built canvas: its legs say what the process is.
        const got = processFromCanvas(nodes.value)
        if ('error' in got) return
        process.value = got.process
      }
      const p = plain(process.value!)
      if (shift) p.shift = [shift[0], shift[1]]
      else delete p.shift
      process.value = p
    })
  }
  function setTitle(t: string) {
    commit(() => { title.value = t })
  }
  /** Click-two-legs shift picking: first click i, second click j. */
  function pickLeg(label: number) {
    if (!pickingShift.value) return
    if (shiftPick.value === null) { shiftPick.value = label; return }
    if (shiftPick.value !== label) setShift([shiftPick.value, label])
    shiftPick.value = null
    pickingShift.value = false
  }

  // ---- hand assembly ----
  function addNode(type: NodeKind, position: { x: number, y: number }, data?: Record<string, unknown>): string {
    const id = newId(type === 'leg' ? 'l' : type === 'block' ? 'b' : 'v')
    let d = data
    if (!d) {
      const s = particleSpin(process.value) ?? 1
      if (type === 'leg') {
        const used = new Set(nodes.value.filter(n => n.type === 'leg').map(n => n.data.label))
        let label = 1
        while (used.has(label)) label++
        const h = process.value?.helicities[label - 1] ?? (label <= 2 ? -s : s)
        d = { label, helicity: h } satisfies LegData
      }
      else if (type === 'block') d = { helicities: [-s, -s, s, s] } satisfies BlockData
      else d = {}
    }
    commit(() => { nodes.value = [...nodes.value, nodeOf(id, type, { ...position }, d!)] })
    return id
  }

  /** Glues two handles. An internal line gets the helicity that fits the source vertex if it can tell, else +s. */
  function connect(c: { source: string, target: string, sourceHandle?: string | null, targetHandle?: string | null }): string | null {
    if (c.source === c.target) return null
    const a = nodeById.value.get(c.source)
    const b = nodeById.value.get(c.target)
    if (!a || !b) return null
    // Two external legs never meet without a vertex between them.
    if (a.type === 'leg' && b.type === 'leg') return null
    const dup = edges.value.some(e => (e.source === c.source && e.sourceHandle === c.sourceHandle && e.target === c.target && e.targetHandle === c.targetHandle)
      || (e.source === c.target && e.sourceHandle === c.targetHandle && e.target === c.source && e.targetHandle === c.sourceHandle))
    if (dup) return null
    // Keep the leg as the source of an attachment.
    const swap = b.type === 'leg' && a.type !== 'leg'
    const src = swap ? { id: c.target, h: c.targetHandle } : { id: c.source, h: c.sourceHandle }
    const dst = swap ? { id: c.source, h: c.sourceHandle } : { id: c.target, h: c.targetHandle }
    const external = a.type === 'leg' || b.type === 'leg'
    const s = particleSpin(process.value) ?? 1
    let data: LineData & Record<string, unknown>
    if (external) data = { external: true }
    // a loop cut's Lines start open: the check sums their helicities
    else if (kind.value === 'loop-cut') data = {}
    else {
      const srcNode = nodeById.value.get(src.id)!
      let h = s
      if (srcNode.type === 'block') {
        const k = Number((src.h ?? 'h0').slice(1))
        h = srcNode.data.helicities[k] ?? s
      }
      else {
        const known = (validation.value.slots[src.id] ?? []).filter(x => x.handle !== src.h && x.helicity !== null).map(x => x.helicity!)
        if (known.length === 2) {
          // Choose the helicity that makes the vertex's kind consistent with its shape.
          const want = srcNode.type === 'angle' ? -1 : 1
          h = [s, -s].find(x => Math.sign(known[0]! + known[1]! + x) === want && !(Math.abs(known[0]! + known[1]! + x) === 3 * s && s > 0)) ?? s
        }
      }
      data = { helicity: h }
    }
    const id = newId('e')
    commit(() => {
      edges.value = [...edges.value, { id, source: src.id, target: dst.id, sourceHandle: src.h ?? null, targetHandle: dst.h ?? null, type: 'line', data }]
    })
    return id
  }

  function updateNodeData(id: string, patch: Record<string, unknown>) {
    commit(() => { nodes.value = nodes.value.map(n => (n.id === id ? nodeOf(n.id, n.type, n.position, { ...n.data, ...patch }) : n)) })
  }
  function setNodeType(id: string, type: NodeKind) {
    commit(() => { nodes.value = nodes.value.map(n => (n.id === id ? nodeOf(n.id, type, n.position, n.data) : n)) })
  }
  function updateEdgeData(id: string, patch: Record<string, unknown>) {
    commit(() => { edges.value = edges.value.map(e => (e.id === id ? { ...e, data: { ...e.data, ...patch } } : e)) })
  }
  /** Flips a line's helicity: both ends change sign (they stay opposite). */
  function flipLine(id: string) {
    const e = edges.value.find(x => x.id === id)
    const d = (e?.data ?? {}) as LineData
    if (!e || d.external) return
    // a loop cut's Line cycles open → +|− → −|+ → open
    if (kind.value === 'loop-cut') {
      const next = d.helicity === undefined ? 1 : d.helicity > 0 ? -1 : undefined
      commit(() => { edges.value = edges.value.map(x => (x.id === id ? { ...x, data: next === undefined ? {} : { helicity: next, targetHelicity: -next } } : x)) })
      return
    }
    if (d.helicity === undefined) return
    updateEdgeData(id, { helicity: -d.helicity, targetHelicity: -(d.targetHelicity ?? -d.helicity) })
  }
  function moveNodes(pos: Record<string, { x: number, y: number }>) {
    commit(() => { nodes.value = nodes.value.map(n => (pos[n.id] ? { ...n, position: { ...pos[n.id]! } } : n)) })
  }
  function removeIds(nodeIds: string[], edgeIds: string[] = []) {
    const ns = new Set(nodeIds)
    const es = new Set(edgeIds)
    if (!ns.size && !es.size) return
    commit(() => {
      nodes.value = nodes.value.filter(n => !ns.has(n.id))
      edges.value = edges.value.filter(e => !es.has(e.id) && !ns.has(e.source) && !ns.has(e.target))
    })
    selection.value = selection.value.filter(id => !ns.has(id))
    selectedEdges.value = selectedEdges.value.filter(id => !es.has(id))
  }
  function removeSelected() {
    removeIds(selection.value, selectedEdges.value)
  }
  function clearCanvas() {
    commit(() => {
      nodes.value = []
      edges.value = []
      expansion.value = null
    })
  }
  function tidy() {
    commit(() => { nodes.value = kind.value === 'loop-cut' ? tidyRings(nodes.value, edges.value, process.value) : layoutGraph(nodes.value, edges.value) })
  }
  /** A loop cut: the rings of every box of the process (or of the boxes listed, 0-based), replacing the canvas. */
  function generateBoxes(which?: number[]): number {
    if (!process.value) return 0
    const g = boxRings(process.value, which)
    commit(() => {
      nodes.value = g.nodes
      edges.value = g.edges
      expansion.value = null
    })
    fitToken.value++
    return g.nodes.filter(n => n.type !== 'leg').length / 4
  }
  /** The last loop-cut check and what it was computed from (stale once the canvas changes). */
  const loopResult = shallowRef<LoopCutDrawingResult | null>(null)
  const loopResultFor = ref<string | null>(null)

  // ---- expansion ----
  function rebuild(specs: CompSpec[]) {
    if (!tree.value || !process.value) return
    const t0 = performance.now()
    const g = specsToGraph(tree.value, specs, undefined, processSpecies(process.value) ?? undefined)
    nodes.value = layoutGraph(g.nodes, g.edges)
    // Read by the browser benchmark (bench/editor.ts).
    lastLayoutMs.value = performance.now() - t0
    edges.value = g.edges
    const collapsed = collapsedCount(tree.value, specs)
    expansion.value = { key: processKey(process.value), seed: expansion.value?.seed ?? 'structure', specs, ...(collapsed ? { collapsed } : {}) }
    fitToken.value++
  }
  /**
   * Takes the term tree of the process (POST /api/evaluate with tree: true, in the diagram's
   * labels: see toLabels) and lays out its channel terms. `shift` is the one the server used.
   */
  function applyExpansion(terms: WireTerm[], shift: [number, number], seed: string, full = false) {
    if (!process.value) return
    explore(() => {
      process.value = { ...plain(process.value!), shift: [shift[0], shift[1]] }
      tree.value = terms
      expansion.value = { key: processKey(process.value), seed, specs: [] }
      rebuild(readableSpecs(terms, full))
    })
  }
  /** A tree fetched again for a saved expansion (after a reload). */
  function setTree(terms: WireTerm[]) {
    tree.value = terms
  }
  function specOfNode(id: string): { spec: CompSpec, path: string } | null {
    const n = nodeById.value.get(id)
    const d = n?.data as { comp?: string, path?: string } | undefined
    if (!d?.comp || !expansion.value) return null
    const spec = expansion.value.specs.find(s => compId(s) === d.comp)
    return spec ? { spec, path: d.path ?? '' } : null
  }
  function canExpand(id: string): boolean {
    const n = nodeById.value.get(id)
    return n?.type === 'block' && !!specOfNode(id) && (n.data.terms ?? 0) > 0 && !expansionStale.value
  }
  function expandBlock(id: string): boolean {
    const at = specOfNode(id)
    if (!at || !tree.value || !expansion.value || !canExpand(id)) return false
    explore(() => rebuild(openOne(tree.value!, expansion.value!.specs, at.spec, at.path)))
    return true
  }
  /** The innermost expanded sub-amplitude above a node (what collapsing it folds back). */
  function collapsiblePath(id: string): string | null {
    const at = specOfNode(id)
    if (!at) return null
    const paths = Object.keys(at.spec.choices).filter(p => at.path.startsWith(`${p}.`)).sort((a, b) => b.length - a.length)
    return paths[0] ?? null
  }
  function collapseAt(id: string): boolean {
    const at = specOfNode(id)
    const path = collapsiblePath(id)
    if (!at || path === null || !tree.value || !expansion.value) return false
    explore(() => rebuild(collapseSpec(expansion.value!.specs, at.spec, path)))
    return true
  }
  /**
   * Expand fully on a shown expansion: Blocks open while the canvas stays readable ('readable');
   * when none fits any more, every Block opens down to three-point vertices ('all').
   */
  function expandAll(): 'readable' | 'all' | false {
    const t = tree.value
    const specs = expansion.value?.specs
    if (!t || !specs || expansionStale.value) return false
    if (!specs.some(s => blockPaths(t, s).length)) return false
    const readable = readableSpecs(t, true, specs)
    const more = readable.length !== specs.length || readable.some((s, k) => Object.keys(s.choices).length !== Object.keys(specs[k]!.choices).length)
    explore(() => rebuild(more ? readable : expandAllSpecs(t, specs)))
    return more ? 'readable' : 'all'
  }

  // ---- results ----
  /** What a check computes from: the process and the drawn structure (positions do not matter). */
  const computationKey = () => JSON.stringify({
    p: process.value ? processKey(process.value) : null,
    n: nodes.value.map(n => [n.id, n.type, (n.data as { label?: unknown }).label, (n.data as { helicity?: unknown }).helicity, (n.data as { helicities?: unknown }).helicities]),
    e: edges.value.map(e => [e.source, e.sourceHandle, e.target, e.targetHandle, (e.data as LineData | undefined)?.helicity, (e.data as LineData | undefined)?.targetHelicity]),
  })
  const resultFor = ref<string | null>(null)
  // The diagram version a stored check was run on (null: run on this canvas).
  const resultVersion = ref<number | null>(null)
  const loopResultVersion = ref<number | null>(null)
  /** Why a result no longer describes the canvas ('' while it does). */
  function staleWhy(has: boolean, key: string | null, from: number | null) {
    if (!has) return ''
    if (from !== null && from !== version.value) return `stale: this stored check was run on v${from}; the canvas shows v${version.value} — run the check again`
    return key !== computationKey() ? 'stale: the canvas or the process changed after this run — run the check again' : ''
  }
  const resultStaleWhy = computed(() => staleWhy(!!result.value, resultFor.value, resultVersion.value))
  const loopResultStaleWhy = computed(() => staleWhy(!!loopResult.value, loopResultFor.value, loopResultVersion.value))
  /** A result computed before the canvas or the process last changed, or a stored one of another version. */
  const resultStale = computed(() => !!resultStaleWhy.value)
  const loopResultStale = computed(() => !!loopResultStaleWhy.value)
  function setLoopResult(r: LoopCutDrawingResult | null, fromVersion: number | null = null) {
    loopResult.value = r
    loopResultFor.value = r ? computationKey() : null
    loopResultVersion.value = r ? fromVersion : null
  }
  function setResult(r: EvaluateResponse | null, fromVersion: number | null = null) {
    result.value = r
    resultKey.value = r && process.value ? processKey(process.value) : null
    resultFor.value = r ? computationKey() : null
    resultVersion.value = r ? fromVersion : null
  }

  // ---- selection ----
  function select(nodeIds: string[], edgeIds: string[] = []) {
    selection.value = nodeIds
    selectedEdges.value = edgeIds
  }

  // ---- draft (kept in localStorage by composables/useDiagramDraft.ts) ----
  function applyDraft(d: Draft) {
    commit(() => {
      title.value = d.title
      setGraph(d.graph)
    })
  }
  /** Replace the canvas with another document (a revision, an import), as one undoable step. */
  function replaceGraph(g: Graph, t?: string) {
    commit(() => {
      setGraph(g)
      if (t !== undefined) title.value = t
    })
    tree.value = null
    fitToken.value++
  }

  return {
    diagramId, projectId, title, version, role, process, kind, settings, nodes, edges, expansion, tree, selection, selectedEdges,
    undoStack, redoStack, canUndo, canRedo, result, resultKey, highlightTerm, shiftPick, pickingShift, fitToken, lastLayoutMs,
    readOnly, validation, nodeById, resultStale, resultStaleWhy, loopResultStaleWhy, focusTerm, dimmed, expansionStale, termComponents, highlighted, dirty,
    toGraph, load, markSaved, commit, undo, redo, setProcess, setShift, setTitle, pickLeg,
    addNode, connect, updateNodeData, setNodeType, updateEdgeData, flipLine, moveNodes, removeIds, removeSelected, clearCanvas, tidy,
    applyExpansion, setTree, canExpand, expandBlock, collapsiblePath, collapseAt, expandAll, specOfNode,
    setResult, select, applyDraft, replaceGraph, currentJson, generateBoxes, loopResult, loopResultStale, setLoopResult,
  }
})
