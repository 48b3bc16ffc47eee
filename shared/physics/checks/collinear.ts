// The collinear check for gluons: adjacent legs a, b = a+1 become collinear with momentum fractions
// z and 1 − z of P, λ_a = √z λ_P + δ √(1−z) η, λ_b = √(1−z) λ_P − δ √z η (the same for λ̃ with η̃),
// so p_a + p_b = P + δ² η η̃ᵀ and ⟨ab⟩, [ab] are O(δ); along δ = 10⁻¹ … 10⁻⁸ the ratio
//   A_n / Σ_h Split(h; a, b) A_{n−1}(…, P^h, …) → 1
// with the tree splitting amplitudes (Mangano & Parke, Phys. Rept. 200 (1991) 301; Bern, Dixon,
// Dunbar, Kosower, hep-ph/9403226), h the helicity of P as an outgoing leg of A_{n−1}. Their
// signs in our conventions follow from Parke–Taylor (angle forms) and from its conjugate, whose
// (−1)ⁿ changes sign between n and n − 1 (square forms); with r = 1/√(z(1−z)):
//   Split(+; a⁺, b⁺) = r/⟨ab⟩          Split(−; a⁻, b⁻) = −r/[ab]
//   Split(−; a⁻, b⁺) = r z²/⟨ab⟩       Split(+; a⁺, b⁻) = −r z²/[ab]
//   Split(−; a⁺, b⁻) = r (1−z)²/⟨ab⟩   Split(+; a⁻, b⁺) = −r (1−z)²/[ab]
//   Split(−; a⁺, b⁺) = Split(+; a⁻, b⁻) = 0 (no all-plus or all-minus three-gluon vertex).
// The corrections are O(δ), so |ratio − 1| falls like δ. Amplitudes: BCFW in double-double.
import { ddField as D, ddOf, type DD } from '../double-double'
import { randomPoint, toDoubleDouble } from '../kinematics'
import { angleOf, squareOf, type Spinor } from '../spinors'
import { PhysicsError } from '../errors'
import type { Process } from '../theories'
import { DEFAULT_PATH, amplitude, scaleSpinor, solveOn } from './common'
import { judge, recoilLegs, seededSpinors, wireOf, type LimitResult, type PathRow } from './soft'

/** Split(h; a^ha, b^hb) at the n-point (0 when that helicity of P cannot couple). */
export function splitting(h: 1 | -1, ha: number, hb: number, z: number, ab: DD, sqab: DD): DD {
  const r = 1 / Math.sqrt(z * (1 - z))
  const c = (x: number) => ddOf(x, 0)
  if (h > 0) {
    if (ha > 0 && hb > 0) return D.div(c(r), ab)
    if (ha > 0 && hb < 0) return D.div(c(-r * z * z), sqab)
    if (ha < 0 && hb > 0) return D.div(c(-r * (1 - z) * (1 - z)), sqab)
    return D.zero
  }
  if (ha < 0 && hb < 0) return D.div(c(-r), sqab)
  if (ha < 0 && hb > 0) return D.div(c(r * z * z), ab)
  if (ha > 0 && hb < 0) return D.div(c(r * (1 - z) * (1 - z)), ab)
  return D.zero
}

export interface CollinearOptions {
  z?: number
  seed?: number | string
  path?: number[]
}

/** The collinear check of legs a, a+1 (0-based a, cyclically) of n gluons with helicities h (n ≥ 5). */
export function collinearCheck(p: Process, h: number[], a: number, opts: CollinearOptions = {}): LimitResult {
  const n = h.length
  if (p.theory !== 'gluon') throw new PhysicsError('theory', `the collinear check applies to gluons, not ${p.theory}`)
  if (n < 5) throw new PhysicsError('helicities', `the collinear check needs n ≥ 5 (A_{n−1} with at least four legs), got n = ${n}`)
  if (!Number.isInteger(a) || a < 0 || a >= n) throw new PhysicsError('legs', `leg ${a + 1} does not exist (legs are 1..${n})`)
  const z = opts.z ?? 0.3
  if (!(z > 0 && z < 1)) throw new PhysicsError('z', `the momentum fraction must lie strictly between 0 and 1, got ${z}`)
  const b = (a + 1) % n
  // A_{n−1}: leg a becomes P, leg b is removed (positions after b shift down by one)
  const hardIndex = (t: number) => (t < b ? t : t - 1)
  const pos = hardIndex(a)
  const seed = String(opts.seed ?? 1)
  const hard = toDoubleDouble(randomPoint(n - 1, `collinear:${seed}`))
  const hardH = (x: number) => {
    const hh = h.filter((_, t) => t !== b)
    hh[pos] = x
    return hh
  }
  const aPlus = amplitude(D, p, hard, hardH(1))
  const aMinus = amplitude(D, p, hard, hardH(-1))
  if (D.isZero(aPlus) && D.isZero(aMinus))
    throw new PhysicsError('legs', `A_${n - 1} vanishes identically for both helicities of the merged leg: the collinear limit of legs ${a + 1}, ${b + 1} has nothing to compare with`)
  const [eta, etaT] = seededSpinors(`collinear:${seed}`, 2) as [Spinor<DD>, Spinor<DD>]
  const lP = hard.lambda[pos]!
  const ltP = hard.lambdaTilde[pos]!
  const sz = ddOf(Math.sqrt(z), 0)
  const sw = ddOf(Math.sqrt(1 - z), 0)
  const [ra, rb] = recoilLegs(n, [a, b])
  const rows: PathRow[] = []
  for (const delta of opts.path ?? DEFAULT_PATH) {
    const d = ddOf(delta, 0)
    const mix = (x: Spinor<DD>, y: Spinor<DD>, cx: DD, cy: DD): Spinor<DD> => {
      const u = scaleSpinor(D, cx, x)
      const v = scaleSpinor(D, D.mul(d, cy), y)
      return [D.add(u[0], v[0]), D.add(u[1], v[1])]
    }
    const lambda: Spinor<DD>[] = []
    const lambdaTilde: Spinor<DD>[] = []
    for (let t = 0; t < n; t++) {
      if (t === a) {
        lambda.push(mix(lP, eta, sz, sw))
        lambdaTilde.push(mix(ltP, etaT, sz, sw))
      }
      else if (t === b) {
        lambda.push(mix(lP, eta, sw, D.neg(sz)))
        lambdaTilde.push(mix(ltP, etaT, sw, D.neg(sz)))
      }
      else {
        lambda.push(hard.lambda[hardIndex(t)]!)
        lambdaTilde.push(hard.lambdaTilde[hardIndex(t)]!)
      }
    }
    const k = solveOn(D, { lambda, lambdaTilde }, ra, rb)
    const ab = angleOf(D, k.lambda[a]!, k.lambda[b]!)
    const sqab = squareOf(D, k.lambdaTilde[a]!, k.lambdaTilde[b]!)
    const expected = D.add(D.mul(splitting(1, h[a]!, h[b]!, z, ab, sqab), aPlus), D.mul(splitting(-1, h[a]!, h[b]!, z, ab, sqab), aMinus))
    const ratio = D.div(amplitude(D, p, k, h), expected)
    rows.push({ x: delta, ratio: wireOf(ratio), deviation: D.abs(D.sub(ratio, D.one)) })
  }
  return { rows, ...judge(rows, 1), expectedRate: 1 }
}
