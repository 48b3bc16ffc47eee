// Node sizes and handle positions, shared by the node components, the layout function and the
// SVG export, so an exported picture matches the canvas.
import type { EditorNode, Origin } from './types'
import { handleCount } from './types'

export const LEG_SIZE = { width: 46, height: 28 }
export const ANGLE_SIZE = { width: 64, height: 48 }
export const SQUARE_SIZE = { width: 52, height: 52 }
export const BLOCK_WIDTH = 150
export const BLOCK_ROW = 18

export function blockHeight(k: number): number {
  return 44 + Math.max(1, Math.ceil(k / 2)) * BLOCK_ROW
}

export function nodeSize(n: Pick<EditorNode, 'type' | 'data'>): { width: number, height: number } {
  if (n.type === 'leg') return LEG_SIZE
  if (n.type === 'block') return { width: BLOCK_WIDTH, height: blockHeight(handleCount(n as EditorNode)) }
  return n.type === 'angle' ? ANGLE_SIZE : SQUARE_SIZE
}

/** The chevron outline of an angle vertex (points, relative to the node's top-left). */
export function chevronPoints(w = ANGLE_SIZE.width, h = ANGLE_SIZE.height, notch = 14): [number, number][] {
  return [[0, 0], [w - notch, 0], [w, h / 2], [w - notch, h], [0, h], [notch, h / 2]]
}

/** The side of each handle position (before rotation), for choosing a rotation. */
export function baseSides(type: EditorNode['type'], k: number): ('left' | 'right')[] {
  if (type === 'leg') return ['right']
  if (type === 'angle' || type === 'square') return ['left', 'right', 'right']
  return Array.from({ length: k }, (_, t) => (t < Math.ceil(k / 2) ? 'left' : 'right'))
}

/**
 * Handle offsets (relative to the node's top-left) and their side. Vertex slots h0, h1, h2 go
 * around the node in cyclic order: left, upper right, lower right. Block slots: first half down
 * the left side, the rest up the right side (so the cyclic order runs round the card). `data.rot`
 * rotates slots round these positions (the cyclic order stays), so a line can face its partner.
 */
export function handleLayout(n: Pick<EditorNode, 'type' | 'data'>): { id: string, x: number, y: number, side: 'left' | 'right' | 'top' | 'bottom' }[] {
  const { width: w, height: h } = nodeSize(n)
  if (n.type === 'leg') return [{ id: 'p', x: w / 2, y: h / 2, side: 'right' }]
  const rot = Number((n.data as { rot?: number }).rot ?? 0) || 0
  let base: { x: number, y: number, side: 'left' | 'right' }[]
  if (n.type === 'angle') {
    base = [
      { x: 14, y: h / 2, side: 'left' },
      { x: w - 7, y: h / 4, side: 'right' },
      { x: w - 7, y: (3 * h) / 4, side: 'right' },
    ]
  }
  else if (n.type === 'square') {
    base = [
      { x: 0, y: h / 2, side: 'left' },
      { x: w, y: h / 4, side: 'right' },
      { x: w, y: (3 * h) / 4, side: 'right' },
    ]
  }
  else {
    const k = handleCount(n as EditorNode)
    const left = Math.ceil(k / 2)
    base = []
    for (let t = 0; t < k; t++) {
      const onLeft = t < left
      const row = onLeft ? t : k - 1 - t
      base.push({ x: onLeft ? 0 : w, y: 40 + row * BLOCK_ROW + BLOCK_ROW / 2, side: onLeft ? 'left' : 'right' })
    }
  }
  const k = base.length
  return base.map((_, t) => ({ id: `h${t}`, ...base[(((t + rot) % k) + k) % k]! }))
}

/** The slot each handle position shows, after rotation (for labelling a block's rows). */
export function slotAtPosition(n: { data: Origin }, position: number, k: number): number {
  const rot = Number(n.data.rot ?? 0) || 0
  return (((position - rot) % k) + k) % k
}

/** The rotation that puts the most slots on the side they want (ties: the smallest rotation). */
export function bestRotation(type: EditorNode['type'], k: number, want: (('left' | 'right') | null)[]): number {
  const sides = baseSides(type, k)
  let best = 0
  let bestScore = -1
  for (let rot = 0; rot < k; rot++) {
    let score = 0
    want.forEach((w, t) => { if (w && sides[(t + rot) % k] === w) score++ })
    if (score > bestScore) { best = rot; bestScore = score }
  }
  return best
}

/** Room above a term's or ring's frame for its label: the canvas places the frame node this much higher. */
export const TERM_LABEL_HEIGHT = 28
