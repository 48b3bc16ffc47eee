import { limitQuery } from '#shared/schemas/common'
// Site administrators: the messages the local catcher captured (nothing is captured with real SMTP).
export default defineEventHandler(async (event) => {
  await requireSiteAdmin(event)
  const { limit } = parseWith(getQuery(event), limitQuery(500, 100), 'query')
  return {
    capturing: !usesRealSmtp(),
    dir: usesRealSmtp() ? null : outboxDir(),
    messages: await readOutbox(limit),
  }
})
