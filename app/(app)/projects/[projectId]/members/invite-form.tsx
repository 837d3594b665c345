'use client'

import { useActionState } from 'react'
import { Field, FormMessage, SelectField, SubmitButton } from '@/app/_components/form'
import { PROJECT_ROLES, ROLE_LABELS } from '@/lib/review/roles'
import { inviteMemberAction } from '../actions'

const ROLE_OPTIONS = PROJECT_ROLES.map((r) => ({ value: r, label: ROLE_LABELS[r] }))

export function InviteForm({ projectId }: { projectId: string }) {
  const [state, action] = useActionState(inviteMemberAction, {})
  return (
    <form action={action} className="panel flex flex-col gap-3 p-4" noValidate data-testid="invite">
      <h2 className="h2">Invite someone</h2>
      <FormMessage state={state} />
      <input type="hidden" name="projectId" value={projectId} />
      <div className="grid gap-3 md:grid-cols-[1fr_14rem_auto] md:items-start">
        <Field name="email" label="E-mail" type="email" state={state} />
        <SelectField name="role" label="Role" options={ROLE_OPTIONS} state={state} />
        <div className="md:pt-5">
          <SubmitButton>Send invitation</SubmitButton>
        </div>
      </div>
    </form>
  )
}
