// Exact results at machine-integer speed: the same engine code runs over the fields Z/p for
// several primes p < 2^26 and the rationals come back by the Chinese remainder theorem and
// Wang's rational reconstruction (von Manteuffel & Schabinger, arXiv:1406.4513; Peraro,
// arXiv:1608.01902). Primes are added until every reconstructed number is confirmed by two more.
import { Fraction, SingularError } from './field'
import type { Kin, Spinor } from './spinors'
import { bcfw, type Term } from './bcfw'
import type { Process } from './theories'
import { LaneField, reconstructFrom, type Lanes } from './finite-field'

/** What one pass gives: per computed quantity its residues in every lane, and their structure. */
export interface LaneRun<S> {
  /** Equal for passes that computed the same list of quantities (e.g. the same BCFW terms). */
  shape: string
  values: Lanes[]
  /** Structure data (e.g. the terms' channels), kept from a pass of the winning shape. */
  info: S
}

export interface ModularResult<S> {
  shape: string
  info: S
  values: Fraction[]
  /** Primes used, and primes skipped as unlucky. */
  primes: number
  unlucky: number
}

export interface ModularOptions {
  /** Remembers how many primes this kind of computation needed (the first pass's width next time). */
  key?: string
  /** Give up (null) beyond this many primes in total. */
  maxPrimes?: number
  /** First prime index (tests start at a chosen unlucky prime). */
  firstPrime?: number
  /** Width of the first pass when no hint is remembered. */
  lanes?: number
}

const hints = new Map<string, number>()
const HINTS_MAX = 512
const fieldCache = new Map<string, LaneField>()
const kinCache = new WeakMap<Kin<Fraction>, Map<string, Kin<Lanes>>>()

/** The lane field of primes first..first+count−1 (cached). */
export function laneField(first: number, count: number): LaneField {
  const key = `${first}:${count}`
  let F = fieldCache.get(key)
  if (!F) {
    if (fieldCache.size > 256) fieldCache.clear()
    fieldCache.set(key, (F = new LaneField(Array.from({ length: count }, (_, t) => first + t))))
  }
  return F
}

/** The point in the lanes of F (cached per point object). */
export function kinLanes(F: LaneField, k: Kin<Fraction>): Kin<Lanes> {
  let m = kinCache.get(k)
  if (!m) kinCache.set(k, (m = new Map()))
  const key = `${F.indices[0]}:${F.width}`
  let km = m.get(key)
  if (!km) {
    const map = (s: Spinor<Fraction>): Spinor<Lanes> => [F.fromRational(s[0]), F.fromRational(s[1])]
    m.set(key, (km = { lambda: k.lambda.map(map), lambdaTilde: k.lambdaTilde.map(map) }))
  }
  return km
}

/**
 * Runs `compute` over lanes of primes until each of its numbers is reconstructed from all primes
 * but two and both of those confirm it (more lanes are added, half as many again each time, when
 * that fails). A prime is unlucky, and skipped, when the point's denominators or a division vanish
 * modulo it (its lane is NaN). Returns null when a pass meets a zero in every lane (an exact zero
 * of the rational computation: the caller runs that for the message) or beyond maxPrimes.
 */
