// The engine entry of the limit and identity checks: checkLimit(request) → the response of
// POST /api/limit-checks. Physics-invalid input throws PhysicsError (422, naming the field).
import { LimitCheckRequestSchema, type LimitCheckRequestInput, type LimitCheckResponse } from '../../schemas/limit-checks'
import { rationalField as Q, type Field } from '../field'
import { ddField } from '../double-double'
import { randomPoint, rationalPoint, toDoubleDouble } from '../kinematics'
import { PhysicsError } from '../errors'
import { validateProcess } from '../theories'
import { softCheck } from './soft'
import { collinearCheck } from './collinear'
import { identityCheck, type IdentityName } from './identities'

const RELATIONS: Record<IdentityName, string> = {
  'cyclicity': 'A(1, 2, …, n) − A(2, …, n, 1) = 0',
  'reflection': 'A(1, 2, …, n) − (−1)ⁿ A(n, …, 2, 1) = 0',
  'u1-decoupling': 'Σ over the positions of leg 1 of A(2, …, 1, …, n) = 0',
  'kleiss-kuijf': 'A(1, α, n, β) − (−1)^|β| Σ_{σ ∈ α ⧢ βᵀ} A(1, σ, n) = 0',
  'bcj': 'Σ_{i=3}^{n} (Σ_{j=3}^{i} s_2j) A(1, 3, …, i, 2, i+1, …, n) = 0',
}

const SOURCES: Record<IdentityName, string> = {
  'cyclicity': 'Kleiss & Kuijf, Nucl. Phys. B312 (1989) 616',
  'reflection': 'Kleiss & Kuijf, Nucl. Phys. B312 (1989) 616',
  'u1-decoupling': 'Kleiss & Kuijf, Nucl. Phys. B312 (1989) 616',
  'kleiss-kuijf': 'Kleiss & Kuijf, Nucl. Phys. B312 (1989) 616',
  'bcj': 'Bern, Carrasco, Johansson, arXiv:0805.3993',
}

function label(l: number, n: number, field: string): number {
  if (!Number.isInteger(l) || l < 1 || l > n) throw new PhysicsError(field, `leg ${l} does not exist (legs are 1..${n})`)
  return l - 1
}

export function checkLimit(input: LimitCheckRequestInput): LimitCheckResponse {
  const t0 = performance.now()
  const req = LimitCheckRequestSchema.parse(input)
  const n = req.helicities.length
  const arithmetic = req.check === 'identity' ? req.arithmetic : 'float'
  const { process: p } = validateProcess(req.theory, req.helicities, arithmetic)
  const ms = () => Math.round((performance.now() - t0) * 1000) / 1000
  if (req.check === 'soft') {
    const s = label(req.soft, n, 'soft')
    const r = softCheck(p, req.helicities, s, { seed: req.seed, path: req.path, order: req.order })
    const plus = req.helicities[s]! > 0
    const sub = req.order === 'subleading'
    const leading = p.theory === 'gluon'
      ? plus ? '⟨ab⟩ / (⟨as⟩⟨sb⟩)' : '−[ab] / ([as][sb])'
      : plus ? 'Σ_a [as]⟨ax⟩⟨ay⟩ / (⟨sa⟩⟨sx⟩⟨sy⟩)' : 'Σ_a ⟨as⟩[ax][ay] / ([sa][sx][sy])'
    const factor = !sub
      ? leading
      : plus
        ? `${leading} + ½ Σ_a [as]/⟨sa⟩ (⟨ax⟩/⟨sx⟩ + ⟨ay⟩/⟨sy⟩) λ̃_s·∂/∂λ̃_a`
        : `${leading} + ½ Σ_a ⟨as⟩/[sa] ([ax]/[sx] + [ay]/[sy]) λ_s·∂/∂λ_a`
    const source = sub ? 'Weinberg, Phys. Rev. 140 (1965) B516; Cachazo & Strominger, arXiv:1404.4091' : 'Weinberg, Phys. Rev. 140 (1965) B516'
    return { check: 'soft', theory: req.theory, n, helicities: req.helicities, legs: [s + 1], order: req.order, ...r, factor, source, ms: ms() }
  }
  if (req.check === 'collinear') {
    const a = label(req.leg, n, 'leg')
    const r = collinearCheck(p, req.helicities, a, { z: req.z, seed: req.seed, path: req.path })
    return {
      check: 'collinear', theory: req.theory, n, helicities: req.helicities, legs: [a + 1, ((a + 1) % n) + 1], ...r,
      factor: 'Σ_h Split(h; a, b) A_{n−1}(…, P^h, …)', source: 'Mangano & Parke, Phys. Rept. 200 (1991) 301; Bern, Dixon, Dunbar, Kosower, hep-ph/9403226', ms: ms(),
    }
  }
  const alpha = req.alpha?.map((l, t) => label(l, n, `alpha[${t}]`))
  const seed = req.seed ?? 1
  const run = <T>(F: Field<T>, k: Parameters<typeof identityCheck<T>>[2]) => {
    const r = identityCheck(F, p, k, req.helicities, req.identity, { alpha })
    const w = (x: T) => F.toWire(x) as [number, number]
    return {
      check: 'identity' as const, theory: req.theory, n, helicities: req.helicities, identity: req.identity, arithmetic, relation: RELATIONS[req.identity],
      terms: r.terms.map((t) => ({ order: t.order, coefficient: w(t.coefficient), value: w(t.value) })),
      sum: w(r.sum), residual: r.residual, tolerance: r.tolerance, holds: r.holds, source: SOURCES[req.identity], ms: ms(),
    }
  }
  return arithmetic === 'exact' ? run(Q, rationalPoint(n, seed)) : run(ddField, toDoubleDouble(randomPoint(n, seed)))
}

export { softCheck, softFactor, subleadingCoefficients } from './soft'
export { collinearCheck, splitting } from './collinear'
export { identityCheck, shuffles, IDENTITIES, IDENTITY_TOLERANCE, type IdentityName } from './identities'
