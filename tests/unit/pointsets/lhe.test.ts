// Les Houches event files: the reader follows the field layout of the standard, Alwall et al.,
// "A standard format for Les Houches Event Files", Comput. Phys. Commun. 176 (2007) 300,
// hep-ph/0609017. tests/fixtures/gluons.lhe was written for these tests from that layout.
import { describe, expect, it } from 'vitest'
import { readFileSync } from 'node:fs'
import { resolve } from 'node:path'
import { parseLhe, validatePoints, PointFileError, TooManyPointsError, MAX_POINTS } from '#shared/pointsets'

const fixture = readFileSync(resolve(import.meta.dirname, '../../fixtures/gluons.lhe'), 'utf8')

function refused(text: string): PointFileError {
  try {
    parseLhe(text)
  }
  catch (e) {
    if (e instanceof PointFileError) return e
    throw e
  }
  throw new Error('the file was accepted')
}

const P = (id: number, st: number, px: number, py: number, pz: number, e: number, m = 0) => ` ${id} ${st} 0 0 0 0 ${px} ${py} ${pz} ${e} ${m} 0 9`
const file = (events: string[][]) => [
  '<LesHouchesEvents version="1.0">',
  '<init>',
  ' 2212 2212 250 250 0 0 0 0 3 1',
  ' 1.0 0.1 1.0 1',
  '</init>',
  ...events.flatMap(e => ['<event>', ` ${e.length} 1 1.0 100 0.0078 0.118`, ...e, '</event>']),
  '</LesHouchesEvents>',
].join('\n')
// g g → g g at √s = 500 (beams along ±z, outgoing pair back to back).
const twoToTwo = [P(21, -1, 0, 0, 250, 250), P(21, -1, 0, 0, -250, 250), P(21, 1, 150, 200, 0, 250), P(21, 1, -150, -200, 0, 250)]

describe('Les Houches event files (hep-ph/0609017)', () => {
  it('reads <init> and every <event>, keeping particle codes and weights', () => {
    const r = parseLhe(fixture)
    expect(r.meta.version).toBe('1.0')
    expect(r.meta.beams).toEqual({ id: [2212, 2212], energy: [500, 500] })
    expect(r.meta.processes).toEqual([{ id: 1, crossSection: 12.5, error: 0.25 }])
    expect(r.points).toHaveLength(5)
    expect(r.points[0]!.codes).toEqual([21, 21, 21, 21, 21, 21])
    expect(r.points[1]!.weight).toBe(0.5)
    expect(r.points[2]!.codes).toEqual([21, 21, 6, 21, 21, 21])
  })

  it('crosses incoming particles to outgoing (p → −p) and orders incoming first', () => {
    const r = parseLhe(fixture)
    const m = r.points[0]!.momenta!
    // Beam 1 along +z with E = 500 comes in; as an outgoing leg it is (−500, 0, 0, −500).
    expect(m[0]).toEqual([-500, 0, 0, -500])
    expect(m[1]).toEqual([-500, 0, 0, 500])
    expect(m[2]).toEqual([112.26212609, 5.5706518238, 95.650643135, 58.503908087])
    // All outgoing: the sum vanishes (to the digits written).
    for (let mu = 0; mu < 4; mu++) expect(Math.abs(m.reduce((a, p) => a + p[mu]!, 0))).toBeLessThan(1e-7)
  })

  it('skips intermediate (status 2) lines and optional lines after the particles', () => {
    const r = parseLhe(fixture)
    expect(r.points[1]!.momenta).toHaveLength(6)
  })

  it('refuses massive, non-conserving and wrong-length events with reasons and sizes', () => {
    const { valid, rejected, n } = validatePoints(parseLhe(fixture).points, 6)
    expect(n).toBe(6)
    expect(valid.map(p => p.label)).toEqual(['event 1', 'event 2'])
    expect(rejected).toHaveLength(3)
    const [massive, broken, short] = rejected
    expect(massive!.point).toBe('event 3')
    expect(massive!.reason).toMatch(/^leg 3 is not massless: p² = .* \(particle code 6\)$/)
    // p² = m² = 173² relative to the largest energy squared (500²).
    expect(massive!.size).toBeCloseTo(173 ** 2 / 500 ** 2, 6)
    expect(broken!.reason).toMatch(/^momentum is not conserved: \|Σp\| = /)
    expect(broken!.size).toBeGreaterThan(5e-3)
    expect(short).toEqual({ point: 'event 5', reason: 'has 4 legs; this point set has 6', size: null })
  })

  it('accepts the four-gluon event on its own with its minimum invariant', () => {
    const { valid } = validatePoints(parseLhe(file([twoToTwo])).points)
    expect(valid).toHaveLength(1)
    // s = 500², t = −2 p1·p3 = −250·250·2 (transverse outgoing), |t| / s = 1/2.
    expect(valid[0]!.minInvariant).toBeCloseTo(0.5, 12)
  })

  it.each([
    ['no root element', 'hello\n', 1, 1, /expected the root element <LesHouchesEvents>/],
    ['a particle line with a missing field', file([[...twoToTwo.slice(0, 3), ' 21 1 0 0 0 0 -150 -200 0 250 0 0']]), 11, 34, /SPINUP is missing/],
    ['a particle line with a word for a number', file([[...twoToTwo.slice(0, 2), ' 21 1 0 0 0 0 150 abc 0 250 0 0 9', twoToTwo[3]!]]), 10, 19, /PUP2 must be a number, got "abc"/],
    ['fewer particles than NUP', file([twoToTwo]).replace(' 4 1 1.0', ' 5 1 1.0'), 12, 1, /NUP = 5 particles announced, 4 given/],
    ['an event that is never closed', file([twoToTwo]).replace('</event>\n', ''), 6, 1, /<event> is not closed/],
    ['a truncated file', file([twoToTwo]).replace('</LesHouchesEvents>', ''), 13, 1, /ends without <\/LesHouchesEvents>/],
    ['a short <init> line', file([twoToTwo]).replace(' 2212 2212 250 250 0 0 0 0 3 1', ' 2212 2212 250 250'), 3, 19, /PDFGUP1 is missing/],
  ])('refuses %s with line and column', (_what, text, line, column, reason) => {
    const e = refused(text)
    expect(e.line).toBe(line)
    expect(e.column).toBe(column)
    expect(e.message).toMatch(reason)
    expect(e.message).toMatch(/^file: line \d+, column \d+: /)
  })

  it('accepts Fortran D exponents (common practice of Fortran writers)', () => {
    const r = parseLhe(file([twoToTwo.map(l => l.replace(' 250 ', ' 2.5D+02 '))]))
    expect(r.points[0]!.momenta![2]![0]).toBe(250)
  })

  it(`stops at ${MAX_POINTS} events`, () => {
    const many = file(Array.from({ length: MAX_POINTS + 1 }, () => twoToTwo))
    expect(() => parseLhe(many)).toThrow(TooManyPointsError)
  })
})
