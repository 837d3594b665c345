'use client'

import Link from 'next/link'
import { useActionState } from 'react'
import { mutate } from 'swr'
import { Field, FormMessage, SelectField, SubmitButton } from '@/app/_components/form'
import { mechanisms } from '@/lib/mechanisms'
import { createCalcAction } from './actions'

const TYPE_OPTIONS = mechanisms().map((m) => ({ value: m.id, label: m.label }))

export function CreateCalcForm({ projectId }: { projectId: string }) {
  const [state, action] = useActionState(async (prev: Parameters<typeof createCalcAction>[0], fd: FormData) => {
    const next = await createCalcAction(prev, fd)
    if (next.ok) await mutate(`/api/projects/${projectId}/calcs`)
    return next
  }, {})
  return (
    <form action={action} className="panel flex flex-col gap-3 p-4" noValidate data-testid="create-calc">
      <h2 className="h2">New calc</h2>
      <FormMessage state={state} />
      {state.redirectTo && (
        <Link href={state.redirectTo} className="text-accent underline">
          Open the new calc
        </Link>
      )}
      <input type="hidden" name="projectId" value={projectId} />
      <div className="grid gap-3 md:grid-cols-[10rem_1fr_16rem_auto] md:items-start">
        <Field name="number" label="Number" placeholder="LC-004" state={state} />
        <Field name="title" label="Title" state={state} />
        <SelectField name="calcType" label="Mechanism" options={TYPE_OPTIONS} state={state} />
        <div className="md:pt-5">
          <SubmitButton>Create draft</SubmitButton>
        </div>
      </div>
    </form>
  )
}
