import type { z } from 'zod'

/** Sign-in and registration: validate with the shared schema, post, refresh the user, go on to ?next=. */
export function useAuthForm<S extends z.ZodType>(schema: S, url: string, initial: Record<string, string>) {
  const route = useRoute()
  const form = reactive({ ...initial })
  const { errors, formError, validate, busy, send } = useFormErrors()
  const { refresh } = useMe()

  async function submit() {
    const body = validate(schema, form)
    if (!body) return
    await send(async () => {
      await $fetch(url, { method: 'POST', body: body as Record<string, unknown> })
      await refresh()
      const next = route.query.next
      await navigateTo(typeof next === 'string' && next.startsWith('/') && !next.startsWith('//') ? next : '/projects')
    })
  }

  return { form, errors, formError, busy, submit }
}
