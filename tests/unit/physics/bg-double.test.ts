// The Berends–Giele target (Berends & Giele, Nucl. Phys. B306 (1988) 759) runs in doubles when the
// independent BCFW value confirms it, else in double-double (docs/engine.md "Berends–Giele"): the
// target a response carries stays within 1e-12 of the double-double recursion.
import { describe, expect, it } from 'vitest'
import { evaluate } from '#shared/physics/index'
import { complexField as C } from '#shared/physics/field'
import { randomPoint } from '#shared/physics/kinematics'
import { berendsGiele } from '#shared/physics/targets/berends-giele'

const rel = (a: [number, number], b: { re: number, im: number }) => Math.hypot(a[0] - b.re, a[1] - b.im) / Math.hypot(b.re, b.im)

describe('Berends–Giele target in doubles when BCFW confirms it', () => {
  it.each([
    [[-1, -1, -1, 1, 1, 1]], [[-1, 1, -1, 1, -1, 1]], [[-1, -1, -1, 1, 1, 1, 1, 1]], [[-1, -1, 1, -1, -1, 1, 1, 1, 1, 1]],
  ])('%j: the response\'s target is the double-double value to 1e-12, the verdict agrees', (h) => {
    for (let seed = 1; seed <= 5; seed++) {
      const r = evaluate({ theory: 'gluon', helicities: h, kinematics: { kind: 'random', seed }, target: 'berends-giele' })
      expect(r.verdict).toBe('agrees')
      const dd = berendsGiele(C, randomPoint(h.length, seed), h)
      expect(rel(r.target!.value as [number, number], dd)).toBeLessThan(1e-12)
    }
  })
})
