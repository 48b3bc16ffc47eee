// Outgoing mail through nodemailer. Without SMTP settings it goes to the local catcher on
// loopback (scripts/mail-catcher.mjs), so nothing leaves the machine.
import nodemailer, { type Transporter } from 'nodemailer'

let transporter: Transporter | undefined

export function mailTransport(): Transporter {
  if (!transporter) {
    const url = process.env.SMTP_URL
    transporter = url
      ? nodemailer.createTransport(url)
      : nodemailer.createTransport({
          host: process.env.SMTP_HOST || '127.0.0.1',
          port: Number(process.env.SMTP_PORT || 2525),
          secure: process.env.SMTP_SECURE === '1',
          auth: process.env.SMTP_USER ? { user: process.env.SMTP_USER, pass: process.env.SMTP_PASSWORD || '' } : undefined,
          tls: { rejectUnauthorized: false },
          ignoreTLS: !process.env.SMTP_HOST,
        })
  }
  return transporter
}

export interface Mail { to: string, subject: string, text: string, html: string }

export async function sendMail(mail: Mail) {
  const from = process.env.MAIL_FROM || 'Polewright <no-reply@polewright.example.test>'
  try {
    await mailTransport().sendMail({ from, ...mail })
    return true
  }
  catch (error) {
    // A mail failure must not lose the user's action; it is logged for the operator.
    console.error('[mail] could not send to', mail.to, (error as Error).message)
    return false
  }
}

export function appUrl(event: import('h3').H3Event): string {
  return process.env.APP_URL || getRequestURL(event).origin
}

export function escapeHtml(s: string) {
  return s.replace(/[&<>"']/g, c => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', '\'': '&#39;' }[c]!))
}
