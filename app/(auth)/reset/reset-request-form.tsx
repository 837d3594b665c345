'use client'

import Link from 'next/link'
import { useActionState } from 'react'
import { Field, FormMessage, SubmitButton } from '@/app/_components/form'
import { requestResetAction } from '../actions'

export function ResetRequestForm() {
  const [state, action] = useActionState(requestResetAction, {})
  return (
    <form action={action} className="flex flex-col gap-4" noValidate>
      <h1 className="h1">Reset your password</h1>
      <FormMessage state={state} />
      <Field name="email" label="E-mail" type="email" autoComplete="email" state={state} />
      <div className="flex items-center justify-between">
        <SubmitButton>Send reset link</SubmitButton>
        <Link href="/sign-in" className="text-xs text-accent underline">
          Back to sign-in
        </Link>
      </div>
    </form>
  )
}
