// How loop-cut numbers and boxes read in the editor: wire numbers as text, corners as {1}{2,3}…
import type { WireNumber } from '../physics/field'

/** A wire number as text: exact fractions as they come, floats to 6 significant digits. */
export function wireText(w: WireNumber | null): string {
  if (!w) return '—'
  const [re, im] = w
  if (typeof re === 'string') return im === '0' ? re : `${re} ${String(im).startsWith('-') ? '−' : '+'} ${String(im).replace(/^-/, '')} i`
  const f = (x: number) => (x === 0 ? '0' : x.toPrecision(6))
  return Math.abs(im as number) < 1e-300 ? f(re) : `${f(re)} ${(im as number) < 0 ? '−' : '+'} ${f(Math.abs(im as number))} i`
}
export const cornersText = (cs: number[][]) => cs.map(c => `{${c.join(',')}}`).join('')
/** Internal helicities h₁…h₄, "·" for an open Line. */
export const linesText = (hs: (number | null)[]) => hs.map(h => (h === null ? '·' : h > 0 ? '+' : '−')).join('')
