// POST /api/evaluate against the built server, field for field as docs/api.md and the generated API page fix it: every
// kinematics kind and target, both arithmetics, reproducible seeds, the error statuses.
// Independent references: Parke–Taylor (Phys. Rev. Lett. 56 (1986) 2459) is the target of MHV
// points; a point given back as explicit spinors or momenta must give the same value as the
// seeded point it came from.
import { beforeAll, describe, expect, it } from 'vitest'
import { Client, newUser } from '../helpers/api'

let u: Client
beforeAll(async () => {
  u = await newUser('eval')
})

type C = [number, number]
const ev = (body: unknown) => u.post('/api/evaluate', body)
const MHV5 = [-1, -1, 1, 1, 1]
const NMHV6 = [-1, 1, -1, 1, -1, 1]

/** p^μ from λ, λ̃ by docs/conventions.md: P = λ λ̃ᵀ, p0 = (P00+P11)/2, p1 = (P01+P10)/2, p2 = (P10−P01)/(2i), p3 = (P00−P11)/2. */
function momentumOf(l: [C, C], lt: [C, C]): [number, number, number, number] {
  const mul = (a: C, b: C): C => [a[0] * b[0] - a[1] * b[1], a[0] * b[1] + a[1] * b[0]]
  const P = [[mul(l[0], lt[0]), mul(l[0], lt[1])], [mul(l[1], lt[0]), mul(l[1], lt[1])]] as C[][]
  const p0 = (P[0]![0]![0] + P[1]![1]![0]) / 2
  const p3 = (P[0]![0]![0] - P[1]![1]![0]) / 2
  const p1 = (P[0]![1]![0] + P[1]![0]![0]) / 2
  const p2 = (P[1]![0]![1] - P[0]![1]![1]) / 2 // (P10 − P01)/(2i): the imaginary parts over 2
  return [p0, p1, p2, p3]
}

const close = (a: C, b: C, tol = 1e-9) => Math.hypot(a[0] - b[0], a[1] - b[1]) <= tol * Math.hypot(b[0], b[1])

