// For load balancers and operators: the database answers, and the job queue when one is configured.
// Public, so it names no address; 503 when something is down.
import { sql } from 'drizzle-orm'

export default defineEventHandler(async (event) => {
  let database = 'ok'
  try {
    await useDB().run(sql`select 1`)
  }
  catch {
    database = 'down'
  }
  const queue = queueEnabled() ? ((await queuePing()) ? 'down' : 'ok') : 'off'
  const ok = database === 'ok' && queue !== 'down'
  if (!ok) setResponseStatus(event, 503)
  return { status: ok ? 'ok' : 'degraded', database, queue }
})
