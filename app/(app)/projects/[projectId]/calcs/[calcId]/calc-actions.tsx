'use client'

import { useRouter } from 'next/navigation'
import { useActionState, useEffect } from 'react'
import { SubmitButton } from '@/app/_components/form'
import { cloneCalcAction } from '../../actions'

/** Clone (a new draft with these inputs, opened at once) and export (the CLI's JSON file). */
export function CalcActions({ projectId, calcId, calcNumber, canCreate }: { projectId: string; calcId: string; calcNumber: string; canCreate: boolean }) {
  const router = useRouter()
  const [state, clone] = useActionState(cloneCalcAction, {})
  useEffect(() => {
    if (state.ok && state.redirectTo) router.push(state.redirectTo)
  }, [state, router])
  return (
    <div className="ml-auto flex flex-wrap items-center gap-2">
      <a className="btn-quiet" href={`/api/v1/projects/${projectId}/calcs/${calcId}/export`} download={`${calcNumber}.json`} data-testid="export-calc">
        Export inputs (JSON)
      </a>
      {canCreate && (
        <form action={clone}>
          <input type="hidden" name="projectId" value={projectId} />
          <input type="hidden" name="calcId" value={calcId} />
          <SubmitButton quiet>Clone</SubmitButton>
        </form>
      )}
      {state.message && (
        <p role={state.ok ? 'status' : 'alert'} className={`text-xs ${state.ok ? 'text-accent' : 'text-fail'}`}>
          {state.message}
        </p>
      )}
    </div>
  )
}
