'use client'

import { useActionState } from 'react'
import { Field, FormMessage, SubmitButton } from '@/app/_components/form'
import { resetPasswordAction } from '../../actions'

export function NewPasswordForm({ token }: { token: string }) {
  const [state, action] = useActionState(resetPasswordAction, {})
  return (
    <form action={action} className="flex flex-col gap-4" noValidate>
      <h1 className="h1">Choose a new password</h1>
      <FormMessage state={state} />
      <input type="hidden" name="token" value={token} />
      <Field name="password" label="New password" type="password" autoComplete="new-password" state={state} hint="At least 10 characters." />
      <Field name="confirm" label="New password again" type="password" autoComplete="new-password" state={state} />
      <SubmitButton>Save password and sign in</SubmitButton>
    </form>
  )
}
