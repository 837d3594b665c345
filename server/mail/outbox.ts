import { hostname } from 'node:os'
import { randomUUID } from 'node:crypto'
import { and, asc, desc, eq, isNotNull, isNull, lt, lte, or, sql } from 'drizzle-orm'
import { db, type Db, type Tx } from '@/db'
import { outbox } from '@/db/schema'
import { smtpSender, type MailSender, type OutgoingMail } from '@/lib/mail/transport'
import { authoriseSite, type Caller } from '../access'

/** Tries before a mail is given up (its row stays, with `failed_at` and the last error). */
export const MAX_ATTEMPTS = 8
/** How long a claim holds: longer than one send with its timeouts, so a live sender never loses its row. */
export const CLAIM_MS = 60_000
const FIRST_RETRY_MS = 30_000
const MAX_RETRY_MS = 3600_000

/** Wait before try `attempts + 1` after `attempts` failures: 30 s, 1 min, 2 min, … at most 1 h. */
export function retryDelayMs(attempts: number): number {
  return Math.min(MAX_RETRY_MS, FIRST_RETRY_MS * 2 ** Math.max(0, attempts - 1))
}

/** Names this process in `claimed_by`, so two instances on one database can tell their claims apart. */
export const INSTANCE_ID = `${hostname()}:${process.pid}:${randomUUID().slice(0, 8)}`

/**
 * Puts a mail in the outbox; it is sent by the outbox sender shortly after, retried while the
 * mail server is away, and never lost. Pass the caller's transaction as `tx` so the mail is
 * written (or not) together with what it tells about. Only inserts a row: never waits on SMTP.
 *
 * @example await db.transaction(async (tx) => { await tx.insert(…); await enqueueMail({ to, subject, text }, tx) })
 */
export async function enqueueMail(message: OutgoingMail, tx?: Tx | Db): Promise<void> {
  await (tx ?? db).insert(outbox).values({ to: message.to, subject: message.subject, text: message.text, html: message.html ?? null })
  kickSender()
}

export interface DrainResult {
  sent: number
  retrying: number
  gaveUp: number
}

/**
 * Sends every due mail once (tests call this; the server runs it on an interval). Each row is
 * claimed with one conditional UPDATE before it is sent, so two senders never send one mail.
 * `now` lets a test step past the retry back-off.
 */
export async function drainOutbox(opts: { now?: Date; limit?: number; sender?: MailSender; instanceId?: string } = {}): Promise<DrainResult> {
  const now = opts.now ?? new Date()
  const me = opts.instanceId ?? INSTANCE_ID
  const result: DrainResult = { sent: 0, retrying: 0, gaveUp: 0 }
  const due = await db
    .select({ id: outbox.id })
    .from(outbox)
    .where(and(isNull(outbox.sentAt), isNull(outbox.failedAt), lte(outbox.nextAttemptAt, now), or(isNull(outbox.claimedUntil), lt(outbox.claimedUntil, now))))
    .orderBy(asc(outbox.id))
    .limit(opts.limit ?? 50)
  if (due.length === 0) return result

  let sender: MailSender | undefined = opts.sender
  try {
    for (const { id } of due) {
      const claimed = await db
        .update(outbox)
        .set({ claimedBy: me, claimedUntil: new Date(now.getTime() + CLAIM_MS) })
        .where(and(eq(outbox.id, id), isNull(outbox.sentAt), isNull(outbox.failedAt), or(isNull(outbox.claimedUntil), lt(outbox.claimedUntil, now))))
        .returning()
      const row = claimed[0]
      if (!row) continue // another instance took it
      sender ??= smtpSender()
      try {
        await sender.send({ to: row.to, subject: row.subject, text: row.text, ...(row.html ? { html: row.html } : {}) })
        await db.update(outbox).set({ sentAt: new Date(), attempts: row.attempts + 1, claimedBy: null, claimedUntil: null, lastError: null }).where(and(eq(outbox.id, id), eq(outbox.claimedBy, me)))
        result.sent++
      } catch (err) {
        const attempts = row.attempts + 1
        const giveUp = attempts >= MAX_ATTEMPTS
        const lastError = (err instanceof Error ? err.message : String(err)).slice(0, 500)
        await db
          .update(outbox)
          .set({
            attempts,
            lastError,
            claimedBy: null,
            claimedUntil: null,
            ...(giveUp ? { failedAt: new Date() } : { nextAttemptAt: new Date(now.getTime() + retryDelayMs(attempts)) }),
          })
          .where(and(eq(outbox.id, id), eq(outbox.claimedBy, me)))
        if (giveUp) {
          result.gaveUp++
          console.error(`[mail] gave up on outbox mail ${id} to ${row.to} after ${attempts} tries: ${lastError}`)
        } else {
          result.retrying++
          console.warn(`[mail] outbox mail ${id} to ${row.to} not sent (try ${attempts} of ${MAX_ATTEMPTS}), retrying later: ${lastError}`)
        }
      }
    }
  } finally {
    if (sender && sender !== opts.sender) sender.close()
  }
  return result
}

