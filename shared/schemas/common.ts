import { z } from 'zod'

/** Formats a zod path the way API.md writes fields: `kinematics.lambda[2][1]`. */
export function formatPath(path: readonly PropertyKey[]): string {
  let out = ''
  for (const p of path) {
    if (typeof p === 'number') out += `[${p}]`
    else out += out ? `.${String(p)}` : String(p)
  }
  return out
}

/** First issue of a failed parse as `{ field, message }`, message starting with the field. */
export function describeIssues(error: z.ZodError, fallback = 'body'): { field: string, message: string } {
  const issue = error.issues[0]
  const field = issue ? formatPath(issue.path) || fallback : fallback
  return { field, message: `${field}: ${issue?.message ?? 'is invalid'}` }
}

/** Field → message map for forms (the first message per field). */
export function fieldErrors(error: z.ZodError): Record<string, string> {
  const out: Record<string, string> = {}
  for (const issue of error.issues) {
    const key = formatPath(issue.path) || 'form'
    out[key] ??= issue.message
  }
  return out
}

/** Decimal digits only: `0x1`, `1e0`, `1.5` and ` 1` are not whole numbers here (Number() would accept them). */
export const DECIMAL_ID = /^[1-9]\d{0,14}$/

/** A whole number in a query string or form field, written in plain decimal digits. */
export function wholeNumber(min: number, max: number, messages: { min?: string, max?: string } = {}) {
  return z.union([z.string(), z.number()], { error: 'must be a whole number' })
    .transform(v => String(v))
    .pipe(z.string().regex(/^\d{1,15}$/, { error: 'must be a whole number' }))
    .transform(Number)
    .pipe(z.number().min(min, { error: messages.min ?? `must be at least ${min}` }).max(max, { error: messages.max ?? `at most ${max}` }))
}

/** `?limit=` of the list routes: 1..max, `fallback` when absent. */
export function limitQuery(max: number, fallback: number) {
  return z.object({ limit: wholeNumber(1, max).default(fallback) })
}

export const IdParam = z.object({ id: z.string().regex(DECIMAL_ID, { error: 'must be an id' }).transform(Number) })
