'use client'

import { useRouter } from 'next/navigation'
import { useActionState, useEffect, useState } from 'react'
import { mutate } from 'swr'
import { Field, FieldError, FormMessage, SelectField, SubmitButton } from '@/app/_components/form'
import { mechanisms } from '@/lib/mechanisms'
import { createCalcAction, importCalcAction } from './actions'

const TYPE_OPTIONS = mechanisms().map((m) => ({ value: m.id, label: m.label }))

/** A new calc starts saved with its mechanism's feasible defaults and opens at once. */
export function CreateCalcForm({ projectId, proposedNumber }: { projectId: string; proposedNumber: string }) {
  const router = useRouter()
  const [state, action] = useActionState(createCalcAction, {})
  useEffect(() => {
    if (state.ok && state.redirectTo) {
      mutate(`/api/v1/projects/${projectId}/calcs`)
      router.push(state.redirectTo)
    }
  }, [state, projectId, router])
  return (
    <form action={action} className="panel flex flex-col gap-3 p-4" noValidate data-testid="create-calc" aria-labelledby="new-calc-title">
      <h2 id="new-calc-title" className="h2">
        New calc
      </h2>
      <FormMessage state={state} />
      <input type="hidden" name="projectId" value={projectId} />
      <div className="grid gap-3 md:grid-cols-[10rem_1fr_16rem_auto] md:items-start">
        <Field name="number" label="Number" defaultValue={proposedNumber} hint="the next free number" state={state} />
        <Field name="title" label="Title" state={state} />
        <SelectField name="calcType" label="Mechanism" options={TYPE_OPTIONS} state={state} />
        <div className="md:pt-5">
          <SubmitButton>Create and open</SubmitButton>
        </div>
      </div>
    </form>
  )
}

/** A calc input file (an exported calc, or the CLI's JSON) made into a new calc; errors name the file's fields. */
export function ImportCalcForm({ projectId }: { projectId: string }) {
  const router = useRouter()
  const [state, action] = useActionState(importCalcAction, {})
  const [text, setText] = useState('')
  const [fileName, setFileName] = useState('')
  useEffect(() => {
    if (state.ok && state.redirectTo) router.push(state.redirectTo)
  }, [state, router])
  const fileErrors = (state.data?.fileErrors as Record<string, string> | undefined) ?? {}
  return (
    <form action={action} className="panel flex flex-col gap-3 p-4" noValidate data-testid="import-calc" aria-labelledby="import-calc-title">
      <h2 id="import-calc-title" className="h2">
        Import a calc file
      </h2>
      <p className="text-xs text-ink/80">A file exported from a calc (Export inputs), or a calc input for the command line (npm run calc). The mechanism comes from the file.</p>
      <FormMessage state={state} />
      {Object.keys(fileErrors).length > 0 && (
        <ul className="rounded bg-fail-soft px-3 py-2 text-xs text-fail" data-testid="import-errors">
          {Object.entries(fileErrors).map(([path, message]) => (
            <li key={path}>
              <span className="font-mono">{path}</span>: {message}
            </li>
          ))}
        </ul>
      )}
      <input type="hidden" name="projectId" value={projectId} />
      <input type="hidden" name="inputs" value={text} />
      <div className="grid gap-3 md:grid-cols-[1fr_10rem_1fr_auto] md:items-start">
        <div>
          <label htmlFor="f-import-file" className="label">
            Calc file (JSON)
          </label>
          <input
            id="f-import-file"
            type="file"
            accept="application/json,.json"
            className="text-xs"
            aria-describedby="f-import-file-error"
            onChange={async (e) => {
              const f = e.target.files?.[0]
              setFileName(f?.name ?? '')
              setText(f ? await f.text() : '')
            }}
          />
          <FieldError id="f-import-file-error" message={state.fieldErrors?.file ?? state.fieldErrors?.inputs} />
        </div>
        <div>
          <label htmlFor="f-import-number" className="label">
            Number (optional)
          </label>
          <input id="f-import-number" name="number" className="field" placeholder="next free" aria-invalid={state.fieldErrors?.number ? true : undefined} aria-describedby="f-import-number-error" />
          <FieldError id="f-import-number-error" message={state.fieldErrors?.number} />
        </div>
        <div>
          <label htmlFor="f-import-title" className="label">
            Title
          </label>
          <input id="f-import-title" name="title" className="field" key={fileName} defaultValue={state.values?.title ?? fileName.replace(/\.json$/i, '')} aria-invalid={state.fieldErrors?.title ? true : undefined} aria-describedby="f-import-title-error" />
          <FieldError id="f-import-title-error" message={state.fieldErrors?.title} />
        </div>
        <div className="md:pt-5">
          <SubmitButton quiet>Import and open</SubmitButton>
        </div>
      </div>
    </form>
  )
}