describe('response shape (docs/api.md "Evaluation response")', () => {
  it('has every field, terms with sorted left sets, the point used and the engine version', async () => {
    const res = await ev({ theory: 'gluon', helicities: MHV5, kinematics: { kind: 'random', seed: 7 } })
    expect(res.status).toBe(200)
    const b = res.body
    expect(Object.keys(b).sort()).toEqual(['arithmetic', 'deviation', 'engine', 'falloff', 'kinematics', 'ms', 'n', 'precision', 'shift', 'target', 'terms', 'theory', 'value', 'verdict', 'warnings'].sort())
    expect(b).toMatchObject({ n: 5, theory: 'gluon', shift: [1, 2], arithmetic: 'float', verdict: 'agrees', falloff: null, warnings: [], target: { name: 'parke-taylor' } })
    expect(b.engine.version).toMatch(/^\d+\.\d+\.\d+/)
    expect(b.deviation).toBeLessThan(1e-9)
    expect(typeof b.ms).toBe('number')
    for (const t of b.terms) {
      expect(t.left).toEqual([...t.left].sort((x: number, y: number) => x - y))
      expect(t.left).toContain(1)
      expect(t.children).toBeNull()
      for (const k of ['z', 'pole', 'value']) expect(t[k]).toHaveLength(2)
    }
    expect(b.kinematics.lambda).toHaveLength(5)
    expect(b.kinematics.lambdaTilde).toHaveLength(5)
  })

  it('runs in a worker thread, not on the request thread', async () => {
    const res = await ev({ theory: 'gluon', helicities: MHV5, kinematics: { kind: 'random', seed: 8 } })
    expect(Number(res.headers.get('x-evaluation-thread'))).toBeGreaterThan(0)
    expect(res.headers.get('server-timing')).toMatch(/^engine;dur=[\d.]+, pool;dur=[\d.]+$/)
  })

  it('tree: true gives each term its children; the default keeps the hand-off lean', async () => {
    const res = await ev({ theory: 'gluon', helicities: NMHV6, kinematics: { kind: 'random', seed: 1 }, tree: true })
    expect(res.status).toBe(200)
    for (const t of res.body.terms) {
      expect(t.children).toHaveProperty('left')
      expect(t.children).toHaveProperty('right')
      for (const side of [t.children.left, t.children.right]) {
        if ('kind' in side) expect(['angle', 'square']).toContain(side.kind)
        else expect(side).toHaveProperty('terms')
      }
    }
  })

  it('probeFalloff gives the integer exponent: −1 for an adjacent [−,+⟩ gluon shift', async () => {
    const res = await ev({ theory: 'gluon', helicities: MHV5, kinematics: { kind: 'random', seed: 2 }, shift: [2, 3], probeFalloff: true })
    expect(res.body.falloff).toMatchObject({ exponent: -1, valid: true })
  })

  it('an invalid shift gives "boundary term suspected" by the table alone', async () => {
    const res = await ev({ theory: 'gluon', helicities: MHV5, kinematics: { kind: 'random', seed: 2 }, shift: [3, 1] })
    expect(res.status).toBe(200)
    expect(res.body.verdict).toBe('boundary term suspected')
    expect(res.body.falloff).toBeNull()
  })

  it('a singular point is a 200 with verdict "singular point", value null and a warning naming it', async () => {
    // λ1 = λ2, so ⟨12⟩ = 0 and s12 = ⟨12⟩[21] = 0; Σ λ_i λ̃_i = 0 exactly (checked by hand).
    const kinematics = {
      kind: 'exact-spinors',
      lambda: [['1', '0'], ['1', '0'], ['0', '1'], ['1', '1']],
      lambdaTilde: [['0', '1'], ['-1', '-3'], ['-1', '-2'], ['1', '2']],
    }
    const res = await ev({ theory: 'gluon', helicities: [-1, -1, 1, 1], kinematics, arithmetic: 'exact' })
    expect(res.status, JSON.stringify(res.body)).toBe(200)
    expect(res.body.verdict).toBe('singular point')
    expect(res.body.value).toBeNull()
    expect(res.body.warnings.some((w: string) => /singular point/.test(w))).toBe(true)
  })

  it('a vanishing helicity class gives value 0 and target 0, verdict agrees', async () => {
    const res = await ev({ theory: 'gluon', helicities: [-1, 1, 1, 1, 1], kinematics: { kind: 'random', seed: 3 } })
    expect(res.body.verdict).toBe('agrees')
    expect(res.body.value).toEqual([0, 0])
    expect(res.body.target.value).toEqual([0, 0])
  })
})

