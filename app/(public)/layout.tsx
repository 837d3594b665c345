import type { ReactNode } from 'react'
import Link from 'next/link'
import { Wordmark } from '@/app/_components/wordmark'

/** Pages anyone may open without signing in: verifying a package, the server's signing key. */
export default function PublicLayout({ children }: { children: ReactNode }) {
  return (
    <>
      <header className="flex items-center gap-6 border-b border-rule bg-white px-6 py-2.5">
        <Wordmark />
        <nav className="flex gap-4 text-sm">
          <Link href="/verify" className="hover:text-accent">
            Verify a package
          </Link>
          <Link href="/about" className="hover:text-accent">
            About signatures
          </Link>
          <Link href="/sign-in" className="hover:text-accent">
            Sign in
          </Link>
        </nav>
      </header>
      <main className="mx-auto max-w-3xl px-6 py-6">{children}</main>
    </>
  )
}
