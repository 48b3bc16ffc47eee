// Response headers for every answer the app itself computes (built assets under /_nuxt keep their
// long cache): no caching of API answers or pages (they carry private data), HSTS over HTTPS, and
// two fixes applied as the head is written — no new session cookie on a 401 (a deletion may pass),
// and a 4xx never carries the renderer's default reason phrase "Server Error".
import { STATUS_CODES } from 'node:http'

const STATIC = /^\/(?:_nuxt|_fonts)\/|\.(?:js|css|svg|png|ico|woff2?|ttf|map|txt)$/

const isDeletion = (cookie: string) => /;\s*max-age=0\b/i.test(cookie) || /;\s*expires=thu, 01 jan 1970/i.test(cookie)

export default defineEventHandler((event) => {
  const path = event.path.split('?')[0]!
  if (!STATIC.test(path)) setResponseHeader(event, 'cache-control', 'no-store')
  // Forwarded-Proto only ever makes the browser stricter, so it is read from any proxy.
  if (getRequestProtocol(event, { xForwardedProto: true }) === 'https') {
    setResponseHeader(event, 'strict-transport-security', 'max-age=31536000; includeSubDomains')
  }
  const res = event.node.res
  const writeHead = res.writeHead
  res.writeHead = function (this: typeof res, ...args: unknown[]) {
    const status = typeof args[0] === 'number' ? args[0] : res.statusCode
    if (status === 401) {
      const cookies = res.getHeader('set-cookie')
      if (cookies !== undefined) {
        const kept = (Array.isArray(cookies) ? cookies : [String(cookies)]).filter(isDeletion)
        if (kept.length) res.setHeader('set-cookie', kept)
        else res.removeHeader('set-cookie')
      }
    }
    if (status >= 400 && status < 500) {
      if (typeof args[1] === 'string' && args[1] === 'Server Error') args[1] = STATUS_CODES[status] ?? 'Error'
      if (res.statusMessage === 'Server Error') res.statusMessage = STATUS_CODES[status] ?? 'Error'
    }
    return (writeHead as (...a: unknown[]) => typeof res).apply(this, args)
  } as typeof res.writeHead
})
