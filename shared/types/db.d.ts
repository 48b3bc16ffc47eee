import type * as schema from '../../db/schema'

export type CommentRow = typeof schema.comments.$inferSelect
export type InvitationRow = typeof schema.invitations.$inferSelect
export type ApiTokenRow = typeof schema.apiTokens.$inferSelect
export type ProjectRole = (typeof schema.memberships.$inferSelect)['role']
