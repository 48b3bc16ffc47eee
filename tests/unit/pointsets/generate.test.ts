// Generated sets reproduce from their seed; their invariants agree with s_ij = 2 p_i·p_j computed
// directly from the momenta (massless legs, mostly-minus metric, docs/conventions.md).
import { describe, expect, it } from 'vitest'
import { generatePoints, generatePoint, invariantMatrix, kinOf, minInvariantRatio, validatePoints, GenerateSchema } from '#shared/pointsets'

describe('generated point sets', () => {
  it('reproduce from the seed, point by point', () => {
    const a = [...generatePoints({ kind: 'physical', n: 6, count: 20, seed: 42, energy: 13 })]
    const b = [...generatePoints({ kind: 'physical', n: 6, count: 20, seed: 42, energy: 13 })]
    expect(a).toEqual(b)
    expect(generatePoint('physical', 6, 42, 7, 13)).toEqual(a[7])
    const c = [...generatePoints({ kind: 'physical', n: 6, count: 20, seed: 43, energy: 13 })]
    expect(c[0]).not.toEqual(a[0])
    const r1 = [...generatePoints({ kind: 'random', n: 7, count: 5, seed: 1 })]
    expect([...generatePoints({ kind: 'random', n: 7, count: 5, seed: 1 })]).toEqual(r1)
  })

  it('physical points: legs 1, 2 incoming along ±z with √s = energy, all valid', () => {
    const pts = [...generatePoints({ kind: 'physical', n: 5, count: 50, seed: 5, energy: 91 })]
    for (const p of pts) {
      const m = p.momenta!
      expect(m[0]![0]).toBeCloseTo(-45.5, 9)
      expect(m[1]![0]).toBeCloseTo(-45.5, 9)
      expect(m.slice(2).every(q => q[0] > 0)).toBe(true)
    }
    expect(validatePoints(pts, 5).rejected).toEqual([])
  })

  it('s_ij from spinors equals 2 p_i·p_j from the momenta', () => {
    const p = generatePoint('physical', 6, 1, 0, 2)
    const m = p.momenta!
    const s = invariantMatrix(kinOf(p))
    const dot = (a: number[], b: number[]) => a[0]! * b[0]! - a[1]! * b[1]! - a[2]! * b[2]! - a[3]! * b[3]!
    for (let i = 0; i < 6; i++) {
      for (let j = i + 1; j < 6; j++) {
        expect(s[i]![j]![0]).toBeCloseTo(2 * dot(m[i]!, m[j]!), 10)
        expect(Math.abs(s[i]![j]![1])).toBeLessThan(1e-12)
      }
    }
    // For 2 → n the largest |s_ij| is s = energy² (s_12).
    const all = s.flat().map(x => Math.abs(x[0]))
    expect(Math.max(...all)).toBeCloseTo(4, 10)
    expect(minInvariantRatio(kinOf(p))).toBeCloseTo(Math.min(...all.filter(x => x > 1e-12)) / 4, 10)
  })

  it.each([
    [{ kind: 'physical', n: 3, count: 1, seed: 1 }, 'n'],
    [{ kind: 'physical', n: 5, count: 10001, seed: 1 }, 'count'],
    [{ kind: 'soft', n: 5, count: 1, seed: 1 }, 'kind'],
    [{ kind: 'physical', n: 5, count: 1, seed: 1, energy: -1 }, 'energy'],
  ])('refuses bad parameters naming the field (%#)', (body, field) => {
    const r = GenerateSchema.safeParse(body)
    expect(r.success).toBe(false)
    expect(r.error!.issues[0]!.path).toEqual([field])
  })
})

describe('plot data', () => {
  it('bins log10 deviations in half decades and counts exact zeros apart', async () => {
    const { deviationHistogram, deviationScatter } = await import('#shared/pointsets')
    const h = deviationHistogram([1e-15, 3e-15, 2e-13, 0, null, 9.9e-10])
    expect(h.zeros).toBe(1)
    expect(h.lo).toBe(-15)
    expect(h.hi).toBe(-9)
    expect(h.bins).toHaveLength(12)
    expect(h.bins[0]).toEqual({ from: -15, to: -14.5, count: 2 })
    expect(h.bins.reduce((a, b) => a + b.count, 0)).toBe(4)
    expect(h.bins.at(-1)!.count).toBe(1)
    const s = deviationScatter({ idx: [0, 1, 2], deviation: [1e-12, 0, 1e-10], minInvariant: [0.01, 0.5, 1e-4], verdict: ['agrees', 'agrees', 'agrees'] })
    expect(s).toEqual([{ x: -2, y: -12, idx: 0, verdict: 'agrees' }, { x: -4, y: -10, idx: 2, verdict: 'agrees' }])
  })
})
