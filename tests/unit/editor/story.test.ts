import { describe, expect, it } from 'vitest'
import { resultStory, type StoryInput } from '#shared/editor/story'

const base: StoryInput = { verdict: 'agrees', drawing: null, falloff: -1, crossAgree: true, hasTarget: true }

describe('one story per result', () => {
  it.each<[string, Partial<StoryInput>, string, RegExp]>([
    ['agrees with every support', {}, 'agrees', /agrees with the target, A\(z\) falls off along the shift and the valid shifts agree/],
    ['spin 3: falls off, no target, valid shifts disagree', { verdict: 'not evaluated', hasTarget: false, crossAgree: false, falloff: -1 }, 'boundary', /valid shifts disagree.*even though A\(z\) falls off.*Do not trust/],
    ['no falloff', { verdict: 'boundary term suspected', falloff: 0, crossAgree: null }, 'boundary', /does not fall off.*boundary term/],
    ['an incomplete drawing', { verdict: 'disagrees', drawing: { complete: false, messages: ['channel {1,6} with internal helicity − is not drawn'] } }, 'disagrees', /not the recursion.*channel \{1,6\} with internal helicity − is not drawn/],
    ['no target, consistent', { verdict: 'not evaluated', hasTarget: false }, 'neutral', /No target.*consistent/],
  ])('%s', (_, x, tone, text) => {
    const s = resultStory({ ...base, ...x })
    expect(s.tone).toBe(tone)
    expect(s.text).toMatch(text)
    // Never both at once.
    expect(/can be trusted/.test(s.text) && /disagree/.test(s.text)).toBe(false)
  })
})
