import { evaluate } from '../shared/physics/index'
const which = process.argv[2] ?? 'g8'
const base: any = which === 'g8' ? { theory: 'gluon', helicities: [-1,1,1,-1,1,1,-1,1], kinematics: { kind: 'rational', seed: 1 }, arithmetic: 'exact', target: process.argv[3] ?? 'none' }
  : { theory: 'scalar-cubic', helicities: [0,0,0,0,0,0,0,0], kinematics: { kind: 'rational', seed: 1 }, arithmetic: 'exact', target: process.argv[3] ?? 'none' }
for (let r = 0; r < 50; r++) evaluate(base)
const N = 200
const t = performance.now()
for (let r = 0; r < N; r++) evaluate(base)
console.log(which, 'ms', (performance.now() - t) / N)
