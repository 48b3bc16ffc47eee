// Big expansions kept readable: Expand fully opens Blocks only while at most READABLE_NODES vertices
// and Blocks are shown, the rest stay labelled Blocks that open one at a time. Whatever is open, the
// drawn sum must stay the recursion: checked against the engine's own residue sum and against
// Berends–Giele's off-shell recursion (Nucl. Phys. B306 (1988) 759), the independent target.
import { beforeEach, describe, expect, it } from 'vitest'
import { createPinia, setActivePinia } from 'pinia'
import { blockLabel, collapsedCount, openOne, READABLE_NODES, readableSpecs, shownCount } from '#shared/editor/collapse'
import { blockPaths, expandAllSpecs, specKey, specsToGraph, STRUCTURE_SEED, topSpecs, type CompSpec } from '#shared/editor/expand'
import { checkDrawing } from '#shared/editor/drawing'
import { evaluateRequest, toLabels } from '#shared/editor/process'
import type { BlockData, EditorNode } from '#shared/editor/types'
import { evaluate, floatTolerance } from '#shared/physics/index'
import type { Process } from '#shared/schemas/graph'
import type { WireComplex, WireTerm } from '#shared/schemas/evaluate'
import { useEditorStore } from '~~/stores/editor'

const M = -1
const P = 1
const cabs = (w: WireComplex) => Math.hypot(Number(w[0]), Number(w[1]))
const cdiff = (a: WireComplex, b: WireComplex) => Math.hypot(Number(a[0]) - Number(b[0]), Number(a[1]) - Number(b[1]))

const NMHV8: Process = { theory: 'gluon', helicities: [M, M, M, P, P, P, P, P] }
const NMHV10: Process = { theory: 'gluon', helicities: [M, M, M, P, P, P, P, P, P, P] }
const N2MHV10: Process = { theory: 'gluon', helicities: [M, M, M, M, P, P, P, P, P, P] }
const NMHV12: Process = { theory: 'gluon', helicities: [M, M, M, P, P, P, P, P, P, P, P, P] }

function treeOf(p: Process): { terms: WireTerm[], process: Process } {
  const res = toLabels(evaluate(evaluateRequest(p, { kinematics: { kind: 'random', seed: STRUCTURE_SEED }, target: 'none', tree: true })), p)
  return { terms: res.terms, process: { ...p, shift: res.shift } }
}

/** The drawn sum of the specs at a seeded point, beside the engine's recursion and Berends–Giele. */
function drawnSum(p: Process, terms: WireTerm[], specs: CompSpec[]) {
  const g = specsToGraph(terms, specs)
  const res = toLabels(evaluate(evaluateRequest(p, { kinematics: { kind: 'random', seed: 11 } })), p)
  const r = checkDrawing(res, p, g)
  return { r, res, g }
}

function expectTheRecursion(p: Process, terms: WireTerm[], specs: CompSpec[]) {
  const { r, res } = drawnSum(p, terms, specs)
  expect(r.drawing!.comparison.messages).toEqual([])
  expect(r.drawing!.comparison.complete).toBe(true)
  expect(r.verdict).toBe('agrees')
  expect(res.target!.name).toBe('berends-giele')
  expect(cdiff(r.value!, res.value!) / cabs(res.value!)).toBeLessThan(1e-12)
  expect(cdiff(r.value!, res.target!.value!) / cabs(res.target!.value!)).toBeLessThan(floatTolerance(p.helicities.length))
}

