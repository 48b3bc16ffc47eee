import { it } from 'vitest'
import { rationalField as Q } from '#shared/physics/field'
import { rationalPoint } from '#shared/physics/kinematics'
import { quarkLineBerendsGiele } from '#shared/physics/targets/quark-line'
import { quarkMhvValue, classifyQuarkMhv } from '#shared/physics/targets/quark-mhv'

function configs(n: number) {
  const out: { h: number[]; c: number[] }[] = []
  for (let a = 0; a < n; a++) for (let b = 0; b < n; b++) {
    if (a === b) continue
    for (let m = 0; m < 1 << n; m++) {
      const h = Array.from({ length: n }, (_, t) => ((m >> t) & 1 ? 1 : -1) * (t === a || t === b ? 0.5 : 1))
      if (h[a] === h[b]) continue
      const c = Array.from({ length: n }, (_, t) => (t === a ? -1 : t === b ? 1 : 21))
      out.push({ h, c })
    }
  }
  return out
}
it('gauge', () => {
  for (const n of [4, 5, 6]) {
    const k = rationalPoint(n, 'gi' + n)
    let bad = 0, tot = 0
    const ratios = new Map<string, number>()
    for (const { h, c } of configs(n)) {
      const v0 = quarkLineBerendsGiele(Q, k, h, c)
      const v1 = quarkLineBerendsGiele(Q, k, h, c, { reference: 3 })
      tot++
      if (!Q.equals(v0, v1)) bad++
      const cf = quarkMhvValue(Q, k, h, c)
      if (cf !== null) {
        const r = Q.isZero(cf) ? 'cf0' : Q.div(v0, cf).toString()
        const cl = classifyQuarkMhv(h, c)
        const key = `${cl.kind} hqbar${h[cl.qbar]! > 0 ? '+' : '-'}`
        ratios.set(key + ' ' + r, (ratios.get(key + ' ' + r) ?? 0) + 1)
      }
    }
    console.log(n, 'gauge bad', bad, 'of', tot)
    console.log([...ratios.entries()])
  }
})
