// A local SMTP catcher on loopback (smtp-server + mailparser): every message is written to
// MAIL_OUTBOX_DIR (default .data/outbox) as JSON, where the admin outbox page and tests read it.
import { SMTPServer } from 'smtp-server'
import { simpleParser } from 'mailparser'
import { mkdirSync, writeFileSync } from 'node:fs'
import { join, resolve } from 'node:path'

const dir = resolve(process.env.MAIL_OUTBOX_DIR || join(import.meta.dirname, '../.data/outbox'))
const port = Number(process.env.SMTP_PORT || 2525)
mkdirSync(dir, { recursive: true })

let seq = 0
const server = new SMTPServer({
  authOptional: true,
  disabledCommands: ['STARTTLS'],
  onData(stream, session, callback) {
    simpleParser(stream).then((mail) => {
      const id = `${Date.now()}-${process.pid}-${++seq}`
      writeFileSync(join(dir, `${id}.json`), JSON.stringify({
        id,
        receivedAt: new Date().toISOString(),
        from: mail.from?.text ?? '',
        to: session.envelope.rcptTo.map(r => r.address),
        subject: mail.subject ?? '',
        text: mail.text ?? '',
        html: typeof mail.html === 'string' ? mail.html : '',
      }, null, 2))
      callback()
    }, callback)
  },
})
server.listen(port, '127.0.0.1', () => console.log(`[mail] catching SMTP on 127.0.0.1:${port} into ${dir}`))
process.on('SIGTERM', () => server.close(() => process.exit(0)))
