// The batch check's progress card: it follows the event stream (progress, end), shows points done,
// rate, time left and live verdict counts while it runs, the elapsed time once over, and falls back
// to polling when the stream breaks. A cancelled or failed batch never shows a green verdict.
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest'
import { mountSuspended, registerEndpoint } from '@nuxt/test-utils/runtime'
import type { VueWrapper } from '@vue/test-utils'
import PointsetProgress from '~/components/pointset/PointsetProgress.vue'
import type { BatchProgressView } from '#shared/pointsets/types'

/** The browser's EventSource, driven by the test: `emit('progress', view)` is one server event. */
class FakeEventSource {
  static last: FakeEventSource | null = null
  static opened: string[] = []
  readonly url: string
  closed = false
  onerror: (() => void) | null = null
  private listeners = new Map<string, ((e: MessageEvent) => void)[]>()
  constructor(url: string) {
    this.url = url
    FakeEventSource.last = this
    FakeEventSource.opened.push(url)
  }

  addEventListener(type: string, fn: (e: MessageEvent) => void) {
    this.listeners.set(type, [...(this.listeners.get(type) ?? []), fn])
  }

  close() { this.closed = true }
  emit(type: string, data: BatchProgressView) {
    for (const fn of this.listeners.get(type) ?? []) fn(new MessageEvent(type, { data: JSON.stringify(data) }))
  }
}

const zero = { 'agrees': 0, 'disagrees': 0, 'boundary term suspected': 0, 'singular point': 0, 'not evaluated': 0 }
const view = (over: Partial<BatchProgressView>): BatchProgressView => ({ id: 41, status: 'running', done: 0, total: 6000, rate: null, etaSeconds: null, elapsedMs: null, counts: { ...zero }, ...over })

let cancelled = 0
let polled: BatchProgressView = view({})
registerEndpoint('/api/batch-checks/41/cancel', { method: 'POST', handler: () => { cancelled++; return { ok: true } } })
registerEndpoint('/api/batch-checks/41', { method: 'GET', handler: () => ({ progress: polled }) })

beforeEach(() => {
  vi.stubGlobal('EventSource', FakeEventSource)
  FakeEventSource.last = null
  FakeEventSource.opened = []
  cancelled = 0
})
afterEach(() => { vi.unstubAllGlobals() })

const mountProgress = (initial: BatchProgressView, canCancel = true) => mountSuspended(PointsetProgress, { props: { checkId: 41, initial, canCancel } })
const textOf = (w: VueWrapper, test: string) => w.find(`[data-test=${test}]`).text()
/** Every verdict badge on the card, and whether anything is painted the green of agreement. */
const badges = (w: VueWrapper) => w.findAll('[data-test=verdict]').map(b => b.text())
const green = (w: VueWrapper) => w.findAll('.bg-verdict-agrees, .text-verdict-agrees').length
const bar = (w: VueWrapper) => w.find('[role=progressbar] > div')

async function stream(w: VueWrapper, type: 'progress' | 'end', v: BatchProgressView) {
  FakeEventSource.last!.emit(type, v)
  await w.vm.$nextTick()
}

