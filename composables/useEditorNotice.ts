// The editor's one-line notice under the header (what the last action did, or why it did not).
export type Say = (text: string, kind?: 'info' | 'error') => void

export function useEditorNotice() {
  const notice = ref<{ kind: 'info' | 'error', text: string } | null>(null)
  const say: Say = (text, kind = 'info') => { notice.value = { kind, text } }
  return { notice, say }
}

/** The server's message of a failed $fetch, or the fallback. */
export function errMessage(e: unknown, fallback: string): string {
  const x = e as { data?: { message?: string } }
  return x.data?.message ?? fallback
}
