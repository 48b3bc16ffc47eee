// The editor's keyboard: one table drives both the key handler and the help overlay.
import { useEventListener } from '@vueuse/core'

export type ShortcutAction
  = | 'help' | 'delete' | 'undo' | 'redo' | 'save' | 'check' | 'fit' | 'tidy' | 'expand' | 'expandFull'
    | 'expandBlock' | 'pickShift' | 'addAngle' | 'addSquare' | 'addBlock' | 'addLeg' | 'escape'

export interface Shortcut {
  /** As the help shows it. */
  keys: string
  what: string
  action: ShortcutAction
  /** Matches a key event (the modifier is Ctrl or ⌘). */
  match: (e: KeyboardEvent, mod: boolean) => boolean
  /** Also while typing in a field (save and run the check do). */
  inFields?: boolean
}

const key = (k: string) => (e: KeyboardEvent, mod: boolean) => !mod && !e.altKey && e.key.toLowerCase() === k
export const EDITOR_SHORTCUTS: Shortcut[] = [
  { keys: '?', what: 'this help', action: 'help', match: (e, mod) => !mod && e.key === '?' },
  { keys: 'Delete / Backspace', what: 'delete the selected nodes and lines', action: 'delete', match: (e, mod) => !mod && (e.key === 'Delete' || e.key === 'Backspace') },
  { keys: 'Ctrl+Z', what: 'undo', action: 'undo', match: (e, mod) => mod && !e.shiftKey && e.key.toLowerCase() === 'z' },
  { keys: 'Ctrl+Shift+Z / Ctrl+Y', what: 'redo', action: 'redo', match: (e, mod) => mod && ((e.shiftKey && e.key.toLowerCase() === 'z') || e.key.toLowerCase() === 'y') },
  { keys: 'Ctrl+S', what: 'save (a new revision)', action: 'save', match: (e, mod) => mod && e.key.toLowerCase() === 's', inFields: true },
  { keys: 'Ctrl+Enter', what: 'run the check on the server', action: 'check', match: (e, mod) => mod && e.key === 'Enter', inFields: true },
  { keys: 'F', what: 'fit the view', action: 'fit', match: key('f') },
  { keys: 'L', what: 'lay the canvas out again', action: 'tidy', match: key('l') },
  { keys: 'E', what: 'expand the process into its channel terms', action: 'expand', match: (e, mod) => !mod && !e.altKey && e.key === 'e' },
  { keys: 'Shift+E', what: 'expand fully, down to three-point vertices', action: 'expandFull', match: (e, mod) => !mod && !e.altKey && e.key === 'E' },
  { keys: 'X', what: 'expand the selected block', action: 'expandBlock', match: key('x') },
  { keys: 'S', what: 'pick the shift: click leg i, then leg j', action: 'pickShift', match: key('s') },
  { keys: 'A', what: 'add an angle vertex', action: 'addAngle', match: key('a') },
  { keys: 'Q', what: 'add a square vertex', action: 'addSquare', match: key('q') },
  { keys: 'B', what: 'add a block', action: 'addBlock', match: key('b') },
  { keys: 'G', what: 'add a leg', action: 'addLeg', match: key('g') },
  { keys: 'Esc', what: 'close dialogs and menus, stop picking a shift, clear the selection and the term focus', action: 'escape', match: e => e.key === 'Escape', inFields: true },
]

function typingIn(t: EventTarget | null): boolean {
  const el = t as HTMLElement | null
  return !!el && (el.tagName === 'INPUT' || el.tagName === 'TEXTAREA' || el.tagName === 'SELECT' || el.isContentEditable)
}

/** Binds the table to handlers; a key without a handler is left to the browser. */
export function useEditorShortcuts(handlers: Partial<Record<ShortcutAction, () => unknown>>) {
  useEventListener(window, 'keydown', (e: KeyboardEvent) => {
    const mod = e.ctrlKey || e.metaKey
    const typing = typingIn(e.target)
    const s = EDITOR_SHORTCUTS.find(x => x.match(e, mod))
    if (!s || (typing && !s.inFields)) return
    const run = handlers[s.action]
    if (!run) return
    if (s.action !== 'escape') e.preventDefault()
    run()
  })
}
