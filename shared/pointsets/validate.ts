// Validation of uploaded points with the engine's own validators (shared/physics/kinematics):
// momentum conservation and masslessness to 1e-8 relative to the point's scale (docs/api.md), and the
// leg count of the point set. A refused point gets its reason and the relative size of the violation.
import { PhysicsError } from '../physics/errors'
import type { Complex } from '../physics/field'
import { complexField } from '../physics/field'
import { pointFromMomenta, pointFromSpinors, type BuiltPoint } from '../physics/kinematics'
import { momentumSum } from '../physics/spinors'
import { kinOf, minInvariantRatio } from './invariants'
import type { PointData, Rejection } from './types'

/** Largest relative mass² violation |p²|/E_max² and relative conservation violation |Σp|/E_max. */
export function momentumViolations(momenta: PointData['momenta'] & object) {
  const scale = momenta.reduce((m, p) => Math.max(m, Math.abs(p[0])), 0)
  const mass = momenta.map(p => Math.abs(p[0] * p[0] - p[1] * p[1] - p[2] * p[2] - p[3] * p[3]) / (scale * scale || 1))
  const sum = [0, 1, 2, 3].map(m => momenta.reduce((a, p) => a + p[m]!, 0))
  return { mass, conservation: Math.hypot(...sum) / (scale || 1) }
}

function frob(P: [[Complex, Complex], [Complex, Complex]]) {
  return Math.hypot(P[0][0].abs(), P[0][1].abs(), P[1][0].abs(), P[1][1].abs())
}

/** |ΣP| / max |P_i| of a spinor point (Frobenius norms of the bispinors, as the engine measures). */
export function spinorViolation(d: PointData): number {
  const k = kinOf(d)
  const n = k.lambda.length
  const scale = Math.max(...Array.from({ length: n }, (_, i) => frob(momentumSum(complexField, k, [i]))))
  return frob(momentumSum(complexField, k, Array.from({ length: n }, (_, i) => i))) / (scale || 1)
}

function legCount(d: PointData) {
  return d.momenta ? d.momenta.length : d.lambda!.length
}

function sizeOf(d: PointData, reason: string): number | null {
  if (d.momenta) {
    const v = momentumViolations(d.momenta)
    const leg = /^leg (\d+) is not massless/.exec(reason)
    if (leg) return v.mass[Number(leg[1]) - 1] ?? null
    if (reason.includes('not conserved')) return v.conservation
    return null
  }
  return reason.includes('not conserved') ? spinorViolation(d) : null
}

/** Checks one point; returns the stored form (with minInvariant) or the rejection. */
export function validatePoint(d: PointData, n: number): { ok: true, data: PointData } | { ok: false, rejection: Rejection } {
  const point = d.label ?? '?'
  const legs = legCount(d)
  if (legs !== n) return { ok: false, rejection: { point, reason: `has ${legs} legs; this point set has ${n}`, size: null } }
  if (d.lambda && d.lambdaTilde && d.lambda.length !== d.lambdaTilde.length) {
    return { ok: false, rejection: { point, reason: `has ${d.lambda.length} angle spinors and ${d.lambdaTilde.length} square spinors`, size: null } }
  }
  if (d.codes && d.codes.length !== legs) return { ok: false, rejection: { point, reason: `has ${d.codes.length} particle codes for ${legs} legs`, size: null } }
  let built: BuiltPoint<Complex>
  try {
    built = d.momenta ? pointFromMomenta(d.momenta) : pointFromSpinors(kinOf(d).lambda, kinOf(d).lambdaTilde)
  }
  catch (e) {
    if (!(e instanceof PhysicsError)) throw e
    let reason = e.message.replace(/^kinematics: /, '')
    const leg = /^leg (\d+) /.exec(reason)
    if (leg && d.codes) reason += ` (particle code ${d.codes[Number(leg[1]) - 1]})`
    return { ok: false, rejection: { point, reason, size: sizeOf(d, reason) } }
  }
  return { ok: true, data: { ...d, minInvariant: minInvariantRatio(built.kin) } }
}

/** Validates every point against n; n defaults to the first point's leg count. */
export function validatePoints(points: PointData[], n?: number) {
  const legs = n ?? (points[0] ? legCount(points[0]) : 0)
  const valid: PointData[] = []
  const rejected: Rejection[] = []
  for (const p of points) {
    const r = validatePoint(p, legs)
    if (r.ok) valid.push(r.data)
    else rejected.push(r.rejection)
  }
  return { n: legs, valid, rejected }
}
