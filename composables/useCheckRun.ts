// Running a check from the editor: the residue sum on the server (stored when the server has this
// diagram; a drawing is saved first so the verdict is about what is on the canvas), then the
// falloff along the shift (exact, at a seeded rational point) and the cross-shift check.
import type { EvaluateRequestInput, EvaluateResponse } from '#shared/schemas/evaluate'
import type { CrossShiftResponse } from '#shared/schemas/service'
import { evaluateRequest, orderOf, processFromCanvas, toLabels } from '#shared/editor/process'
import { defaultEvalSettings, kinematicsOf, type EvalSettings } from '#shared/editor/kinematics'
import { FALLOFF_Z, falloffFit, log10Abs, shiftExact, type FalloffPoints } from '#shared/editor/falloff'
import { hasDrawnTerms } from '#shared/editor/drawing/evaluate'
import { isLoopCutResult } from '#shared/editor/loop-cut-check'
import { alternativeShift } from '#shared/physics/falloff'
import { processOf } from '#shared/physics/theories'
import type { Process } from '#shared/schemas/graph'
import { useEditorStore } from '~~/stores/editor'
import { processSpecies } from '#shared/editor/species'
import { errMessage, type Say } from './useEditorNotice'

export interface StoredCheck { id: number, kind?: string, status?: string, result: EvaluateResponse | null, diagramVersion: number | null, summary?: { target?: string | null } | null }

/** What a check run needs of the editor page (tree checks here, loop cuts in useLoopCutCheck). */
export interface CheckRunContext {
  diagramId: number
  canEdit: Ref<boolean>
  say: Say
  busy: Ref<boolean>
  /** The diagram's canvas and process are the saved ones. */
  inSync: Ref<boolean>
  save: (note?: string) => Promise<boolean>
}

interface Ctx extends CheckRunContext {
  savedProcess: Ref<string>
}

async function measureFalloff(p: Process, res: EvaluateResponse, step: (s: string) => void, tick: () => void): Promise<FalloffPoints> {
  const order = orderOf(p)
  const pos = (l: number) => order.indexOf(l)
  step('falloff: the shifted point at growing z')
  const base = await $fetch('/api/evaluate', { method: 'POST', body: evaluateRequest({ ...p, shift: res.shift }, { kinematics: { kind: 'rational', seed: 'falloff' }, target: 'none', arithmetic: 'exact' }) })
  tick()
  const hOrd = order.map(l => p.helicities[l - 1]!)
  // Several species (qcd): the species in the colour order, for the process and every request.
  const sp = processSpecies(p)
  const spOrd = sp ? { species: order.map(l => sp[l - 1]!) } : {}
  const [i, j] = [pos(res.shift[0]), pos(res.shift[1])]
  const alt = alternativeShift(processOf(p.theory, p.spin, sp ? hOrd : undefined, spOrd.species), hOrd, i, j)
  const lam = base.kinematics.lambda as [string, string][]
  const lamT = base.kinematics.lambdaTilde as [string, string][]
  const points: FalloffPoints['points'] = []
  for (const z of FALLOFF_Z) {
    step(`falloff: A(z) at z = 1e${z.toString().length - 1}`)
    const shifted = shiftExact(lam, lamT, i, j, z)
    const r = await $fetch('/api/evaluate', { method: 'POST', body: { theory: p.theory, ...(p.theory === 'spin' ? { spin: p.spin } : {}), helicities: hOrd, ...spOrd, kinematics: { kind: 'exact-spinors', ...shifted }, shift: [alt[0] + 1, alt[1] + 1], arithmetic: 'exact', target: 'none' } })
    tick()
    if (!r.value) throw new Error(`A(z) is singular at z = ${z}`)
    const y = log10Abs(r.value)
    if (!Number.isFinite(y)) throw new Error('the amplitude vanishes identically along the shift: no falloff to measure')
    points.push({ log10z: Math.log10(Number(z)), log10abs: y })
  }
  return { shift: res.shift, via: [order[alt[0]]!, order[alt[1]]!], points, ...falloffFit(points) }
}

