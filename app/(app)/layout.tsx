import type { ReactNode } from 'react'
import Link from 'next/link'
import { signOutAction } from '@/app/(auth)/actions'
import { Wordmark } from '@/app/_components/wordmark'
import { requirePageUser } from '@/app/_lib/session'
import { mailInboxEnabled } from '@/lib/mail/inbox'
import { todoFor, unreadNoticeCount } from '@/server/todo'

/** The signed-in shell; its gate sends visitors without a session to sign-in. */
export default async function AppLayout({ children }: { children: ReactNode }) {
  const user = await requirePageUser()
  const [todo, unread] = await Promise.all([todoFor(user), unreadNoticeCount(user)])
  return (
    <>
      <header className="flex items-center gap-6 border-b border-rule bg-white px-6 py-2.5">
        <Wordmark />
        <nav className="flex gap-4 text-sm">
          <Link href="/todo" className="hover:text-accent" data-testid="nav-todo">
            Waiting for you
            {todo.length > 0 && <span className="ml-1 rounded-full bg-accent px-1.5 text-xs font-semibold text-white">{todo.length}</span>}
            {unread > 0 && <span className="ml-1 text-xs text-ink/70">({unread} new)</span>}
          </Link>
          <Link href="/projects" className="hover:text-accent">
            Projects
          </Link>
          {user.isAdmin && mailInboxEnabled() && (
            <Link href="/admin/mail" className="hover:text-accent">
              Local mailbox
            </Link>
          )}
        </nav>
        <div className="ml-auto flex items-center gap-3 text-sm">
          <Link href="/settings" className="hover:text-accent">
            Settings
          </Link>
          <span data-testid="current-user">
            {user.name}
            {user.isAdmin && <span className="ml-1.5 rounded bg-ink px-1.5 py-0.5 text-[10px] font-semibold text-white uppercase">admin</span>}
          </span>
          <form action={signOutAction}>
            <button type="submit" className="btn-quiet">
              Sign out
            </button>
          </form>
        </div>
      </header>
      <main className="mx-auto max-w-7xl px-6 py-6">{children}</main>
    </>
  )
}
