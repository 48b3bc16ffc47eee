// Which N = 4 states cross a quadruple cut of a gluon amplitude, by counting Grassmann degrees
// per SU(4) index (common practice of the on-shell superspace: corner superamplitudes are
// δ⁸(Q)/… for MHV, δ⁴(…)/… for the anti-MHV three-point vertex, so each index A carries k
// Grassmann variables per corner, k = 2 for MHV, 1 for the square vertex; a negative-helicity
// gluon carries η⁴, a positive one none; ∫d⁴η of an internal line puts each η^A on one end).
// Per index an orientation says at which end of every line its η^A sits; the corners' degrees
// must come out right. Where every consistent degree pattern has a single orientation, all four
// indices share it: only gluons cross, and the gluon-only helicity sum is the N = 4 state sum.
// Otherwise fermions and scalars contribute too (not summed by the engine).
import type { VertexKind } from '../three-point'
import type { Box } from './boxes'

/**
 * Orientations (bit l set: line l's η at its −ℓ end, in corner l, i.e. h_l = +1 for a gluon) that
 * give every corner an allowed degree, grouped by their degree pattern.
 */
export function orientations(box: Box, kinds: readonly (VertexKind | null)[], helicities: readonly number[]): Map<string, number[]> {
  const groups = new Map<string, number[]>()
  const minus = box.corners.map((c) => c.filter((e) => helicities[e]! < 0).length)
  const low = kinds.map((kind) => (kind === 'square' ? 1 : 2))
  const high = kinds.map((kind, q) => (kind ? low[q]! : box.corners[q]!.length))
  for (let o = 0; o < 16; o++) {
    let key = ''
    let ok = true
    for (let q = 0; q < 4 && ok; q++) {
      const d = minus[q]! + ((o >> q) & 1) + (1 - ((o >> ((q + 1) % 4)) & 1))
      ok = d >= low[q]! && d <= high[q]!
      key += d
    }
    if (!ok) continue
    const g = groups.get(key)
    if (g) g.push(o)
    else groups.set(key, [o])
  }
  return groups
}

/** 'gluons' where the gluon-only state sum is the N = 4 one, 'multiplet' otherwise. */
export function cutStates(box: Box, kinds: readonly (VertexKind | null)[], helicities: readonly number[]): 'gluons' | 'multiplet' {
  for (const g of orientations(box, kinds, helicities).values()) if (g.length > 1) return 'multiplet'
  return 'gluons'
}

/** The gluon helicities h_1..h_4 of an orientation. */
export const helicitiesOf = (o: number): number[] => [0, 1, 2, 3].map((l) => ((o >> l) & 1 ? 1 : -1))