describe('kinematics kinds', () => {
  it('random, and the echoed point given back as spinors, give the same value', async () => {
    const a = (await ev({ theory: 'gluon', helicities: NMHV6, kinematics: { kind: 'random', seed: 11 } })).body
    expect(a.verdict).toBe('agrees')
    const b = (await ev({ theory: 'gluon', helicities: NMHV6, kinematics: { kind: 'spinors', ...a.kinematics } })).body
    expect(b.verdict).toBe('agrees')
    expect(close(b.value, a.value, 1e-12)).toBe(true)
  })

  it('physical (RAMBO), and the same point as momenta, give the same value', async () => {
    const a = (await ev({ theory: 'gluon', helicities: MHV5, kinematics: { kind: 'physical', seed: 5, energy: 2 } })).body
    expect(a.verdict).toBe('agrees')
    const momenta = a.kinematics.lambda.map((l: [C, C], i: number) => momentumOf(l, a.kinematics.lambdaTilde[i]))
    // Legs 1 and 2 incoming along ±z, crossed to outgoing: negative energies, total √s = 2.
    expect(momenta[0][0]).toBeLessThan(0)
    expect(momenta[1][0]).toBeLessThan(0)
    expect(momenta[0][0] + momenta[1][0]).toBeCloseTo(-2, 10)
    const b = (await ev({ theory: 'gluon', helicities: MHV5, kinematics: { kind: 'momenta', momenta } })).body
    expect(b.verdict).toBe('agrees')
    // Spinors of a momentum are fixed only up to little-group phases; |A| is not.
    expect(Math.hypot(...b.value)).toBeCloseTo(Math.hypot(...a.value), 6)
  })

  it('momenta written by hand (a 2 → 2 scattering at 90°)', async () => {
    const momenta = [[-1, 0, 0, -1], [-1, 0, 0, 1], [1, 1, 0, 0], [1, -1, 0, 0]]
    const res = await ev({ theory: 'gluon', helicities: [-1, -1, 1, 1], kinematics: { kind: 'momenta', momenta } })
    expect(res.status).toBe(200)
    expect(res.body.verdict).toBe('agrees')
    // |A(1⁻2⁻3⁺4⁺)| = s12² / |s12 s23| = s/|t| = 4/2 (Parke–Taylor, momenta above: s = 4, t = −2).
    expect(Math.hypot(...res.body.value)).toBeCloseTo(2, 10)
  })

  it('rational in exact arithmetic returns equal rationals; given back as exact-spinors, the same', async () => {
    const a = await ev({ theory: 'gluon', helicities: MHV5, kinematics: { kind: 'rational', seed: 4 }, arithmetic: 'exact' })
    expect(a.status).toBe(200)
    expect(a.body.arithmetic).toBe('exact')
    expect(a.body.verdict).toBe('agrees')
    expect(a.body.deviation).toBe(0)
    expect(a.body.value).toEqual(a.body.target.value)
    for (const x of [...a.body.value, ...a.body.terms.flatMap((t: { z: string[] }) => t.z)]) expect(x).toMatch(/^-?\d+(\/\d+)?$/)
    expect(a.body.value[1]).toBe('0')
    const b = await ev({ theory: 'gluon', helicities: MHV5, kinematics: { kind: 'exact-spinors', ...a.body.kinematics }, arithmetic: 'exact' })
    expect(b.body.value).toEqual(a.body.value)
  })

  it('exact-spinors in float arithmetic, unreduced input accepted', async () => {
    const a = (await ev({ theory: 'gluon', helicities: MHV5, kinematics: { kind: 'rational', seed: 4 }, arithmetic: 'exact' })).body
    const unreduced = (s: string) => (s.includes('/') ? s.replace(/^(-?\d+)\/(\d+)$/, (_m, p, q) => `${2 * Number(p)}/${2 * Number(q)}`) : `${s}/1`)
    const lambda = a.kinematics.lambda.map((sp: string[]) => sp.map(unreduced))
    const b = await ev({ theory: 'gluon', helicities: MHV5, kinematics: { kind: 'exact-spinors', lambda, lambdaTilde: a.kinematics.lambdaTilde } })
    expect(b.status).toBe(200)
    expect(b.body.arithmetic).toBe('float')
    const exact = a.value.map((s: string) => { const [p, q] = s.split('/'); return Number(p) / Number(q ?? 1) }) as C
    expect(close(b.body.value, exact, 1e-12)).toBe(true)
  })

  it('the same seed gives the same point and value twice', async () => {
    for (const kinematics of [{ kind: 'random', seed: 'reproducible' }, { kind: 'physical', seed: 99 }, { kind: 'rational', seed: 12 }]) {
      const body = { theory: 'gluon', helicities: NMHV6, kinematics }
      const [a, b] = [(await ev(body)).body, (await ev(body)).body]
      expect(b.kinematics).toEqual(a.kinematics)
      expect(b.value).toEqual(a.value)
    }
  })
})

