import type { H3Event } from 'h3'
import type { z } from 'zod'
import { DECIMAL_ID, describeIssues } from '#shared/schemas/common'

const statusMessages: Record<number, string> = {
  400: 'Bad Request', 401: 'Unauthorized', 403: 'Forbidden', 404: 'Not Found', 409: 'Conflict', 410: 'Gone',
  413: 'Payload Too Large', 415: 'Unsupported Media Type', 422: 'Unprocessable Entity', 429: 'Too Many Requests', 503: 'Service Unavailable',
}

/** An h3 error whose message starts with the field path, as docs/api.md "Errors" requires. */
export function fieldError(statusCode: number, field: string, message: string, data: Record<string, unknown> = {}) {
  return createError({
    statusCode,
    statusMessage: statusMessages[statusCode] ?? 'Error',
    message: field ? `${field}: ${message}` : message,
    data: { field, ...data },
  })
}

export function httpError(statusCode: number, message: string, data: Record<string, unknown> = {}) {
  return createError({ statusCode, statusMessage: statusMessages[statusCode] ?? 'Error', message, data })
}

/** Reads a JSON body and validates it: malformed JSON or a schema failure → 400 naming the field. */
export async function readValid<S extends z.ZodType>(event: H3Event, schema: S): Promise<z.output<S>> {
  let raw: unknown
  try {
    raw = await readBody(event)
  }
  catch {
    throw fieldError(400, 'body', 'is not valid JSON')
  }
  if (raw === undefined || raw === '') raw = {}
  const parsed = schema.safeParse(raw)
  if (!parsed.success) {
    const { field, message } = describeIssues(parsed.error)
    throw createError({
      statusCode: 400,
      statusMessage: 'Bad Request',
      message,
      data: { field, issues: parsed.error.issues },
    })
  }
  return parsed.data
}

/** Validates route params or the query string: failures → 400 (route params that name nothing → 404 later). */
export function parseWith<S extends z.ZodType>(input: unknown, schema: S, fallback = 'params'): z.output<S> {
  const parsed = schema.safeParse(input)
  if (!parsed.success) {
    const { field, message } = describeIssues(parsed.error, fallback)
    throw createError({ statusCode: 400, statusMessage: 'Bad Request', message, data: { field, issues: parsed.error.issues } })
  }
  return parsed.data
}

export function routeId(event: H3Event, name = 'id'): number {
  const raw = getRouterParam(event, name) ?? ''
  // Plain decimal only: Number() would read 0x1, 1e0 and " 1" as id 1.
  if (!DECIMAL_ID.test(raw)) throw httpError(404, `${name}: no such item`)
  return Number(raw)
}
