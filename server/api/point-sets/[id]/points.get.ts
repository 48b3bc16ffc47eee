// A page of points: momenta (or spinors) per leg, spinors on demand, invariants s_ij on demand.
import { PointsQuerySchema, invariantMatrix, kinOf } from '#shared/pointsets'
import { kinToWire } from '#shared/physics/kinematics'
import { complexField } from '#shared/physics/field'

export default defineEventHandler(async (event) => {
  const { pointSet } = await requirePointSetRole(event, routeId(event), 'viewer')
  const q = parseWith(getQuery(event), PointsQuerySchema, 'query')
  const rows = await pointsInRange(pointSet.id, q.offset, q.offset + q.limit)
  return {
    total: pointSet.count,
    offset: q.offset,
    limit: q.limit,
    n: pointSet.n,
    items: rows.map(({ idx, data }) => {
      const k = q.spinors || q.invariants ? kinOf(data) : null
      return {
        idx,
        label: data.label ?? String(idx + 1),
        ...(data.momenta ? { momenta: data.momenta } : {}),
        ...(data.lambda ? { lambda: data.lambda, lambdaTilde: data.lambdaTilde } : {}),
        ...(data.codes ? { codes: data.codes } : {}),
        ...(data.weight !== undefined ? { weight: data.weight } : {}),
        minInvariant: data.minInvariant ?? null,
        ...(q.spinors && data.momenta ? { spinors: kinToWire(complexField, k!) } : {}),
        ...(q.invariants ? { invariants: invariantMatrix(k!) } : {}),
      }
    }),
  }
})
