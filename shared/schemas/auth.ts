import { z } from 'zod'

export const EmailSchema = z.email({ error: 'must be an e-mail address' }).max(254, { error: 'must have at most 254 characters' }).transform(s => s.trim().toLowerCase())
export const PASSWORD_MAX = 200
// Each check carries its own message: the type-level `error` would otherwise answer "is required"
// for a password that is merely too long. Strength (common passwords) is checked on the server.
export const PasswordSchema = z.string({ error: 'is required' })
  .min(8, { error: 'must have at least 8 characters' })
  .max(PASSWORD_MAX, { error: `must have at most ${PASSWORD_MAX} characters` })

export const RegisterSchema = z.object({
  email: EmailSchema,
  password: PasswordSchema,
  name: z.string({ error: 'is required' }).trim().min(1, { error: 'is required' }).max(120, { error: 'must have at most 120 characters' }),
})

export const LoginSchema = z.object({
  email: EmailSchema,
  password: z.string({ error: 'is required' }).min(1, { error: 'is required' }).max(PASSWORD_MAX, { error: `must have at most ${PASSWORD_MAX} characters` }),
})

export type RegisterInput = z.infer<typeof RegisterSchema>
export type LoginInput = z.infer<typeof LoginSchema>