describe('the readable bound', () => {
  // The last column: how many Blocks stay collapsed (measured; the layout depends on READABLE_NODES).
  it.each([['8 NMHV', NMHV8, 2], ['10 NMHV', NMHV10, 9], ['10 N²MHV', N2MHV10, 5], ['12 NMHV', NMHV12, 15]] as const)('%s: Expand fully shows at most READABLE_NODES vertices and Blocks, the rest collapsed', (_, p, collapsed) => {
    const { terms } = treeOf(p)
    const top = topSpecs(terms)
    const specs = readableSpecs(terms, true)
    expect(shownCount(terms, top)).toBeLessThanOrEqual(READABLE_NODES)
    expect(shownCount(terms, specs)).toBeLessThanOrEqual(READABLE_NODES)
    // Opening everything would not be readable, so something stays a Block …
    expect(shownCount(terms, expandAllSpecs(terms, top))).toBeGreaterThan(READABLE_NODES)
    expect(collapsedCount(terms, specs)).toBe(collapsed)
    // … and nothing more fits: opening any one remaining Block would cross the bound.
    for (const s of specs) {
      for (const path of blockPaths(terms, s)) expect(shownCount(terms, openOne(terms, specs, s, path, Infinity))).toBeGreaterThan(READABLE_NODES)
    }
    // Plain Expand is the top level.
    expect(readableSpecs(terms, false)).toEqual(top)
  })

  it('a small process opens all the way (six gluons, NMHV)', () => {
    const { terms } = treeOf({ theory: 'gluon', helicities: [M, M, M, P, P, P] })
    const specs = readableSpecs(terms, true)
    expect(collapsedCount(terms, specs)).toBe(0)
    expect(specs.map(specKey).sort()).toEqual(expandAllSpecs(terms, topSpecs(terms)).map(specKey).sort())
  })
})

describe('Block labels', () => {
  it('name the side, the channel\'s legs, the helicities and the terms below', () => {
    const l = blockLabel({ path: 'L.0.R', legs: ['4', '5', 'L2'], helicities: [P, P, M], terms: 1 })
    expect(l.side).toBe('A_R')
    expect(l.channel).toEqual([4, 5])
    expect(l.legs).toBe('4⁺ 5⁺ P̂₂⁻')
    expect(l.text).toBe('A_R{4,5}: 4⁺ 5⁺ P̂₂⁻ · 1 term')
    expect(blockLabel({ path: 'L', legs: ['1', '2', '3', 'L1'], helicities: [M, M, M, P], terms: 3 }).text).toBe('A_L{1,2,3}: 1⁻ 2⁻ 3⁻ P̂₁⁺ · 3 terms')
  })

  it('every collapsed Block of an 8-gluon expansion is labelled with its own legs', () => {
    const { terms } = treeOf(NMHV8)
    const g = specsToGraph(terms, readableSpecs(terms, true))
    const blocks = g.nodes.filter(n => n.type === 'block') as Extract<EditorNode, { type: 'block' }>[]
    expect(blocks).toHaveLength(2)
    for (const b of blocks) {
      const l = blockLabel(b.data as BlockData)
      expect(l.side).toBe(b.data.path!.endsWith('R') ? 'A_R' : 'A_L')
      expect(l.channel.length).toBeGreaterThan(0)
      expect(l.terms).toBe(b.data.terms)
      // The legs the label names are the ones its lines and legs attach to.
      expect(l.channel).toEqual(b.data.legs!.filter(x => /^\d+$/.test(x)).map(Number))
    }
  })
})

