// Bodies of the collaboration routes (password reset, comments, API tokens), shared by pages and server.
import { z } from 'zod'
import { EmailSchema, PasswordSchema } from './auth'

export const ForgotPasswordSchema = z.object({ email: EmailSchema })

export const ResetPasswordSchema = z.object({
  token: z.string({ error: 'is required' }).min(10, { error: 'is not a reset link token' }).max(200),
  password: PasswordSchema,
})

export const COMMENT_MAX = 5000

export const CommentBodySchema = z.object({
  body: z.string({ error: 'is required' }).trim().min(1, { error: 'is empty' }).max(COMMENT_MAX, { error: `must be at most ${COMMENT_MAX} characters` }),
})

export const TokenScopeSchema = z.enum(['read', 'read-write'], { error: 'must be read or read-write' })

export const TokenCreateSchema = z.object({
  name: z.string({ error: 'is required' }).trim().min(1, { error: 'is required' }).max(80),
  scope: TokenScopeSchema,
})

/** Prefix of every API token, so a leaked one is easy to recognise in logs and secret scanners. */
export const TOKEN_PREFIX = 'pw_'

/**
 * Splits a comment into plain text and inline math: `$...$` on one line is math, `\$` is a
 * literal dollar sign. Unclosed `$` stays text. As in the usual Markdown rule for inline TeX, an
 * opening `$` must be followed by a non-space and a closing `$` preceded by a non-space and not
 * followed by a digit, so "costs $5 and $10" keeps both dollars.
 */
export function splitInlineMath(body: string): { kind: 'text' | 'math', value: string }[] {
  const parts: { kind: 'text' | 'math', value: string }[] = []
  let text = ''
  let i = 0
  const space = (ch: string | undefined) => ch === undefined || /\s/.test(ch)
  while (i < body.length) {
    const c = body[i]!
    if (c === '\\' && body[i + 1] === '$') {
      text += '$'
      i += 2
      continue
    }
    if (c === '$' && !space(body[i + 1])) {
      let j = i + 1
      let math = ''
      let closed = false
      while (j < body.length && body[j] !== '\n') {
        if (body[j] === '\\' && body[j + 1] === '$') {
          math += '\\$'
          j += 2
          continue
        }
        if (body[j] === '$' && !space(body[j - 1]) && !/\d/.test(body[j + 1] ?? '')) {
          closed = true
          break
        }
        math += body[j]
        j++
      }
      if (closed && math.trim()) {
        if (text) parts.push({ kind: 'text', value: text })
        text = ''
        parts.push({ kind: 'math', value: math })
        i = j + 1
        continue
      }
    }
    text += c
    i++
  }
  if (text) parts.push({ kind: 'text', value: text })
  return parts
}
