import { it } from 'vitest'
import { Fraction, rationalField as Q } from '#shared/physics/field'
import { rationalPoint } from '#shared/physics/kinematics'
import { quarkLineBerendsGiele } from '#shared/physics/targets/quark-line'
import { shiftedKin, lnAbs, fit, PROBE_Z } from '#shared/physics/falloff'

function configs(n: number) {
  const out: { h: number[]; c: number[] }[] = []
  for (let a = 0; a < n; a++) for (let b = 0; b < n; b++) {
    if (a === b) continue
    for (let m = 0; m < 1 << n; m++) {
      const h = Array.from({ length: n }, (_, t) => ((m >> t) & 1 ? 1 : -1) * (t === a || t === b ? 0.5 : 1))
      if (h[a] === h[b]) continue
      const minus = h.filter(x => x < 0).length
      if (minus < 2 || n - minus < 2) continue
      const c = Array.from({ length: n }, (_, t) => (t === a ? -1 : t === b ? 1 : 21))
      out.push({ h, c })
    }
  }
  return out
}
it('falloff', () => {
  for (const n of [5, 6]) {
    const k = rationalPoint(n, 'fo' + n, { numerator: 9, denominator: 4 })
    const table = new Map<string, Set<number>>()
    for (const { h, c } of configs(n)) for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
      if (i === j) continue
      const ys = PROBE_Z.map(z => lnAbs(quarkLineBerendsGiele(Q, shiftedKin(k, i, j, new Fraction(z)), h, c)))
      const e = Math.round(fit(PROBE_Z.map(z => Math.log(Number(z))), ys).slope)
      const adj = (i - j + n) % n === 1 || (j - i + n) % n === 1
      const key = `${c[i] === 21 ? 'g' : c[i]! > 0 ? 'q' : 'Q'}${h[i]! > 0 ? '+' : '-'} ${c[j] === 21 ? 'g' : c[j]! > 0 ? 'q' : 'Q'}${h[j]! > 0 ? '+' : '-'} ${adj ? 'adj' : 'non'}`
      if (!table.has(key)) table.set(key, new Set())
      table.get(key)!.add(e)
    }
    console.log(n, [...table.entries()].sort().map(([k, v]) => `${k}: ${[...v].join(',')}`).join('\n'))
  }
})
