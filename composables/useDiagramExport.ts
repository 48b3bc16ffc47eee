// Exports of the diagram (JSON to import again, SVG, PNG, the term table as CSV or LaTeX, a loop
// cut's box table as CSV or JSON) and the JSON import, which replaces the canvas as one undoable step.
import { GraphSchema } from '#shared/schemas/graph'
import { canvasSvg, exportCaption, termsCsv, termsLatex } from '#shared/editor/exports'
import { loopDrawingCsv, loopDrawingJson } from '#shared/physics/loop/exports'
import { useEditorStore } from '~~/stores/editor'
import type { Say } from './useEditorNotice'

function download(name: string, data: Blob) {
  const url = URL.createObjectURL(data)
  const a = document.createElement('a')
  a.href = url
  a.download = name
  document.body.appendChild(a)
  a.click()
  a.remove()
  setTimeout(() => URL.revokeObjectURL(url), 2000)
}

async function svgToPng(svg: string, scale = 2): Promise<Blob> {
  const img = new Image()
  const url = URL.createObjectURL(new Blob([svg], { type: 'image/svg+xml' }))
  try {
    await new Promise<void>((resolve, reject) => {
      img.onload = () => resolve()
      img.onerror = () => reject(new Error('the SVG could not be drawn'))
      img.src = url
    })
    const c = document.createElement('canvas')
    c.width = img.width * scale
    c.height = img.height * scale
    const ctx = c.getContext('2d')!
    ctx.scale(scale, scale)
    ctx.drawImage(img, 0, 0)
    const blob = await new Promise<Blob | null>(r => c.toBlob(r, 'image/png'))
    if (!blob) throw new Error('the PNG could not be encoded')
    return blob
  }
  finally {
    URL.revokeObjectURL(url)
  }
}

export function useDiagramExport(say: Say) {
  const store = useEditorStore()
  const fileBase = computed(() => (store.title || 'diagram').replace(/[^\w-]+/g, '-').replace(/-+/g, '-').replace(/^-|-$/g, '').toLowerCase() || 'diagram')
  // The figure is captioned with the process and the shift (the PNG is drawn from the same SVG).
  const svgText = () => canvasSvg(store.nodes, store.edges, { shift: store.process?.shift, title: store.title, caption: exportCaption(store.process) })

  function exportJson() {
    const body = { format: 'polewright-diagram', formatVersion: 1, title: store.title, graph: store.toGraph() }
    download(`${fileBase.value}.json`, new Blob([JSON.stringify(body, null, 2)], { type: 'application/json' }))
  }
  function exportSvg() {
    download(`${fileBase.value}.svg`, new Blob([svgText()], { type: 'image/svg+xml' }))
  }
  async function exportPng() {
    try {
      download(`${fileBase.value}.png`, await svgToPng(svgText()))
    }
    catch (e) {
      say((e as Error).message, 'error')
    }
  }
  function exportTable(kind: 'csv' | 'latex') {
    const r = store.result
    const p = store.process
    if (!r || !p) return
    if (kind === 'csv') download(`${fileBase.value}-terms.csv`, new Blob([termsCsv(r, p)], { type: 'text/csv' }))
    else download(`${fileBase.value}-terms.tex`, new Blob([termsLatex(r, p)], { type: 'application/x-tex' }))
  }
  /** A loop cut's box table, with what the check ran on (JSON). */
  function exportLoopTable(kind: 'csv' | 'json', request?: Record<string, unknown> | null) {
    const r = store.loopResult
    if (!r) return
    if (kind === 'csv') download(`${fileBase.value}-boxes.csv`, new Blob([loopDrawingCsv(r)], { type: 'text/csv' }))
    else download(`${fileBase.value}-boxes.json`, new Blob([loopDrawingJson(r, request ?? undefined)], { type: 'application/json' }))
  }
  async function importFile(input: HTMLInputElement) {
    const file = input.files?.[0]
    if (!file) return
    try {
      const raw = JSON.parse(await file.text()) as { graph?: unknown, title?: string }
      const g = GraphSchema.safeParse(raw.graph ?? raw)
      if (!g.success) {
        const i = g.error.issues[0]!
        say(`Not a diagram: graph.${i.path.join('.')}: ${i.message}`, 'error')
        return
      }
      store.replaceGraph(g.data, typeof raw.title === 'string' ? raw.title : undefined)
      say(`Imported ${file.name} (not saved yet; Ctrl+Z undoes the import).`)
    }
    catch (err) {
      say(`Not a diagram file: ${(err as Error).message}`, 'error')
    }
    finally {
      input.value = ''
    }
  }
  return { exportJson, exportSvg, exportPng, exportTable, exportLoopTable, importFile }
}