export function byPrimes<S>(k: Kin<Fraction>, compute: (F: LaneField, k: Kin<Lanes>) => LaneRun<S>, opts: ModularOptions = {}): ModularResult<S> | null {
  const first = opts.firstPrime ?? 0
  const maxPrimes = opts.maxPrimes ?? 400
  let width = Math.max(4, opts.key ? (hints.get(opts.key) ?? opts.lanes ?? 8) : (opts.lanes ?? 8))
  let next = first
  let shape: string | null = null
  let info: S | null = null
  let columns = -1
  const idx: number[] = []
  const rows: number[][] = []
  let unlucky = 0
  for (;;) {
    if (next + width - first > maxPrimes) return null
    const F = laneField(next, width)
    next += width
    let run: LaneRun<S>
    try {
      run = compute(F, kinLanes(F, k))
    }
    catch (e) {
      if (!(e instanceof SingularError)) throw e
      return null
    }
    if (run.values.length > columns) {
      // Every earlier pass dropped something this one keeps (it vanished in all their lanes).
      unlucky += rows.length
      rows.length = 0
      idx.length = 0
      columns = run.values.length
      shape = run.shape
      info = run.info
    }
    if (run.values.length === columns && run.shape === shape) {
      for (let t = 0; t < F.width; t++) {
        const row: number[] = new Array(columns)
        let ok = true
        for (let c = 0; c < columns; c++) {
          const x = run.values[c]![t]!
          if (x !== x) {
            ok = false
            break
          }
          row[c] = x
        }
        if (!ok) {
          unlucky++
          continue
        }
        idx.push(F.indices[t]!)
        rows.push(row)
      }
    }
    else unlucky += F.width
    const values = rows.length >= 3 ? reconstructAll(rows, idx) : null
    if (values) {
      if (opts.key) {
        if (hints.size >= HINTS_MAX) hints.clear()
        hints.set(opts.key, primesNeeded(values) + 1)
      }
      return { shape: shape!, info: info!, values, primes: rows.length, unlucky }
    }
    width = Math.max(2, Math.ceil((next - first) / 2))
  }
}

/**
 * Each column of residues as a rational: first from two primes (small numbers such as poles and
 * shift parameters need no more), else from all but the last two; every other prime must agree.
 * Identical columns are reconstructed once.
 */
function reconstructAll(rows: number[][], idx: number[]): Fraction[] | null {
  const m = rows.length
  const width = rows[0]!.length
  const out: Fraction[] = new Array(width)
  const seen = new Map<string, Fraction>()
  const col: number[] = new Array(m)
  for (let c = 0; c < width; c++) {
    let zero = true
    for (let t = 0; t < m; t++) {
      col[t] = rows[t]![c]!
      if (col[t] !== 0) zero = false
    }
    if (zero) {
      out[c] = ZERO
      continue
    }
    const key = col.join(',')
    let f = seen.get(key) ?? null
    if (!f && m - 2 > 2) f = reconstructFrom(col, idx, 2)
    if (!f) f = reconstructFrom(col, idx, m - 2)
    if (!f) return null
    seen.set(key, f)
    out[c] = f
  }
  return out
}

const ZERO = new Fraction(0)

/** Primes (of ≥ 25.99 bits) that Wang's bound needs for these fractions, plus the two that confirm. */
function primesNeeded(values: Fraction[]): number {
  let bits = 1
  for (const f of values) bits = Math.max(bits, f.n.toString(16).length * 4, f.d.toString(16).length * 4)
  return Math.ceil((2 * bits + 2) / 25.99) + 2
}

/**
 * The BCFW value (and, with `terms`, the top-level terms' z, pole and value) exactly, by primes;
 * null when a pass meets an exact zero (see byPrimes).
 */
export function bcfwByPrimes(p: Process, k: Kin<Fraction>, h: number[], shift: [number, number], opts: { terms?: boolean } = {}): { value: Fraction; terms: Term<Fraction>[]; primes: number } | null {
  const r = byPrimes(
    k,
    (F, km) => {
      const b = bcfw(F, p, km, h, shift)
      const values = [b.value]
      if (opts.terms) for (const t of b.terms) values.push(t.z, t.pole, t.value)
      return { shape: opts.terms ? b.terms.map((t) => `${t.left.join('.')}:${t.helicity}`).join(';') : '', values, info: b.terms }
    },
    { key: `bcfw:${p.theory}:${p.s}:${h.join(',')}:${shift.join(',')}:${opts.terms ? 't' : ''}` },
  )
  if (!r) return null
  const terms = opts.terms ? r.info.map((t, s) => ({ left: t.left, helicity: t.helicity, z: r.values[1 + 3 * s]!, pole: r.values[2 + 3 * s]!, value: r.values[3 + 3 * s]!, children: null })) : []
  return { value: r.values[0]!, terms, primes: r.primes }
}
