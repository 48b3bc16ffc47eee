// Saving a diagram: a new revision per save, a 409 when someone saved in between (keep mine or
// reload theirs, nothing lost either way), and opening or restoring an old revision.
import type { Graph } from '#shared/schemas/graph'
import { GraphSchema } from '#shared/schemas/graph'
import { useEditorStore, type DiagramDoc } from '~~/stores/editor'
import { errMessage, type Say } from './useEditorNotice'

interface Revision { version: number, title: string, graph: unknown }

export function useDiagramSave(diagramId: number, canEdit: Ref<boolean>, say: Say, flushDraft: () => void) {
  const store = useEditorStore()
  const saving = ref(false)
  const conflict = ref<{ current: number | null } | null>(null)
  const viewing = ref<{ version: number, title: string } | null>(null)
  /** The graph as last saved: a stored check evaluates the saved diagram. */
  const savedJson = ref(JSON.stringify(store.toGraph()))
  const savedProcess = computed(() => JSON.stringify(JSON.parse(savedJson.value).process ?? null))
  /** The canvas and process are what the server has (a check would evaluate exactly this). */
  const inSync = computed(() => !store.dirty && JSON.stringify(store.toGraph()) === savedJson.value)

  async function put(version: number, note?: string) {
    return await $fetch(`/api/diagrams/${diagramId}`, { method: 'PUT', body: { title: store.title, graph: store.toGraph(), version, ...(note ? { note } : {}) } })
  }
  function took(saved: DiagramDoc) {
    store.markSaved(saved)
    savedJson.value = JSON.stringify(saved.graph)
    conflict.value = null
  }
  async function save(note?: string): Promise<boolean> {
    if (!canEdit.value || saving.value) return false
    const g = GraphSchema.safeParse(store.toGraph())
    if (!g.success) { say(`Cannot save: graph.${g.error.issues[0]?.path.join('.')}: ${g.error.issues[0]?.message}`, 'error'); return false }
    saving.value = true
    flushDraft()
    try {
      const saved = await put(store.version, note)
      took(saved)
      say(`Saved as version ${saved.version}${note ? ` (${note})` : ''}.`)
      return true
    }
    catch (e) {
      const x = e as { statusCode?: number, data?: { data?: { current?: number } } }
      if (x.statusCode === 409) conflict.value = { current: x.data?.data?.current ?? null }
      else say(errMessage(e, 'the save failed; your work is still here and in the local draft'), 'error')
      return false
    }
    finally {
      saving.value = false
    }
  }
  /** 409: their version replaces the canvas as one undoable step, so mine is still one Ctrl+Z away. */
  async function reloadTheirs() {
    try {
      const theirs = await $fetch(`/api/diagrams/${diagramId}`)
      flushDraft()
      store.replaceGraph(theirs.graph, theirs.title)
      took(theirs)
      say(`Loaded version ${theirs.version} from the server. Your version is one undo away (Ctrl+Z), and can then be saved as a new revision.`)
    }
    catch (e) {
      say(errMessage(e, 'could not load their version; your work is untouched'), 'error')
    }
  }
  async function keepMine() {
    try {
      const theirs = await $fetch(`/api/diagrams/${diagramId}`)
      const saved = await put(theirs.version, `kept over v${theirs.version} after a conflict`)
      took(saved)
      say(`Your version is saved as version ${saved.version}; version ${theirs.version} stays in the revisions.`)
    }
    catch (e) {
      if ((e as { statusCode?: number }).statusCode === 409) say('Someone saved again in between; try once more. Your work is untouched.', 'error')
      else say(errMessage(e, 'the save failed; your work is untouched'), 'error')
    }
  }
  function openRevision(r: Revision) {
    // Opening is restoring without saving: the canvas shows it, Ctrl+Z goes back.
    store.replaceGraph(r.graph as Graph, r.title)
    viewing.value = { version: r.version, title: r.title }
    say(`Showing version ${r.version}${canEdit.value ? ' (not saved; Ctrl+Z returns to your canvas, Save makes it the newest revision)' : ''}.`)
  }
  async function restoreRevision(r: Revision) {
    store.replaceGraph(r.graph as Graph, r.title)
    viewing.value = null
    await save()
  }
  return { saving, conflict, viewing, savedProcess, inSync, save, reloadTheirs, keepMine, openRevision, restoreRevision }
}
