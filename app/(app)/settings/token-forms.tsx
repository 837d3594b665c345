'use client'

import { useActionState } from 'react'
import { Field, FormMessage, SubmitButton } from '@/app/_components/form'
import { createTokenAction, revokeTokenAction } from './actions'

export function CreateTokenForm() {
  const [state, action] = useActionState(createTokenAction, {})
  const token = state.data?.token as string | undefined
  return (
    <form action={action} className="panel flex flex-col gap-3 p-4" noValidate>
      <h2 className="h2">New API token</h2>
      <FormMessage state={state} />
      {token && (
        <p className="break-all rounded border border-accent bg-accent-soft p-2 font-mono text-sm" data-testid="new-token">
          {token}
        </p>
      )}
      <div className="grid gap-3 md:grid-cols-[1fr_auto] md:items-start">
        <Field name="name" label="Name (what the token is for)" placeholder="nightly register export" state={state} />
        <div className="md:pt-5">
          <SubmitButton>Create token</SubmitButton>
        </div>
      </div>
    </form>
  )
}

export function RevokeTokenForm({ tokenId, name }: { tokenId: string; name: string }) {
  const [state, action] = useActionState(revokeTokenAction, {})
  return (
    <form action={action}>
      <input type="hidden" name="tokenId" value={tokenId} />
      <button type="submit" className="btn-quiet" aria-label={`Revoke ${name}`}>
        Revoke
      </button>
      {state.message && !state.ok && <span className="ml-2 text-xs text-fail">{state.message}</span>}
    </form>
  )
}
