// The inspector beside the canvas: what the selected leg, vertex, line or block is, its slots and
// its three-point formula, and the edits it offers, each landing in the editor store.
import { describe, expect, it } from 'vitest'
import { mountSuspended } from '@nuxt/test-utils/runtime'
import type { VueWrapper } from '@vue/test-utils'
import EditorInspector from '~/components/editor/EditorInspector.vue'
import type { Process } from '#shared/schemas/graph'
import type { BlockData, LegData, LineData } from '#shared/editor/types'
import { editorWith, plainCopy, type Role } from './editor-helpers'

const four: Process = { theory: 'gluon', helicities: [-1, -1, 1, 1], shift: [1, 2] }

/**
 * The [1,2⟩ channel of A₄(1⁻2⁻3⁺4⁺) drawn by hand: legs 1 and 4 on an angle vertex, 2 and 3 on a
 * square vertex, one line between them (its helicity chosen by the store to fit the angle vertex).
 */
async function mountFour(role: Role = 'editor') {
  const store = editorWith({ process: four })
  const a = store.addNode('angle', { x: 0, y: 0 })
  const b = store.addNode('square', { x: 200, y: 0 })
  const legs = [[1, -1], [2, -1], [3, 1], [4, 1]].map(([label, helicity]) => store.addNode('leg', { x: 0, y: 0 }, { label, helicity }))
  store.connect({ source: legs[0]!, target: a, sourceHandle: 'p', targetHandle: 'h0' })
  store.connect({ source: legs[3]!, target: a, sourceHandle: 'p', targetHandle: 'h1' })
  store.connect({ source: legs[1]!, target: b, sourceHandle: 'p', targetHandle: 'h0' })
  store.connect({ source: legs[2]!, target: b, sourceHandle: 'p', targetHandle: 'h1' })
  const line = store.connect({ source: a, target: b, sourceHandle: 'h2', targetHandle: 'h2' })!
  store.role = role
  const wrapper = await mountSuspended(EditorInspector)
  return { wrapper, store, a, b, legs, line }
}
/** The TeX a KaTeX formula was rendered from (its MathML annotation). */
const texOf = (w: VueWrapper, sel: string) => w.find(`${sel} annotation[encoding="application/x-tex"]`).text()
const rows = (w: VueWrapper) => w.findAll('tbody tr').map(r => r.findAll('td').map(d => d.text()))
const optionsOf = (w: VueWrapper, sel: string) => w.findAll(`${sel} option`).map(o => [o.attributes('value'), o.text()])
async function change(w: VueWrapper, sel: string, value: string | number) {
  const el = w.find(sel)
  await el.setValue(value)
  await el.trigger('change')
}

