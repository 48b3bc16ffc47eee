// Site administrators: puts a failed chunk back on the queue.
import { z } from 'zod'

const RetrySchema = z.object({ jobId: z.string().min(1).max(100) })

export default defineEventHandler(async (event) => {
  const { user } = await requireSiteAdmin(event)
  const body = await readValid(event, RetrySchema)
  if (!queueEnabled()) throw fieldError(409, 'jobId', 'no job queue is configured (REDIS_URL is not set)')
  const out = await retryChunk(body.jobId)
  await audit(null, user.id, 'queue.retry', 'job', null, { jobId: body.jobId })
  return out
})
