// Depth and size bounds for free-form JSON fields (node data, edge data, editor settings). Walks
// iteratively, so a value nested thousands of levels deep is measured without recursion; such a
// value would otherwise overflow the stack later, when it is serialised for a page.
import type { z } from 'zod'

/** Deepest nesting allowed inside a free-form field, and the most values one field may hold. */
export const JSON_MAX_DEPTH = 24
export const JSON_MAX_VALUES = 20_000

/** How deep `value` nests (a scalar is 0, `{}` is 1), stopping early once past `limit`. */
export function jsonDepth(value: unknown, limit = JSON_MAX_DEPTH): { depth: number, values: number } {
  let depth = 0
  let values = 0
  const stack: [unknown, number][] = [[value, 0]]
  while (stack.length) {
    const [v, d] = stack.pop()!
    values++
    if (v === null || typeof v !== 'object') continue
    const level = d + 1
    if (level > depth) depth = level
    if (depth > limit || values > JSON_MAX_VALUES) break
    for (const child of Array.isArray(v) ? v : Object.values(v)) stack.push([child, level])
  }
  return { depth, values }
}

/** A superRefine check: each key of an object (a node, its data, the settings) is bounded. */
export function boundedFields(value: Record<string, unknown>, ctx: z.RefinementCtx, maxDepth = JSON_MAX_DEPTH, skip: readonly string[] = []) {
  for (const [key, v] of Object.entries(value)) {
    if (skip.includes(key)) continue
    const { depth, values } = jsonDepth(v, maxDepth)
    if (depth > maxDepth) ctx.addIssue({ code: 'custom', path: [key], message: `nests more than ${maxDepth} levels deep` })
    else if (values > JSON_MAX_VALUES) ctx.addIssue({ code: 'custom', path: [key], message: `holds more than ${JSON_MAX_VALUES} values` })
  }
}

/** The same check for the extra keys a loose object keeps (`checked` fields have their own). */
export const boundedExtras = (checked: readonly string[]) => (value: Record<string, unknown>, ctx: z.RefinementCtx) => boundedFields(value, ctx, JSON_MAX_DEPTH, checked)

/**
 * A copy of a stored value with anything nested deeper than `maxDepth` replaced by null, and the
 * paths that were cut: a graph saved before the bound existed still opens (the row stays as stored).
 */
export function pruneDeep(value: unknown, maxDepth = JSON_MAX_DEPTH * 2): { value: unknown, cut: string[] } {
  const cut: string[] = []
  const root: { v: unknown } = { v: undefined }
  const stack: { src: unknown, set: (x: unknown) => void, depth: number, path: string }[] = [{ src: value, set: (x) => { root.v = x }, depth: 0, path: '' }]
  while (stack.length) {
    const { src, set, depth, path } = stack.pop()!
    if (src === null || typeof src !== 'object') {
      set(src)
      continue
    }
    if (depth >= maxDepth) {
      set(null)
      if (cut.length < 20) cut.push(path || '(root)')
      continue
    }
    if (Array.isArray(src)) {
      const out: unknown[] = Array.from({ length: src.length })
      set(out)
      src.forEach((x, i) => stack.push({ src: x, set: (y) => { out[i] = y }, depth: depth + 1, path: `${path}[${i}]` }))
    }
    else {
      const out: Record<string, unknown> = {}
      set(out)
      for (const [k, x] of Object.entries(src)) stack.push({ src: x, set: (y) => { out[k] = y }, depth: depth + 1, path: path ? `${path}.${k}` : k })
    }
  }
  return { value: root.v, cut }
}
