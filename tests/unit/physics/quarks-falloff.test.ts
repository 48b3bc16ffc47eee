// The qcd falloff table (docs/conventions.md "Falloff") confirmed by the exact probe, whose A(z)
// comes from the Berends–Giele current with one or two quark lines (Berends & Giele, Nucl. Phys.
// B306 (1988) 759).
import { describe, expect, it } from 'vitest'
import { probeFalloff } from '#shared/physics/falloff'
import { processOf, tableExponent, isValidShift } from '#shared/physics/theories'
import { QCD_FALLOFF_RISE, isQuarkCode, linesCross } from '#shared/physics/quarks'
import { oneLineCases, sample, speciesNames, twoLineCases } from './quarks-helpers'

const typeOf = (c: number, h: number) => `${isQuarkCode(c) ? 'f' : 'g'}${h > 0 ? '+' : '-'}`

describe('qcd falloff table = measured exponent', () => {
  for (const n of [5, 6]) {
    it(`n = ${n}: every table entry, adjacent and not`, () => {
      const seen = new Set<string>()
      for (const { h, pdg } of oneLineCases(n, { nonVanishing: true })) {
        for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
          if (i === j) continue
          const adj = (i - j + n) % n === 1 || (j - i + n) % n === 1
          const key = `${typeOf(pdg[i]!, h[i]!)}${typeOf(pdg[j]!, h[j]!)}:${adj}`
          if (seen.has(key)) continue
          seen.add(key)
          const p = processOf('qcd', undefined, h, speciesNames(pdg))
          const f = probeFalloff(p, h, i, j)
          expect(f.measured).toBe(true)
          expect(f.exponent, `${key} ${h} ${pdg} [${i + 1},${j + 1}⟩`).toBe(tableExponent(p, h, i, j))
          expect(isValidShift(p, h, i, j)).toBe(f.exponent < 0)
        }
      }
      // every entry of the table was met, both adjacent and not
      expect(seen.size).toBe(2 * Object.keys(QCD_FALLOFF_RISE).length)
    })
  }
})

describe('two quark lines: the table bounds the measured exponent and its validity is exact', () => {
  for (const [n, count] of [[4, 200], [5, 60], [6, 20]] as [number, number][]) {
    it(`n = ${n}: every shift of ${n === 4 ? 'every' : 'sampled'} assignment${n === 4 ? '' : 's'}`, () => {
      let lines = 0
      for (const { h, pdg } of sample(twoLineCases(n, { nonVanishing: true }).filter(({ pdg }) => !linesCross(pdg)), count)) {
        const p = processOf('qcd', undefined, h, speciesNames(pdg))
        for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
          if (i === j) continue
          const f = probeFalloff(p, h, i, j)
          const t = tableExponent(p, h, i, j)!
          expect(f.exponent, `${h} ${pdg} [${i + 1},${j + 1}⟩`).toBeLessThanOrEqual(t)
          expect(isValidShift(p, h, i, j), `${h} ${pdg} [${i + 1},${j + 1}⟩`).toBe(f.exponent < 0)
          if (isQuarkCode(pdg[i]!) && isQuarkCode(pdg[j]!) && Math.abs(pdg[i]!) !== Math.abs(pdg[j]!)) lines++
        }
      }
      expect(lines).toBeGreaterThan(0)
    })
  }
})
