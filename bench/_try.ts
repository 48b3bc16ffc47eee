import { evaluate } from '../shared/physics/index'
function classHelicities(n: number, k: number): number[] { const m = k + 2; const h = Array<number>(n).fill(1); for (let t = 0; t < m; t++) h[Math.floor((t * n) / m)] = -1; return h }
for (const [th, n, k] of [['gluon',6,1],['gluon',8,1],['gluon',8,2],['gluon',9,2],['scalar-cubic',8,0]] as const) {
  const helicities = th === 'scalar-cubic' ? Array(n).fill(0) : classHelicities(n, k)
  const base = { theory: th as any, helicities, kinematics: { kind: 'rational' as const, seed: 1 }, arithmetic: 'exact' as const }
  let t = performance.now()
  const a = evaluate({ ...base, exact: { backend: 'rational' } })
  const ta = performance.now() - t
  const tm: number[] = []
  let b: any
  for (let r = 0; r < 5; r++) { t = performance.now(); b = evaluate(base); tm.push(performance.now() - t) }
  const same = JSON.stringify({ ...a, ms: 0 }) === JSON.stringify({ ...b, ms: 0 })
  console.log(th, n, k, 'rational', ta.toFixed(1), 'modular', tm.map((x) => x.toFixed(2)).join(' '), 'same', same, a.verdict, b.verdict)
  if (!same) { console.log(JSON.stringify(a).slice(0,600)); console.log(JSON.stringify(b).slice(0,600)) }
}
