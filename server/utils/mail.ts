// Outgoing mail through nodemailer. Without SMTP settings it goes to the local catcher on
// loopback (scripts/mail-catcher.mjs), so nothing leaves the machine.
import nodemailer, { type Transporter } from 'nodemailer'
import { readdir, readFile } from 'node:fs/promises'
import { join, resolve } from 'node:path'
import type { H3Event } from 'h3'

let transporter: Transporter | undefined

/** True when real SMTP settings were given (then nothing is captured locally). */
export function usesRealSmtp() {
  return Boolean(process.env.SMTP_URL || process.env.SMTP_HOST)
}

export function mailTransport(): Transporter {
  if (!transporter) {
    // Short timeouts: an unreachable mail server must not hold a request for minutes.
    const timeouts = { connectionTimeout: 10_000, greetingTimeout: 10_000, socketTimeout: 20_000 }
    const url = process.env.SMTP_URL
    transporter = url
      ? nodemailer.createTransport({ url, ...timeouts })
      : nodemailer.createTransport({
          host: process.env.SMTP_HOST || '127.0.0.1',
          port: Number(process.env.SMTP_PORT || 2525),
          secure: process.env.SMTP_SECURE === '1',
          auth: process.env.SMTP_USER ? { user: process.env.SMTP_USER, pass: process.env.SMTP_PASSWORD || '' } : undefined,
          // The loopback catcher speaks plain SMTP; a real server negotiates STARTTLS as usual.
          ignoreTLS: !process.env.SMTP_HOST,
          ...timeouts,
        })
  }
  return transporter
}

export interface Mail { to: string, subject: string, text: string, html: string, replyTo?: string }

export function mailFrom() {
  return process.env.MAIL_FROM || 'Polewright <no-reply@polewright.example.test>'
}

/** Sends one message; a failure is logged and reported as false, never thrown (the user's action stands). */
export async function sendMail(mail: Mail) {
  try {
    await mailTransport().sendMail({ from: mailFrom(), ...mail })
    return true
  }
  catch (error) {
    console.error('[mail] could not send to', mail.to, (error as Error).message)
    return false
  }
}

/**
 * The address e-mailed links point to: APP_URL, or in development (nuxt dev) the dev server's own
 * listen address. Never a request header (a forged Host would put the victim's reset link on the
 * attacker's host). Null in production without APP_URL: then no mail with a link is sent.
 */
export function appUrl(): string | null {
  const configured = process.env.APP_URL?.trim()
  if (configured) return configured.replace(/\/+$/, '')
  if (import.meta.dev) {
    // The same settings, in the same order, that `nuxt dev` listens on.
    const env = process.env
    const host = env.NUXT_HOST || env.NITRO_HOST || env.HOST || 'localhost'
    return `http://${host.includes(':') ? `[${host}]` : host}:${env.NUXT_PORT || env.NITRO_PORT || env.PORT || 3000}`
  }
  return null
}

/** Checked once at start-up (server/plugins/app-url.ts): a message saying what is wrong, or null. */
export function appUrlProblem(): string | null {
  const configured = process.env.APP_URL?.trim()
  if (!configured) {
    return import.meta.dev
      ? null
      : 'APP_URL is not set, so no e-mail with a link is sent (password reset, invitations, member notices). '
        + 'Set APP_URL to the public address of this server, e.g. APP_URL=https://polewright.example.org'
  }
  let url: URL
  try {
    url = new URL(configured)
  }
  catch {
    return `APP_URL=${configured} is not an absolute address; use e.g. https://polewright.example.org`
  }
  if (url.protocol !== 'https:' && url.protocol !== 'http:') return `APP_URL=${configured} must start with https:// (or http:// for a local server)`
  return null
}

/** The configured link base, or a 503 naming the setting (for actions whose whole point is the mail). */
export function requireAppUrl(): string {
  const url = appUrl()
  if (!url) throw httpError(503, 'mail links are off on this server: APP_URL is not configured; ask the site administrator')
  return url
}

/** Runs a task once the answer has been handed to the client (mail is sent after answering). */
export function afterResponse(event: H3Event, task: () => Promise<unknown>) {
  const res = event.node.res
  let started = false
  const run = () => {
    if (started) return
    started = true
    task().catch(error => console.error('[after-response]', (error as Error).message))
  }
  res.once('finish', run)
  res.once('close', run)
}

export function escapeHtml(s: string) {
  return s.replace(/[&<>"']/g, c => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', '\'': '&#39;' }[c]!))
}

export interface Letter {
  to: string
  subject: string
  /** Paragraphs of plain text; each becomes a <p> in the HTML part. */
  paragraphs: string[]
  action?: { label: string, url: string }
  /** Why the recipient gets this message (shown at the end of both parts). */
  why: string
  replyTo?: string
}

/** One layout for every message: the same words in the plain-text and the HTML part. */
export function composeMail(letter: Letter): Mail {
  const text = [
    ...letter.paragraphs,
    ...(letter.action ? [`${letter.action.label}:\n${letter.action.url}`] : []),
    '--',
    letter.why,
  ].join('\n\n')
  const p = (s: string) => `<p style="margin:0 0 14px">${escapeHtml(s).replace(/\n/g, '<br>')}</p>`
  const button = letter.action
    ? `<p style="margin:20px 0"><a href="${escapeHtml(letter.action.url)}" style="background:#3d4fd6;color:#fff;padding:10px 16px;border-radius:6px;text-decoration:none">${escapeHtml(letter.action.label)}</a></p>`
    + `<p style="margin:0 0 14px;font-size:12px;color:#666">Or paste this address into your browser: ${escapeHtml(letter.action.url)}</p>`
    : ''
  const html = `<!doctype html><html><body style="font-family:system-ui,sans-serif;color:#222;max-width:560px;margin:0 auto;padding:16px">`
    + `<p style="font-weight:700;margin:0 0 16px">Polewright</p>`
    + letter.paragraphs.map(p).join('')
    + button
    + `<hr style="border:none;border-top:1px solid #ddd;margin:20px 0"><p style="font-size:12px;color:#666">${escapeHtml(letter.why)}</p>`
    + `</body></html>`
  return { to: letter.to, subject: letter.subject, text, html, replyTo: letter.replyTo }
}

// --- The local outbox (messages captured by scripts/mail-catcher.mjs) ---

export function outboxDir() {
  return resolve(process.env.MAIL_OUTBOX_DIR || join(process.cwd(), '.data/outbox'))
}

export interface OutboxMessage {
  id: string
  receivedAt: string
  from: string
  to: string[]
  subject: string
  text: string
  html: string
}

/** The newest captured messages first; a missing folder is an empty outbox. */
export async function readOutbox(limit = 200): Promise<OutboxMessage[]> {
  const dir = outboxDir()
  let names: string[]
  try {
    names = (await readdir(dir)).filter(n => n.endsWith('.json'))
  }
  catch {
    return []
  }
  const messages: OutboxMessage[] = []
  for (const name of names) {
    try {
      messages.push(JSON.parse(await readFile(join(dir, name), 'utf8')) as OutboxMessage)
    }
    catch { /* a file being written or not ours */ }
  }
  messages.sort((a, b) => (a.receivedAt < b.receivedAt ? 1 : a.receivedAt > b.receivedAt ? -1 : b.id.localeCompare(a.id)))
  return messages.slice(0, limit)
}
