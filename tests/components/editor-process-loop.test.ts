// The process header of a loop-cut diagram: a box is cut, not recursed, so no BCFW shift control,
// no shift list request and no colour order field (boxes use 1..n); gluons fixed, legs clamped to
// 4..8, helicity chips flip as on a tree. An order left from a tree can still be cleared.
import { afterEach, describe, expect, it } from 'vitest'
import { mountSuspended, registerEndpoint } from '@nuxt/test-utils/runtime'
import EditorProcess from '~/components/editor/EditorProcess.vue'
import type { Process } from '#shared/schemas/graph'
import { LOOP_CUT_MAX_LEGS } from '#shared/schemas/loop-cuts'
import { editorWith, plainCopy, type Role } from './editor-helpers'

let shiftRequests = 0
registerEndpoint('/api/shifts', { method: 'POST', handler: () => { shiftRequests++; return { rows: [] } } })
afterEach(() => { shiftRequests = 0 })

async function mountLoop(process: Process | undefined, role: Role = 'editor') {
  const store = editorWith({ process, role, kind: 'loop-cut' })
  const wrapper = await mountSuspended(EditorProcess, { props: { catalogue: null } })
  return { wrapper, store }
}
const chips = (w: Awaited<ReturnType<typeof mountLoop>>['wrapper']) => w.findAll('[data-test=helicity-chips] button').map(b => b.text())

describe('EditorProcess on a loop-cut diagram', () => {
  it('shows gluons, legs and helicities, and none of the shift controls', async () => {
    const { wrapper } = await mountLoop({ theory: 'gluon', helicities: [-1, -1, 1, 1, 1] })
    await new Promise(r => setTimeout(r, 400))
    expect(wrapper.find('[data-test=loop-theory]').text()).toContain('Theory')
    expect(wrapper.find('select[name=theory]').exists()).toBe(false)
    expect(chips(wrapper)).toEqual(['1−', '2−', '3+', '4+', '5+'])
    for (const t of ['shift-controls', 'shift-button', 'pick-shift', 'shift-list', 'expand', 'expand-full']) expect(wrapper.find(`[data-test=${t}]`).exists(), t).toBe(false)
    expect(wrapper.text()).not.toContain('Shift')
    expect(wrapper.find('input[name=order]').exists()).toBe(false)
    expect(wrapper.find('[data-test=loop-process-note]').text()).toBe('colour order 1…n · no shift in a box')
    expect(shiftRequests).toBe(0)
  })

  it('a chip flips its leg; the legs field is clamped to 4..8', async () => {
    const { wrapper, store } = await mountLoop({ theory: 'gluon', helicities: [-1, -1, 1, 1] })
    await wrapper.find('[data-test=hel-3]').trigger('click')
    expect(plainCopy(store.process)).toEqual({ theory: 'gluon', helicities: [-1, -1, -1, 1] })
    const legs = wrapper.find('input[name=legs]')
    await legs.setValue(3)
    await legs.trigger('change')
    expect(store.process!.helicities).toHaveLength(4)
    await legs.setValue(12)
    await legs.trigger('change')
    expect(store.process!.helicities).toHaveLength(LOOP_CUT_MAX_LEGS)
  })

  it('without a process the start button sets −−++ with no shift, and no pick-the-shift button', async () => {
    const { wrapper, store } = await mountLoop(undefined)
    expect(wrapper.find('[data-test=pick-shift]').exists()).toBe(false)
    expect(wrapper.text()).not.toContain('shift')
    expect(wrapper.find('[data-test=loop-start-hint]').text()).toContain('generate the boxes')
    await wrapper.find('[data-test=process-start]').trigger('click')
    expect(plainCopy(store.process)).toEqual({ theory: 'gluon', helicities: [-1, -1, 1, 1] })
    expect(wrapper.find('[data-test=shift-button]').exists()).toBe(false)
  })

  it('a colour order left on the process shows its field, so it can be cleared', async () => {
    const { wrapper, store } = await mountLoop({ theory: 'gluon', helicities: [-1, -1, 1, 1], order: [1, 3, 2, 4] })
    const order = wrapper.find('input[name=order]')
    await order.setValue('1 2 3 4')
    await order.trigger('change')
    expect(plainCopy(store.process)).toEqual({ theory: 'gluon', helicities: [-1, -1, 1, 1] })
    expect(wrapper.find('input[name=order]').exists()).toBe(false)
  })
})
