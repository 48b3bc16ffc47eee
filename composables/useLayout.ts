// The editor's automatic layout (dagre per term, terms packed in rows). The pure functions live in
// shared/editor/layout.ts so the demo seed and the unit tests use them without Nuxt.
import { components, layoutGraph, layoutPositions } from '~~/shared/editor/layout'

export { components, layoutGraph, layoutPositions }
export type { LayoutOptions } from '~~/shared/editor/layout'

export function useLayout() {
  return { layoutGraph, layoutPositions, components }
}
