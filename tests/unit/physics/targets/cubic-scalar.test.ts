// The cubic-scalar diagram sum against an explicit enumeration of planar cubic trees. A planar
// cubic tree with n colour-ordered legs is a triangulation of the n-gon (each diagonal a propagator);
// their number is the Catalan number C_{n−2} (the classical Euler–Segner count of polygon
// triangulations; reference from memory).
import { describe, expect, it } from 'vitest'
import { Fraction, complexField as C, rationalField as Q } from '#shared/physics/field'
import { mandelstam } from '#shared/physics/spinors'
import { cubicScalarFeynman } from '#shared/physics/targets/cubic-scalar'
import { permuteKin, randomComplexPoint, randomRationalPoint, relDiff } from './_points'

/**
 * Every triangulation of the polygon with vertices 0..n−1, as lists of diagonals [i, j] (i < j).
 * Vertex v of the polygon sits between legs v−1 and v, so diagonal [i, j] is the channel of legs
 * i..j−1 (0-based).
 */
function triangulations(vertices: number[]): Array<Array<[number, number]>> {
  if (vertices.length < 3) return [[]]
  const a = vertices[0]!
  const b = vertices[vertices.length - 1]!
  const out: Array<Array<[number, number]>> = []
  // The triangle on the edge (a, b) has a third vertex c.
  for (let t = 1; t < vertices.length - 1; t++) {
    const c = vertices[t]!
    const left = triangulations(vertices.slice(0, t + 1))
    const right = triangulations(vertices.slice(t))
    for (const L of left) {
      for (const R of right) {
        const d: Array<[number, number]> = [...L, ...R]
        if (t > 1) d.push([a, c])
        if (t < vertices.length - 2) d.push([c, b])
        out.push(d)
      }
    }
  }
  return out
}

function catalan(m: number): number {
  let c = 1
  for (let i = 0; i < m; i++) c = (c * 2 * (2 * i + 1)) / (i + 2)
  return c
}

function enumerated(k: ReturnType<typeof randomRationalPoint>): Fraction {
  const n = k.lambda.length
  const verts = Array.from({ length: n }, (_, v) => v)
  let sum = new Fraction(0)
  for (const diagram of triangulations(verts)) {
    let term = new Fraction(1)
    for (const [i, j] of diagram) {
      const legs = Array.from({ length: j - i }, (_, t) => i + t)
      term = term.div(mandelstam(Q, k, legs))
    }
    sum = sum.add(term)
  }
  return sum
}

describe('planar cubic trees: count and diagram sum', () => {
  it.each([3, 4, 5, 6, 7, 8])('n = %i: C_{n−2} triangulations, each with n − 3 propagators', (n) => {
    const t = triangulations(Array.from({ length: n }, (_, v) => v))
    expect(t.length).toBe(catalan(n - 2))
    for (const d of t) expect(d.length).toBe(n - 3)
    expect(new Set(t.map((d) => JSON.stringify([...d].sort()))).size).toBe(t.length)
  })
  it.each([4, 5, 6, 7, 8])('n = %i: recursion = explicit enumeration (exact)', (n) => {
    const k = randomRationalPoint(n, `cubic-${n}`)
    expect(cubicScalarFeynman(Q, k).equals(enumerated(k))).toBe(true)
  })
  it('A_4 = 1/s12 + 1/s23 (docs/conventions.md)', () => {
    const k = randomRationalPoint(4, 'cubic-a4')
    const expected = new Fraction(1).div(mandelstam(Q, k, [0, 1])).add(new Fraction(1).div(mandelstam(Q, k, [1, 2])))
    expect(cubicScalarFeynman(Q, k).equals(expected)).toBe(true)
  })
  it.each([5, 6, 7])('n = %i: cyclic and reflection symmetry of the colour-ordered sum', (n) => {
    const k = randomComplexPoint(n, `cubic-sym-${n}`)
    const base = cubicScalarFeynman(C, k)
    const rot = Array.from({ length: n }, (_, a) => (a + 1) % n)
    const rev = Array.from({ length: n }, (_, a) => n - 1 - a)
    expect(relDiff(cubicScalarFeynman(C, permuteKin(k, rot)), base)).toBeLessThan(1e-12)
    expect(relDiff(cubicScalarFeynman(C, permuteKin(k, rev)), base)).toBeLessThan(1e-12)
  })
  it('three points: the vertex, 1', () => {
    const k = randomRationalPoint(4, 'c3')
    const three = { lambda: k.lambda.slice(0, 3), lambdaTilde: k.lambdaTilde.slice(0, 3) }
    expect(cubicScalarFeynman(Q, three).equals(new Fraction(1))).toBe(true)
  })
})
