// Starts the built server (and the local mail catcher) once for all API and browser tests,
// on a temporary SQLite file. POLEWRIGHT_TEST_OUTPUT picks another build folder.
import { spawn, type ChildProcess } from 'node:child_process'
import { mkdtempSync, rmSync, existsSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join, resolve } from 'node:path'
import type { TestProject } from 'vitest/node'

const root = resolve(import.meta.dirname, '../..')

async function waitFor(url: string, child: ChildProcess, log: () => string) {
  for (let i = 0; i < 300; i++) {
    if (child.exitCode !== null) throw new Error(`server exited early:\n${log()}`)
    try {
      const res = await fetch(url)
      if (res.status > 0) return
    }
    catch { /* not up yet */ }
    await new Promise(r => setTimeout(r, 100))
  }
  throw new Error(`server did not start:\n${log()}`)
}

/** The environment of a test server on its own temporary database, ports and outbox (production mode). */
export function testServerEnv(dir: string, port: number, smtpPort: number): Record<string, string | undefined> {
  return {
    ...process.env,
    PORT: String(port),
    HOST: '127.0.0.1',
    DATABASE_URL: `file:${join(dir, 'test.db')}`,
    NUXT_SESSION_PASSWORD: 'test-session-password-0123456789-abcdefghijklmnop',
    POLEWRIGHT_MIGRATIONS_DIR: join(root, 'db/migrations'),
    SMTP_PORT: String(smtpPort),
    MAIL_OUTBOX_DIR: join(dir, 'outbox'),
    NODE_ENV: 'production',
  }
}

export default async function setup(project: TestProject) {
  const output = process.env.POLEWRIGHT_TEST_OUTPUT || '.output'
  const entry = join(root, output, 'server/index.mjs')
  if (!existsSync(entry)) throw new Error(`No build at ${entry}: run "npm test" (it builds once) or "npx nuxt build".`)
  const dir = mkdtempSync(join(tmpdir(), 'polewright-test-'))
  const port = 3900 + Math.floor(Math.random() * 90)
  const smtpPort = port + 1000
  const outbox = join(dir, 'outbox')
  const baseURL = `http://127.0.0.1:${port}`
  const env = {
    ...testServerEnv(dir, port, smtpPort),
    POLEWRIGHT_SEED: '1',
    APP_URL: baseURL,
    // Every test client signs in from 127.0.0.1: the per-address limit across accounts would add
    // up the failed sign-ins of all files. security-auth*.test.ts checks it on its own server.
    POLEWRIGHT_LOGIN_ADDRESS_ATTEMPTS: '1000',
  }
  let logs = ''
  const mail = spawn(process.execPath, [join(root, 'scripts/mail-catcher.mjs')], { env, stdio: 'pipe' })
  const server = spawn(process.execPath, [entry], { env, cwd: root, stdio: 'pipe' })
  for (const c of [mail, server]) {
    c.stdout?.on('data', (d) => { logs += d })
    c.stderr?.on('data', (d) => { logs += d })
  }
  await waitFor(`${baseURL}/api/auth/me`, server, () => logs)
  project.provide('baseURL', baseURL)
  project.provide('outbox', outbox)
  project.provide('tmpDir', dir)
  return async () => {
    server.kill('SIGTERM')
    mail.kill('SIGTERM')
    if (process.env.POLEWRIGHT_TEST_LOGS) console.log(logs)
    await new Promise(r => setTimeout(r, 200))
    rmSync(dir, { recursive: true, force: true })
  }
}

declare module 'vitest' {
  export interface ProvidedContext {
    baseURL: string
    outbox: string
    tmpDir: string
  }
}
