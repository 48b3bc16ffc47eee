// The process header's edits go through the store: a spread of the reactive process (what a
// component naturally writes) must become plain data, one undo step each; a result goes stale
// when the canvas or the process changes after it, not when a node is only moved.
import { beforeEach, describe, expect, it } from 'vitest'
import { createPinia, setActivePinia } from 'pinia'
import { useEditorStore } from '~~/stores/editor'
import type { Process } from '#shared/schemas/graph'
import type { EvaluateResponse } from '#shared/schemas/evaluate'

const doc = (process?: Process) => ({ id: 1, projectId: 1, title: 'T', version: 1, role: 'editor' as const, graph: { schemaVersion: 1 as const, ...(process ? { process } : {}), nodes: [], edges: [] } })
const four: Process = { theory: 'gluon', helicities: [-1, -1, 1, 1], shift: [1, 2] }

describe('editor store: the process', () => {
  beforeEach(() => setActivePinia(createPinia()))

  it.each([
    ['helicity flip', (p: Process) => ({ ...p, helicities: p.helicities.map((h, t) => (t === 2 ? -h : h)) }), (p: Process) => p.helicities[2] === -1],
    ['theory', (p: Process) => ({ ...p, theory: 'graviton' as const, helicities: p.helicities.map(h => 2 * h) }), (p: Process) => p.theory === 'graviton'],
    ['spin', (p: Process) => ({ ...p, theory: 'spin' as const, spin: 3, helicities: p.helicities.map(h => 3 * h) }), (p: Process) => p.spin === 3],
    ['legs', (p: Process) => ({ ...p, helicities: [...p.helicities, 1] }), (p: Process) => p.helicities.length === 5],
    ['colour order', (p: Process) => ({ ...p, order: [1, 3, 2, 4] }), (p: Process) => p.order?.join() === '1,3,2,4'],
  ])('a %s written as a spread of the reactive process changes it, and undo brings the old one back', (_, edit, holds) => {
    const s = useEditorStore()
    s.load(doc(four))
    // s.process is reactive: the spread keeps proxies inside (the shift array).
    expect(() => s.setProcess(edit({ ...s.process! }))).not.toThrow()
    expect(holds(s.process!)).toBe(true)
    expect(s.dirty).toBe(true)
    expect(s.toGraph().process).toEqual(s.process)
    s.undo()
    expect(s.process).toEqual(four)
    s.redo()
    expect(holds(s.process!)).toBe(true)
  })

  it('the shift changes through setShift, one undo step', () => {
    const s = useEditorStore()
    s.load(doc(four))
    s.setShift([2, 3])
    expect(s.process!.shift).toEqual([2, 3])
    s.undo()
    expect(s.process!.shift).toEqual([1, 2])
  })

  it('a result is stale after a change of the process or the canvas, not after a move', () => {
    const s = useEditorStore()
    s.load(doc(four))
    const v = s.addNode('angle', { x: 0, y: 0 })
    s.setResult({ verdict: 'agrees', terms: [] } as unknown as EvaluateResponse)
    expect(s.resultStale).toBe(false)
    s.moveNodes({ [v]: { x: 40, y: 40 } })
    expect(s.resultStale).toBe(false)
    s.setNodeType(v, 'square')
    expect(s.resultStale).toBe(true)
    s.undo()
    expect(s.resultStale).toBe(false)
    s.setProcess({ ...s.process!, helicities: [-1, 1, -1, 1] })
    expect(s.resultStale).toBe(true)
  })
})
