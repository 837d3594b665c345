import Link from 'next/link'

/** Inverso's mark: a point and its inverse on one ray through a circle. */
export function Wordmark({ href = '/projects' }: { href?: string }) {
  return (
    <Link href={href} className="flex items-center gap-2 text-ink no-underline">
      <svg width="26" height="26" viewBox="0 0 26 26" aria-hidden="true">
        <circle cx="9" cy="13" r="7.5" fill="none" stroke="currentColor" strokeWidth="1.6" />
        <line x1="1.5" y1="13" x2="25" y2="13" stroke="#0f5e63" strokeWidth="1.6" />
        <circle cx="13" cy="13" r="1.9" fill="#0f5e63" />
        <circle cx="23" cy="13" r="1.9" fill="#0f5e63" />
      </svg>
      <span className="text-lg font-bold tracking-tight">Inverso</span>
    </Link>
  )
}
