// Sorting and filtering of a project's diagram list (pure: the page and the unit tests share it).

export interface DiagramListItem {
  id: number
  title: string
  version: number
  /** 'tree' (BCFW channel terms) or 'loop-cut' (rings of quadruple cuts). */
  kind: 'tree' | 'loop-cut'
  updatedAt: string
  updatedByName: string | null
  process: { theory: string, helicities: number[], shift?: number[] } | null
  latestCheck: { id: number, kind: string, verdict: string | null, createdAt: string } | null
}

export type DiagramSort = 'updated' | 'title' | 'verdict' | 'checked'
/** '' = any; 'none' = never checked; kind 'tree' | 'loop-cut'. */
export interface DiagramFilter { verdict: string, theory: string, kind?: string }

// Worst first, so "sort by verdict" shows what needs attention at the top.
const VERDICT_RANK: Record<string, number> = { 'disagrees': 0, 'boundary term suspected': 1, 'singular point': 2, 'not evaluated': 3, 'agrees': 4 }

export function filterDiagrams<T extends DiagramListItem>(items: T[], f: DiagramFilter): T[] {
  return items.filter((d) => {
    if (f.theory && d.process?.theory !== f.theory) return false
    if (f.kind && d.kind !== f.kind) return false
    if (f.verdict === 'none') return !d.latestCheck
    if (f.verdict && d.latestCheck?.verdict !== f.verdict) return false
    return true
  })
}

export function sortDiagrams<T extends DiagramListItem>(items: T[], by: DiagramSort): T[] {
  const time = (s: string | undefined) => (s ? new Date(s).getTime() : -Infinity)
  const out = [...items]
  if (by === 'title') out.sort((a, b) => a.title.localeCompare(b.title, undefined, { numeric: true }) || a.id - b.id)
  else if (by === 'verdict') out.sort((a, b) => (VERDICT_RANK[a.latestCheck?.verdict ?? ''] ?? 5) - (VERDICT_RANK[b.latestCheck?.verdict ?? ''] ?? 5) || time(b.updatedAt) - time(a.updatedAt))
  else if (by === 'checked') out.sort((a, b) => time(b.latestCheck?.createdAt) - time(a.latestCheck?.createdAt) || a.id - b.id)
  else out.sort((a, b) => time(b.updatedAt) - time(a.updatedAt) || b.id - a.id)
  return out
}
