'use client'

import { useState, useTransition, type FormEvent, type InputHTMLAttributes } from 'react'
import type { Verification } from '@/server/verify'

type Field = 'file' | 'code'

/** One way in (a file or a code): its label, its input, its message at the field and its button. */
function VerifyBy(props: { field: Field; label: string; button: string; pending: boolean; error: string; onSubmit: (form: HTMLFormElement) => void; input: InputHTMLAttributes<HTMLInputElement> }) {
  const id = `verify-${props.field}`
  const submit = (e: FormEvent<HTMLFormElement>) => {
    e.preventDefault()
    props.onSubmit(e.currentTarget)
  }
  return (
    <form className="panel flex flex-col gap-2 p-4" onSubmit={submit}>
      <label htmlFor={id} className="label">
        {props.label}
      </label>
      <input id={id} name={props.field} aria-describedby={`${id}-error`} {...props.input} className={`field ${props.input.className ?? ''}`} />
      <p id={`${id}-error`} className="field-error" aria-live="polite">
        {props.error}
      </p>
      <div>
        <button className="btn" disabled={props.pending}>
          {props.pending ? 'Checking…' : props.button}
        </button>
      </div>
    </form>
  )
}

/** Calls the public API (POST /api/v1/verify) with a file or a code and shows the verdict in plain words. */
export function VerifyForm() {
  const [verdict, setVerdict] = useState<Verification | null>(null)
  const [error, setError] = useState<{ field: Field; message: string } | null>(null)
  const [pending, start] = useTransition()

  const send = (field: Field, init: RequestInit) =>
    start(async () => {
      setVerdict(null)
      setError(null)
      const res = await fetch('/api/v1/verify', { method: 'POST', ...init })
      const body = await res.json().catch(() => null)
      if (!res.ok) setError({ field, message: body?.error?.fields?.[field] ?? body?.error?.message ?? `The server answered ${res.status}.` })
      else setVerdict(body as Verification)
    })
  const errorAt = (field: Field) => (error?.field === field ? error.message : '')

  const good = verdict?.issued && verdict.signatureValid && !verdict.superseded && !verdict.voided
  return (
    <div className="flex flex-col gap-4">
      <VerifyBy
        field="file"
        label="The PDF package"
        button="Verify the file"
        pending={pending}
        error={errorAt('file')}
        input={{ type: 'file', accept: 'application/pdf' }}
        onSubmit={(form) => {
          const fd = new FormData(form)
          const file = fd.get('file')
          if (!(file instanceof File) || file.size === 0) return setError({ field: 'file', message: 'Choose the PDF to verify.' })
          send('file', { body: fd })
        }}
      />
      <VerifyBy
        field="code"
        label="Or the verification code"
        button="Verify the code"
        pending={pending}
        error={errorAt('code')}
        input={{ className: 'font-mono uppercase', placeholder: '7K2QD-M9XWA', autoComplete: 'off' }}
        onSubmit={(form) => {
          const code = String(new FormData(form).get('code') ?? '')
          send('code', { headers: { 'Content-Type': 'application/json' }, body: JSON.stringify({ code }) })
        }}
      />
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
