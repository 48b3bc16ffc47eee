// Helpers of the quark tests: every helicity assignment and quark-line position of a process.
import type { Process } from '#shared/physics/theories'

export const QCD: Process = { theory: 'qcd', s: 1, colourOrdered: true }

export interface QuarkCase {
  h: number[]
  pdg: number[]
}

/** One quark line (q̄ at a, q at b) and n − 2 gluons: every position and helicity assignment. */
export function oneLineCases(n: number, opts: { conserving?: boolean; nonVanishing?: boolean } = {}): QuarkCase[] {
  const out: QuarkCase[] = []
  for (let a = 0; a < n; a++) for (let b = 0; b < n; b++) {
    if (a === b) continue
    for (let m = 0; m < 1 << n; m++) {
      const h = Array.from({ length: n }, (_, t) => ((m >> t) & 1 ? 1 : -1) * (t === a || t === b ? 0.5 : 1))
      if (opts.conserving !== false && h[a] === h[b]) continue
      const minus = h.filter((x) => x < 0).length
      if (opts.nonVanishing && (minus < 2 || n - minus < 2)) continue
      out.push({ h, pdg: Array.from({ length: n }, (_, t) => (t === a ? -1 : t === b ? 1 : 21)) })
    }
  }
  return out
}

/** Wire species names of a case. */
export function speciesNames(pdg: readonly number[]): string[] {
  return pdg.map((c) => (c === 21 ? 'g' : c > 0 ? `q${c}` : `qbar${-c}`))
}

/** A deterministic sample of a list (every k-th item). */
export function sample<T>(xs: T[], count: number): T[] {
  const step = Math.max(1, Math.floor(xs.length / count))
  return xs.filter((_, t) => t % step === 0)
}

/**
 * Two quark lines of flavours 1 and 2 (q̄₁ at a1, q₁ at b1, q̄₂ at a2, q₂ at b2) and n − 4 gluons:
 * every position and helicity assignment with opposite helicities at the ends of each line.
 */
export function twoLineCases(n: number, opts: { nonVanishing?: boolean } = {}): QuarkCase[] {
  const out: QuarkCase[] = []
  const legs = Array.from({ length: n }, (_, t) => t)
  for (const a1 of legs) for (const b1 of legs) for (const a2 of legs) for (const b2 of legs) {
    if (new Set([a1, b1, a2, b2]).size < 4) continue
    const pdg = legs.map((t) => (t === a1 ? -1 : t === b1 ? 1 : t === a2 ? -2 : t === b2 ? 2 : 21))
    for (let m = 0; m < 1 << n; m++) {
      const h = legs.map((t) => ((m >> t) & 1 ? 1 : -1) * (pdg[t] === 21 ? 1 : 0.5))
      if (h[a1] === h[b1] || h[a2] === h[b2]) continue
      const minus = h.filter((x) => x < 0).length
      if (opts.nonVanishing && (minus < 2 || n - minus < 2)) continue
      out.push({ h, pdg })
    }
  }
  return out
}
