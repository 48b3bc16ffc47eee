// Component tests of the editor: a fresh editor store per test in the Nuxt app's own Pinia, a
// diagram loaded into it the way the page loads one, and a check that what it holds is plain data.
import { toRaw } from 'vue'
import { setActivePinia, type Pinia } from 'pinia'
import { useNuxtApp } from '#imports'
import type { Graph, Process } from '#shared/schemas/graph'
import type { EditorEdge, EditorNode } from '#shared/editor/types'
import { useEditorStore } from '~~/stores/editor'

export type Role = 'owner' | 'editor' | 'viewer'

/** A fresh editor store holding one diagram; components mounted next use the same one. */
export function editorWith(opts: { process?: Process, nodes?: EditorNode[], edges?: EditorEdge[], role?: Role, kind?: 'loop-cut' } = {}): ReturnType<typeof useEditorStore> {
  const pinia = useNuxtApp().$pinia as Pinia
  setActivePinia(pinia)
  // The previous test's store goes, state and all: the next useEditorStore() builds a new one.
  useEditorStore().$dispose()
  delete pinia.state.value.editor
  const store = useEditorStore()
  const graph: Graph = { schemaVersion: 1, ...(opts.kind ? { kind: opts.kind } : {}), ...(opts.process ? { process: opts.process } : {}), nodes: opts.nodes ?? [], edges: opts.edges ?? [] } as Graph
  store.load({ id: 7, projectId: 3, title: 'Test diagram', version: 1, role: opts.role ?? 'editor', graph })
  return store
}

/**
 * What the store holds after an edit, as data a draft, a save or a worker message can take:
 * structuredClone refuses a proxy left inside (a spread of reactive state).
 */
export function plainCopy<T>(x: T): T {
  return structuredClone(toRaw(x))
}