describe('targets', () => {
  it.each([
    ['parke-taylor', 'gluon', MHV5],
    ['berends-giele', 'gluon', NMHV6],
    ['berends-giele', 'gluon', MHV5],
    ['hodges', 'graviton', [-2, -2, 2, 2, 2]],
    ['klt', 'graviton', [-2, 2, -2, 2, -2, 2]],
    ['feynman', 'scalar-cubic', [0, 0, 0, 0, 0, 0]],
  ])('%s for %s %j agrees', async (target, theory, helicities) => {
    const res = await ev({ theory, helicities, kinematics: { kind: 'random', seed: 21 }, target })
    expect(res.status, JSON.stringify(res.body)).toBe(200)
    expect(res.body.target.name).toBe(target)
    expect(res.body.verdict).toBe('agrees')
  })

  it.each([
    ['gluon', NMHV6, 'berends-giele'],
    ['graviton', [-2, -2, 2, 2, 2], 'hodges'],
    ['scalar-cubic', [0, 0, 0, 0, 0], 'feynman'],
  ])('auto picks an applicable target for %s', async (theory, helicities, name) => {
    const res = await ev({ theory, helicities, kinematics: { kind: 'random', seed: 22 } })
    expect(res.body.target.name).toBe(name)
  })

  it('a formula in bracket notation: Parke–Taylor typed by hand agrees', async () => {
    const res = await ev({ theory: 'gluon', helicities: MHV5, kinematics: { kind: 'rational', seed: 6 }, arithmetic: 'exact', target: { formula: '<1 2>^4/(<1 2><2 3><3 4><4 5><5 1>)' } })
    expect(res.status, JSON.stringify(res.body)).toBe(200)
    expect(res.body.verdict).toBe('agrees')
    expect(res.body.value).toEqual(res.body.target.value)
  })

  it('a wrong formula disagrees', async () => {
    const res = await ev({ theory: 'gluon', helicities: MHV5, kinematics: { kind: 'random', seed: 6 }, target: { formula: '<1 3>^4/(<1 2><2 3><3 4><4 5><5 1>)' } })
    expect(res.body.verdict).toBe('disagrees')
  })

  it('none: not evaluated, target null', async () => {
    const res = await ev({ theory: 'gluon', helicities: MHV5, kinematics: { kind: 'random', seed: 6 }, target: 'none' })
    expect(res.body.verdict).toBe('not evaluated')
    expect(res.body.target).toBeNull()
  })

  it('spin s ≠ 2: auto means none; the four-particle test runs', async () => {
    const res = await ev({ theory: 'spin', spin: 3, helicities: [-3, -3, 3, 3], kinematics: { kind: 'random', seed: 1 } })
    expect(res.status).toBe(200)
    expect(res.body.target).toBeNull()
    expect(res.body.verdict).toBe('not evaluated')
    expect(res.body.spin).toBe(3)
  })
})