export function useCheckRun(ctx: Ctx) {
  const store = useEditorStore()
  const { say, busy } = ctx
  const settings = computed<EvalSettings>(() => ({ ...defaultEvalSettings(), ...((store.settings.evaluation as Partial<EvalSettings> | undefined) ?? {}) }))
  const progress = ref<{ step: string, done: number, total: number } | null>(null)
  const falloff = ref<FalloffPoints | null>(null)
  const falloffError = ref('')
  const cross = ref<CrossShiftResponse | null>(null)
  const crossError = ref('')
  const storedAs = ref<number | null>(null)
  const notStored = ref('')
  /** A stored batch check opened from the Stored tab: its target and batch page instead of a result. */
  const batchCheck = ref<StoredCheck | null>(null)
  const checksToken = ref(0)
  const resultsOpen = ref(true)

  function clear() {
    falloff.value = null
    falloffError.value = ''
    cross.value = null
    crossError.value = ''
    storedAs.value = null
    notStored.value = ''
    batchCheck.value = null
  }

  async function residueSum(p: Process, body: { kinematics: EvaluateRequestInput['kinematics'], target: EvaluateRequestInput['target'], arithmetic: EvalSettings['arithmetic'] }): Promise<EvaluateResponse> {
    const drawn = hasDrawnTerms(store.nodes)
    // A drawing is evaluated by the server from the saved graph: save it first (a new revision).
    if (drawn && ctx.canEdit.value && !ctx.inSync.value) {
      if (!(await ctx.save('saved to check the drawing'))) throw new Error('the drawing could not be saved, so it was not checked')
    }
    if (ctx.canEdit.value && JSON.stringify(p) === ctx.savedProcess.value) {
      const check = await $fetch(`/api/diagrams/${ctx.diagramId}/checks`, { method: 'POST', body: { ...body, probeFalloff: false, tree: false } })
      storedAs.value = check.id
      checksToken.value++
      // a tree diagram's check; a loop cut's goes through useLoopCutCheck
      if (!check.result || isLoopCutResult(check.result)) throw new Error('this diagram is a loop cut: its check has no tree result')
      return check.result
    }
    if (!ctx.canEdit.value && drawn) {
      // A viewer checks the canvas as it is (Blocks opened while exploring included); nothing is stored.
      notStored.value = 'not stored: viewers run checks without storing them; this is a check of what is drawn'
      const drawing = await $fetch(`/api/diagrams/${ctx.diagramId}/check-drawing`, { method: 'POST', body: { ...body, graph: store.toGraph() } })
      return drawing
    }
    notStored.value = ctx.canEdit.value
      ? 'not stored: save the diagram (Ctrl+S) to store checks of this process'
      : 'not stored: viewers run checks without storing them'
    const res = await $fetch('/api/evaluate', { method: 'POST', body: evaluateRequest(p, { ...body }) })
    return toLabels(res, p)
  }

  async function runCheck() {
    if (busy.value) return
    let p = store.process
    if (!p) {
      const got = processFromCanvas(store.nodes)
      if ('error' in got) { say(`No process to evaluate: ${got.error}.`, 'error'); return }
      store.setProcess(got.process)
      p = store.process!
    }
    const kin = kinematicsOf(settings.value, p.helicities.length)
    if ('message' in kin) { say(kin.message, 'error'); return 'settings' as const }
    const s = settings.value
    const target: EvaluateRequestInput['target'] = s.target === 'formula' ? { formula: s.formula } : (s.target as EvaluateRequestInput['target'])
    const wantFalloff = p.helicities.length <= 8
    const total = 1 + (wantFalloff ? FALLOFF_Z.length + 1 : 0) + 1
    busy.value = true
    clear()
    let done = 0
    const step = (name: string) => { progress.value = { step: name, done, total } }
    try {
      step('residue sum on the server')
      const res = await residueSum(p, { kinematics: kin.kinematics, target, arithmetic: s.arithmetic })
      p = store.process!
      store.setResult(res)
      resultsOpen.value = true
      done++
      if (wantFalloff) {
        try {
          falloff.value = await measureFalloff(p, res, step, () => done++)
        }
        catch (e) {
          falloffError.value = errMessage(e, (e as Error).message ?? 'the falloff could not be measured')
        }
      }
      done = total - 1
      step('cross-shift check')
      try {
        const order = orderOf(p)
        const sp = processSpecies(p)
        const cs = await $fetch('/api/cross-shift', { method: 'POST', body: { theory: p.theory, ...(p.theory === 'spin' ? { spin: p.spin } : {}), helicities: order.map(l => p!.helicities[l - 1]!), ...(sp ? { species: order.map(l => sp[l - 1]!) } : {}), kinematics: kin.kinematics, arithmetic: s.arithmetic } })
        cross.value = { ...cs, rows: cs.rows.map(r => ({ ...r, shift: [order[r.shift[0] - 1]!, order[r.shift[1] - 1]!] as [number, number] })) }
      }
      catch (e) {
        crossError.value = errMessage(e, 'the cross-shift check failed')
      }
    }
    catch (e) {
      say(errMessage(e, (e as Error).message ?? 'the evaluation failed'), 'error')
    }
    finally {
      busy.value = false
      progress.value = null
    }
  }

  async function openCheck(id: number) {
    try {
      const c = await $fetch(`/api/checks/${id}`)
      clear()
      if (!c.result || isLoopCutResult(c.result)) {
        // A batch check keeps its results on its batch page.
        if (c.kind === 'batch') { batchCheck.value = { ...c, result: null }; return }
        say(`check #${id} has no result${c.status ? ` (${c.status})` : ''}`, 'error')
        return
      }
      store.setResult(c.result, c.diagramVersion)
      storedAs.value = c.id
      resultsOpen.value = true
      say(`Showing stored check #${id} (diagram v${c.diagramVersion}).`)
    }
    catch (e) {
      say(errMessage(e, 'the check could not be opened'), 'error')
    }
  }
  return { settings, progress, falloff, falloffError, cross, crossError, storedAs, notStored, batchCheck, checksToken, resultsOpen, runCheck, openCheck }
}
