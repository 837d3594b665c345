import type { Metadata } from 'next'
import { notFound } from 'next/navigation'
import { requirePageUser } from '@/app/_lib/session'
import { AppError } from '@/lib/errors'
import { caughtMail } from '@/server/mail-inbox'

export const metadata: Metadata = { title: 'Caught mail' }
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
  return (
    <div className="flex flex-col gap-4">
      <h1 className="h1">Caught mail</h1>
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
