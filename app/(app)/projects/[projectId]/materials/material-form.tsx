'use client'

import { useActionState } from 'react'
import { Field, FormMessage, SelectField, SubmitButton } from '@/app/_components/form'
import { addMaterialAction } from './actions'

const KINDS = [
  { value: 'steel', label: 'Steel' },
  { value: 'aluminium', label: 'Aluminium (allowable stress basis only)' },
] as const

export function MaterialForm({ projectId }: { projectId: string }) {
  const [state, action] = useActionState(addMaterialAction, {})
  return (
    <form action={action} className="panel flex flex-col gap-3 p-4" noValidate data-testid="material-form">
      <h2 className="h2">Add a project material</h2>
      <FormMessage state={state} />
      <input type="hidden" name="projectId" value={projectId} />
      <div className="grid gap-3 md:grid-cols-3">
        <Field name="name" label="Name" placeholder="S460M bar" state={state} />
        <SelectField name="kind" label="Kind" options={KINDS} state={state} />
        <Field name="E" label="E [MPa]" type="number" step="any" defaultValue="210000" state={state} />
        <Field name="fy" label="fy [MPa]" type="number" step="any" state={state} />
        <Field name="fu" label="fu [MPa]" type="number" step="any" state={state} />
        <Field name="density" label="Density [kg/m³]" type="number" step="any" state={state} />
      </div>
      <Field name="source" label="Source of the values" placeholder="Mill certificate 3.1 no. …, or standard and table" state={state} hint="Required: every value in a calc package must be traceable." />
      <div>
        <SubmitButton>Add material</SubmitButton>
      </div>
    </form>
  )
}