describe('PointsetProgress: a running batch', () => {
  it('opens the check\'s event stream and shows each progress event: points done, rate, time left, live counts', async () => {
    const w = await mountProgress(view({ status: 'queued' }))
    expect(FakeEventSource.opened).toEqual(['/api/batch-checks/41/events'])
    expect(textOf(w, 'batch-status')).toBe('queued')
    expect(textOf(w, 'batch-done')).toBe('0 / 6,000 points')
    expect(w.text()).toContain('time left —')
    // Nothing done yet: no counts line.
    expect(w.find('[data-test=batch-live-counts]').exists()).toBe(false)

    await stream(w, 'progress', view({ done: 1500, rate: 748.6, etaSeconds: 6.1, counts: { ...zero, 'agrees': 1497, 'singular point': 3 } }))
    expect(textOf(w, 'batch-status')).toBe('running')
    expect(textOf(w, 'batch-done')).toBe('1,500 / 6,000 points')
    expect(w.text()).toContain('749 points/s')
    expect(w.text()).toContain('time left 7 s')
    expect(bar(w).attributes('style')).toContain('width: 25%')
    expect(w.find('[role=progressbar]').attributes('aria-valuenow')).toBe('1500')
    // Only the verdicts that occurred are visible, each with its count.
    const shown = w.findAll('[data-test=batch-live-counts] > span').filter(s => s.attributes('style') !== 'display: none;').map(s => s.text())
    expect(shown).toEqual(['agrees 1497', 'singular point 3'])
    expect(w.emitted('progress')).toHaveLength(1)

    await stream(w, 'progress', view({ done: 3000, rate: 750, etaSeconds: 240, counts: { ...zero, agrees: 3000 } }))
    expect(w.text()).toContain('time left 4 min')
  })

  it('ends on the end event: done, how long it took, the stream closed, finished emitted with the final view', async () => {
    const w = await mountProgress(view({}))
    const final = view({ status: 'done', done: 6000, rate: 800, etaSeconds: 0, elapsedMs: 7512, counts: { ...zero, agrees: 6000 } })
    await stream(w, 'end', final)
    expect(textOf(w, 'batch-status')).toBe('done')
    expect(textOf(w, 'batch-done')).toBe('6,000 / 6,000 points')
    expect(w.text()).toContain('took 7.5 s')
    expect(w.text()).not.toContain('time left')
    expect(w.find('[data-test=cancel]').exists()).toBe(false)
    // The live counts give way to the page's summary.
    expect(w.find('[data-test=batch-live-counts]').exists()).toBe(false)
    expect(bar(w).classes()).toContain('bg-accent')
    expect(FakeEventSource.last!.closed).toBe(true)
    expect(w.emitted('finished')).toEqual([[final]])
  })

  it('Cancel asks the server once; the end event then shows the batch cancelled, in amber, with the server\'s message', async () => {
    const w = await mountProgress(view({ done: 1200, counts: { ...zero, agrees: 1200 } }))
    // While it runs, the live counts carry verdict badges, the agreeing one green.
    expect(badges(w)).toEqual(['agrees', 'disagrees', 'boundary term suspected', 'singular point', 'not evaluated'])
    expect(green(w)).toBe(1)
    await w.find('[data-test=cancel]').trigger('click')
    await vi.waitFor(() => expect(cancelled).toBe(1))
    await stream(w, 'end', view({ status: 'cancelled', done: 1250, elapsedMs: 2100, counts: { ...zero, agrees: 1250 }, message: 'cancelled after 1250 of 6000 points' }))
    expect(textOf(w, 'batch-status')).toBe('cancelled')
    expect(w.text()).toContain('cancelled after 1250 of 6000 points')
    expect(bar(w).classes()).toContain('bg-verdict-boundary')
    expect(bar(w).classes()).not.toContain('bg-accent')
    // 1250 points agreed before the cancel, yet nothing on the card is green.
    expect(badges(w)).toEqual([])
    expect(green(w)).toBe(0)
    expect(w.find('[data-test=cancel]').exists()).toBe(false)
  })

  it('a batch already over opens no stream; cancelled and failed are amber and never green', async () => {
    for (const status of ['cancelled', 'failed'] as const) {
      const w = await mountProgress(view({ status, done: 900, elapsedMs: 1000, counts: { ...zero, agrees: 900 }, message: status === 'failed' ? 'the batch stopped: out of memory' : 'cancelled after 900 of 6000 points' }))
      expect(textOf(w, 'batch-status')).toBe(status)
      expect(bar(w).classes()).toContain('bg-verdict-boundary')
      expect(green(w)).toBe(0)
      expect(w.text()).toContain(status === 'failed' ? 'the batch stopped: out of memory' : 'cancelled after 900 of 6000 points')
      expect(w.text()).toContain('took 1.0 s')
    }
    expect(FakeEventSource.opened).toEqual([])
  })

  it('without the right to cancel there is no Cancel button', async () => {
    const w = await mountProgress(view({ done: 10 }), false)
    expect(w.find('[data-test=cancel]').exists()).toBe(false)
  })

  it('a broken stream falls back to polling the check until it is over', async () => {
    polled = view({ status: 'done', done: 6000, elapsedMs: 9000, counts: { ...zero, agrees: 6000 } })
    const w = await mountProgress(view({ done: 100 }))
    FakeEventSource.last!.onerror!()
    expect(FakeEventSource.last!.closed).toBe(true)
    await vi.waitFor(() => expect(textOf(w, 'batch-status')).toBe('done'), { timeout: 5000 })
    expect(textOf(w, 'batch-done')).toBe('6,000 / 6,000 points')
    expect(w.emitted('finished')).toEqual([[polled]])
  })
})
