// The points of the falloff plot: A(z) at the [i,j⟩-shifted point for growing z, each from one
// exact evaluation on the server (docs/conventions.md "Falloff": double precision cannot
// measure large-z behaviour, so the shifted point is an exact rational point; it stays on shell
// and momentum-conserving, so A(z) there comes from the recursion under another, valid shift).
import type { WireComplex } from '../schemas/evaluate'
// the module, not physics/index (which re-exports it as fitSlope), so the page bundles no more of the engine
import { fit as fitSlope } from '../physics/falloff'

export interface FalloffPoints {
  shift: [number, number]
  /** The valid shift that computed A(z) at the shifted points. */
  via: [number, number]
  points: { log10z: number, log10abs: number }[]
  /** Least-squares slope of log|A| against log|z| over the largest four z. */
  slope: number
  exponent: number
}

/** z = 10^2 … 10^7: the largest four match the engine's probe (O(1/z) corrections < 1e-3 in the slope). */
export const FALLOFF_Z = [100n, 1000n, 10_000n, 100_000n, 1_000_000n, 10_000_000n]

type Rat = { n: bigint, d: bigint }
function parse(s: string): Rat {
  const [p, q = '1'] = s.split('/').map(x => x.trim())
  let n = BigInt(p!)
  let d = BigInt(q)
  if (d < 0n) { n = -n; d = -d }
  return { n, d }
}
const str = (r: Rat) => (r.d === 1n ? r.n.toString() : `${r.n}/${r.d}`)
const add = (a: Rat, b: Rat): Rat => ({ n: a.n * b.d + b.n * a.d, d: a.d * b.d })
const scale = (a: Rat, z: bigint): Rat => ({ n: a.n * z, d: a.d })

type ExactSpinor = [string, string]

/** The [i,j⟩-shifted exact spinors (0-based): λ̃_i → λ̃_i + z λ̃_j, λ_j → λ_j − z λ_i. */
export function shiftExact(lambda: ExactSpinor[], lambdaTilde: ExactSpinor[], i: number, j: number, z: bigint): { lambda: ExactSpinor[], lambdaTilde: ExactSpinor[] } {
  const lt = lambdaTilde.map(s => [...s] as ExactSpinor)
  const l = lambda.map(s => [...s] as ExactSpinor)
  for (const a of [0, 1]) {
    lt[i]![a] = str(add(parse(lambdaTilde[i]![a]!), scale(parse(lambdaTilde[j]![a]!), z)))
    l[j]![a] = str(add(parse(lambda[j]![a]!), scale(parse(lambda[i]![a]!), -z)))
  }
  return { lambda: l, lambdaTilde: lt }
}

/** log10 |p/q| of an exact string without overflowing a double (−Infinity for zero). */
export function log10AbsRational(s: string): number {
  const { n, d } = parse(s)
  if (n === 0n) return -Infinity
  const lg = (b: bigint) => {
    const t = (b < 0n ? -b : b).toString()
    return Math.log10(Number(t.slice(0, 17))) + Math.max(0, t.length - 17)
  }
  return lg(n) - lg(d)
}

export function log10Abs(c: WireComplex): number {
  const a = typeof c[0] === 'string' ? log10AbsRational(c[0]) : Math.log10(Math.abs(c[0]))
  const b = typeof c[1] === 'string' ? log10AbsRational(c[1]) : Math.log10(Math.abs(c[1]))
  const hi = Math.max(a, b)
  const lo = Math.min(a, b)
  if (hi === -Infinity) return -Infinity
  return hi + 0.5 * Math.log10(1 + 10 ** (2 * (lo - hi)))
}

export function falloffFit(points: FalloffPoints['points']): { slope: number, exponent: number } {
  const tail = points.slice(-4)
  const { slope } = fitSlope(tail.map(p => p.log10z), tail.map(p => p.log10abs))
  return { slope, exponent: Math.round(slope) }
}
