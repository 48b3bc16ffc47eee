import { z } from 'zod'

/** Formats a zod path the way docs/api.md writes fields: `kinematics.lambda[2][1]`. */
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

export const IdParam = z.object({ id: z.coerce.number().int().positive() })
