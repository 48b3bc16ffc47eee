import type { H3Event } from 'h3'
import { createHash, randomBytes } from 'node:crypto'
import { and, eq, isNull, sql } from 'drizzle-orm'

export interface AuthUser {
  id: number
  email: string
  name: string
  role: 'admin' | 'member'
}

export interface AuthContext {
  user: AuthUser
  via: 'session' | 'token'
  /** Tokens may be read-only; sessions are always read-write. */
  scope: 'read' | 'read-write'
  tokenId?: number
}

/** Opaque secrets (tokens in links and API tokens) are stored as SHA-256 only. */
export function hashSecret(secret: string): string {
  return createHash('sha256').update(secret).digest('hex')
}

export function newSecret(prefix = ''): string {
  return prefix + randomBytes(32).toString('base64url')
}

/** Who is calling: a bearer token or a session, checked against the database on every request. */
export async function currentAuth(event: H3Event): Promise<AuthContext | null> {
  if (event.context.auth !== undefined) return event.context.auth as AuthContext | null
  const db = useDB()
  let result: AuthContext | null = null
  const header = getRequestHeader(event, 'authorization')
  if (header?.startsWith('Bearer ')) {
    const token = header.slice(7).trim()
    const row = await db.select({ token: tables.apiTokens, user: tables.users })
      .from(tables.apiTokens)
      .innerJoin(tables.users, eq(tables.users.id, tables.apiTokens.userId))
      .where(and(eq(tables.apiTokens.tokenHash, hashSecret(token)), isNull(tables.apiTokens.revokedAt)))
      .get()
    if (!row || row.user.disabled) throw httpError(401, 'authorization: the token is unknown, revoked, or its account is disabled')
    await db.update(tables.apiTokens).set({ lastUsedAt: new Date() }).where(eq(tables.apiTokens.id, row.token.id))
    result = { user: pick(row.user), via: 'token', scope: row.token.scope, tokenId: row.token.id }
  }
  else {
    const raw = getCookie(event, sessionCookieName())
    const sessionUser = await unsealedUser(event, raw)
    if (sessionUser) {
      const row = await userById().get({ id: sessionUser.id })
      if (!row || row.disabled || row.sessionVersion !== sessionUser.sv) {
        if (raw) unsealed.delete(raw)
        await clearUserSession(event)
      }
      else result = { user: pick(row), via: 'session', scope: 'read-write' }
    }
  }
  event.context.auth = result
  return result
}

// Unsealing the cookie costs more than the user lookup, so a sealed value seen recently is
// remembered briefly. The user row is still read on every request, so a disable or a reset
// (session version bump) takes effect at the next request as before.
const unsealed = new Map<string, { id: number, sv: number, at: number }>()
const UNSEALED_TTL_MS = 30_000

function sessionCookieName(): string {
  return (useRuntimeConfig().session as { name?: string } | undefined)?.name || 'nuxt-session'
}

async function unsealedUser(event: H3Event, raw: string | undefined) {
  const hit = raw ? unsealed.get(raw) : undefined
  if (hit && Date.now() - hit.at < UNSEALED_TTL_MS) return hit
  const session = await getUserSession(event)
  if (!session.user) return null
  const entry = { id: session.user.id, sv: session.user.sv, at: Date.now() }
  if (raw) {
    if (unsealed.size >= 10_000) unsealed.clear()
    unsealed.set(raw, entry)
  }
  return entry
}

// The session's user row is read on every request: the statement is built once (drizzle's query
// building cost more than the lookup itself).
let userStatement: ReturnType<typeof prepareUserById> | undefined
function prepareUserById() {
  return useDB().select().from(tables.users).where(eq(tables.users.id, sql.placeholder('id'))).prepare()
}
function userById() {
  return (userStatement ??= prepareUserById())
}

function pick(row: typeof tables.users.$inferSelect): AuthUser {
  return { id: row.id, email: row.email, name: row.name, role: row.role }
}

export async function requireAuth(event: H3Event): Promise<AuthContext> {
  const auth = await currentAuth(event)
  if (!auth) throw httpError(401, 'You need to sign in (or send a valid API token).')
  return auth
}

export async function requireUser(event: H3Event): Promise<AuthUser> {
  return (await requireAuth(event)).user
}

/** Writes need a session or a read-write token. */
export function requireWriteScope(auth: AuthContext) {
  if (auth.scope !== 'read-write') throw httpError(403, 'authorization: this token is read-only')
}

export async function startSession(event: H3Event, user: typeof tables.users.$inferSelect) {
  await replaceUserSession(event, { user: { id: user.id, role: user.role, sv: user.sessionVersion }, loggedInAt: Date.now() })
}
