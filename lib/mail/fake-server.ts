import { mkdirSync, writeFileSync } from 'node:fs'
import path from 'node:path'
import { simpleParser } from 'mailparser'
import { SMTPServer } from 'smtp-server'

export interface CaughtMail {
  id: string
  receivedAt: string
  from: string
  to: string[]
  subject: string
  text: string
}

/**
 * A local SMTP server that accepts everything and keeps each message as a JSON file, so the
 * app, the tests and a developer can all read what was "sent". Never use it in production.
 */
export function startFakeMailServer(opts: { port: number; host?: string; dir: string }): Promise<{ close: () => Promise<void> }> {
  mkdirSync(opts.dir, { recursive: true })
  let counter = 0
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((parsed) => {
          const receivedAt = new Date().toISOString()
          const id = `${receivedAt.replace(/[:.]/g, '-')}-${process.pid}-${counter++}`
          const mail: CaughtMail = {
            id,
            receivedAt,
            from: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
            to: session.envelope.rcptTo.map((r) => r.address),
            subject: parsed.subject ?? '',
            text: parsed.text ?? '',
          }
          writeFileSync(path.join(opts.dir, `${id}.json`), JSON.stringify(mail, null, 2))
          callback()
        })
        .catch((err: Error) => callback(err))
    },
  })
  return new Promise((resolve, reject) => {
    server.once('error', reject)
    server.listen(opts.port, opts.host ?? '127.0.0.1', () =>
      resolve({ close: () => new Promise<void>((done) => server.close(() => done())) }),
    )
  })
}
