// Cross-site write protection for /api (SameSite=Lax cookies are the first layer):
// - a write whose Origin is `null` or another site is refused (403), whatever the credentials;
// - a write with no Origin is accepted: browsers send Origin on every cross-site POST/PUT/PATCH/DELETE
//   and on same-origin fetches, so its absence means a script (curl, a bearer-token client);
// - a write with a body must be JSON (multipart on the upload route), 415 otherwise — an HTML form can
//   only send urlencoded, multipart or text/plain bodies, and cross-site JSON needs a preflight the
//   server never grants.
const SAFE = ['GET', 'HEAD', 'OPTIONS']
const MULTIPART_ROUTES = [/^\/api\/projects\/[^/]+\/point-sets\/?$/]

function hasBody(event: Parameters<typeof getRequestHeader>[0]): boolean {
  const length = getRequestHeader(event, 'content-length')
  if (length !== undefined) return Number(length) > 0
  return getRequestHeader(event, 'transfer-encoding') !== undefined
}

export default defineEventHandler((event) => {
  if (!event.path.startsWith('/api/') || SAFE.includes(event.method)) return
  const origin = getRequestHeader(event, 'origin')
  if (origin !== undefined) {
    const host = getRequestHeader(event, 'x-forwarded-host') || getRequestHeader(event, 'host')
    let originHost = ''
    try {
      originHost = origin === 'null' ? '' : new URL(origin).host
    }
    catch { /* unreadable origin: refused below */ }
    if (!originHost || originHost !== host) throw httpError(403, `origin: requests from ${origin} are not accepted`)
  }
  if (!hasBody(event)) return
  const type = (getRequestHeader(event, 'content-type') ?? '').split(';')[0]!.trim().toLowerCase()
  const path = event.path.split('?')[0]!
  const multipart = MULTIPART_ROUTES.some(re => re.test(path))
  if (type === 'application/json' || (multipart && type === 'multipart/form-data')) return
  throw fieldError(415, 'content-type', `send the body as ${multipart ? 'multipart/form-data' : 'application/json'} (got ${type || 'no content type'})`)
})
