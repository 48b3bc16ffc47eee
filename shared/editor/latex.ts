// LaTeX for what the editor shows through KatexMath: each three-point vertex by the
// little-group formula of docs/conventions.md "Amplitudes and normalisations", each channel term, a process.
import type { Process } from '../schemas/graph'
import { helicityText } from './types'
import { THEORIES } from '../physics/theories'

/** A leg name in TeX: labels as they are, lines L3 as P_{3}, the shifted legs hatted. */
export function legTex(name: string, hatted: string[] = []): string {
  const base = /^L\d+$/.test(name) ? `P_{${name.slice(1)}}` : name
  return hatted.includes(name) ? `\\hat{${base}}` : base
}

function bracket(kind: 'angle' | 'square', a: string, b: string): string {
  return kind === 'angle' ? `\\langle ${a}\\,${b}\\rangle` : `[${a}\\,${b}]`
}

/**
 * The three-point amplitude of a vertex with legs (a, b, c) and helicities (h1, h2, h3):
 * angle ⟨12⟩^(h3−h1−h2)⟨23⟩^(h1−h2−h3)⟨31⟩^(h2−h3−h1); square σ[12]^(h1+h2−h3)[23]^(h2+h3−h1)[31]^(h3+h1−h2),
 * σ = (−1)^s (docs/conventions.md); the cubic scalar's is 1.
 */
export function vertexTex(kind: 'angle' | 'square', legs: string[], h: number[], s: number | null, hatted: string[] = []): string {
  if (legs.length !== 3 || h.length !== 3) return kind === 'angle' ? 'A_3^{\\langle\\rangle}' : 'A_3^{[\\,]}'
  if (s === 0) return '1'
  const [a, b, c] = legs.map(l => legTex(l, hatted)) as [string, string, string]
  const [h1, h2, h3] = h as [number, number, number]
  const factors: [string, number][] = kind === 'angle'
    ? [[bracket('angle', a, b), h3 - h1 - h2], [bracket('angle', b, c), h1 - h2 - h3], [bracket('angle', c, a), h2 - h3 - h1]]
    : [[bracket('square', a, b), h1 + h2 - h3], [bracket('square', b, c), h2 + h3 - h1], [bracket('square', c, a), h3 + h1 - h2]]
  const pow = (f: string, e: number) => (e === 1 ? f : `${f}^{${e}}`)
  const num = factors.filter(([, e]) => e > 0).map(([f, e]) => pow(f, e)).join('')
  const den = factors.filter(([, e]) => e < 0).map(([f, e]) => pow(f, -e)).join('')
  const sigma = kind === 'square' && s !== null && s % 2 === 1 ? '-' : ''
  if (!den) return `${sigma}${num || '1'}`
  return `${sigma}\\frac{${num || '1'}}{${den}}`
}

/** A channel term: A_L(…, −P̂^h) A_R(…, P̂^−h) / P²_L (docs/conventions.md "BCFW"). */
export function termTex(left: number[], right: number[], h: number, shift?: [number, number]): string {
  const hat = (l: number) => (shift && (l === shift[0] || l === shift[1]) ? `\\hat{${l}}` : String(l))
  const hs = (x: number) => (x === 0 ? '' : `^{${helicityText(x).replace('−', '-')}}`)
  const L = left.map(hat).join(',')
  const R = right.map(hat).join(',')
  return `\\frac{A_L(${L},-\\hat{P}${hs(h)})\\,A_R(${R},\\hat{P}${hs(-h)})}{s_{${left.join('')}}}`
}

/** The process as A_n(1^−, 2^−, 3^+, …). */
export function processTex(p: Process): string {
  const order = p.order && p.order.length === p.helicities.length ? p.order : p.helicities.map((_, t) => t + 1)
  const legs = order.map(l => `${l}^{${helicityText(p.helicities[l - 1]!).replace('−', '-')}}`)
  return `${THEORIES[p.theory].amplitudeLatex}_{${p.helicities.length}}(${legs.join(',')})`
}
