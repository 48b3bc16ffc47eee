// The API page's point-set section: every example parses with its route's schema, and the JSON
// Schemas the page shows can be generated.
import { describe, expect, it } from 'vitest'
import { POINT_SET_SECTION } from '#shared/pointsets/docs'
import { JsonPointFileSchema } from '#shared/pointsets/json'
import { jsonSchemaOf } from '#shared/docs/api-routes'

describe('API docs: point sets', () => {
  const withExamples = POINT_SET_SECTION.routes.filter(r => r.schema)
  it.each(withExamples.flatMap(r => r.examples!.map(e => [r.id, e.label, r] as const)))('%s: "%s" parses', (_id, label, route) => {
    const body = route.examples!.find(e => e.label === label)!.body
    expect(route.schema!.safeParse(body).success).toBe(true)
    expect(jsonSchemaOf(route.schema!)).toHaveProperty('properties')
  })
  it('the JSON layout has a JSON Schema', () => {
    expect(jsonSchemaOf(JsonPointFileSchema)).toHaveProperty('properties.points')
  })
  it('paths are unique', () => {
    const keys = POINT_SET_SECTION.routes.map(r => `${r.method} ${r.path}`)
    expect(new Set(keys).size).toBe(keys.length)
  })
})
