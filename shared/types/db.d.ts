import type * as schema from '../../db/schema'

export type UserRow = typeof schema.users.$inferSelect
export type ProjectRow = typeof schema.projects.$inferSelect
export type MembershipRow = typeof schema.memberships.$inferSelect
export type DiagramRow = typeof schema.diagrams.$inferSelect
export type RevisionRow = typeof schema.diagramRevisions.$inferSelect
export type CheckRow = typeof schema.checks.$inferSelect
export type PointSetRow = typeof schema.pointSets.$inferSelect
export type CommentRow = typeof schema.comments.$inferSelect
export type InvitationRow = typeof schema.invitations.$inferSelect
export type ApiTokenRow = typeof schema.apiTokens.$inferSelect
export type ProjectRole = MembershipRow['role']
