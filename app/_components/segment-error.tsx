'use client'

import { useEffect } from 'react'

/** Shared body of the error.tsx files: says what happened and offers a retry. */
export function SegmentError({ error, reset, what }: { error: Error & { digest?: string }; reset: () => void; what: string }) {
  useEffect(() => console.error(error), [error])
  return (
    <div role="alert" className="panel mx-auto mt-10 max-w-lg p-6">
      <h2 className="h1">Could not load {what}</h2>
      <p className="mt-2 text-ink/70">Nothing you saved was lost. Try again; if it keeps failing, give an administrator this reference: {error.digest ?? 'n/a'}.</p>
      <button type="button" className="btn mt-4" onClick={reset}>
        Try again
      </button>
    </div>
  )
}
