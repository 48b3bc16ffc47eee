// The one set of KaTeX options (formulas, terms, comments). trust:false refuses \href, \url and
// friends; maxSize caps every size a user writes (\rule, \kern, \rule{10000em}{…} → 10em), so a
// comment cannot paint over the page; maxExpand stops a macro bomb from freezing it.
export const KATEX_MAX_SIZE_EM = 10
export const KATEX_MAX_EXPAND = 1000

export function katexOptions(display = false) {
  return {
    displayMode: display,
    trust: false,
    throwOnError: false,
    strict: 'ignore' as const,
    maxExpand: KATEX_MAX_EXPAND,
    maxSize: KATEX_MAX_SIZE_EM,
    output: 'htmlAndMathml' as const,
  }
}
