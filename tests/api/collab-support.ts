// Shared by the collaboration tests: the local catcher's outbox (one JSON file per message, written
// by scripts/mail-catcher.mjs) and direct access to the test server's SQLite file.
import { inject } from 'vitest'
import { readdirSync, readFileSync } from 'node:fs'
import { join } from 'node:path'
import { createClient, type Client as DbClient } from '@libsql/client'

export interface Captured { id: string, receivedAt: string, from: string, to: string[], subject: string, text: string, html: string }

export function outbox(): Captured[] {
  const dir = inject('outbox')
  let names: string[] = []
  try {
    names = readdirSync(dir).filter(n => n.endsWith('.json'))
  }
  catch { /* not created yet */ }
  return names.map(n => JSON.parse(readFileSync(join(dir, n), 'utf8')) as Captured)
}

export function mailsTo(address: string) {
  return outbox().filter(m => m.to.includes(address)).sort((a, b) => a.id.localeCompare(b.id))
}

/** Waits for the count-th message to an address (the catcher writes it a moment after the answer). */
export async function waitForMail(address: string, count = 1, timeoutMs = 15_000): Promise<Captured> {
  const until = Date.now() + timeoutMs
  while (Date.now() < until) {
    const got = mailsTo(address)
    if (got.length >= count) return got[count - 1]!
    await new Promise(r => setTimeout(r, 100))
  }
  throw new Error(`no message #${count} to ${address} within ${timeoutMs} ms (outbox has ${outbox().length})`)
}

export function linkIn(mail: Captured, path: 'invitations' | 'password/reset') {
  const m = mail.text.match(new RegExp(`https?://[^\\s]+/${path}/([A-Za-z0-9_-]+)`))
  if (!m) throw new Error(`no /${path}/ link in: ${mail.text}`)
  return { url: m[0], token: m[1]!, path: new URL(m[0]).pathname }
}

let db: DbClient | undefined
export function testDb(): DbClient {
  db ??= createClient({ url: `file:${join(inject('tmpDir'), 'test.db')}` })
  return db
}

/** A stored check on a diagram, written straight into the database (these tests need one, not its physics). */
export async function insertCheck(projectId: number, diagramId: number, userId: number) {
  const res = await testDb().execute({
    sql: `INSERT INTO checks (project_id, diagram_id, diagram_version, kind, status, request, verdict, engine_version, arithmetic, created_by)
          VALUES (?, ?, 1, 'single', 'done', '{}', 'agrees', 'test', 'float', ?) RETURNING id`,
    args: [projectId, diagramId, userId],
  })
  return Number(res.rows[0]!.id)
}
