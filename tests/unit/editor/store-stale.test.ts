import { beforeEach, describe, expect, it } from 'vitest'
import { createPinia, setActivePinia } from 'pinia'
import { useEditorStore } from '~~/stores/editor'
import { evaluate } from '#shared/physics/index'
import type { Process } from '#shared/schemas/graph'

// What the drawer says about a result that no longer describes the canvas: an edit after the run,
// or a stored check opened from another diagram version (common practice: a result names what it was computed from).
const process: Process = { theory: 'gluon', helicities: [-1, -1, 1, 1], shift: [1, 2] }
const doc = (version: number) => ({ id: 1, projectId: 1, title: 'T', version, role: 'editor' as const, graph: { schemaVersion: 1 as const, process, nodes: [], edges: [] } })
const result = () => evaluate({ theory: 'gluon', helicities: [-1, -1, 1, 1], shift: [1, 2], kinematics: { kind: 'random', seed: 1 }, target: 'parke-taylor' })

describe('stale results', () => {
  beforeEach(() => setActivePinia(createPinia()))

  it('a run on this canvas is fresh until the canvas changes', () => {
    const s = useEditorStore()
    s.load(doc(3))
    s.setResult(result())
    expect(s.resultStale).toBe(false)
    expect(s.resultStaleWhy).toBe('')
    s.addNode('angle', { x: 0, y: 0 })
    expect(s.resultStale).toBe(true)
    expect(s.resultStaleWhy).toBe('stale: the canvas or the process changed after this run — run the check again')
  })

  it('a stored check of an older version says which version it was run on', () => {
    const s = useEditorStore()
    s.load(doc(3))
    s.setResult(result(), 2)
    expect(s.resultStaleWhy).toBe('stale: this stored check was run on v2; the canvas shows v3 — run the check again')
    s.setResult(result(), 3)
    expect(s.resultStale).toBe(false)
    s.setResult(null, 2)
    expect(s.resultStaleWhy).toBe('')
  })
})
