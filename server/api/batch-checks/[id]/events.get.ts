// Server-sent events: "progress" after every stored chunk, then one "end" when the batch is done,
// failed or cancelled; the stream then closes. A finished batch sends "end" at once.
export default defineEventHandler(async (event) => {
  const { check } = await requireCheckRole(event, routeId(event), 'viewer')
  const stream = createEventStream(event)
  const send = (p: BatchProgress) => stream.push({ event: isTerminal(p.status) ? 'end' : 'progress', data: JSON.stringify(p) })
  let closed = false
  const finish = async () => {
    if (closed) return
    closed = true
    off()
    await stream.close()
  }
  const off = onBatchProgress(check.id, (p) => {
    void send(p).then(() => (isTerminal(p.status) ? finish() : undefined))
  })
  stream.onClosed(finish)
  const now = await batchProgress(check.id)
  if (now) void send(now).then(() => (isTerminal(now.status) ? finish() : undefined))
  return stream.send()
})
