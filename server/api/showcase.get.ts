// The landing page's worked example, public: the five-gluon MHV amplitude under the [1,2⟩ shift,
// expanded down to three-point vertices and drawn as the canvas export draws it, with the verdicts
// of the engine against Parke–Taylor in floating and in exact arithmetic. Computed once in the
// worker pool per process start and kept (it depends on nothing a visitor sends).
import type { Process } from '#shared/schemas/graph'
import { canvasSvg } from '#shared/editor/exports'
import { graphFromTree } from '#shared/editor/demo'
import { STRUCTURE_SEED } from '#shared/editor/expand'
import { evaluateRequest } from '#shared/editor/process'
import { floatTolerance } from '#shared/physics/verdict'
import type { EditorEdge, EditorNode } from '#shared/editor/types'

const PROCESS = { theory: 'gluon', helicities: [-1, -1, 1, 1, 1], shift: [1, 2] } satisfies Process

async function build() {
  const float = await evaluateInPool(evaluateRequest(PROCESS, { kinematics: { kind: 'random', seed: STRUCTURE_SEED }, target: 'auto', tree: true }))
  const exact = await evaluateInPool(evaluateRequest(PROCESS, { kinematics: { kind: 'rational', seed: 'showcase' }, target: 'auto', arithmetic: 'exact' }))
  const graph = graphFromTree(PROCESS, float, true)
  const svg = canvasSvg(graph.nodes as EditorNode[], graph.edges as EditorEdge[], { shift: graph.process?.shift ?? PROCESS.shift, padding: 24 })
  const verdictOf = (r: typeof float, seed: string) => ({
    arithmetic: r.arithmetic, verdict: r.verdict, deviation: r.deviation, target: r.target?.name ?? null,
    tolerance: r.arithmetic === 'float' ? floatTolerance(r.n) : null, seed, terms: r.terms.length, ms: r.ms,
  })
  return {
    process: { ...PROCESS, shift: graph.process?.shift ?? PROCESS.shift },
    svg,
    vertices: graph.nodes.filter(n => n.type === 'angle' || n.type === 'square').length,
    checks: [verdictOf(float, STRUCTURE_SEED), verdictOf(exact, 'showcase')],
    engine: float.engine.version,
  }
}

let cached: ReturnType<typeof build> | undefined
export default defineEventHandler(async () => {
  cached ??= build().catch((e) => { cached = undefined; throw evaluationHttpError(e) })
  return cached
})
