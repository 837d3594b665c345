'use client'

import { useActionState } from 'react'
import { FieldError, FormMessage, SubmitButton } from '@/app/_components/form'
import { addAttachmentAction } from './actions'

/** Appendices: PDFs that the next saved revision appends to its package. */
export function AttachmentsForm({ projectId, calcId, pending }: { projectId: string; calcId: string; pending: { id: string; name: string; size: number }[] }) {
  const [state, action] = useActionState(addAttachmentAction, {})
  return (
    <form action={action} className="panel flex flex-col gap-2 p-4" data-testid="attachments">
      <h2 className="h2">Appendices for the next revision</h2>
      {pending.length > 0 ? (
        <ul className="text-xs">
          {pending.map((a) => (
            <li key={a.id}>
              {a.name} <span className="text-ink/80">({Math.ceil(a.size / 1024)} kB)</span>
            </li>
          ))}
        </ul>
      ) : (
        <p className="text-xs text-ink/80">None. Data sheets or test reports (PDF) added here are appended to the package.</p>
      )}
      <FormMessage state={state} />
      <input type="hidden" name="projectId" value={projectId} />
      <input type="hidden" name="calcId" value={calcId} />
      <label htmlFor="f-file" className="sr-only">
        PDF to append
      </label>
      <input id="f-file" name="file" type="file" accept="application/pdf" className="text-xs" aria-invalid={state.fieldErrors?.file ? true : undefined} />
      <FieldError id="f-file-error" message={state.fieldErrors?.file} />
      <div>
        <SubmitButton quiet>Add appendix</SubmitButton>
      </div>
    </form>
  )
}
