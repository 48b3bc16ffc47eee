// A second built server for the security tests that need other settings than the shared one
// (no APP_URL, a trusted proxy, small throttle limits): own temporary database, own mail catcher.
import { spawn, type ChildProcess } from 'node:child_process'
import { mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs'
import { createServer } from 'node:net'
import { request } from 'node:http'
import { tmpdir } from 'node:os'
import { join, resolve } from 'node:path'
import { testServerEnv } from '../setup/server'

const root = resolve(import.meta.dirname, '../..')

function freePort(): Promise<number> {
  return new Promise((ok, fail) => {
    const s = createServer()
    s.once('error', fail)
    s.listen(0, '127.0.0.1', () => {
      const port = (s.address() as { port: number }).port
      s.close(() => ok(port))
    })
  })
}

export interface ExtraServer {
  baseURL: string
  logs: () => string
  outbox: () => { to: string[], subject: string, text: string }[]
  stop: () => Promise<void>
}

export async function startExtraServer(extraEnv: Record<string, string | undefined>): Promise<ExtraServer> {
  const output = process.env.POLEWRIGHT_TEST_OUTPUT || '.output'
  const dir = mkdtempSync(join(tmpdir(), 'polewright-sec-'))
  const [port, smtpPort] = [await freePort(), await freePort()]
  const baseURL = `http://127.0.0.1:${port}`
  const env = { ...testServerEnv(dir, port, smtpPort), POLEWRIGHT_SEED: undefined, APP_URL: undefined, ...extraEnv }
  let logs = ''
  const children: ChildProcess[] = [
    spawn(process.execPath, [join(root, 'scripts/mail-catcher.mjs')], { env, stdio: 'pipe' }),
    spawn(process.execPath, [join(root, output, 'server/index.mjs')], { env, cwd: root, stdio: 'pipe' }),
  ]
  for (const c of children) {
    c.stdout?.on('data', (d) => { logs += d })
    c.stderr?.on('data', (d) => { logs += d })
  }
  const server = children[1]!
  for (let i = 0; ; i++) {
    if (server.exitCode !== null || i > 300) throw new Error(`extra server did not start:\n${logs}`)
    try {
      if ((await fetch(`${baseURL}/api/auth/me`)).status > 0) break
    }
    catch { /* not up yet */ }
    await new Promise(r => setTimeout(r, 100))
  }
  return {
    baseURL,
    logs: () => logs,
    outbox: () => {
      try {
        return readdirSync(join(dir, 'outbox')).filter(n => n.endsWith('.json')).map(n => JSON.parse(readFileSync(join(dir, 'outbox', n), 'utf8')))
      }
      catch {
        return []
      }
    },
    stop: async () => {
      for (const c of children) c.kill('SIGTERM')
      await new Promise(r => setTimeout(r, 200))
      rmSync(dir, { recursive: true, force: true })
    },
  }
}

/** A request with headers fetch will not send as given (Host): node:http directly. */
export function rawRequest(url: string, method: string, headers: Record<string, string>, body?: unknown): Promise<{ status: number, body: any }> {
  return new Promise((ok, fail) => {
    const data = body === undefined ? undefined : JSON.stringify(body)
    const req = request(url, { method, headers: { ...(data && { 'content-type': 'application/json', 'content-length': String(Buffer.byteLength(data)) }), ...headers } }, (res) => {
      let text = ''
      res.on('data', (c) => { text += c })
      res.on('end', () => {
        let parsed: unknown = text
        try {
          parsed = text ? JSON.parse(text) : null
        }
        catch { /* not JSON */ }
        ok({ status: res.statusCode ?? 0, body: parsed })
      })
    })
    req.on('error', fail)
    if (data) req.write(data)
    req.end()
  })
}
