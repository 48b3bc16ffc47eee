// Site administrators: the job queue's workers, depth, throughput and failed chunks.
export default defineEventHandler(async (event) => {
  await requireSiteAdmin(event)
  if (!queueEnabled()) return { enabled: false as const }
  return { enabled: true as const, ...(await queueOverview()) }
})
