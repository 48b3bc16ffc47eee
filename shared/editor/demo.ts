// A process expanded into its channel terms and laid out, as the editor's Expand command does it,
// computed by the engine directly (the demo seed runs without a browser or an HTTP round trip).
import type { Graph, Process } from '../schemas/graph'
import type { EvaluateResponse } from '../schemas/evaluate'
import { GRAPH_SCHEMA_VERSION } from '../schemas/graph'
import { evaluate } from '../physics/index'
import { expandAllSpecs, specsToGraph, STRUCTURE_SEED, topSpecs } from './expand'
import { evaluateRequest, processKey, toLabels } from './process'
import { layoutGraph } from './layout'
import { readableSpecs } from './collapse'
import { processSpecies } from './species'

/** `full`: every Block opened; 'readable': as Expand fully does it (collapse.ts). */
export function expandedGraph(process: Process, full: boolean | 'readable' = false): Graph {
  return graphFromTree(process, evaluate(evaluateRequest(process, { kinematics: { kind: 'random', seed: STRUCTURE_SEED }, target: 'none', tree: true })), full)
}

/** The laid-out graph of an evaluation made with `tree: true` (from the engine or the worker pool). */
export function graphFromTree(process: Process, response: EvaluateResponse, full: boolean | 'readable' = false): Graph {
  const res = toLabels(response, process)
  const p: Process = { ...process, shift: res.shift }
  const specs = full === 'readable' ? readableSpecs(res.terms, true) : full ? expandAllSpecs(res.terms, topSpecs(res.terms)) : topSpecs(res.terms)
  const g = specsToGraph(res.terms, specs, undefined, processSpecies(p) ?? undefined)
  return {
    schemaVersion: GRAPH_SCHEMA_VERSION,
    process: p,
    settings: { expansion: { key: processKey(p), seed: STRUCTURE_SEED, specs } },
    nodes: layoutGraph(g.nodes, g.edges) as Graph['nodes'],
    edges: g.edges as Graph['edges'],
  }
}
