// The editor's process header as a user works it: chips flip helicities, the legs field grows and
// shrinks the process, the theory select rescales helicities, the colour order and the shift are
// typed or picked. Every edit must land in the store as plain data (a draft and a save clone it).
import { afterEach, describe, expect, it, vi } from 'vitest'
import { mountSuspended, registerEndpoint } from '@nuxt/test-utils/runtime'
import { readBody } from 'h3'
import type { VueWrapper } from '@vue/test-utils'
import EditorProcess from '~/components/editor/EditorProcess.vue'
import type { Process } from '#shared/schemas/graph'
import type { ShiftsRequest, ShiftsResponse } from '#shared/schemas/service'
import { editorWith, plainCopy, type Role } from './editor-helpers'

const four: Process = { theory: 'gluon', helicities: [-1, -1, 1, 1], shift: [1, 2] }

// The shift list the server would send for a request: every [i,j⟩ of adjacent positions, with the
// exponent of the table for −,+ (valid) and anything else (invalid). Only the shape matters here.
const asked: ShiftsRequest[] = []
registerEndpoint('/api/shifts', {
  method: 'POST',
  handler: async (event): Promise<ShiftsResponse> => {
    const body = await readBody<ShiftsRequest>(event)
    asked.push(body)
    const n = body.helicities.length
    const rows = [[1, 2], [2, 1], [2, 3]].map(([i, j]) => {
      const valid = body.helicities[i! - 1]! < 0 && body.helicities[j! - 1]! > 0
      return { shift: [i!, j!] as [number, number], exponent: valid ? -1 : 3, valid, source: 'table' as const }
    })
    return { theory: body.theory, n, helicities: body.helicities, defaultShift: [1, 2], rows, ms: 1 }
  },
})

async function mountHeader(process: Process | undefined, role: Role = 'editor') {
  const store = editorWith({ process, role })
  const wrapper = await mountSuspended(EditorProcess, { props: { catalogue: null } })
  return { wrapper, store }
}
const chips = (w: VueWrapper) => w.findAll('[data-test=helicity-chips] button').map(b => b.text())
async function typeInto(w: VueWrapper, name: string, value: string | number) {
  const input = w.find(`input[name=${name}]`)
  await input.setValue(value)
  await input.trigger('change')
}

afterEach(() => { asked.length = 0 })

