import { z } from 'zod'

export const EmailSchema = z.email({ error: 'must be an e-mail address' }).max(254, { error: 'must have at most 254 characters' }).transform(s => s.trim().toLowerCase())
export const PASSWORD_MAX = 200
// Each check carries its own message: the type-level `error` would otherwise answer "is required"
// for a password that is merely too long. Strength (common passwords) is checked on the server.
export const PasswordSchema = z.string({ error: 'is required' })
  .min(8, { error: 'must have at least 8 characters' })
  .max(PASSWORD_MAX, { error: `must have at most ${PASSWORD_MAX} characters` })

export const NameSchema = z.string({ error: 'is required' }).trim().min(1, { error: 'is required' }).max(120, { error: 'must have at most 120 characters' })

export const RegisterSchema = z.object({
  email: EmailSchema,
  password: PasswordSchema,
  name: NameSchema,
})

export const LoginSchema = z.object({
  email: EmailSchema,
  password: z.string({ error: 'is required' }).min(1, { error: 'is required' }).max(PASSWORD_MAX, { error: `must have at most ${PASSWORD_MAX} characters` }),
})

export type RegisterInput = z.infer<typeof RegisterSchema>
export type LoginInput = z.infer<typeof LoginSchema>

/** PATCH /api/account: the display name (the e-mail address is the sign-in and does not change). */
export const AccountUpdateSchema = z.object({ name: NameSchema })

/** POST /api/account/password: the current password proves it is the owner at the keyboard. */
export const PasswordChangeSchema = z.object({
  currentPassword: z.string({ error: 'is required' }).min(1, { error: 'is required' }).max(PASSWORD_MAX, { error: `must have at most ${PASSWORD_MAX} characters` }),
  password: PasswordSchema,
})

export type AccountUpdateInput = z.infer<typeof AccountUpdateSchema>
export type PasswordChangeInput = z.infer<typeof PasswordChangeSchema>
