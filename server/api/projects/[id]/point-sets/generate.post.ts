// A seeded set: N physical points (RAMBO, energy) or N random complex points; point i uses the
// seed "<seed>:<i>", so the set is reproducible from its stored seed.
import { GenerateSchema, PHYSICAL_MAX_LEGS, type PointData } from '#shared/pointsets'

export default defineEventHandler(async (event) => {
  const { project, user } = await requireProjectRole(event, routeId(event), 'editor')
  const body = await readValid(event, GenerateSchema)
  if (body.kind === 'physical' && body.n > PHYSICAL_MAX_LEGS) {
    throw fieldError(422, 'n', `physical points are drawn for at most ${PHYSICAL_MAX_LEGS} legs: beyond that almost no phase-space point is well-conditioned (min |s_ij| / max |s_ij| ≥ 1e-3); use kind "random" for more legs`)
  }
  const energy = body.kind === 'physical' ? body.energy ?? 1 : null
  const name = body.name ?? (body.kind === 'physical'
    ? `${body.count} physical points, n = ${body.n}, √s = ${energy}, seed ${body.seed}`
    : `${body.count} random complex points, n = ${body.n}, seed ${body.seed}`)
  // Off the request thread, with the evaluations' time budget (10,000 points at n = 16 take seconds).
  let points: PointData[]
  try {
    points = (await runInPool<PointData[]>({ kind: 'generatePoints', g: { ...body, energy: energy ?? undefined } }, poolOptions(event))).value
  }
  catch (e) {
    // The engine's seeded points name kinematics.*; here the request's own fields are meant.
    throw evaluationHttpError(e, f => (f === 'kinematics.seed' ? 'n' : f.replace(/^kinematics\./, '')))
  }
  const set = await storePointSet({
    projectId: project.id, userId: user.id, name, source: body.kind, n: body.n, seed: body.seed, energy,
    meta: { kinematics: body.kind === 'physical' ? 'momenta' : 'spinors', seedRule: '<seed>:<index>' },
    points,
  })
  await audit(project.id, user.id, 'pointset.generate', 'point-set', set.id, { name: set.name, count: set.count, seed: body.seed })
  setResponseStatus(event, 201)
  return pointSetView(set)
})
