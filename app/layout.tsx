import type { Metadata } from 'next'
import { connection } from 'next/server'
import type { ReactNode } from 'react'
import { SkipLink } from '@/app/_components/skip-link'
import { GENERAL_CAUTION } from '@/lib/cautions'
import { notoMono, notoSans } from './fonts'
import './globals.css'

export const metadata: Metadata = {
  title: { default: 'Inverso', template: '%s · Inverso' },
  description: 'Straight-line linkage calculations, checked and signed.',
  icons: { icon: [{ url: '/favicon.svg', type: 'image/svg+xml' }] },
}

export default async function RootLayout({ children }: { children: ReactNode }) {
  // Rendered per request, so Next can put this request's CSP nonce (proxy.ts) on its scripts.
  await connection()
  return (
    <html lang="en" className={`${notoSans.variable} ${notoMono.variable}`}>
      <body className="flex min-h-screen flex-col font-sans text-sm antialiased">
        <SkipLink />
        <div className="flex-1">{children}</div>
        <footer className="border-t border-rule bg-caution-soft px-6 py-2 text-xs text-caution" data-testid="caution">
          <strong>Caution.</strong> {GENERAL_CAUTION}
        </footer>
      </body>
    </html>
  )
}
