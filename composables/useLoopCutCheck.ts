// A loop-cut diagram's check. An editor's is stored, as a tree check is: the drawing is saved first
// (a new revision), then POST /api/diagrams/:id/checks checks the saved rings and keeps the row.
// A viewer checks the canvas as drawn with POST /api/diagrams/:id/check-loop-cut, nothing stored.
// The result goes to the store, which marks it stale once the canvas changes.
import { isLoopCutResult, type LoopCutDrawingResult } from '#shared/editor/loop-cut-check'
import { useEditorStore } from '~~/stores/editor'
import { errMessage } from './useEditorNotice'
import type { CheckRunContext } from './useCheckRun'

export interface LoopSettings { arithmetic: 'float' | 'exact', seed: number, corners: 'closed' | 'bcfw' | 'berends-giele' }
export const defaultLoopSettings = (): LoopSettings => ({ arithmetic: 'float', seed: 1, corners: 'closed' })

interface Ctx extends CheckRunContext {
  /** Bumped when a check is stored, so the Stored tab reloads. */
  checksToken: Ref<number>
}

export function useLoopCutCheck(ctx: Ctx) {
  const { diagramId, say, busy } = ctx
  const store = useEditorStore()
  const open = ref(true)
  /** The stored check the drawer shows (its id), or why the last run was not stored. */
  const storedAs = ref<number | null>(null)
  const notStored = ref('')
  const settings = computed<LoopSettings>({
    get: () => ({ ...defaultLoopSettings(), ...((store.settings.loop as Partial<LoopSettings> | undefined) ?? {}) }),
    set: (v) => { store.settings = { ...store.settings, loop: { ...v } } },
  })
  /** What the check ran with, for the exports' provenance. */
  const ranWith = ref<Record<string, unknown> | null>(null)
  async function run() {
    if (busy.value) return
    busy.value = true
    storedAs.value = null
    notStored.value = ''
    try {
      const s = settings.value
      const body = { arithmetic: s.arithmetic, corners: s.corners, kinematics: { kind: s.arithmetic === 'exact' ? 'rational' as const : 'random' as const, seed: s.seed } }
      let res: LoopCutDrawingResult
      let stored: number | null = null
      if (ctx.canEdit.value) {
        if (!ctx.inSync.value && !(await ctx.save('saved to check the drawing'))) throw new Error('the drawing could not be saved, so it was not checked')
        const check = await $fetch(`/api/diagrams/${diagramId}/checks`, { method: 'POST', body })
        if (!check.result || !isLoopCutResult(check.result)) throw new Error('the server answered with a tree check: reload the diagram')
        res = check.result
        storedAs.value = check.id
        stored = check.id
        ctx.checksToken.value++
      }
      else {
        // through a const: assigning the typed fetch straight to `res` exceeds TypeScript's stack depth
        const drawn = await $fetch(`/api/diagrams/${diagramId}/check-loop-cut`, { method: 'POST', body: { ...body, graph: store.toGraph() } })
        res = drawn
        notStored.value = 'not stored: viewers run checks without storing them; this is a check of what is drawn'
      }
      ranWith.value = { diagram: { id: diagramId, title: store.title, version: store.version }, ...(stored ? { check: stored } : {}), ...body }
      store.setLoopResult(res)
      open.value = true
    }
    catch (e) {
      say(errMessage(e, (e as Error).message ?? 'The loop cut could not be checked.'), 'error')
    }
    finally {
      busy.value = false
    }
  }
  /** A stored loop-cut check opened from the Stored tab. */
  async function openStored(id: number) {
    try {
      const c = await $fetch(`/api/checks/${id}`)
      if (!c.result || !isLoopCutResult(c.result)) { say(`check #${id} is not a loop-cut check`, 'error'); return }
      store.setLoopResult(c.result, c.diagramVersion)
      storedAs.value = c.id
      notStored.value = ''
      ranWith.value = { diagram: { id: diagramId, title: store.title, version: c.diagramVersion }, check: c.id }
      open.value = true
      say(`Showing stored check #${id} (diagram v${c.diagramVersion}).`)
    }
    catch (e) {
      say(errMessage(e, 'the check could not be opened'), 'error')
    }
  }
  return { run, openStored, settings, open, storedAs, notStored, ranWith }
}
