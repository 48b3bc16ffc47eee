// Expanding the process into its channel terms on the canvas: the term tree comes from the server
// (POST /api/evaluate with tree: true at the structure seed) and is laid out by the store.
import type { EvaluateResponse } from '#shared/schemas/evaluate'
import { evaluateRequest, toLabels } from '#shared/editor/process'
import { STRUCTURE_SEED } from '#shared/editor/expand'
import { READABLE_NODES } from '#shared/editor/collapse'
import { useEditorStore } from '~~/stores/editor'
import { errMessage, type Say } from './useEditorNotice'

export function useExpansion(say: Say, busy: Ref<boolean>) {
  const store = useEditorStore()
  async function fetchTree(seed: string): Promise<EvaluateResponse> {
    const p = store.process!
    const res = await $fetch('/api/evaluate', { method: 'POST', body: evaluateRequest(p, { kinematics: { kind: 'random', seed }, target: 'none', tree: true }) })
    return toLabels(res, p)
  }
  /** A saved expansion needs its tree again after a reload (to open its Blocks). */
  async function ensureTree() {
    if (store.tree || !store.process || !store.expansion || store.expansionStale) return
    try {
      store.setTree((await fetchTree(store.expansion.seed ?? STRUCTURE_SEED)).terms)
    }
    catch (e) {
      say(errMessage(e, 'the term tree of the expansion could not be loaded'), 'error')
    }
  }
  watch(() => store.expansion?.specs, () => { void ensureTree() })

  function collapsedNote() {
    const k = store.expansion?.collapsed ?? 0
    if (!k) return 'every block is open.'
    return `${k} block${k === 1 ? '' : 's'} kept collapsed so the canvas stays readable (at most ${READABLE_NODES} vertices and blocks): open them one at a time, or Expand fully again to open all.`
  }

  async function expand(full: boolean) {
    if (!store.process) { say('Set the process first: theory, helicities and shift.', 'error'); return }
    if (busy.value) return
    busy.value = true
    try {
      if (!store.expansionStale && store.expansion && store.tree && full) {
        const how = store.expandAll()
        if (!how) say('Every block is already expanded down to three-point vertices.')
        else say(how === 'all' ? `${store.validation.drawing.terms.length} terms of three-point vertices.` : `${store.validation.drawing.terms.length} terms; ${collapsedNote()}`)
        return
      }
      const handBuilt = store.nodes.some(n => !(n.data as { comp?: string }).comp)
      const res = await fetchTree(STRUCTURE_SEED)
      store.applyExpansion(res.terms, res.shift, STRUCTURE_SEED, full)
      const terms = store.validation.drawing.terms.length
      const blocks = store.expansion?.collapsed ?? 0
      const what = !full ? '' : blocks ? `, ${terms} terms; ${collapsedNote()}` : `, ${terms} terms of three-point vertices.`
      say(`${res.terms.length} channel term${res.terms.length === 1 ? '' : 's'} of [${res.shift.join(',')}⟩${what || '.'}${handBuilt && !store.readOnly ? ' The hand-built canvas was replaced (Ctrl+Z brings it back).' : ''}`)
    }
    catch (e) {
      say(errMessage(e, 'the expansion failed'), 'error')
    }
    finally {
      busy.value = false
    }
  }
  return { expand, ensureTree }
}