// ---- the sender loop in the server process ------------------------------------------------

const loop = globalThis as unknown as { __inversoOutbox?: { timer?: NodeJS.Timeout; running: boolean; stopped: boolean; intervalMs: number } }

function schedule(delayMs: number) {
  const s = loop.__inversoOutbox
  if (!s || s.stopped) return
  clearTimeout(s.timer)
  s.timer = setTimeout(() => void tick(), delayMs)
  s.timer.unref?.()
}

async function tick() {
  const s = loop.__inversoOutbox
  if (!s || s.stopped) return
  // A kick during a drain only moves the next tick earlier: drains never overlap.
  if (s.running) return
  s.running = true
  try {
    await drainOutbox()
  } catch (err) {
    console.error('[mail] outbox sender', err)
  } finally {
    s.running = false
    schedule(s.intervalMs)
  }
}

/** Starts the sender in this process (instrumentation.ts): a drain every `intervalMs`, one at a time. */
export function startOutboxSender(intervalMs = Number(process.env.OUTBOX_INTERVAL_MS || 5000)): () => void {
  if (loop.__inversoOutbox && !loop.__inversoOutbox.stopped) return stopOutboxSender
  loop.__inversoOutbox = { running: false, stopped: false, intervalMs }
  schedule(1000)
  return stopOutboxSender
}

export function stopOutboxSender() {
  const s = loop.__inversoOutbox
  if (!s) return
  s.stopped = true
  clearTimeout(s.timer)
}

/** A new mail is due now: drain soon instead of at the next interval (no-op where no sender runs). */
function kickSender() {
  const s = loop.__inversoOutbox
  if (s && !s.stopped && !s.running) schedule(300)
}

/** What the outbox holds beyond the sent mail, for the admin's mail page. */
export async function outboxProblems(caller: Caller | null, limit = 50) {
  authoriseSite(caller, 'mail.view')
  return db
    .select({ id: outbox.id, to: outbox.to, subject: outbox.subject, attempts: outbox.attempts, nextAttemptAt: outbox.nextAttemptAt, failedAt: outbox.failedAt, lastError: outbox.lastError, createdAt: outbox.createdAt })
    .from(outbox)
    .where(and(isNull(outbox.sentAt), or(isNotNull(outbox.lastError), isNotNull(outbox.failedAt))))
    .orderBy(desc(outbox.id))
    .limit(limit)
}

/** Counts by state, for tests and the load script. */
export async function outboxCounts() {
  const [row] = await db
    .select({
      waiting: sql<number>`sum(case when ${outbox.sentAt} is null and ${outbox.failedAt} is null then 1 else 0 end)`,
      sent: sql<number>`sum(case when ${outbox.sentAt} is not null then 1 else 0 end)`,
      failed: sql<number>`sum(case when ${outbox.failedAt} is not null then 1 else 0 end)`,
    })
    .from(outbox)
  return { waiting: Number(row?.waiting ?? 0), sent: Number(row?.sent ?? 0), failed: Number(row?.failed ?? 0) }
}
