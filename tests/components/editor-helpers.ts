// Component tests of the editor: a fresh Pinia per test, a diagram loaded into the editor store the
// way the page loads one, and a check that what the store holds is plain data.
import { toRaw } from 'vue'
import { createPinia, setActivePinia, type Pinia } from 'pinia'
import type { Graph, Process } from '#shared/schemas/graph'
import type { EditorEdge, EditorNode } from '#shared/editor/types'
import { useEditorStore } from '~~/stores/editor'

export type Role = 'owner' | 'editor' | 'viewer'

/** A fresh store (its own Pinia, also given to the mounted component) holding one diagram. */
export function editorWith(opts: { process?: Process, nodes?: EditorNode[], edges?: EditorEdge[], role?: Role } = {}): { pinia: Pinia, store: ReturnType<typeof useEditorStore> } {
  const pinia = createPinia()
  setActivePinia(pinia)
  const store = useEditorStore()
  const graph: Graph = { schemaVersion: 1, ...(opts.process ? { process: opts.process } : {}), nodes: opts.nodes ?? [], edges: opts.edges ?? [] } as Graph
  store.load({ id: 7, projectId: 3, title: 'Test diagram', version: 1, role: opts.role ?? 'editor', graph })
  return { pinia, store }
}

/**
 * What the store holds after an edit, as data a draft, a save or a worker message can take:
 * structuredClone refuses a proxy left inside (a spread of reactive state).
 */
export function plainCopy<T>(x: T): T {
  return structuredClone(toRaw(x))
}
