// POST /api/diagrams/:id/check-loop-cut: the rings drawn on a loop-cut diagram, checked against
// the engine's boxes (shared/editor/loop-cut-check.ts). Writes nothing.
import type { z } from 'zod'
import { GraphSchema } from './graph'
import { LoopCutRequestSchema } from './loop-cuts'

export const LoopCutDrawingCheckSchema = LoopCutRequestSchema.pick({ arithmetic: true, kinematics: true, corners: true, target: true }).extend({
  /** The canvas as drawn; absent: the diagram's saved graph. */
  graph: GraphSchema.optional(),
})
export type LoopCutDrawingCheck = z.output<typeof LoopCutDrawingCheckSchema>

/** POST /api/diagrams/:id/checks on a loop-cut diagram: the saved rings, checked and stored. */
export const LoopCutCheckRunSchema = LoopCutDrawingCheckSchema.omit({ graph: true })
export type LoopCutCheckRun = z.output<typeof LoopCutCheckRunSchema>
