'use client'

import { useActionState } from 'react'
import { Field, FieldError, FormMessage, SelectField, SubmitButton } from '@/app/_components/form'
import { addRemarkAction, closeRemarkAction, respondRemarkAction } from './actions'

export interface RemarkRow {
  id: string
  stepId: string
  stepNumber: number | null
  text: string
  status: 'open' | 'answered' | 'closed'
  response: string | null
  author: string
}

interface RemarksPanelProps {
  projectId: string
  calcId: string
  revisionId: string
  revisionLabel: string
  steps: { id: string; number: number; title: string }[]
  remarks: RemarkRow[]
  canRemark: boolean
  canRespond: boolean
}

const STATUS_STYLE = { open: 'text-fail', answered: 'text-caution', closed: 'text-pass' } as const

function RespondForm({ projectId, calcId, remarkId }: { projectId: string; calcId: string; remarkId: string }) {
  const [state, action] = useActionState(respondRemarkAction, {})
  return (
    <form action={action} className="mt-1 flex flex-col gap-1">
      <input type="hidden" name="projectId" value={projectId} />
      <input type="hidden" name="calcId" value={calcId} />
      <input type="hidden" name="remarkId" value={remarkId} />
      <Field name="response" label="Response" state={state} />
      <div>
        <SubmitButton quiet>Answer</SubmitButton>
      </div>
    </form>
  )
}

function CloseForm({ projectId, calcId, remarkId }: { projectId: string; calcId: string; remarkId: string }) {
  const [state, action] = useActionState(closeRemarkAction, {})
  return (
    <form action={action}>
      <input type="hidden" name="projectId" value={projectId} />
      <input type="hidden" name="calcId" value={calcId} />
      <input type="hidden" name="remarkId" value={remarkId} />
      <FormMessage state={state} />
      <SubmitButton quiet>Close remark</SubmitButton>
    </form>
  )
}

/** Checker remarks on the shown revision, each tied to a step (its number here, its id for later revisions). */
export function RemarksPanel(props: RemarksPanelProps) {
  const { projectId, calcId, revisionId, steps, remarks } = props
  const [state, action] = useActionState(addRemarkAction, {})
  return (
    <section className="panel flex flex-col gap-3 p-4" data-testid="remarks">
      <h2 className="h2">Remarks on Rev {props.revisionLabel}</h2>
      {remarks.length === 0 && <p className="text-xs text-ink/60">No remarks.</p>}
      <ol className="flex flex-col gap-2">
        {remarks.map((r) => (
          <li key={r.id} className="rounded border border-rule p-2 text-xs">
            <div className="flex justify-between gap-2">
              <a href={`#step-${r.stepId}`} className="font-mono text-accent underline">
                {r.stepNumber ? `Step ${r.stepNumber}` : r.stepId}
              </a>
              <span className={`font-semibold uppercase ${STATUS_STYLE[r.status]}`}>{r.status}</span>
            </div>
            <p className="mt-1">
              {r.text} <span className="text-ink/50">— {r.author}</span>
            </p>
            {r.response && <p className="mt-1 border-l-2 border-accent pl-2">{r.response}</p>}
            {props.canRespond && r.status !== 'closed' && <RespondForm projectId={projectId} calcId={calcId} remarkId={r.id} />}
            {props.canRemark && r.status === 'answered' && <CloseForm projectId={projectId} calcId={calcId} remarkId={r.id} />}
          </li>
        ))}
      </ol>
      {props.canRemark && (
        <form action={action} className="flex flex-col gap-2 border-t border-rule pt-3" noValidate>
          <FormMessage state={state} />
          <input type="hidden" name="projectId" value={projectId} />
          <input type="hidden" name="calcId" value={calcId} />
          <input type="hidden" name="revisionId" value={revisionId} />
          <SelectField
            name="stepId"
            label="Step"
            state={state}
            defaultValue=""
            options={[{ value: '', label: 'Choose a step…' }, ...steps.map((s) => ({ value: s.id, label: `${s.number}. ${s.title}` }))]}
          />
          <label htmlFor="f-text" className="label">
            Remark
          </label>
          <textarea id="f-text" name="text" rows={3} className="field" defaultValue={state.values?.text} aria-invalid={state.fieldErrors?.text ? true : undefined} />
          <FieldError id="f-text-error" message={state.fieldErrors?.text} />
          <div>
            <SubmitButton>Add remark</SubmitButton>
          </div>
        </form>
      )}
    </section>
  )
}
