// Compiled drawings kept per worker thread, keyed on the packed graph itself: a check run again on
// the same canvas (new kinematics, target or arithmetic: the common case) skips unpacking,
// validation, the structure pass and the comparison, which cost more than the engine's whole check
// (bench/drawing.ts). A hit needs the same process and shift, the same text and the same numbers
// bit for bit, so it is exactly the drawing compiled before: any change is compiled afresh.
import { Buffer } from 'node:buffer'
import type { Process as GraphProcess } from '#shared/schemas/graph'
import type { EvaluateResponse } from '#shared/schemas/evaluate'
import { checkCompiled, compileDrawing, type CheckedResponse, type CompiledDrawing } from '#shared/editor/drawing/evaluate'
import { unpackDrawingGraph, type PackedGraph } from '#shared/editor/drawing/handoff'
import { processKey } from '#shared/editor/process'

interface Entry {
  process: string
  text: string
  nodeCount: number
  edgeCount: number
  bytes: Uint8Array
  compiled: CompiledDrawing
}

/** Drawings kept per thread; a packed graph of more numbers than MAX_NUMS is compiled every time. */
export const DRAWING_CACHE_SIZE = 16
const MAX_NUMS = 200_000
// Most recently used first: a few entries, so a scan with cheap length tests first beats hashing the pack.
const cache: Entry[] = []

const bytesOf = (a: Float64Array) => new Uint8Array(a.buffer, a.byteOffset, a.byteLength)
/** The compiled drawing of a packed graph for `proc` (the process with the check's shift): from the cache, or unpacked and compiled. */
export function compilePacked(proc: GraphProcess, p: PackedGraph): CompiledDrawing {
  // Values of no simple kind (never written by the editor) are not compared: compiled afresh.
  const cacheable = !!p && typeof p === 'object' && Array.isArray(p.other) && p.other.length === 0 && p.nums instanceof Float64Array && p.nums.length <= MAX_NUMS && typeof p.text === 'string'
  if (!cacheable) return compileDrawing(proc, unpackDrawingGraph(p))
  const bytes = bytesOf(p.nums)
  const process = processKey(proc)
  for (let k = 0; k < cache.length; k++) {
    const e = cache[k]!
    if (e.nodeCount !== p.nodeCount || e.edgeCount !== p.edgeCount || e.bytes.length !== bytes.length || e.text.length !== p.text.length) continue
    if (e.process !== process || e.text !== p.text || Buffer.compare(e.bytes, bytes) !== 0) continue
    if (k > 0) {
      cache.splice(k, 1)
      cache.unshift(e)
    }
    return e.compiled
  }
  const compiled = compileDrawing(proc, unpackDrawingGraph(p))
  // A copy of the numbers: the caller's array may be reused or transferred.
  cache.unshift({ process, text: p.text, nodeCount: p.nodeCount, edgeCount: p.edgeCount, bytes: bytesOf(p.nums.slice()), compiled })
  if (cache.length > DRAWING_CACHE_SIZE) cache.pop()
  return compiled
}

/** checkDrawing of a packed graph (the worker's task), compiled once per drawing and process. */
export function checkPackedDrawing(res: EvaluateResponse, process: GraphProcess, p: PackedGraph): CheckedResponse {
  const proc: GraphProcess = { ...process, shift: res.shift }
  return checkCompiled(res, proc, compilePacked(proc, p))
}

/** Empties this thread's cache (a benchmark of a first check; tests). */
export function clearDrawingCache(): void {
  cache.length = 0
}
