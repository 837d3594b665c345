import type { Metadata } from 'next'
import Link from 'next/link'
import { requirePageUser } from '@/app/_lib/session'
import { listNotices, markNoticesRead } from '@/server/notices'
import { todoFor } from '@/server/todo'

export const metadata: Metadata = { title: 'Waiting for you' }
export const dynamic = 'force-dynamic'

/** After sign-in: what waits for this person across their projects, and the notices they were sent. */
export default async function TodoPage() {
  const user = await requirePageUser()
  const [items, notices] = await Promise.all([todoFor(user), listNotices(user, 30)])
  await markNoticesRead(user)
  return (
    <div className="flex max-w-4xl flex-col gap-6">
      <h1 className="h1">Waiting for you</h1>
      <section className="flex flex-col gap-2" aria-labelledby="todo-h">
        <h2 id="todo-h" className="h2">
          To do ({items.length})
        </h2>
        {items.length === 0 ? (
          <p className="panel p-4 text-ink/70">Nothing waits for you. New work arrives here and by mail.</p>
        ) : (
          <ul className="panel divide-y divide-rule" data-testid="todo">
            {items.map((t, i) => (
              <li key={i} className="flex flex-wrap items-baseline gap-x-3 gap-y-1 px-4 py-2">
                <span className="w-40 font-semibold">
                  {t.count ? `${t.count} ` : ''}
                  {t.label}
                </span>
                <Link href={t.link} className="text-accent underline">
                  {t.calc} · rev {t.revision}
                </Link>
                <span className="ml-auto font-mono text-xs text-ink/70">{t.project}</span>
              </li>
            ))}
          </ul>
        )}
      </section>
      <section className="flex flex-col gap-2" aria-labelledby="notices-h">
        <h2 id="notices-h" className="h2">
          Notices
        </h2>
        {notices.length === 0 ? (
          <p className="panel p-4 text-ink/70">No notices yet.</p>
        ) : (
          <ul className="panel divide-y divide-rule" data-testid="notices">
            {notices.map((n) => (
              <li key={n.id} className="flex flex-wrap items-baseline gap-3 px-4 py-2">
                <time className="w-36 font-mono text-xs text-ink/70">{n.createdAt.toISOString().slice(0, 16).replace('T', ' ')}</time>
                <Link href={n.link} className={`underline ${n.readAt ? 'text-ink' : 'font-semibold text-accent'}`}>
                  {n.text}
                </Link>
              </li>
            ))}
          </ul>
        )}
      </section>
    </div>
  )
}