describe('EditorProcess: the process header', () => {
  it('shows the process: theory, one chip per leg with its helicity, the colour order and the shift', async () => {
    const { wrapper } = await mountHeader(four)
    expect((wrapper.find('select[name=theory]').element as HTMLSelectElement).value).toBe('gluon')
    expect((wrapper.find('input[name=legs]').element as HTMLInputElement).value).toBe('4')
    expect(chips(wrapper)).toEqual(['1−', '2−', '3+', '4+'])
    expect((wrapper.find('input[name=order]').element as HTMLInputElement).value).toBe('1 2 3 4')
    expect(wrapper.find('[data-test=shift-button]').text()).toMatch(/^\[1,2⟩/)
    // The shifted legs are ringed.
    expect(wrapper.find('[data-test=hel-1]').classes()).toContain('ring-2')
    expect(wrapper.find('[data-test=hel-3]').classes()).not.toContain('ring-2')
  })

  it('without a process offers to set one, and the button sets −−++ with the [1,2⟩ shift', async () => {
    const { wrapper, store } = await mountHeader(undefined)
    expect(wrapper.text()).toContain('No process yet.')
    await wrapper.find('[data-test=process-start]').trigger('click')
    expect(plainCopy(store.process)).toEqual({ theory: 'gluon', helicities: [-1, -1, 1, 1], shift: [1, 2] })
    expect(chips(wrapper)).toEqual(['1−', '2−', '3+', '4+'])
  })

  it('a click on a chip flips that leg only; the shift stays; one undo step brings it back', async () => {
    const { wrapper, store } = await mountHeader(four)
    await wrapper.find('[data-test=hel-3]').trigger('click')
    expect(plainCopy(store.process)).toEqual({ theory: 'gluon', helicities: [-1, -1, -1, 1], shift: [1, 2] })
    expect(chips(wrapper)).toEqual(['1−', '2−', '3−', '4+'])
    expect(store.dirty).toBe(true)
    store.undo()
    await wrapper.vm.$nextTick()
    expect(chips(wrapper)).toEqual(['1−', '2−', '3+', '4+'])
  })

  it('more legs append positive helicities and drop the colour order; fewer legs drop a shift on a removed leg', async () => {
    const { wrapper, store } = await mountHeader({ theory: 'gluon', helicities: [-1, -1, 1, 1], order: [1, 3, 2, 4], shift: [2, 4] })
    await typeInto(wrapper, 'legs', 6)
    expect(plainCopy(store.process)).toEqual({ theory: 'gluon', helicities: [-1, -1, 1, 1, 1, 1], shift: [2, 4] })
    expect(chips(wrapper)).toEqual(['1−', '2−', '3+', '4+', '5+', '6+'])
    expect((wrapper.find('input[name=order]').element as HTMLInputElement).value).toBe('1 2 3 4 5 6')
    await typeInto(wrapper, 'legs', 3)
    expect(plainCopy(store.process)).toEqual({ theory: 'gluon', helicities: [-1, -1, 1] })
    expect(wrapper.find('[data-test=shift-button]').text()).toMatch(/^default/)
  })

  it('the legs field is clamped to 3 and to the theory\'s float limit', async () => {
    const { wrapper, store } = await mountHeader(four)
    await typeInto(wrapper, 'legs', 1)
    expect(store.process!.helicities).toEqual([-1, -1, 1])
    await typeInto(wrapper, 'legs', 99)
    // gluons: at most 12 legs in float arithmetic (the theory registry's limit).
    expect(store.process!.helicities).toHaveLength(12)
    expect((wrapper.find('input[name=legs]').element as HTMLInputElement).value).toBe('12')
  })

  it('from eight legs the chips give way to one sign string, which is typed and checked', async () => {
    const { wrapper, store } = await mountHeader(four)
    await typeInto(wrapper, 'legs', 8)
    expect(wrapper.find('[data-test=helicity-chips]').exists()).toBe(false)
    const field = wrapper.find('input[name=helicities]')
    expect((field.element as HTMLInputElement).value).toBe('−−++++++')
    await typeInto(wrapper, 'helicities', '-+-+-+-+')
    expect(plainCopy(store.process)!.helicities).toEqual([-1, 1, -1, 1, -1, 1, -1, 1])
    expect((field.element as HTMLInputElement).value).toBe('−+−+−+−+')
    await typeInto(wrapper, 'helicities', '-+-+')
    expect(wrapper.find('[data-test=helicity-error]').text()).toBe('one sign per leg: 8 of + and −')
    expect(store.process!.helicities).toEqual([-1, 1, -1, 1, -1, 1, -1, 1])
  })

  it('the theory select rescales helicities to the new spin and hides the colour order of an unordered theory', async () => {
    const { wrapper, store } = await mountHeader({ ...four, order: [1, 3, 2, 4] })
    await wrapper.find('select[name=theory]').setValue('graviton')
    expect(plainCopy(store.process)).toEqual({ theory: 'graviton', helicities: [-2, -2, 2, 2], shift: [1, 2] })
    expect(chips(wrapper)).toEqual(['1−2', '2−2', '3+2', '4+2'])
    expect(wrapper.find('input[name=order]').exists()).toBe(false)
    await wrapper.find('select[name=theory]').setValue('spin')
    expect(plainCopy(store.process)).toEqual({ theory: 'spin', spin: 2, helicities: [-2, -2, 2, 2], shift: [1, 2] })
    await typeInto(wrapper, 'spin', 3)
    expect(plainCopy(store.process)).toEqual({ theory: 'spin', spin: 3, helicities: [-3, -3, 3, 3], shift: [1, 2] })
    expect(chips(wrapper)).toEqual(['1−3', '2−3', '3+3', '4+3'])
    await wrapper.find('select[name=theory]').setValue('scalar-cubic')
    expect(plainCopy(store.process)).toEqual({ theory: 'scalar-cubic', helicities: [0, 0, 0, 0], shift: [1, 2] })
    // Scalars have no helicity to flip.
    await wrapper.find('[data-test=hel-2]').trigger('click')
    expect(store.process!.helicities).toEqual([0, 0, 0, 0])
  })

  it('a typed colour order is stored as labels; the identity is stored as none; a repeated leg is refused by name', async () => {
    const { wrapper, store } = await mountHeader(four)
    await typeInto(wrapper, 'order', '1 3 2 4')
    expect(plainCopy(store.process)).toEqual({ ...four, order: [1, 3, 2, 4] })
    await typeInto(wrapper, 'order', '1, 2, 3, 4')
    expect(plainCopy(store.process)).toEqual(four)
    await typeInto(wrapper, 'order', '1 1 2 3')
    expect(wrapper.find('.field-error').text()).toBe('order: leg 1 appears twice; the colour order must name every leg once')
    expect(plainCopy(store.process)).toEqual(four)
  })

  it('the shift list comes from the server in colour order and maps back to labels; choosing a row sets the shift', async () => {
    const { wrapper, store } = await mountHeader({ ...four, order: [1, 3, 2, 4] })
    await wrapper.find('[data-test=shift-button]').trigger('click')
    expect(wrapper.find('[data-test=shift-list]').text()).toContain('Loading the shifts…')
    await vi.waitFor(() => expect(wrapper.find('[data-test=shift-list] table').exists()).toBe(true), { timeout: 5000 })
    // Helicities sent in the colour order 1 3 2 4: −, +, −, +. (An earlier test's header may still
    // ask for its own process after it is gone: look for this request among them.)
    expect(asked).toContainEqual({ theory: 'gluon', helicities: [-1, 1, -1, 1] })
    // Positions [1,2⟩ [2,1⟩ [2,3⟩ are labels [1,3⟩ [3,1⟩ [3,2⟩, sorted by label.
    const rows = wrapper.findAll('[data-test=shift-list] tr').map(r => r.findAll('td').slice(0, 4).map(d => d.text()))
    expect(rows).toEqual([
      ['[1,3⟩', '−,+', 'z^−1', 'valid'],
      ['[3,1⟩', '+,−', 'z^3', 'invalid: boundary term'],
      ['[3,2⟩', '+,−', 'z^3', 'invalid: boundary term'],
    ])
    await wrapper.find('[data-test=shift-1-3]').trigger('click')
    expect(plainCopy(store.process)).toEqual({ ...four, order: [1, 3, 2, 4], shift: [1, 3] })
    expect(wrapper.find('[data-test=shift-list]').exists()).toBe(false)
    const button = wrapper.find('[data-test=shift-button]')
    expect(button.text()).toBe('[1,3⟩z^−1 ▾')
    // The exponent of a valid shift in the verdict colour of agreement.
    expect(button.find('span').classes()).toContain('text-verdict-agrees')
  })

  it('Pick, then two chips, sets the shift [i,j⟩ in click order without flipping a helicity', async () => {
    const { wrapper, store } = await mountHeader(four)
    await wrapper.find('[data-test=pick-shift]').trigger('click')
    expect(wrapper.find('[data-test=pick-shift]').text()).toBe('click leg i…')
    await wrapper.find('[data-test=hel-4]').trigger('click')
    expect(wrapper.find('[data-test=pick-shift]').text()).toBe('i = 4, now j…')
    await wrapper.find('[data-test=hel-2]').trigger('click')
    expect(plainCopy(store.process)).toEqual({ theory: 'gluon', helicities: [-1, -1, 1, 1], shift: [4, 2] })
    expect(store.pickingShift).toBe(false)
    expect(wrapper.find('[data-test=shift-button]').text()).toMatch(/^\[4,2⟩/)
  })

  it('a viewer sees the process but cannot change it', async () => {
    const { wrapper, store } = await mountHeader(four, 'viewer')
    expect(wrapper.find('[data-test=hel-1]').attributes('disabled')).toBe('')
    expect(wrapper.find('select[name=theory]').attributes('disabled')).toBe('')
    expect(wrapper.find('[data-test=pick-shift]').exists()).toBe(false)
    await wrapper.find('[data-test=hel-1]').trigger('click')
    await typeInto(wrapper, 'legs', 6)
    expect(plainCopy(store.process)).toEqual(four)
  })

  it('Expand and Expand fully emit expand with full = false and true, and are disabled while busy', async () => {
    const { wrapper } = await mountHeader(four)
    await wrapper.find('[data-test=expand]').trigger('click')
    await wrapper.find('[data-test=expand-full]').trigger('click')
    expect(wrapper.emitted('expand')).toEqual([[false], [true]])
    await wrapper.setProps({ busy: true })
    expect(wrapper.find('[data-test=expand]').attributes('disabled')).toBe('')
  })
})
