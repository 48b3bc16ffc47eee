// `npm run dev` only: start the local mail catcher beside the dev server when no SMTP server is
// configured, as `npm start` and the tests do, so invitations and reset links can be read at
// /admin/outbox. Built servers never run this (import.meta.dev is false there).
import { spawn, type ChildProcess } from 'node:child_process'
import { existsSync } from 'node:fs'
import { resolve } from 'node:path'

export default defineNitroPlugin((nitro) => {
  if (!import.meta.dev || usesRealSmtp()) return
  const script = resolve(process.cwd(), 'scripts/mail-catcher.mjs')
  if (!existsSync(script)) return
  // The IPC channel ends the catcher when the dev server goes, however it goes. A catcher already
  // listening (from an earlier dev restart) makes this one exit at once; fine.
  const child: ChildProcess = spawn(process.execPath, [script], { stdio: ['ignore', 'inherit', 'inherit', 'ipc'], env: process.env })
  child.on('error', e => console.error('[mail] could not start the local catcher:', e.message))
  nitro.hooks.hook('close', () => {
    child.kill('SIGTERM')
  })
})
