import { describe, expect, it } from 'vitest'
import { splitInlineMath } from '#shared/schemas/collab'

describe('splitInlineMath: $...$ on one line is math, \\$ is a dollar', () => {
  it.each([
    ['plain text', 'no math here', [['text', 'no math here']]],
    ['one formula', 'pole at $s_{12}=0$.', [['text', 'pole at '], ['math', 's_{12}=0'], ['text', '.']]],
    ['two formulas', '$a$ and $b$', [['math', 'a'], ['text', ' and '], ['math', 'b']]],
    ['an escaped dollar', 'costs \\$5', [['text', 'costs $5']]],
    ['an escaped dollar inside math', '$x = \\$y$', [['math', 'x = \\$y']]],
    ['an unclosed dollar stays text', 'only $half', [['text', 'only $half']]],
    ['math does not cross a line break', '$a\nb$', [['text', '$a\nb$']]],
    ['an empty pair is text', 'a $$ b', [['text', 'a $$ b']]],
    ['a price is not math', 'costs $5', [['text', 'costs $5']]],
    ['two prices are not math', 'costs $5 and $10 more', [['text', 'costs $5 and $10 more']]],
    ['a dollar before a space opens nothing', 'pay $ 5 or $x$', [['text', 'pay $ 5 or '], ['math', 'x']]],
    ['math next to a price', '$s_{12}$ costs $5', [['math', 's_{12}'], ['text', ' costs $5']]],
    ['angle brackets are just characters', '<1 2> and $\\langle 1 2\\rangle$', [['text', '<1 2> and '], ['math', '\\langle 1 2\\rangle']]],
  ])('%s', (_label, input, expected) => {
    expect(splitInlineMath(input).map(p => [p.kind, p.value])).toEqual(expected)
  })
})
