// Stops a running (or queued) batch; the points evaluated so far stay stored with the summary.
export default defineEventHandler(async (event) => {
  const { check, project, user } = await requireCheckRole(event, routeId(event), 'editor')
  if (check.kind !== 'batch') throw fieldError(409, 'status', 'this is a single check; only batch checks can be cancelled')
  if (!cancelBatch(check.id)) throw fieldError(409, 'status', `the batch check is already ${check.status === 'running' || check.status === 'queued' ? 'stopped' : check.status}`)
  await new Promise<void>((resolve) => {
    const off = onBatchProgress(check.id, (p) => {
      if (isTerminal(p.status)) {
        off()
        resolve()
      }
    })
    setTimeout(() => {
      off()
      resolve()
    }, 5000)
  })
  await audit(project.id, user.id, 'check.cancel', 'check', check.id, {})
  const row = await useDB().query.checks.findFirst({ where: (c, { eq }) => eq(c.id, check.id) })
  return batchView(row!)
})
