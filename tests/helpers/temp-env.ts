import { mkdtempSync } from 'node:fs'
import { createServer } from 'node:net'
import { tmpdir } from 'node:os'
import path from 'node:path'
import { db } from '@/db'
import { migrateDb } from '@/db/migrate'
import { startFakeMailServer } from '@/lib/mail/fake-server'

async function freePort(): Promise<number> {
  return new Promise((resolve) => {
    const s = createServer()
    s.listen(0, '127.0.0.1', () => {
      const { port } = s.address() as { port: number }
      s.close(() => resolve(port))
    })
  })
}

/**
 * A temporary SQLite file and a fake mail server for one test file. The db module opens its
 * client lazily from DATABASE_URL, so setting the variables here, before first use, is enough.
 */
export async function useTempEnvironment() {
  const dir = mkdtempSync(path.join(tmpdir(), 'inverso-test-'))
  const mailDir = path.join(dir, 'mail')
  const smtpPort = await freePort()
  process.env.DATABASE_URL = `file:${path.join(dir, 'test.db')}`
  process.env.SMTP_PORT = String(smtpPort)
  process.env.MAIL_FAKE_DIR = mailDir
  process.env.APP_URL = 'http://localhost:3999'
  const mail = await startFakeMailServer({ port: smtpPort, dir: mailDir })
  await migrateDb(db)
  return { dir, mailDir, close: mail.close }
}
