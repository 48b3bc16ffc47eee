// The API page's examples are real: each parses with the schema its route validates with, and
// each example of a route that writes nothing succeeds against the built server, as written.
import { describe, expect, it } from 'vitest'
import { API_SECTIONS, curlSnippet, examplePath, fetchSnippet } from '#shared/docs/api-routes'
import { baseURL, newUser } from '../helpers/api'

const routes = API_SECTIONS.flatMap(s => s.routes)
const examples = routes.flatMap(r => (r.examples ?? []).map(ex => [`${r.method} ${r.path}: ${ex.label}`, r, ex.body] as const))

describe('API page examples', () => {
  it.each(examples)('%s parses with its schema', (_name, route, body) => {
    const parsed = route.schema!.safeParse(body)
    expect(parsed.success, JSON.stringify(parsed.error?.issues)).toBe(true)
  })

  it('every route file the page names exists in the access matrix', async () => {
    const { matrix } = await import('./access-matrix')
    const files = new Set(matrix.map(m => m.file))
    for (const r of routes) {
      const file = r.path.replace(/^\/api\//, '').replace(/:(\w+)/g, '[$1]')
      const candidates = [`${file}.${r.method.toLowerCase()}.ts`, `${file}/index.${r.method.toLowerCase()}.ts`]
      expect(candidates.some(c => files.has(c)), `${r.method} ${r.path}`).toBe(true)
    }
  })

  const runnable = [...examples.filter(([, r]) => r.runnable), ...routes.filter(r => r.runnable && !r.examples).map(r => [`${r.method} ${r.path}`, r, undefined] as const)]
  it.each(runnable)('%s runs (2xx)', async (_name, route, body) => {
    const u = await newUser('docs')
    const res = await u.req(route.method, examplePath(route), body)
    expect(res.status, JSON.stringify(res.body).slice(0, 400)).toBeLessThan(300)
  })

  it('the snippets carry the method, the URL, the token and the body', () => {
    const r = routes.find(x => x.id === 'evaluate')!
    const body = r.examples![0]!.body
    const curl = curlSnippet(baseURL(), r, body)
    expect(curl).toContain(`curl -X POST '${baseURL()}/api/evaluate'`)
    expect(curl).toContain('Authorization: Bearer $POLEWRIGHT_TOKEN')
    expect(curl).toContain(`-d '${JSON.stringify(body)}'`)
    const js = fetchSnippet(baseURL(), r, body)
    expect(js).toContain(`fetch('${baseURL()}/api/evaluate'`)
    expect(JSON.parse(js.slice(js.indexOf('JSON.stringify(') + 15, js.lastIndexOf('),')))).toEqual(body)
  })
})
