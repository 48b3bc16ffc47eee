// A loop-cut diagram's check: the canvas as drawn (saved or not) to POST /api/diagrams/:id/check-loop-cut;
// the result goes to the store, which marks it stale once the canvas changes.
import { useEditorStore } from '~~/stores/editor'
import { errMessage, type Say } from './useEditorNotice'

export interface LoopSettings { arithmetic: 'float' | 'exact', seed: number, corners: 'closed' | 'bcfw' | 'berends-giele' }
export const defaultLoopSettings = (): LoopSettings => ({ arithmetic: 'float', seed: 1, corners: 'closed' })

export function useLoopCutCheck(diagramId: number, say: Say, busy: Ref<boolean>) {
  const store = useEditorStore()
  const open = ref(true)
  const settings = computed<LoopSettings>({
    get: () => ({ ...defaultLoopSettings(), ...((store.settings.loop as Partial<LoopSettings> | undefined) ?? {}) }),
    set: (v) => { store.settings = { ...store.settings, loop: { ...v } } },
  })
  async function run() {
    if (busy.value) return
    busy.value = true
    try {
      const s = settings.value
      const res = await $fetch(`/api/diagrams/${diagramId}/check-loop-cut`, {
        method: 'POST',
        body: { graph: store.toGraph(), arithmetic: s.arithmetic, corners: s.corners, kinematics: { kind: s.arithmetic === 'exact' ? 'rational' : 'random', seed: s.seed } },
      })
      store.setLoopResult(res)
      open.value = true
    }
    catch (e) {
      say(errMessage(e, 'The loop cut could not be checked.'), 'error')
    }
    finally {
      busy.value = false
    }
  }
  return { run, settings, open }
}
