// The unsaved draft of a diagram, kept in this browser's localStorage while the canvas differs from
// the saved version; offered back when the diagram is opened again.
import { StorageSerializers, useEventListener, useLocalStorage, watchDebounced } from '@vueuse/core'
import { draftKey, useEditorStore, type Draft } from '~~/stores/editor'
import type { Say } from './useEditorNotice'

export function useDiagramDraft(diagramId: number, canEdit: Ref<boolean>, say: Say, onRestored: () => void) {
  const store = useEditorStore()
  const stored = useLocalStorage<Draft | null>(draftKey(diagramId), null, { serializer: StorageSerializers.object })
  /** A draft found on opening, until restored or discarded. */
  const offered = ref<Draft | null>(null)

  function flush() {
    if (!canEdit.value) return
    stored.value = store.dirty ? { baseVersion: store.version, title: store.title, graph: store.toGraph(), savedAt: Date.now() } : null
  }
  watchDebounced(() => store.currentJson, flush, { debounce: 400 })
  // Saved (or back to the saved state): no draft to keep.
  watch(() => store.dirty, (d) => { if (!d && canEdit.value) stored.value = null })
  useEventListener(window, 'beforeunload', flush)
  onBeforeUnmount(flush)

  onMounted(() => {
    const d = stored.value
    if (!d || !canEdit.value || !Array.isArray(d.graph?.nodes)) return
    if (JSON.stringify({ title: d.title, graph: d.graph }) === store.currentJson) stored.value = null
    else offered.value = d
  })
  function restore() {
    const d = offered.value
    if (!d) return
    store.applyDraft(d)
    onRestored()
    say(`Restored your unsaved draft from ${new Date(d.savedAt).toLocaleString()}${d.baseVersion !== store.version ? ` (it was based on v${d.baseVersion}; the diagram is now at v${store.version})` : ''}.`)
    offered.value = null
  }
  function discard() {
    stored.value = null
    offered.value = null
  }
  return { draft: offered, restore, discard, flush }
}
