import { describe, expect, it } from 'vitest'
import { filterDiagrams, sortDiagrams, type DiagramListItem } from '#shared/diagram-list'

const item = (id: number, title: string, updatedAt: string, theory: string | null, verdict: string | null, checkedAt = updatedAt): DiagramListItem => ({
  id, title, version: 1, kind: 'tree', updatedAt, updatedByName: 'Ada Example',
  process: theory ? { theory, helicities: [-1, -1, 1, 1] } : null,
  latestCheck: verdict ? { id: id * 10, kind: 'single', verdict, createdAt: checkedAt } : null,
})
const list = [
  item(1, 'Diagram 10', '2026-01-03T00:00:00Z', 'gluon', 'agrees', '2026-01-04T00:00:00Z'),
  item(2, 'Diagram 9', '2026-01-05T00:00:00Z', 'graviton', 'disagrees', '2026-01-01T00:00:00Z'),
  item(3, 'Alpha', '2026-01-01T00:00:00Z', 'gluon', null),
  item(4, 'Beta', '2026-01-02T00:00:00Z', null, 'boundary term suspected', '2026-01-06T00:00:00Z'),
]

describe('diagram list sort and filter', () => {
  it('sorts by last edit, newest first (the default)', () => {
    expect(sortDiagrams(list, 'updated').map(d => d.id)).toEqual([2, 1, 4, 3])
  })
  it('sorts titles with numbers in numeric order', () => {
    expect(sortDiagrams(list, 'title').map(d => d.title)).toEqual(['Alpha', 'Beta', 'Diagram 9', 'Diagram 10'])
  })
  it('puts the worst verdict first and never-checked diagrams last', () => {
    expect(sortDiagrams(list, 'verdict').map(d => d.id)).toEqual([2, 4, 1, 3])
  })
  it('sorts by last check, never-checked last', () => {
    expect(sortDiagrams(list, 'checked').map(d => d.id)).toEqual([4, 1, 2, 3])
  })
  it('filters by theory and verdict, and "none" keeps the never-checked', () => {
    expect(filterDiagrams(list, { verdict: '', theory: 'gluon' }).map(d => d.id)).toEqual([1, 3])
    expect(filterDiagrams(list, { verdict: 'disagrees', theory: '' }).map(d => d.id)).toEqual([2])
    expect(filterDiagrams(list, { verdict: 'none', theory: '' }).map(d => d.id)).toEqual([3])
    expect(filterDiagrams(list, { verdict: 'agrees', theory: 'graviton' })).toEqual([])
  })
  it('filters by kind: tree or loop cut', () => {
    const mixed = [...list, { ...list[0]!, id: 5, kind: 'loop-cut' as const }]
    expect(filterDiagrams(mixed, { verdict: '', theory: '', kind: 'loop-cut' }).map(d => d.id)).toEqual([5])
    expect(filterDiagrams(mixed, { verdict: '', theory: '', kind: 'tree' }).map(d => d.id)).toEqual([1, 2, 3, 4])
  })
  it('does not reorder its input', () => {
    const before = list.map(d => d.id)
    sortDiagrams(list, 'title')
    expect(list.map(d => d.id)).toEqual(before)
  })
})
