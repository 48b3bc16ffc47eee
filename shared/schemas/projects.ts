import { z } from 'zod'
import { EmailSchema } from './auth'
import { GraphSchema } from './graph'

export const ProjectRoleSchema = z.enum(['owner', 'editor', 'viewer'], { error: 'must be owner, editor or viewer' })

export const ProjectCreateSchema = z.object({
  name: z.string({ error: 'is required' }).trim().min(1, { error: 'is required' }).max(120),
  description: z.string().max(2000).optional(),
})

export const ProjectUpdateSchema = ProjectCreateSchema.partial()

export const MemberAddSchema = z.object({ email: EmailSchema, role: ProjectRoleSchema })
export const MemberUpdateSchema = z.object({ role: ProjectRoleSchema })

export const DiagramCreateSchema = z.object({
  title: z.string({ error: 'is required' }).trim().min(1, { error: 'is required' }).max(200),
  graph: GraphSchema,
})

export const DiagramDuplicateSchema = z.object({
  title: z.string().trim().min(1, { error: 'is required' }).max(200).optional(),
})

export const DiagramUpdateSchema = z.object({
  title: z.string().trim().min(1, { error: 'is required' }).max(200).optional(),
  graph: GraphSchema.optional(),
  version: z.number({ error: 'is required (the version you edited)' }).int().positive(),
  note: z.string().max(500).optional(),
})

export type ProjectRole = z.infer<typeof ProjectRoleSchema>
