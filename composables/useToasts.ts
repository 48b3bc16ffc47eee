// Short messages in the corner of every page (app.vue shows them): errors a handler threw, so a
// control that failed never looks like a control that does nothing.
export interface Toast { id: number, kind: 'error' | 'info', title: string, text: string }

let next = 0
export function useToasts() {
  const toasts = useState<Toast[]>('toasts', () => [])
  function dismiss(id: number) {
    toasts.value = toasts.value.filter(t => t.id !== id)
  }
  function push(t: Omit<Toast, 'id'>, ms = 9000) {
    const id = ++next
    // The same failure repeated (a handler on every keystroke) shows once.
    if (toasts.value.some(x => x.title === t.title && x.text === t.text)) return
    toasts.value = [...toasts.value.slice(-3), { ...t, id }]
    if (import.meta.client && ms > 0) setTimeout(() => dismiss(id), ms)
  }
  return { toasts, push, dismiss }
}
