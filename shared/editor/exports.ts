// Exports of the editor: the term table as CSV and as a LaTeX table, and the canvas as a
// standalone SVG drawn from node positions and shapes (the PNG is this SVG drawn on a canvas),
// captioned with the process and the shift so a figure pasted into a paper says what it shows.
import type { EvaluateResponse, WireComplex } from '../schemas/evaluate'
import type { Process } from '../schemas/graph'
import type { EditorEdge, EditorNode, LineData } from './types'
import { helicityText, sign } from './types'
import { absOf, fmtDeviation, fmtReal, phaseOf } from './format'
import { neutraliseCell } from '../csv-safe'
import { chevronPoints, handleLayout, nodeSize, slotAtPosition } from './geometry'
import { orderOf } from './process'
import { THEORIES } from '../physics/theories'

/** Colours of tailwind.config.ts (kept in step by hand: the SVG must stand alone). */
export const PALETTE = {
  paper: '#f7f3ea', ink: '#1f2328', inkSoft: '#4a4f57', edge: '#ddd3bf', accent: '#3d4fd6',
  angle: '#0f8b8d', angleLight: '#d5efef', square: '#e04e2b', squareLight: '#fbe0d8', block: '#52606d', blockLight: '#e4e8ec',
}

const csvCell = (raw: string) => {
  const s = neutraliseCell(raw)
  return /[",\n\r]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s
}
const part = (c: WireComplex | null | undefined, k: 0 | 1) => (c ? (typeof c[k] === 'string' ? (c[k] as string) : String(c[k])) : '')

/** The term table as CSV: one row per channel term, then the total and the target. */
export function termsCsv(r: EvaluateResponse, _p?: Process): string {
  const head = ['channel', 'helicity', 'z_re', 'z_im', 'pole_re', 'pole_im', 'value_re', 'value_im', 'abs', 'phase_over_pi']
  const rows = r.terms.map(t => [
    `{${t.left.join(' ')}}`, String(t.helicity),
    part(t.z, 0), part(t.z, 1), part(t.pole, 0), part(t.pole, 1), part(t.value, 0), part(t.value, 1),
    String(absOf(t.value)), String(phaseOf(t.value)),
  ])
  const tail = (name: string, v: WireComplex | null | undefined) => [name, '', '', '', '', '', part(v, 0), part(v, 1), v ? String(absOf(v)) : '', v ? String(phaseOf(v)) : '']
  rows.push(tail('total', r.value))
  if (r.target) rows.push(tail(`target:${r.target.name}`, r.target.value))
  const meta = `# shift [${r.shift.join(',')}>, arithmetic ${r.arithmetic}, deviation ${r.deviation ?? ''}, verdict ${r.verdict}, engine ${r.engine.version}`
  return [meta, head.join(','), ...rows.map(row => row.map(csvCell).join(','))].join('\n') + '\n'
}

const texNum = (x: number | string) => {
  if (typeof x === 'string') return x.includes('/') ? `\\tfrac{${x.split('/')[0]}}{${x.split('/')[1]}}` : x
  const s = fmtReal(x, 8)
  const m = /^(-?[\d.]+)e([+-])0*(\d+)$/.exec(s)
  return m ? `${m[1]}\\times 10^{${m[2] === '-' ? '-' : ''}${m[3]}}` : s
}
const texComplex = (c: WireComplex | null | undefined) => (c ? `$${texNum(c[0])}$ & $${texNum(c[1])}$` : '-- & --')

/** The term table as a LaTeX tabular (booktabs rules). */
export function termsLatex(r: EvaluateResponse, p: Process): string {
  const lines = [
    `% ${p.theory}, helicities (${p.helicities.map(sign).join('')}), shift [${r.shift.join(',')}\\rangle, ${r.arithmetic} arithmetic; verdict: ${r.verdict}`,
    '\\begin{tabular}{llrrrr}',
    '\\toprule',
    'channel & $h$ & $\\mathrm{Re}\\,z^*$ & $\\mathrm{Im}\\,z^*$ & $\\mathrm{Re}$ term & $\\mathrm{Im}$ term \\\\',
    '\\midrule',
    ...r.terms.map(t => `$\\{${t.left.join(',')}\\}$ & $${helicityText(t.helicity).replace('−', '-')}$ & ${texComplex(t.z)} & ${texComplex(t.value)} \\\\`),
    '\\midrule',
    `total & & & & ${texComplex(r.value)} \\\\`,
    ...(r.target ? [`target (${r.target.name}) & & & & ${texComplex(r.target.value)} \\\\`] : []),
    `\\multicolumn{6}{l}{relative deviation ${fmtDeviation(r.deviation)}} \\\\`,
    '\\bottomrule',
    '\\end{tabular}',
  ]
  return lines.join('\n') + '\n'
}

const SUP: Record<string, string> = { '+': '⁺', '−': '⁻', '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹', '/': 'ᐟ' }
const SUB: Record<string, string> = { 0: '₀', 1: '₁', 2: '₂', 3: '₃', 4: '₄', 5: '₅', 6: '₆', 7: '₇', 8: '₈', 9: '₉' }
const sup = (t: string) => [...t].map(c => SUP[c] ?? c).join('')

/** The figure caption: A₅(1⁻, 2⁻, 3⁺, 4⁺, 5⁺) · gluons (colour-ordered) · shift [1,2⟩ (legs in colour order). */
export function exportCaption(p: Process | null | undefined): string {
  if (!p) return 'no process set'
  const info = THEORIES[p.theory]
  const n = p.helicities.length
  const legs = orderOf(p).map(l => `${l}${sup(helicityText(p.helicities[l - 1]!))}`)
  const theory = `${info.label}${p.theory === 'spin' && p.spin !== undefined ? `, s = ${p.spin}` : ''}`
  const shift = p.shift ? `shift [${p.shift[0]},${p.shift[1]}⟩` : 'default shift'
  return `${info.amplitudeLatex}${[...String(n)].map(d => SUB[d]).join('')}(${legs.join(', ')}) · ${theory} · ${shift}`
}

const esc = (s: string) => s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;')

/** The canvas as a standalone SVG: same shapes, colours and handle positions as the nodes. */
export function canvasSvg(nodes: EditorNode[], edges: EditorEdge[], opts: { shift?: [number, number], title?: string, caption?: string, padding?: number } = {}): string {
  const pad = opts.padding ?? 40
  const byId = new Map(nodes.map(n => [n.id, n]))
  let minX = Infinity
  let minY = Infinity
  let maxX = -Infinity
  let maxY = -Infinity
  for (const n of nodes) {
    const s = nodeSize(n)
    minX = Math.min(minX, n.position.x)
    minY = Math.min(minY, n.position.y)
    maxX = Math.max(maxX, n.position.x + s.width)
    maxY = Math.max(maxY, n.position.y + s.height)
  }
  if (!nodes.length) { minX = 0; minY = 0; maxX = 200; maxY = 80 }
  const titleH = opts.title ? 28 : 0
  const captionH = opts.caption ? 26 : 0
  // Wide enough for the caption (about 7 px a character at 13 px).
  const W = Math.ceil(Math.max(maxX - minX + 2 * pad, opts.caption ? opts.caption.length * 7 + 2 * pad : 0))
  const H = Math.ceil(maxY - minY + 2 * pad + titleH + captionH)
  const ox = pad - minX
  const oy = pad - minY + titleH
  const handlePos = (id: string, h: string | null | undefined) => {
    const n = byId.get(id)!
    const hl = handleLayout(n).find(x => x.id === (h ?? '')) ?? handleLayout(n)[0]!
    return { x: n.position.x + hl.x + ox, y: n.position.y + hl.y + oy }
  }
  const out: string[] = []
  out.push(`<svg xmlns="http://www.w3.org/2000/svg" width="${W}" height="${H}" viewBox="0 0 ${W} ${H}" font-family="Space Grotesk, system-ui, sans-serif">`)
  out.push(`<rect width="${W}" height="${H}" fill="${PALETTE.paper}"/>`)
  if (opts.title) out.push(`<text x="${pad}" y="${pad - 8}" font-size="15" font-weight="700" fill="${PALETTE.ink}">${esc(opts.title)}</text>`)
  if (opts.caption) out.push(`<text x="${pad}" y="${H - pad / 2}" font-size="13" fill="${PALETTE.inkSoft}" data-role="caption">${esc(opts.caption)}</text>`)
  for (const e of edges) {
    if (!byId.has(e.source) || !byId.has(e.target)) continue
    const a = handlePos(e.source, e.sourceHandle)
    const b = handlePos(e.target, e.targetHandle)
    const d = (e.data ?? {}) as LineData
    const external = byId.get(e.source)!.type === 'leg' || byId.get(e.target)!.type === 'leg'
    out.push(`<line x1="${a.x}" y1="${a.y}" x2="${b.x}" y2="${b.y}" stroke="${external ? PALETTE.ink : PALETTE.inkSoft}" stroke-width="${external ? 1.6 : 2}"${external ? '' : ' stroke-dasharray="6 4"'}/>`)
    if (!external && d.helicity !== undefined) {
      const th = d.targetHelicity ?? -d.helicity
      const [l, r] = a.x <= b.x ? [d.helicity, th] : [th, d.helicity]
      const mx = (a.x + b.x) / 2
      const my = (a.y + b.y) / 2
      out.push(`<rect x="${mx - 20}" y="${my - 10}" width="40" height="20" rx="10" fill="#fff" stroke="${PALETTE.inkSoft}"/>`)
      out.push(`<text x="${mx}" y="${my + 4}" font-size="12" text-anchor="middle" fill="${PALETTE.ink}">${helicityText(l)}|${helicityText(r)}</text>`)
    }
  }
  for (const n of nodes) {
    const { width: w, height: h } = nodeSize(n)
    const x = n.position.x + ox
    const y = n.position.y + oy
    if (n.type === 'leg') {
      const d = n.data
      const shifted = opts.shift && (opts.shift[0] === d.label || opts.shift[1] === d.label)
      if (shifted) {
        out.push(`<circle cx="${x + w - 2}" cy="${y + 2}" r="9" fill="${PALETTE.accent}" opacity="0.9"/>`)
        out.push(`<text x="${x + w - 2}" y="${y + 6}" font-size="11" font-style="italic" text-anchor="middle" fill="#fff">z</text>`)
      }
      out.push(`<rect x="${x}" y="${y}" width="${w}" height="${h}" rx="${h / 2}" fill="#fff" stroke="${PALETTE.ink}" stroke-width="1.4"/>`)
      out.push(`<text x="${x + w / 2}" y="${y + h / 2 + 5}" font-size="14" font-weight="700" text-anchor="middle" fill="${PALETTE.ink}">${d.label}${esc(sign(d.helicity))}</text>`)
    }
    else if (n.type === 'angle') {
      const pts = chevronPoints(w, h).map(([px, py]) => `${x + px},${y + py}`).join(' ')
      out.push(`<polygon points="${pts}" fill="${PALETTE.angle}" stroke="${PALETTE.angle}"/>`)
      out.push(`<text x="${x + w / 2 + 2}" y="${y + h / 2 + 5}" font-size="15" font-weight="700" text-anchor="middle" fill="#fff">⟨⟩</text>`)
    }
    else if (n.type === 'square') {
      out.push(`<rect x="${x}" y="${y}" width="${w}" height="${h}" fill="${PALETTE.square}"/>`)
      out.push(`<text x="${x + w / 2}" y="${y + h / 2 + 5}" font-size="15" font-weight="700" text-anchor="middle" fill="#fff">[ ]</text>`)
    }
    else {
      const d = n.data
      out.push(`<rect x="${x}" y="${y}" width="${w}" height="${h}" rx="12" fill="${PALETTE.blockLight}" stroke="${PALETTE.block}" stroke-width="1.6"/>`)
      const k = d.helicities.length
      out.push(`<text x="${x + 10}" y="${y + 23}" font-size="12" font-weight="700" fill="${PALETTE.block}">A${[...String(k)].map(c => SUB[c]).join('')}</text>`)
      out.push(`<line x1="${x}" y1="${y + 36}" x2="${x + w}" y2="${y + 36}" stroke="${PALETTE.block}" stroke-opacity="0.3"/>`)
      // The slot labels, row by row as the card shows them: leg or line name with its helicity.
      const slotText = (t: number) => `${esc(d.legs?.[t]?.replace(/^L(\d+)$/, 'P$1') ?? String(t + 1))}${sup(helicityText(d.helicities[t]!))}`
      const at = (pos: number) => slotAtPosition(n, pos, k)
      for (let r = 0; r < Math.ceil(k / 2); r++) {
        const ty = y + 40 + r * 18 + 13
        out.push(`<text x="${x + 12}" y="${ty}" font-size="12" fill="${PALETTE.ink}" data-role="slot">${slotText(at(r))}</text>`)
        if (r !== k - 1 - r) out.push(`<text x="${x + w - 12}" y="${ty}" font-size="12" text-anchor="end" fill="${PALETTE.ink}" data-role="slot">${slotText(at(k - 1 - r))}</text>`)
      }
    }
    for (const hl of n.type === 'leg' ? [] : handleLayout(n)) out.push(`<circle cx="${x + hl.x}" cy="${y + hl.y}" r="3" fill="${PALETTE.ink}"/>`)
  }
  out.push('</svg>')
  return out.join('\n')
}
