// The canvas's node and edge components, keyed by the graph's node type (Vue Flow `node-types`).
// Their data types live in shared/editor/types.ts (the graph document shares them).
import { markRaw } from 'vue'
import type { NodeTypesObject, EdgeTypesObject } from '@vue-flow/core'
import LegNode from './LegNode.vue'
import AngleVertexNode from './AngleVertexNode.vue'
import SquareVertexNode from './SquareVertexNode.vue'
import BlockNode from './BlockNode.vue'
import TermFrameNode from './TermFrameNode.vue'
import LineEdge from '../edges/LineEdge.vue'

export type { LegData, VertexData, BlockData, LineData } from '#shared/editor/types'

// Boundary: Vue Flow types node components by its own NodeProps; ours declare the graph's data types.
export const nodeTypes = markRaw({
  leg: LegNode,
  angle: AngleVertexNode,
  square: SquareVertexNode,
  block: BlockNode,
  termframe: TermFrameNode,
}) as unknown as NodeTypesObject

export const edgeTypes = markRaw({ line: LineEdge }) as unknown as EdgeTypesObject
