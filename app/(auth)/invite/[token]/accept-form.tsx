'use client'

import { useActionState } from 'react'
import { Field, FormMessage, SubmitButton } from '@/app/_components/form'
import { acceptInvitationAction, joinWithInvitationAction } from '../../actions'

export function AcceptForm({ token, email }: { token: string; email: string }) {
  const [state, action] = useActionState(acceptInvitationAction, {})
  return (
    <form action={action} className="flex flex-col gap-4" noValidate>
      <h1 className="h1">Welcome to Inverso</h1>
      <p className="text-ink/70">
        Set up the account for <strong>{email}</strong>.
      </p>
      <FormMessage state={state} />
      <input type="hidden" name="token" value={token} />
      <Field name="name" label="Your name" autoComplete="name" state={state} hint="As it should appear on signed calcs." />
      <Field name="password" label="Password" type="password" autoComplete="new-password" state={state} hint="At least 10 characters." />
      <Field name="confirm" label="Password again" type="password" autoComplete="new-password" state={state} />
      <SubmitButton>Set password and sign in</SubmitButton>
    </form>
  )
}

export function JoinForm({ token, email }: { token: string; email: string }) {
  const [state, action] = useActionState(joinWithInvitationAction, {})
  return (
    <form action={action} className="flex flex-col gap-4" noValidate>
      <h1 className="h1">Join the project</h1>
      <p className="text-ink/70">
        <strong>{email}</strong> already has an Inverso account. Accepting adds the project to it; your name and password stay as they are.
      </p>
      <FormMessage state={state} />
      <input type="hidden" name="token" value={token} />
      <SubmitButton>Add the project, then sign in</SubmitButton>
    </form>
  )
}
