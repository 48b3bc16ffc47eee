import { complexField as C } from '../shared/physics/field'
import { primeFieldAt } from '../shared/physics/finite-field'
import { kinAt } from '../shared/physics/modular'
import { randomPoint, rationalPoint } from '../shared/physics/kinematics'
import { bcfw } from '../shared/physics/bcfw'
import { defaultShift, processOf } from '../shared/physics/theories'
import { berendsGiele } from '../shared/physics/targets/berends-giele'
const g = processOf('gluon')
for (const h of [[-1,1,1,-1,1,1,-1,1],[-1,1,-1,1,-1,1,-1,1],[-1,1,-1,1,1,-1,1,-1,1]]) {
  const n = h.length
  const kq = rationalPoint(n, 1), kc = randomPoint(n, 1)
  const sh = defaultShift(g, h)
  const F = primeFieldAt(0); const km = kinAt(kq, 0)!
  const T = (f: () => unknown) => { for (let i = 0; i < 300; i++) f(); const t = performance.now(); for (let i = 0; i < 2000; i++) f(); return ((performance.now() - t) / 2000 * 1000).toFixed(1) + 'us' }
  console.log(n, h.join(''), 'float', T(() => bcfw(C, g, kc, h, sh)), 'prime', T(() => bcfw(F, g, km, h, sh)), 'BG prime', T(() => berendsGiele(F, km, h)))
}
