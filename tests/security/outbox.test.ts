/**
 * Issue 13, item 11: mail goes through an outbox. An action succeeds while the mail server is
 * down and its mail is delivered once the server is back; each mail is claimed by one sender
 * only; a sender never hangs on a silent server; a mail that keeps failing is kept and visible;
 * the member row and its mail row are written together or not at all.
 */
import { createServer, type Server } from 'node:net'
import { and, eq } from 'drizzle-orm'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { db, dbClient } from '@/db'
import { mailTokens, outbox } from '@/db/schema'
import { drainOutbox, enqueueMail, MAX_ATTEMPTS, outboxProblems } from '@/server/mail/outbox'
import { inviteMember } from '@/server/members'
import type { Caller } from '@/server/access'
import { startFakeMailServer } from '@/lib/mail/fake-server'
import { listCaughtMail } from '@/lib/mail/inbox'
import type { MailSender, OutgoingMail } from '@/lib/mail/transport'
import { seededDemo, type DemoRole } from '../helpers/demo'
import { useTempEnvironment } from '../helpers/temp-env'

let env: Awaited<ReturnType<typeof useTempEnvironment>>
let who: Record<DemoRole, Caller>
let projectId = ''
let closeMail: () => Promise<void>
beforeAll(async () => {
  env = await useTempEnvironment()
  closeMail = env.close
  ;({ people: who, projectId } = await seededDemo())
})
afterAll(() => closeMail())

const later = (minutes: number) => new Date(Date.now() + minutes * 60_000)

describe('outbox', () => {
  it('an invitation succeeds with the mail server stopped; the mail is delivered once the server is back', async () => {
    await closeMail()
    const t0 = Date.now()
    const out = await inviteMember(who.admin, projectId, { email: 'offline@feldmark.example', role: 'checker' })
    expect(out.invited).toBe(true)
    expect(Date.now() - t0).toBeLessThan(2000)
    const [row] = await db.select().from(outbox).where(eq(outbox.to, 'offline@feldmark.example'))
    expect(row.sentAt).toBeNull()

    const down = await drainOutbox()
    expect(down.retrying).toBeGreaterThanOrEqual(1)
    const [afterFailure] = await db.select().from(outbox).where(eq(outbox.id, row.id))
    expect(afterFailure.attempts).toBe(1)
    expect(afterFailure.lastError).toBeTruthy()
    expect(afterFailure.nextAttemptAt.getTime()).toBeGreaterThan(Date.now())
    expect(listCaughtMail(env.mailDir).filter((m) => m.to.includes('offline@feldmark.example'))).toHaveLength(0)

    const server = await startFakeMailServer({ port: Number(process.env.SMTP_PORT), dir: env.mailDir })
    closeMail = server.close
    // Not due yet: the back-off holds it…
    expect((await drainOutbox()).sent).toBe(0)
    // …until its time comes.
    expect((await drainOutbox({ now: later(2) })).sent).toBeGreaterThanOrEqual(1)
    const caught = listCaughtMail(env.mailDir).filter((m) => m.to.includes('offline@feldmark.example'))
    expect(caught).toHaveLength(1)
    expect(caught[0].subject).toMatch(/Invitation to/)
    expect((await db.select().from(outbox).where(eq(outbox.id, row.id)))[0].sentAt).not.toBeNull()
  })

  it('two senders (two app instances) draining at once send each mail exactly once', async () => {
    for (let i = 0; i < 12; i++) await enqueueMail({ to: `pair${i}@feldmark.example`, subject: `Pair ${i}`, text: 'x' })
    const sentBy = new Map<string, string[]>()
    const sender = (instance: string): MailSender => ({
      send: async (m: OutgoingMail) => {
        await new Promise((r) => setTimeout(r, 5))
        sentBy.set(m.to, [...(sentBy.get(m.to) ?? []), instance])
      },
      close: () => undefined,
    })
    const [a, b] = await Promise.all([drainOutbox({ sender: sender('A'), instanceId: 'A' }), drainOutbox({ sender: sender('B'), instanceId: 'B' })])
    expect(a.sent + b.sent).toBe(12)
    for (let i = 0; i < 12; i++) expect(sentBy.get(`pair${i}@feldmark.example`)).toHaveLength(1)
    // Nothing is left to send.
    expect((await drainOutbox({ sender: sender('C'), instanceId: 'C' })).sent).toBe(0)
  })

  it('a mail server that accepts the connection but never answers costs the sender a few seconds, not the action', async () => {
    const silent: Server = createServer(() => undefined)
    await new Promise<void>((r) => silent.listen(0, '127.0.0.1', () => r()))
    const port = process.env.SMTP_PORT
    process.env.SMTP_PORT = String((silent.address() as { port: number }).port)
    try {
      const t0 = Date.now()
      await inviteMember(who.admin, projectId, { email: 'silent@feldmark.example', role: 'approver' })
      expect(Date.now() - t0).toBeLessThan(2000)
      const t1 = Date.now()
      const r = await drainOutbox()
      expect(r.retrying).toBeGreaterThanOrEqual(1)
      expect(Date.now() - t1).toBeLessThan(12_000)
    } finally {
      process.env.SMTP_PORT = port
      silent.close()
    }
  })

  it(`a mail that fails ${MAX_ATTEMPTS} times is given up, kept and shown to the admin`, async () => {
    await enqueueMail({ to: 'bounce@feldmark.example', subject: 'Never arrives', text: 'x' })
    const failing: MailSender = { send: async () => Promise.reject(new Error('550 mailbox unavailable')), close: () => undefined }
    let now = Date.now()
    for (let i = 0; i < MAX_ATTEMPTS; i++) {
      now += 2 * 3600_000
      await drainOutbox({ sender: failing, now: new Date(now) })
    }
    const [row] = await db.select().from(outbox).where(eq(outbox.to, 'bounce@feldmark.example'))
    expect(row.attempts).toBe(MAX_ATTEMPTS)
    expect(row.failedAt).not.toBeNull()
    expect(row.lastError).toMatch(/550/)
    const problems = await outboxProblems(who.admin)
    expect(problems.find((p) => p.to === 'bounce@feldmark.example')?.failedAt).toBeTruthy()
    await expect(outboxProblems(who.engineer)).rejects.toThrow()
  })

  it('the invitation and its mail are written together: when the mail cannot be queued, no invitation is left', async () => {
    await dbClient().execute('ALTER TABLE outbox RENAME TO outbox_away')
    try {
      await expect(inviteMember(who.admin, projectId, { email: 'atomic@feldmark.example', role: 'checker' })).rejects.toThrow()
    } finally {
      await dbClient().execute('ALTER TABLE outbox_away RENAME TO outbox')
    }
    expect(await db.select().from(mailTokens).where(and(eq(mailTokens.email, 'atomic@feldmark.example'), eq(mailTokens.kind, 'invite')))).toHaveLength(0)
  })
})
