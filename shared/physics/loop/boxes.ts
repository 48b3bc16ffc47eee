// Every box of an n-point colour-ordered one-loop amplitude: four non-empty corners of cyclically
// consecutive legs, one per choice of four of the n gaps between legs (C(n, 4) boxes).

export type BoxKind = 'zero-mass' | 'one-mass' | 'two-mass-easy' | 'two-mass-hard' | 'three-mass' | 'four-mass'

export interface Box {
  /** Per corner its external legs (0-based) in colour order. */
  corners: number[][]
  kind: BoxKind
}

export function boxKind(corners: readonly (readonly number[])[]): BoxKind {
  const massive = corners.map((c) => c.length > 1)
  const m = massive.filter(Boolean).length
  if (m === 0) return 'zero-mass'
  if (m === 1) return 'one-mass'
  if (m === 3) return 'three-mass'
  if (m === 4) return 'four-mass'
  return massive[0] === massive[2] ? 'two-mass-easy' : 'two-mass-hard'
}

/** The boxes of n legs, ordered by their first cut (lexicographic in the gaps). */
export function allBoxes(n: number): Box[] {
  const out: Box[] = []
  for (let a = 0; a < n; a++)
    for (let b = a + 1; b < n; b++)
      for (let c = b + 1; c < n; c++)
        for (let d = c + 1; d < n; d++) {
          const cuts = [a, b, c, d]
          const corners = cuts.map((s, k) => {
            const e = k < 3 ? cuts[k + 1]! : a + n
            return Array.from({ length: e - s }, (_, t) => (s + t) % n)
          })
          out.push({ corners, kind: boxKind(corners) })
        }
  return out
}

/** The box with its corners relabelled to start at corner `start` (same box, another first corner). */
export function rotateBox(box: Box, start: number): Box {
  const corners = [0, 1, 2, 3].map((k) => box.corners[(k + start) % 4]!)
  return { corners, kind: boxKind(corners) }
}
