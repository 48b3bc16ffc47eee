// Site administrators: the messages the local catcher captured (nothing is captured with real SMTP).
export default defineEventHandler(async (event) => {
  await requireSiteAdmin(event)
  const limit = Math.min(500, Math.max(1, Number(getQuery(event).limit) || 100))
  return {
    capturing: !usesRealSmtp(),
    dir: usesRealSmtp() ? null : outboxDir(),
    messages: await readOutbox(limit),
  }
})