describe('EditorInspector', () => {
  it('with nothing selected: the process as a formula and what the canvas holds', async () => {
    const { wrapper } = await mountFour()
    expect(texOf(wrapper, '[data-test=process-tex]')).toBe('A_{4}(1^{-},2^{-},3^{+},4^{+})')
    expect(wrapper.text()).toContain('6 nodes, 1 term on the canvas.')
    expect(wrapper.text()).not.toContain('problem')
  })

  it('a leg: its label and helicity, the shifted-leg note, and edits of both', async () => {
    const { wrapper, store, legs } = await mountFour()
    store.select([legs[0]!])
    await wrapper.vm.$nextTick()
    expect(wrapper.find('h3').text()).toBe('Leg 1')
    expect(wrapper.text()).toContain('Shifted leg î (λ̃ shifted).')
    store.select([legs[2]!])
    await wrapper.vm.$nextTick()
    expect(wrapper.find('h3').text()).toBe('Leg 3')
    expect((wrapper.find('input[name=leg-label]').element as HTMLInputElement).value).toBe('3')
    expect((wrapper.find('select[name=leg-helicity]').element as HTMLSelectElement).value).toBe('1')
    expect(optionsOf(wrapper, 'select[name=leg-helicity]')).toEqual([['-1', '−'], ['1', '+']])
    expect(wrapper.text()).not.toContain('Shifted leg')

    await change(wrapper, 'select[name=leg-helicity]', '-1')
    expect(plainCopy(store.nodeById.get(legs[2]!)!.data) as LegData).toEqual({ label: 3, helicity: -1 })
    // Leg 3 now disagrees with the process header (3⁺): the inspector says so.
    expect(wrapper.find('[data-test=inspector-issues]').exists()).toBe(true)

    // A new label takes the process's helicity of that leg.
    await change(wrapper, 'input[name=leg-label]', 4)
    expect(plainCopy(store.nodeById.get(legs[2]!)!.data) as LegData).toEqual({ label: 4, helicity: 1 })
    expect(wrapper.find('h3').text()).toBe('Leg 4')
  })

  it('a vertex: its slots, the helicity sum, the hatted three-point formula; a kind that does not fit is an error', async () => {
    const { wrapper, store, a } = await mountFour()
    store.select([a])
    await wrapper.vm.$nextTick()
    expect(wrapper.find('h3').text()).toBe('Angle vertex')
    expect(rows(wrapper)).toEqual([['1', 'leg 1', '−'], ['2', 'leg 4', '+'], ['3', 'line P1', '−']])
    expect(wrapper.text()).toContain('Σh = −1: an angle vertex.')
    // ⟨12⟩^(h3−h1−h2)⟨23⟩^(h1−h2−h3)⟨31⟩^(h2−h3−h1) at (1⁻, 4⁺, P⁻), leg 1 shifted (docs/conventions.md).
    expect(texOf(wrapper, '[data-test=vertex-formula]')).toBe('A_3 = \\frac{\\langle P1\\,\\hat{1}\\rangle^{3}}{\\langle \\hat{1}\\,4\\rangle\\langle 4\\,P1\\rangle}')
    expect(wrapper.text()).toContain('Nothing wrong here.')

    await wrapper.findAll('button').find(b => b.text() === 'Make it a square vertex')!.trigger('click')
    expect(store.nodeById.get(a)!.type).toBe('square')
    expect(wrapper.find('h3').text()).toBe('Square vertex')
    const issues = wrapper.findAll('[data-test=inspector-issues] li').map(li => li.text())
    expect(issues).toEqual([expect.stringContaining('angle')])
    expect(wrapper.text()).not.toContain('Nothing wrong here.')
  })

  it('a line: its two ends, each end editable, Flip both ends keeps them opposite', async () => {
    const { wrapper, store, line } = await mountFour()
    store.select([], [line])
    await wrapper.vm.$nextTick()
    expect(wrapper.find('h3').text()).toBe('Line')
    expect(wrapper.text()).toContain('angle vertex — square vertex')
    const ends = () => wrapper.findAll('select').map(s => (s.element as HTMLSelectElement).value)
    expect(ends()).toEqual(['-1', '1'])
    await wrapper.findAll('button').find(b => b.text() === 'Flip both ends')!.trigger('click')
    expect(plainCopy(store.edges.find(e => e.id === line)!.data) as LineData).toEqual({ helicity: 1, targetHelicity: -1 })
    expect(ends()).toEqual(['1', '-1'])
    // One end alone: the other stays.
    await change(wrapper, 'select:nth-of-type(1)', '-1')
    expect(plainCopy(store.edges.find(e => e.id === line)!.data) as LineData).toEqual({ helicity: -1, targetHelicity: -1 })
  })

  it('a block: its helicities in leg order, edited as signs; fewer than three is refused with a hint', async () => {
    const store = editorWith({ process: four })
    const blk = store.addNode('block', { x: 0, y: 0 })
    const wrapper = await mountSuspended(EditorInspector)
    store.select([blk])
    await wrapper.vm.$nextTick()
    expect(wrapper.find('h3').text()).toBe('Block A4')
    const field = wrapper.find('input[name=block-helicities]')
    expect((field.element as HTMLInputElement).value).toBe('− − + +')
    await change(wrapper, 'input[name=block-helicities]', '+ - + - +')
    expect(plainCopy(store.nodeById.get(blk)!.data) as BlockData).toEqual({ helicities: [1, -1, 1, -1, 1] })
    expect(wrapper.find('h3').text()).toBe('Block A5')
    await change(wrapper, 'input[name=block-helicities]', '+ -')
    expect(wrapper.find('.field-error').text()).toBe('write the helicities in leg order, e.g. "− − + +" (at least 3)')
    expect((store.nodeById.get(blk)!.data as BlockData).helicities).toEqual([1, -1, 1, -1, 1])
  })

  it('a viewer inspects but cannot edit', async () => {
    const { wrapper, store, legs, a } = await mountFour('viewer')
    store.select([legs[2]!])
    await wrapper.vm.$nextTick()
    expect(wrapper.find('input[name=leg-label]').attributes('disabled')).toBe('')
    expect(wrapper.find('select[name=leg-helicity]').attributes('disabled')).toBe('')
    store.select([a])
    await wrapper.vm.$nextTick()
    expect(wrapper.findAll('button').map(b => b.text())).toEqual([])
  })
})