describe('errors: 400 for the schema, 422 for the physics, each naming its field', () => {
  const base = { theory: 'gluon', helicities: MHV5, kinematics: { kind: 'random', seed: 1 } }
  it.each([
    [400, 'theory', { ...base, theory: undefined }],
    [400, 'theory', { ...base, theory: 'quark' }],
    [400, 'helicities[0]', { ...base, helicities: ['NaN', -1, 1, 1, 1] }],
    [400, 'kinematics.momenta[0][3]', { ...base, kinematics: { kind: 'momenta', momenta: [[1, 0, 0, 'NaN']] } }],
    [400, 'kinematics.lambda[2][1]', { ...base, kinematics: { kind: 'spinors', lambda: [[[1, 0], [0, 1]], [[1, 0], [0, 1]], [[1, 0], 'x']], lambdaTilde: [] } }],
    [400, 'kinematics.kind', { ...base, kinematics: { kind: 'wavefunctions' } }],
    [400, 'arithmetic', { ...base, arithmetic: 'quad' }],
    [400, 'probeFalloff', { ...base, probeFalloff: 'yes' }],
    [400, 'shift', { ...base, shift: [1] }],
    [422, 'helicities[0]', { ...base, helicities: [2, -1, 1, 1, 1] }],
    [422, 'shift', { ...base, shift: [1, 9] }],
    [422, 'target', { ...base, target: 'hodges' }],
    [422, 'arithmetic', { ...base, arithmetic: 'exact' }],
    [422, 'kinematics.lambda', { ...base, kinematics: { kind: 'spinors', lambda: [[[1, 0], [0, 1]]], lambdaTilde: [[[1, 0], [0, 1]]] } }],
    [422, 'kinematics.momenta', { ...base, kinematics: { kind: 'momenta', momenta: [[1, 0, 0, 1]] } }],
    [422, 'spin', { theory: 'spin', spin: 1.5, helicities: [-1.5, -1.5, 1.5, 1.5], kinematics: { kind: 'random', seed: 1 } }],
    [422, 'spin', { theory: 'spin', helicities: [-3, -3, 3, 3], kinematics: { kind: 'random', seed: 1 } }],
    [422, 'helicities', { theory: 'spin', spin: 3, helicities: [-3, -3, 3, 3, 3], kinematics: { kind: 'random', seed: 1 } }],
    [422, 'helicities', { ...base, helicities: [-1, 1, 1] }],
    [422, 'target.formula', { ...base, target: { formula: '<1 2>^4/(<1 2><2 3' } }],
  ])('%i on %s', async (status, field, body) => {
    const res = await ev(body)
    expect(res.status, JSON.stringify(res.body)).toBe(status)
    expect(res.body.data.field).toBe(field)
    expect(res.body.message.startsWith(field)).toBe(true)
    // The zod issues behind a 400 include one at exactly that path.
    const at = (path: (string | number)[]) => path.map(k => (typeof k === 'number' ? `[${k}]` : `.${k}`)).join('').slice(1)
    if (status === 400) expect(res.body.data.issues.map((i: { path: (string | number)[] }) => at(i.path))).toContain(field)
  })

  it('malformed JSON and a non-finite number are 400', async () => {
    const bad = await u.req('POST', '/api/evaluate', undefined, { raw: '{"theory": "gluon",' })
    expect(bad.status).toBe(400)
    const inf = await u.req('POST', '/api/evaluate', undefined, { raw: '{"theory":"gluon","helicities":[-1,-1,1,1],"kinematics":{"kind":"momenta","momenta":[[1e999,0,0,1],[1,0,0,-1],[-1,1,0,0],[-1,-1,0,0]]}}' })
    expect(inf.status).toBe(400)
    expect(inf.body.data.field).toBe('kinematics.momenta[0][0]')
  })

  it('a point that does not conserve momentum: 422 saying by how much', async () => {
    const res = await ev({ ...base, helicities: [-1, -1, 1, 1], kinematics: { kind: 'momenta', momenta: [[-1, 0, 0, -1], [-1, 0, 0, 1], [1, 1, 0, 0], [1.01, -1.01, 0, 0]] } })
    expect(res.status).toBe(422)
    expect(res.body.data.field).toBe('kinematics')
    expect(res.body.message).toMatch(/^kinematics: momentum is not conserved: \|Σp\| = [\d.e-]+ relative to the largest energy/)
  })

  it('a massive leg: 422 naming the leg and its p²', async () => {
    const res = await ev({ ...base, helicities: [-1, -1, 1, 1], kinematics: { kind: 'momenta', momenta: [[-1, 0, 0, -1], [-1, 0, 0, 1], [1, 0.5, 0, 0], [1, -0.5, 0, 0]] } })
    expect(res.status).toBe(422)
    expect(res.body.message).toBe('kinematics: leg 3 is not massless: p² = 0.75')
  })

  it.each([
    ['gluon', 13, 'float', 12],
    ['gluon', 10, 'exact', 9],
    ['graviton', 8, 'float', 7],
    ['graviton', 7, 'exact', 6],
    ['scalar-cubic', 9, 'float', 8],
  ])('over the limit: %s n = %i in %s → 422 with the limit %i', async (theory, n, arithmetic, limit) => {
    const s = theory === 'gluon' ? 1 : theory === 'graviton' ? 2 : 0
    const helicities = Array.from({ length: n }, (_, i) => (i < 2 ? -s : s))
    const res = await ev({ theory, helicities, arithmetic, kinematics: { kind: arithmetic === 'exact' ? 'rational' : 'random', seed: 1 } })
    expect(res.status).toBe(422)
    expect(res.body.data.field).toBe('helicities')
    expect(res.body.message).toContain(`limit of ${limit}`)
  })

  it('401 without a session', async () => {
    expect((await new Client().post('/api/evaluate', base)).status).toBe(401)
  })

  it('a read-only token may evaluate (it writes nothing)', async () => {
    const t = await u.post('/api/tokens', { name: 'notebook', scope: 'read' })
    expect(t.status).toBe(201)
    const c = new Client()
    c.token = t.body.token
    const res = await c.post('/api/evaluate', base)
    expect(res.status).toBe(200)
    expect(res.body.verdict).toBe('agrees')
  })
})

