// Edits of a canvas the drawing tests share.
import type { EditorEdge, EditorNode } from '#shared/editor/types'

export type G = { nodes: EditorNode[], edges: EditorEdge[] }

/** Flips a Line's helicity as the editor does: both ends change sign. */
export function flipped(g: G, edgeId: string): G {
  return {
    nodes: g.nodes,
    edges: g.edges.map((e) => {
      if (e.id !== edgeId) return e
      const d = e.data as { helicity: number, targetHelicity?: number }
      return { ...e, data: { ...d, helicity: -d.helicity, targetHelicity: -(d.targetHelicity ?? -d.helicity) } }
    }),
  }
}
