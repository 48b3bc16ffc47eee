import type { Catalogue } from '../workers/tasks'

// What the engine offers, computed once by a worker (it knows the engine; the request thread
// need not load it) and kept for the life of the process.
let cached: Promise<Catalogue> | null = null

export default defineEventHandler(async (event) => {
  await requireAuth(event)
  cached ??= runInPool<Catalogue>({ kind: 'catalogue' }).then(r => r.value)
  try {
    const catalogue = await cached
    const pool = poolInfo()
    return { ...catalogue, service: { budgetMs: evaluationBudgetMs(), workers: pool.workers, threads: pool.threads } }
  }
  catch (e) {
    cached = null
    throw evaluationHttpError(e)
  }
})
