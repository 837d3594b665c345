'use client'

import { useState, useTransition } from 'react'

interface Verdict {
  issued: boolean
  signatureValid: boolean
  superseded: boolean
  voided: boolean
  project: string | null
  calc: string | null
  revision: string | null
  issuedAt: string | null
  message: string
}

/** Calls the public API (POST /api/v1/verify) with a file or a code and shows the verdict in plain words. */
export function VerifyForm() {
  const [verdict, setVerdict] = useState<Verdict | null>(null)
  const [error, setError] = useState<{ field: 'file' | 'code'; message: string } | null>(null)
  const [pending, start] = useTransition()

  const send = (field: 'file' | 'code', init: RequestInit) =>
    start(async () => {
      setVerdict(null)
      setError(null)
      const res = await fetch('/api/v1/verify', { method: 'POST', ...init })
      const body = await res.json().catch(() => null)
      if (!res.ok) setError({ field, message: body?.error?.fields?.[field] ?? body?.error?.message ?? `The server answered ${res.status}.` })
      else setVerdict(body as Verdict)
    })

  const good = verdict?.issued && verdict.signatureValid && !verdict.superseded && !verdict.voided
  return (
    <div className="flex flex-col gap-4">
      <form
        className="panel flex flex-col gap-2 p-4"
        onSubmit={(e) => {
          e.preventDefault()
          const fd = new FormData(e.currentTarget)
          const file = fd.get('file')
          if (!(file instanceof File) || file.size === 0) return setError({ field: 'file', message: 'Choose the PDF to verify.' })
          send('file', { body: fd })
        }}
      >
        <label htmlFor="verify-file" className="label">
          The PDF package
        </label>
        <input id="verify-file" name="file" type="file" accept="application/pdf" className="field" aria-describedby="verify-file-error" />
        <p id="verify-file-error" className="field-error" aria-live="polite">
          {error?.field === 'file' ? error.message : ''}
        </p>
        <div>
          <button className="btn" disabled={pending}>
            {pending ? 'Checking…' : 'Verify the file'}
          </button>
        </div>
      </form>
      <form
        className="panel flex flex-col gap-2 p-4"
        onSubmit={(e) => {
          e.preventDefault()
          const code = String(new FormData(e.currentTarget).get('code') ?? '')
          send('code', { headers: { 'Content-Type': 'application/json' }, body: JSON.stringify({ code }) })
        }}
      >
        <label htmlFor="verify-code" className="label">
          Or the verification code
        </label>
        <input id="verify-code" name="code" className="field font-mono uppercase" placeholder="7K2QD-M9XWA" autoComplete="off" aria-describedby="verify-code-error" />
        <p id="verify-code-error" className="field-error" aria-live="polite">
          {error?.field === 'code' ? error.message : ''}
        </p>
        <div>
          <button className="btn" disabled={pending}>
            {pending ? 'Checking…' : 'Verify the code'}
          </button>
        </div>
      </form>
      {verdict && (
        <section role="status" className={`rounded border p-4 ${good ? 'border-pass bg-white' : 'border-fail bg-fail-soft'}`} data-testid="verdict">
          <p className={`text-base font-semibold ${good ? 'text-pass' : 'text-fail'}`}>{verdict.message}</p>
          {verdict.issued && (
            <dl className="mt-2 grid grid-cols-[10rem_1fr] gap-x-3 gap-y-1 text-sm">
              <dt className="text-ink/70">Project</dt>
              <dd>{verdict.project}</dd>
              <dt className="text-ink/70">Calc</dt>
              <dd>{verdict.calc}</dd>
              <dt className="text-ink/70">Revision</dt>
              <dd>{verdict.revision}</dd>
              <dt className="text-ink/70">Issued</dt>
              <dd>{verdict.issuedAt?.slice(0, 10)}</dd>
              <dt className="text-ink/70">Signature</dt>
              <dd>{verdict.signatureValid ? 'verifies' : 'DOES NOT VERIFY'}</dd>
              <dt className="text-ink/70">Still current</dt>
              <dd>{verdict.voided ? 'no — voided' : verdict.superseded ? 'no — superseded' : 'yes'}</dd>
            </dl>
          )}
        </section>
      )}
    </div>
  )
}
