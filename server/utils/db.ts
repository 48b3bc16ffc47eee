import { createClient, type Client } from '@libsql/client/node'
import { drizzle, type LibSQLDatabase } from 'drizzle-orm/libsql'
import { mkdirSync } from 'node:fs'
import { dirname, resolve } from 'node:path'
import * as schema from '../../db/schema'

export { schema }
export const tables = schema

let _client: Client | undefined
let _db: LibSQLDatabase<typeof schema> | undefined

export function databaseUrl(): string {
  return process.env.DATABASE_URL || `file:${resolve(process.cwd(), 'data/polewright.db')}`
}

/** The libSQL client: an embedded SQLite file by default, a libsql:// server when configured. */
export function useClient(): Client {
  if (!_client) {
    const url = databaseUrl()
    if (url.startsWith('file:')) mkdirSync(dirname(url.slice(5)), { recursive: true })
    // One connection: per-connection pragmas hold, and writers queue instead of failing.
    _client = createClient({ url, authToken: process.env.DATABASE_AUTH_TOKEN, concurrency: 1 })
  }
  return _client
}

export async function configureConnection(client: Client) {
  if (!databaseUrl().startsWith('file:')) return
  await client.execute('PRAGMA journal_mode = WAL')
  await client.execute('PRAGMA foreign_keys = ON')
  await client.execute('PRAGMA busy_timeout = 5000')
  await client.execute('PRAGMA synchronous = NORMAL')
}

export function useDB() {
  if (!_db) _db = drizzle(useClient(), { schema })
  return _db
}

let _ready: Promise<void> | undefined

/** Resolves once migrations (and the optional demo seed) have run; requests wait for it. */
export function dbReady(): Promise<void> {
  return _ready ?? Promise.resolve()
}

export function setDbReady(p: Promise<void>) {
  _ready = p
}
