// App-wide: an error thrown in a component, a watcher or an event handler is logged and shown as a
// toast naming what failed. Nuxt's own fatal-error page still takes the errors it handles.
import type { ComponentPublicInstance } from 'vue'

function where(instance: ComponentPublicInstance | null, info: string): string {
  const name = instance?.$options as { __name?: string, name?: string } | undefined
  const component = name?.__name ?? name?.name
  return component ? `${component} (${info})` : info
}

export default defineNuxtPlugin((nuxtApp) => {
  const { push } = useToasts()
  nuxtApp.hook('vue:error', (err, instance, info) => {
    const e = err as { message?: string, statusCode?: number, fatal?: boolean }
    if (e?.fatal) return
    console.error(`[polewright] ${where(instance, String(info))} failed:`, err)
    push({ kind: 'error', title: `Something failed in ${where(instance, String(info))}`, text: e?.message ?? String(err) })
  })
  window.addEventListener('unhandledrejection', (ev) => {
    const r = ev.reason as { message?: string } | undefined
    console.error('[polewright] an unhandled promise rejection:', ev.reason)
    push({ kind: 'error', title: 'A background task failed', text: r?.message ?? String(ev.reason) })
  })
})
