'use client'

import { useActionState } from 'react'
import { Field, FormMessage, SubmitButton } from '@/app/_components/form'
import { createProjectAction } from './actions'

export function CreateProjectForm() {
  const [state, action] = useActionState(createProjectAction, {})
  return (
    <form action={action} className="panel flex flex-col gap-3 p-4" noValidate>
      <h2 className="h2">New project</h2>
      <FormMessage state={state} />
      <div className="grid gap-3 md:grid-cols-[10rem_1fr_1fr_auto] md:items-start">
        <Field name="code" label="Code" placeholder="P-2027-01" state={state} />
        <Field name="name" label="Name" state={state} />
        <Field name="client" label="Client" state={state} />
        <div className="md:pt-5">
          <SubmitButton>Create project</SubmitButton>
        </div>
      </div>
    </form>
  )
}
