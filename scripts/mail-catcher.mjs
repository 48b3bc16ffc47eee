// A local SMTP catcher on loopback (smtp-server + mailparser): every message is written to
// MAIL_OUTBOX_DIR (default .data/outbox) as one JSON file, where the admin outbox page and the
// tests read it. Nothing is relayed anywhere.
import { SMTPServer } from 'smtp-server'
import { simpleParser } from 'mailparser'
import { mkdirSync, renameSync, writeFileSync } from 'node:fs'
import { join, resolve } from 'node:path'

const dir = resolve(process.env.MAIL_OUTBOX_DIR || join(import.meta.dirname, '../.data/outbox'))
const port = Number(process.env.SMTP_PORT || 2525)
mkdirSync(dir, { recursive: true })

let seq = 0
const server = new SMTPServer({
  authOptional: true,
  disabledCommands: ['STARTTLS'],
  size: 5 * 1024 * 1024,
  banner: 'Polewright local mail catcher (nothing is relayed)',
  onData(stream, session, callback) {
    simpleParser(stream).then((mail) => {
      const id = `${Date.now()}-${process.pid}-${String(++seq).padStart(5, '0')}`
      const json = JSON.stringify({
        id,
        receivedAt: new Date().toISOString(),
        from: mail.from?.text ?? '',
        to: session.envelope.rcptTo.map(r => r.address),
        subject: mail.subject ?? '',
        text: mail.text ?? '',
        html: typeof mail.html === 'string' ? mail.html : '',
      }, null, 2)
      // Written under a temporary name and renamed, so readers never see half a message.
      const tmp = join(dir, `.${id}.tmp`)
      writeFileSync(tmp, json)
      renameSync(tmp, join(dir, `${id}.json`))
      callback()
    }, callback)
  },
})
server.on('error', (e) => {
  console.error(`[mail] catcher on 127.0.0.1:${port} failed: ${e.message}`)
  process.exit(1)
})
server.listen(port, '127.0.0.1', () => console.log(`[mail] catching SMTP on 127.0.0.1:${port} into ${dir}`))
// Started with an IPC channel (the dev server's plugin): stop when that parent goes away.
if (process.send) process.on('disconnect', () => process.exit(0))
process.on('SIGTERM', () => server.close(() => process.exit(0)))
process.on('SIGINT', () => server.close(() => process.exit(0)))
