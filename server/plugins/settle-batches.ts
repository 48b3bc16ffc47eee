// Batches a previous server process left queued or running are marked interrupted before the
// first request is served (after the migrations: plugins run in file-name order, migrate.ts first),
// so the diagram's checks list never shows them as running.
export default defineNitroPlugin(() => {
  setDbReady(dbReady().then(async () => {
    try {
      const n = await settleOrphanBatches()
      if (n) console.log(`[batch] ${n} batch check(s) interrupted by the last restart marked as failed`)
    }
    catch (error) {
      console.error('[batch] could not settle interrupted batches:', error)
    }
  }))
})
