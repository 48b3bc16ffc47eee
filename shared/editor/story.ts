// One sentence per result: the verdict, the drawing's comparison, the measured falloff and the
// cross-shift check decide together, so the drawer never says "can be trusted" beside "the valid
// shifts disagree".
import type { Verdict } from '../schemas/evaluate'

export interface StoryInput {
  verdict: Verdict | string
  /** The drawing's comparison, when the check evaluated a drawing. */
  drawing?: { complete: boolean, messages: string[] } | null
  /** Exponent k of |A(z)| ~ |z|^k measured along the shift (null: not measured). */
  falloff: number | null
  /** Whether the valid shifts agree with each other (null: not run). */
  crossAgree: boolean | null
  hasTarget: boolean
  /** The value is the drawing's sum (a check of what is on the canvas). */
  drawn?: boolean
}

export interface Story { tone: 'agrees' | 'disagrees' | 'boundary' | 'neutral', text: string }

export function resultStory(x: StoryInput): Story {
  const what = x.drawn ? 'The drawn residue sum' : 'The residue sum'
  if (x.drawing && !x.drawing.complete) {
    const first = x.drawing.messages[0]
    return { tone: 'disagrees', text: `The drawing is not the recursion of this shift${first ? `: ${first}` : ''}${x.drawing.messages.length > 1 ? ` (and ${x.drawing.messages.length - 1} more)` : ''}.` }
  }
  const falls = x.falloff === null ? null : x.falloff < 0
  if (x.crossAgree === false) {
    return {
      tone: 'boundary',
      text: `The valid shifts disagree with each other, so no residue sum here is the amplitude${falls ? ' — even though A(z) falls off along this shift' : ''}${x.hasTarget ? '' : '; there is no target to compare with'}. Do not trust this value.`,
    }
  }
  if (falls === false) return { tone: 'boundary', text: `A(z) does not fall off along this shift (|z|^${x.falloff}): a boundary term is expected and the residue sum misses it.` }
  if (x.verdict === 'agrees') return { tone: 'agrees', text: `${what} agrees with the target${falls ? ', A(z) falls off along the shift' : ''}${x.crossAgree ? ' and the valid shifts agree' : ''}.` }
  if (x.verdict === 'disagrees') return { tone: 'disagrees', text: `${what} disagrees with the target.` }
  if (!x.hasTarget || x.verdict === 'not evaluated') {
    const support = [falls ? 'A(z) falls off along the shift' : '', x.crossAgree ? 'the valid shifts agree' : ''].filter(Boolean)
    return { tone: 'neutral', text: `No target to compare with${support.length ? `; ${support.join(' and ')}, so the residue sum is consistent` : ''}.` }
  }
  return { tone: 'neutral', text: `Verdict: ${x.verdict}.` }
}
