// The kinematics panel's choices turned into the request's `kinematics` (docs/api.md), with pasted
// spinors or momenta checked against the same schema the server uses, errors naming the field.
import { KinematicsSchema, zodIssuePath, type Kinematics } from '../schemas/evaluate'

export type KinChoice = 'random' | 'rational' | 'physical' | 'pasted'

export interface EvalSettings {
  kind: KinChoice
  seed: string
  energy: number
  pasted: string
  arithmetic: 'float' | 'exact'
  target: string
  formula: string
}

export const defaultEvalSettings = (): EvalSettings => ({ kind: 'random', seed: '1', energy: 1, pasted: '', arithmetic: 'float', target: 'auto', formula: '' })

const seedOf = (s: string): number | string => (/^-?\d+$/.test(s.trim()) ? Number(s.trim()) : s.trim())

/** The request's kinematics, or an error `{ field, message }`. */
export function kinematicsOf(s: EvalSettings, n: number): { kinematics: Kinematics } | { field: string, message: string } {
  if (s.kind !== 'pasted') {
    if (!s.seed.trim()) return { field: 'kinematics.seed', message: 'kinematics.seed: is required' }
    if (s.kind === 'physical') {
      if (!(s.energy > 0) || !Number.isFinite(s.energy)) return { field: 'kinematics.energy', message: 'kinematics.energy: the centre-of-mass energy must be a positive number' }
      return { kinematics: { kind: 'physical', seed: seedOf(s.seed), energy: s.energy } }
    }
    return { kinematics: { kind: s.kind, seed: seedOf(s.seed) } as Kinematics }
  }
  let raw: unknown
  try {
    raw = JSON.parse(s.pasted)
  }
  catch (e) {
    return { field: 'kinematics', message: `kinematics: not valid JSON (${(e as Error).message})` }
  }
  let obj: Record<string, unknown>
  if (Array.isArray(raw)) obj = { kind: 'momenta', momenta: raw }
  else if (raw && typeof raw === 'object') {
    obj = { ...(raw as Record<string, unknown>) }
    if (!obj.kind) {
      if ('momenta' in obj) obj.kind = 'momenta'
      else if ('lambda' in obj) {
        const first = (obj.lambda as unknown[][] | undefined)?.[0]?.[0]
        obj.kind = typeof first === 'string' ? 'exact-spinors' : 'spinors'
      }
    }
  }
  else return { field: 'kinematics', message: 'kinematics: paste {"lambda": […], "lambdaTilde": […]}, {"momenta": […]} or a list of [E, px, py, pz]' }
  const parsed = KinematicsSchema.safeParse(obj)
  if (!parsed.success) {
    const issue = parsed.error.issues[0]!
    const path = zodIssuePath(issue)
    const field = path ? `kinematics.${path}` : 'kinematics'
    return { field, message: `${field}: ${issue.message}` }
  }
  const k = parsed.data
  const len = k.kind === 'momenta' ? k.momenta.length : 'lambda' in k ? k.lambda.length : n
  if (len !== n) return { field: 'kinematics', message: `kinematics: ${len} legs pasted for a process of ${n}` }
  return { kinematics: k }
}
