import { z } from 'zod'

export const EmailSchema = z.email({ error: 'must be an e-mail address' }).max(254).transform(s => s.trim().toLowerCase())
export const PasswordSchema = z.string({ error: 'is required' }).min(8, { error: 'must have at least 8 characters' }).max(200)

export const RegisterSchema = z.object({
  email: EmailSchema,
  password: PasswordSchema,
  name: z.string({ error: 'is required' }).trim().min(1, { error: 'is required' }).max(120),
})

export const LoginSchema = z.object({
  email: EmailSchema,
  password: z.string({ error: 'is required' }).min(1, { error: 'is required' }).max(200),
})

export type RegisterInput = z.infer<typeof RegisterSchema>
export type LoginInput = z.infer<typeof LoginSchema>
