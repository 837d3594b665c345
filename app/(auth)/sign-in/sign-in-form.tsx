'use client'

import Link from 'next/link'
import { useActionState } from 'react'
import { Field, FormMessage, SubmitButton } from '@/app/_components/form'
import { signInAction } from '../actions'

export function SignInForm({ notice }: { notice?: string }) {
  const [state, action] = useActionState(signInAction, {})
  return (
    <form action={action} className="flex flex-col gap-4" noValidate>
      <h1 className="h1">Sign in</h1>
      {notice && !state.message && !state.fieldErrors && (
        <p role="status" className="rounded bg-accent/10 px-3 py-2 text-sm">
          {notice}
        </p>
      )}
      <FormMessage state={state} />
      <Field name="email" label="E-mail" type="email" autoComplete="email" state={state} required autoFocus />
      <Field name="password" label="Password" type="password" autoComplete="current-password" state={state} required />
      <div className="flex items-center justify-between">
        <SubmitButton>Sign in</SubmitButton>
        <Link href="/reset" className="text-xs text-accent underline">
          Forgot your password?
        </Link>
      </div>
    </form>
  )
}
