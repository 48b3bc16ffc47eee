// Cross-site protection: SameSite cookies plus refusing a mismatched Origin on writes.
// Scripts send no Origin header and are accepted.
export default defineEventHandler((event) => {
  if (!event.path.startsWith('/api/') || ['GET', 'HEAD', 'OPTIONS'].includes(event.method)) return
  const origin = getRequestHeader(event, 'origin')
  if (!origin || origin === 'null') return
  const host = getRequestHeader(event, 'x-forwarded-host') || getRequestHeader(event, 'host')
  let originHost = ''
  try {
    originHost = new URL(origin).host
  }
  catch { /* unreadable origin: refused below */ }
  if (originHost !== host) throw httpError(403, `origin: requests from ${origin} are not accepted`)
})
