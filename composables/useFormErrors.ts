import type { z } from 'zod'
import { fieldErrors } from '#shared/schemas/common'

/** Field errors from the shared zod schema (before sending) and from the server's answer (after). */
export function useFormErrors() {
  const errors = ref<Record<string, string>>({})
  const formError = ref('')

  function validate<S extends z.ZodType>(schema: S, value: unknown): z.output<S> | null {
    errors.value = {}
    formError.value = ''
    const parsed = schema.safeParse(value)
    if (!parsed.success) {
      errors.value = fieldErrors(parsed.error)
      return null
    }
    return parsed.data
  }

  function fromServer(error: unknown) {
    const data = (error as { data?: { message?: string, data?: { field?: string } } }).data
    const message = data?.message ?? (error as Error).message ?? 'Something went wrong'
    const field = data?.data?.field
    if (field && field !== 'body') {
      const prefix = `${field}: `
      errors.value = { ...errors.value, [field]: message.startsWith(prefix) ? message.slice(prefix.length) : message }
    }
    else formError.value = message
  }

  const busy = ref(false)
  /** Runs a form's request with `busy` set meanwhile; a refusal goes through fromServer. */
  async function send(request: () => Promise<unknown>) {
    busy.value = true
    try {
      await request()
    }
    catch (e) {
      fromServer(e)
    }
    finally {
      busy.value = false
    }
  }

  return { errors, formError, validate, fromServer, busy, send }
}
