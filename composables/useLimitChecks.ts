// The limit and identity panel's calls: one request at a time to POST /api/limit-checks; the answer
// is dropped when the canvas's process changes (it was for another process).
import type { LimitCheckRequestInput, LimitCheckResponse } from '#shared/schemas/limit-checks'
import { processKey } from '#shared/editor/process'
import { useEditorStore } from '~~/stores/editor'

export function useLimitChecks() {
  const store = useEditorStore()
  const result = ref<LimitCheckResponse | null>(null)
  const running = ref<string | null>(null)
  const error = ref('')
  const key = () => (store.process ? processKey(store.process) : '')
  watch(key, () => {
    result.value = null
    error.value = ''
  })
  async function run(name: string, body: LimitCheckRequestInput) {
    running.value = name
    error.value = ''
    try {
      const res = await $fetch('/api/limit-checks', { method: 'POST', body })
      result.value = res
    }
    catch (e) {
      result.value = null
      const err = e as { data?: { message?: string }, message?: string }
      error.value = err.data?.message ?? err.message ?? 'the check failed'
    }
    finally {
      running.value = null
    }
  }
  return { result, running, error, run }
}
