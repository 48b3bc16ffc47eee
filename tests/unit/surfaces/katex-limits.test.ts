// KaTeX's own size cap (its documented maxSize option) keeps a pasted \rule or \kern from covering
// the page; maxExpand stops a self-expanding macro.
import katex from 'katex'
import { describe, expect, it } from 'vitest'
import { KATEX_MAX_SIZE_EM, katexOptions } from '#shared/katex-options'

// Sizes in the visible HTML part. The MathML copy (for screen readers) is clipped to 1px by KaTeX's
// stylesheet, and it keeps \raisebox's offset uncapped; the comment box hides overflow as well.
function sizesIn(html: string): number[] {
  const rendered = html.slice(html.indexOf('katex-html'))
  return [...rendered.matchAll(/(-?[\d.]+)em/g)].map(m => Math.abs(Number(m[1])))
}

describe('comment math cannot cover the page', () => {
  it.each([
    ['a huge rule', '\\rule{10000em}{10000em}'],
    ['a huge kern', 'a\\kern{5000em}b'],
    ['a huge raise', '\\raisebox{9000em}{x}'],
  ])('%s is capped at the maximum size', (_label, tex) => {
    const html = katex.renderToString(tex, katexOptions())
    const sizes = sizesIn(html)
    expect(sizes.length).toBeGreaterThan(0)
    // The capped size plus the glyph's own height and depth (a raised box adds its strut).
    expect(Math.max(...sizes)).toBeLessThanOrEqual(KATEX_MAX_SIZE_EM * 1.5)
  })

  it('a self-expanding macro stops with an error shown in place, not a frozen page', () => {
    const html = katex.renderToString('\\def\\a{\\a\\a}\\a', katexOptions())
    expect(html).toContain('katex-error')
  })

  it('links are refused (trust is off)', () => {
    const html = katex.renderToString('\\href{https://example.test}{x}', katexOptions())
    expect(html).not.toContain('<a ')
  })
})
