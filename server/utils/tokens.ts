// Personal API tokens: managed only from a signed-in session, so a leaked token cannot mint more.
import type { H3Event } from 'h3'
import type { ApiTokenRow } from '#shared/types/db'

export async function requireSessionUser(event: H3Event) {
  return (await requireSession(event, 'list, create or revoke tokens')).user
}

export function tokenView(row: ApiTokenRow) {
  return {
    id: row.id,
    name: row.name,
    scope: row.scope,
    createdAt: row.createdAt,
    lastUsedAt: row.lastUsedAt,
    revokedAt: row.revokedAt,
  }
}