describe('shifts, cross-shift and the catalogue', () => {
  it('POST /api/shifts lists every [i,j⟩ with exponent and validity', async () => {
    const res = await u.post('/api/shifts', { theory: 'gluon', helicities: MHV5 })
    expect(res.status).toBe(200)
    expect(res.body.rows).toHaveLength(20)
    expect(res.body.defaultShift).toEqual([1, 2])
    const row = (i: number, j: number) => res.body.rows.find((r: { shift: number[] }) => r.shift[0] === i && r.shift[1] === j)
    expect(row(1, 2)).toMatchObject({ exponent: -1, valid: true }) // adjacent [−,−⟩
    expect(row(3, 1)).toMatchObject({ valid: false }) // [+,−⟩
  })

  it('measured exponents agree with the table for six gluons', async () => {
    const res = await u.post('/api/shifts', { theory: 'gluon', helicities: [-1, -1, 1, -1, 1, 1], measure: true })
    expect(res.status).toBe(200)
    const table = (await u.post('/api/shifts', { theory: 'gluon', helicities: [-1, -1, 1, -1, 1, 1] })).body.rows
    res.body.rows.forEach((r: { exponent: number, source: string }, k: number) => {
      expect(r.source).toBe('measured')
      expect(r.exponent).toBe(table[k].exponent)
    })
  })

  it('shifts: over the measuring limit → 422; a wrong helicity → 422 with its field', async () => {
    const eight = await u.post('/api/shifts', { theory: 'gluon', helicities: [-1, -1, 1, 1, 1, 1, 1, 1], measure: true })
    expect(eight.status).toBe(422)
    expect(eight.body.message).toContain('limit of 7')
    const bad = await u.post('/api/shifts', { theory: 'graviton', helicities: [-2, 1, 2, 2] })
    expect(bad.status).toBe(422)
    expect(bad.body.data.field).toBe('helicities[1]')
  })

  it('cross-shift: gravity agrees under every valid shift; spin 3 does not (the four-particle test)', async () => {
    const grav = await u.post('/api/cross-shift', { theory: 'graviton', helicities: [-2, -2, 2, 2] })
    expect(grav.status).toBe(200)
    expect(grav.body.agree).toBe(true)
    expect(grav.body.rows).toHaveLength(12)
    const s3 = await u.post('/api/cross-shift', { theory: 'spin', spin: 3, helicities: [-3, -3, 3, 3], kinematics: { kind: 'rational', seed: 2 }, arithmetic: 'exact' })
    expect(s3.status).toBe(200)
    expect(s3.body.agree).toBe(false)
    expect(s3.body.spread).toBeGreaterThan(1e-3)
    expect(s3.body.rows[0].value[0]).toMatch(/^-?\d+(\/\d+)?$/)
  })

  it('GET /api/catalogue lists theories, targets, limits, kinematics kinds, arithmetics and the formula syntax', async () => {
    const res = await u.get('/api/catalogue')
    expect(res.status).toBe(200)
    const c = res.body
    expect(c.theories.map((t: { name: string }) => t.name)).toEqual(['gluon', 'graviton', 'scalar-cubic', 'spin', 'qcd'])
    expect(c.theories[0]).toMatchObject({ helicities: [-1, 1], limits: { float: 12, exact: 9 } })
    expect(c.theories[0].targets).toContain('parke-taylor')
    expect(c.targets.map((t: { name: string }) => t.name)).toEqual(expect.arrayContaining(['auto', 'parke-taylor', 'berends-giele', 'hodges', 'klt', 'feynman', 'formula', 'none']))
    expect(c.kinematics.map((k: { kind: string }) => k.kind)).toEqual(['spinors', 'exact-spinors', 'momenta', 'random', 'rational', 'physical'])
    expect(c.arithmetics.map((a: { name: string }) => a.name)).toEqual(['float', 'exact'])
    expect(c.formula.syntax.map((f: { form: string }) => f.form)).toEqual(expect.arrayContaining(['<1 2>', '[1 2]', 's(1,2,3)', '<1|2+3|4]']))
    expect(c.theories[0].species).toEqual([{ name: 'gluon', spin: 1, colourOrdered: true, pdg: 21, latex: 'g' }])
    expect(c.limits.find((l: { theory: string }) => l.theory === 'graviton')).toMatchObject({ float: 7, exact: 6 })
    expect(c.service.workers).toBe(true)
  })
})
