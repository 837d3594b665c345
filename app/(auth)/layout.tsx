import type { ReactNode } from 'react'
import { Wordmark } from '@/app/_components/wordmark'

export default function AuthLayout({ children }: { children: ReactNode }) {
  return (
    <main className="mx-auto flex max-w-sm flex-col gap-6 px-4 pt-20 pb-10">
      <Wordmark />
      <div className="panel p-6">{children}</div>
    </main>
  )
}
