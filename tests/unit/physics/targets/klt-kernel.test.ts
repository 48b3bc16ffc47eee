// KLT for any n by the momentum kernel (Bern, Dixon, Perelstein, Rozowsky, Nucl. Phys. B546 (1999)
// 423; kernel of Bjerrum-Bohr, Damgaard, Søndergaard, Vanhove, arXiv:1010.3933): equal to the
// explicit n = 4, 5, 6 forms for every helicity (exactly), to Hodges' formula (Hodges,
// arXiv:1204.1930) for seven-graviton MHV and anti-MHV, and to BCFW for seven-graviton NMHV —
// the process that had no target before.
import { describe, expect, it } from 'vitest'
import { complexField as C, rationalField as Q } from '#shared/physics/field'
import { klt, kltKernel } from '#shared/physics/targets/klt'
import { hodges } from '#shared/physics/targets/hodges'
import { evaluate } from '#shared/physics/index'
import { randomComplexPoint, randomRationalPoint, relDiff } from './_points'

const allGraviton = (n: number) => Array.from({ length: 1 << n }, (_, m) => Array.from({ length: n }, (_, t) => (m & (1 << t) ? 2 : -2)))

describe('the kernel form equals the explicit forms exactly', () => {
  it.each([4, 5])('every helicity at n = %i', (n) => {
    const k = randomRationalPoint(n, `kernel-${n}`)
    for (const h of allGraviton(n)) expect(kltKernel(Q, k, h).equals(klt(Q, k, h)), h.join(',')).toBe(true)
  })
  it.each([[[-2, 2, -2, 2, -2, 2]], [[-2, -2, -2, 2, 2, 2]], [[2, -2, 2, 2, -2, -2]], [[-2, -2, 2, 2, 2, 2]]])('n = 6, %j', (h) => {
    const k = randomRationalPoint(6, 'kernel-6')
    expect(kltKernel(Q, k, h).equals(klt(Q, k, h))).toBe(true)
  })
})

describe('seven gravitons', () => {
  it.each([[[-2, -2, 2, 2, 2, 2, 2]], [[2, -2, 2, -2, 2, 2, 2]], [[2, 2, -2, -2, -2, -2, -2]]])('= Hodges for %j', (h) => {
    const k = randomComplexPoint(7, 'kernel-7')
    expect(relDiff(klt(C, k, h), hodges(C, k, h))).toBeLessThan(1e-11)
  })
  it('NMHV: evaluate() now has a target (auto → klt) and agrees with BCFW', () => {
    const r = evaluate({ theory: 'graviton', helicities: [-2, 2, -2, 2, -2, 2, 2], kinematics: { kind: 'random', seed: 1 } })
    expect(r.target!.name).toBe('klt')
    expect(r.verdict).toBe('agrees')
    expect(r.deviation!).toBeLessThan(1e-12)
  })
})