describe('opening one Block at a time', () => {
  it('opens the Block, leaves every other component as it was, and keeps the drawn sum the recursion', () => {
    const { terms, process } = treeOf(NMHV10)
    let specs = readableSpecs(terms, true)
    expectTheRecursion(process, terms, specs)
    for (let step = 0; step < 3; step++) {
      const s = specs.find(x => blockPaths(terms, x).length)
      if (!s) break
      const path = blockPaths(terms, s)[0]!
      const next = openOne(terms, specs, s, path)
      const others = specs.filter(x => specKey(x) !== specKey(s)).map(specKey)
      // Nothing else is collapsed or opened.
      for (const k of others) expect(next.map(specKey)).toContain(k)
      // The opened Block is gone: its component became its channel terms, each with that path chosen.
      const mine = next.filter(x => !others.includes(specKey(x)))
      expect(mine.length).toBeGreaterThan(0)
      for (const x of mine) expect(x.choices[path]).toBeTypeOf('number')
      specs = next
      expectTheRecursion(process, terms, specs)
    }
  })

  it('inside the opened Block, deeper Blocks open only while the bound allows', () => {
    const { terms } = treeOf(NMHV8)
    const top = topSpecs(terms)
    // From the top level (8 nodes) opening a Block opens what fits below it too.
    const s = top.find(x => blockPaths(terms, x).length)!
    const path = blockPaths(terms, s)[0]!
    const next = openOne(terms, top, s, path)
    expect(shownCount(terms, next)).toBeLessThanOrEqual(READABLE_NODES)
    // Past the bound a Block still opens when asked (one level), with nothing below it opened.
    const full = readableSpecs(terms, true)
    const f = full.find(x => blockPaths(terms, x).length)!
    const fp = blockPaths(terms, f)[0]!
    const opened = openOne(terms, full, f, fp)
    expect(shownCount(terms, opened)).toBeGreaterThan(READABLE_NODES)
    const depth = (x: CompSpec) => Object.keys(x.choices).filter(p => p.startsWith(`${fp}.`)).length
    const before = new Set(full.map(specKey))
    const fresh = opened.filter(x => !before.has(specKey(x)))
    expect(fresh).toHaveLength(1)
    for (const x of fresh) expect(x.choices[fp]).toBeTypeOf('number')
    expect(fresh.filter(x => depth(x) > 0)).toHaveLength(0)
  })

  it('fully expanded, collapsed and everything between give the same drawn sum (8 gluons)', () => {
    const { terms, process } = treeOf(NMHV8)
    expectTheRecursion(process, terms, topSpecs(terms))
    expectTheRecursion(process, terms, readableSpecs(terms, true))
    expectTheRecursion(process, terms, expandAllSpecs(terms, topSpecs(terms)))
  })
})

describe('the editor store', () => {
  beforeEach(() => setActivePinia(createPinia()))
  const doc = (p: Process, role: 'editor' | 'viewer') => ({ id: 1, projectId: 1, title: 'T', version: 1, role, graph: { schemaVersion: 1 as const, process: p, nodes: [], edges: [] } })

  it('Expand fully keeps the canvas readable and records how many Blocks stay collapsed; again opens all', () => {
    const s = useEditorStore()
    s.load(doc(NMHV8, 'editor'))
    const { terms, process } = treeOf(NMHV8)
    s.applyExpansion(terms, process.shift!, STRUCTURE_SEED, true)
    expect(s.nodes.filter(n => n.type !== 'leg').length).toBeLessThanOrEqual(READABLE_NODES)
    expect(s.expansion!.collapsed).toBe(collapsedCount(terms, s.expansion!.specs))
    expect(s.expansion!.collapsed).toBe(2)
    const block = s.nodes.find(n => n.type === 'block')!
    expect(s.expandBlock(block.id)).toBe(true)
    expect(s.nodes.some(n => n.id === block.id)).toBe(false)
    expect(s.expandAll()).toBe('all')
    expect(s.expansion!.collapsed).toBeUndefined()
    expect(s.nodes.filter(n => n.type === 'block')).toHaveLength(0)
    expect(s.expandAll()).toBe(false)
  })

  it('a viewer opens and folds Blocks (no undo step, nothing to save for them)', () => {
    const s = useEditorStore()
    s.load(doc(NMHV8, 'viewer'))
    const { terms, process } = treeOf(NMHV8)
    s.applyExpansion(terms, process.shift!, STRUCTURE_SEED, true)
    expect(s.nodes).toHaveLength(52)
    const block = s.nodes.find(n => n.type === 'block')!
    expect(s.canExpand(block.id)).toBe(true)
    expect(s.expandBlock(block.id)).toBe(true)
    const inner = s.nodes.find(n => n.type !== 'leg' && s.collapsiblePath(n.id) !== null)!
    expect(s.collapseAt(inner.id)).toBe(true)
    expect(s.canUndo).toBe(false)
    // The hand edits stay closed to a viewer.
    const before = s.nodes.length
    s.addNode('angle', { x: 0, y: 0 })
    expect(s.nodes).toHaveLength(before)
  })
})
