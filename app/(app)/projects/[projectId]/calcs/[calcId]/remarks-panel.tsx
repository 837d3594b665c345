'use client'

import { useActionState, useId } from 'react'
import { FieldError, FormMessage, SubmitButton } from '@/app/_components/form'
import { REMARK_SEVERITIES, SEVERITY_LABELS } from '@/lib/review/workflow'
import { addRemarkAction, closeRemarkAction, replyRemarkAction } from './actions'
import type { StepRemark } from './package-view'
import { useReview } from './review-context'

export interface RemarkRow extends StepRemark {
  /** The step's number in this package, or null for the whole calc or an anchor the package lacks. */
  stepNumber: number | null
  stepTitle: string | null
  carried: boolean
}

interface RemarksPanelProps {
  projectId: string
  calcId: string
  revisionId: string
  revisionLabel: string
  remarks: RemarkRow[]
  canRemark: boolean
  canReply: boolean
  canClose: boolean
}

const STATUS_STYLE = { open: 'text-fail', answered: 'text-caution', closed: 'text-pass' } as const

function Hidden({ fields }: { fields: Record<string, string> }) {
  return Object.entries(fields).map(([k, v]) => <input key={k} type="hidden" name={k} value={v} />)
}

function ReplyForm({ projectId, calcId, remarkId }: { projectId: string; calcId: string; remarkId: string }) {
  const [state, action] = useActionState(replyRemarkAction, {})
  const id = useId()
  return (
    <form action={action} className="mt-1 flex flex-col gap-1">
      <Hidden fields={{ projectId, calcId, remarkId }} />
      <label htmlFor={`${id}-text`} className="label">
        Reply
      </label>
      <textarea id={`${id}-text`} name="text" rows={2} className="field" defaultValue={state.ok ? '' : state.values?.text} aria-invalid={state.fieldErrors?.text ? true : undefined} />
      <FieldError message={state.fieldErrors?.text} />
      <FormMessage state={state} />
      <div>
        <SubmitButton quiet>Reply</SubmitButton>
      </div>
    </form>
  )
}

function CloseForm({ projectId, calcId, remarkId }: { projectId: string; calcId: string; remarkId: string }) {
  const [state, action] = useActionState(closeRemarkAction, {})
  return (
    <form action={action}>
      <Hidden fields={{ projectId, calcId, remarkId }} />
      <FormMessage state={state} />
      <SubmitButton quiet>Close remark</SubmitButton>
    </form>
  )
}

function NewRemarkForm({ projectId, calcId, revisionId }: { projectId: string; calcId: string; revisionId: string }) {
  const [state, action] = useActionState(addRemarkAction, {})
  const { step, pick } = useReview()
  const id = useId()
  return (
    <form action={action} className="flex flex-col gap-2 border-t border-rule pt-3" noValidate>
      <FormMessage state={state} />
      <Hidden fields={{ projectId, calcId, revisionId, stepId: step?.id ?? '' }} />
      <p className="text-xs">
        On: <strong>{step ? step.label : 'the whole calc'}</strong>{' '}
        {step ? (
          <button type="button" className="text-accent underline" onClick={() => pick(null)}>
            (whole calc instead)
          </button>
        ) : (
          <span className="text-ink/70">— click a step in the package to anchor the remark there</span>
        )}
      </p>
      <FieldError message={state.fieldErrors?.stepId} />
      <label htmlFor={`${id}-severity`} className="label">
        Severity
      </label>
      <select id={`${id}-severity`} name="severity" className="field" defaultValue={state.values?.severity ?? 'must-resolve'}>
        {REMARK_SEVERITIES.map((s) => (
          <option key={s} value={s}>
            {SEVERITY_LABELS[s]}
          </option>
        ))}
      </select>
      <label htmlFor={`${id}-text`} className="label">
        Remark
      </label>
      <textarea id={`${id}-text`} name="text" rows={3} className="field" defaultValue={state.ok ? '' : state.values?.text} aria-invalid={state.fieldErrors?.text ? true : undefined} />
      <FieldError message={state.fieldErrors?.text} />
      <div>
        <SubmitButton>Add remark</SubmitButton>
      </div>
    </form>
  )
}

/** Checker remarks on the shown revision with their threads; each anchored to a step id (kept across revisions) or the whole calc. */
export function RemarksPanel(props: RemarksPanelProps) {
  const { projectId, calcId, revisionId, remarks } = props
  return (
    <section className="panel flex flex-col gap-3 p-4" data-testid="remarks">
      <h2 className="h2">Remarks on Rev {props.revisionLabel}</h2>
      {remarks.length === 0 && <p className="text-xs text-ink/70">No remarks.</p>}
      <ol className="flex flex-col gap-2">
        {remarks.map((r) => (
          <li key={r.id} className="rounded border border-rule p-2 text-xs" data-testid="remark">
            <div className="flex flex-wrap justify-between gap-2">
              {r.stepId ? (
                <a href={`#step-${r.stepId}`} className="font-mono text-accent underline">
                  {r.stepNumber ? `Step ${r.stepNumber}` : r.stepId}
                  {r.stepTitle ? ` — ${r.stepTitle}` : ''}
                </a>
              ) : (
                <span className="font-mono">Whole calc</span>
              )}
              <span className={`font-semibold ${STATUS_STYLE[r.status]}`}>
                {SEVERITY_LABELS[r.severity]} · {r.status}
              </span>
            </div>
            <p className="mt-1">
              {r.text} <span className="text-ink/70">— {r.author}</span>
              {r.carried && <span className="ml-1 text-ink/70">(carried over from an earlier revision)</span>}
            </p>
            {r.replies.map((x) => (
              <p key={x.id} className="mt-1 border-l-2 border-accent pl-2">
                {x.text} <span className="text-ink/70">— {x.author}, {x.createdAt.slice(0, 16).replace('T', ' ')}</span>
              </p>
            ))}
            {props.canReply && r.status !== 'closed' && <ReplyForm projectId={projectId} calcId={calcId} remarkId={r.id} />}
            {props.canClose && r.status !== 'closed' && <CloseForm projectId={projectId} calcId={calcId} remarkId={r.id} />}
          </li>
        ))}
      </ol>
      {props.canRemark && <NewRemarkForm projectId={projectId} calcId={calcId} revisionId={revisionId} />}
    </section>
  )
}
