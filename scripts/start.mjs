// npm start: install what is missing, build, migrate and seed the demo, then serve on :3000.
import { spawn } from 'node:child_process'
import { join } from 'node:path'
import { ensureBuilt, ensureInstalled, root, serverEnv } from './lib.mjs'

ensureInstalled()
ensureBuilt()

const children = []
const env = serverEnv({ POLEWRIGHT_SEED: '1', PORT: process.env.PORT || '3000', HOST: process.env.HOST || 'localhost' })
// Mailed links come only from APP_URL (never from a request's Host); locally that is our own address.
env.APP_URL ||= `http://${env.HOST}:${env.PORT}`
if (!process.env.SMTP_URL && !process.env.SMTP_HOST) {
  // Development mail goes to the local catcher; the admin outbox page shows it.
  children.push(spawn(process.execPath, [join(root, 'scripts/mail-catcher.mjs')], { stdio: 'inherit', env }))
}
const server = spawn(process.execPath, [join(root, '.output/server/index.mjs')], { stdio: 'inherit', env, cwd: root })
children.push(server)
console.log(`Polewright on http://${env.HOST}:${env.PORT} — demo sign-ins are listed in README.md`)
const stop = () => { for (const c of children) c.kill('SIGTERM') }
process.on('SIGINT', stop)
process.on('SIGTERM', stop)
server.on('exit', (code) => { stop(); process.exit(code ?? 0) })
