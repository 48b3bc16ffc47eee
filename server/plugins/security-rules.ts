// nuxt-security resolves its per-route rules on every request from a structured clone of all its
// options (a router built anew each time) and draws a CSP nonce: ≈ 12 % of the request thread's
// CPU for a small /api/evaluate. For /api paths this plugin hands it the same rules, resolved once
// per path the way nuxt-security does (radix3 matches, merged with arrays replaced) and frozen, so
// no request can change what the next one sees. API answers are JSON and never rendered, so they
// need no nonce (nonce: false here; pages keep nuxt-security's own per-request rules and nonce).
// Runs before nuxt-security's hooks: project plugins are registered first.
import { createDefu } from 'defu'
import { createRouter, toRouteMatcher } from 'radix3'

type Rules = Record<string, unknown>
const mergeReplacingArrays = createDefu((obj, key, value) => {
  if (Array.isArray(obj[key]) || Array.isArray(value)) {
    (obj as Record<PropertyKey, unknown>)[key] = value
    return true
  }
})

function deepFreeze<T>(x: T): T {
  if (x && typeof x === 'object' && !Object.isFrozen(x)) {
    Object.freeze(x)
    for (const v of Object.values(x)) deepFreeze(v)
  }
  return x
}

export default defineNitroPlugin((nitroApp) => {
  let options: Record<string, Rules> | null = null
  let resolve: ((path: string) => { rules: Rules, route: string }) | null = null
  const cache = new Map<string, { rules: Rules, route: string }>()
  // The options object nuxt-security reads from (passed when it is ready), and any later change.
  nitroApp.hooks.hook('nuxt-security:routeRules', (o: Record<string, Rules>) => {
    options = o
    resolve = null
  })
  nitroApp.hooks.hook('nuxt-security:headers', () => {
    resolve = null
  })
  nitroApp.hooks.hook('request', (event) => {
    const path = event.path.split('?')[0]!
    if (!options || !path.startsWith('/api/')) return
    if (!resolve) {
      cache.clear()
      const snapshot = structuredClone(options)
      const matcher = toRouteMatcher(createRouter({ routes: snapshot }))
      const names = createRouter({ routes: Object.fromEntries(Object.keys(snapshot).map(name => [name, { name }])) })
      resolve = p => ({
        rules: { ...mergeReplacingArrays({}, ...(matcher.matchAll(p) as Rules[]).reverse()), nonce: false },
        route: (names.lookup(p)?.name as string | undefined) ?? '',
      })
    }
    let hit = cache.get(path)
    if (!hit) {
      hit = deepFreeze(resolve(path))
      if (cache.size >= 2000) cache.clear()
      cache.set(path, hit)
    }
    const ctx = (event.context.security ??= {}) as Record<string, unknown>
    ctx.rules ??= hit.rules
    ctx.route ??= hit.route
  })
})
