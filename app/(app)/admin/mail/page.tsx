import type { Metadata } from 'next'
import { notFound } from 'next/navigation'
import { requirePageUser } from '@/app/_lib/session'
import { AppError } from '@/lib/errors'
import { caughtMail } from '@/server/mail-inbox'
import { outboxProblems } from '@/server/mail/outbox'

export const metadata: Metadata = { title: 'Local mailbox' }
export const dynamic = 'force-dynamic'

/** What the local fake mail server caught. Development and demo only. */
export default async function MailPage() {
  const user = await requirePageUser()
  let mails: ReturnType<typeof caughtMail>
  try {
    mails = caughtMail(user)
  } catch (err) {
    if (err instanceof AppError) notFound()
    throw err
  }
  // Mail the outbox could not deliver yet (retrying) or gave up on: kept, never lost.
  const problems = await outboxProblems(user)
  return (
    <div className="flex flex-col gap-4">
      {problems.length > 0 && (
        <section className="panel p-4" data-testid="outbox-problems">
          <h2 className="font-semibold">Mail not delivered</h2>
          <ul className="mt-2 flex flex-col gap-1 text-xs">
            {problems.map((p) => (
              <li key={p.id}>
                {p.failedAt ? 'Given up' : 'Retrying'} after {p.attempts} tries: “{p.subject}” to {p.to}
                {p.lastError ? ` — ${p.lastError}` : ''}
              </li>
            ))}
          </ul>
        </section>
      )}
      <h1 className="h1">Local mailbox</h1>
      <p className="text-ink/70">Messages the local fake SMTP server received. Nothing here left this machine.</p>
      {mails.length === 0 && <p className="panel p-4 text-ink/60">No mail caught yet.</p>}
      {mails.map((m) => (
        <article key={m.id} className="panel p-4">
          <div className="flex flex-wrap justify-between gap-2 text-xs text-ink/60">
            <span>To: {m.to.join(', ')}</span>
            <time>{m.receivedAt.replace('T', ' ').slice(0, 19)} UTC</time>
          </div>
          <h2 className="mt-1 font-semibold">{m.subject}</h2>
          <pre className="mt-2 font-sans text-sm whitespace-pre-wrap">{m.text}</pre>
        </article>
      ))}
    </div>
  )
}
