'use client'

import { useRouter } from 'next/navigation'
import { useEffect, useId, useState, useTransition, type FormEvent, type ReactNode } from 'react'
import { FieldError, FormMessage } from '@/app/_components/form'
import { StateBadge } from '@/app/_components/state-badge'
import type { ActionState } from '@/app/_lib/action'
import { transitionsFrom, type RevisionState, type TransitionAction, type TransitionSpec } from '@/lib/review/workflow'
import { saveRevisionAction, transitionAction } from './actions'

export interface RevisionRow {
  id: string
  label: string
  state: RevisionState
  reason: string | null
  submittedFailing: boolean
  contentHash: string | null
  pdfHash: string | null
  createdAt: string
  verificationCode: string | null
  assignedChecker: string | null
  assignedApprover: string | null
  openRemarks: { mustResolve: number; any: number }
  /** "From memory" material values not yet confirmed (what issuing asks the approver to confirm). */
  memoryValues: { key: string; source: string }[]
  /** Set while the package is being rendered (or why that failed); nothing can be signed meanwhile. */
  preparing: string | null
}

interface Person {
  id: string
  name: string
}

interface RevisionsPanelProps {
  projectId: string
  calcId: string
  calcNumber: string
  canSave: boolean
  /** The workflow actions the viewer's role may take. */
  allowed: TransitionAction[]
  revisions: RevisionRow[]
  checkers: Person[]
  approvers: Person[]
  /** Preselected: who signed off the calc's last revision, or the only one there is; '' for "any". */
  suggestedChecker: string
  suggestedApprover: string
  /** The working result fails a check: submitting asks for confirmation. */
  workingFails: string | null
}

/** The shell both confirmations share: runs the action, shows its message, closes and refreshes on success. */
function ConfirmForm(props: {
  label: string
  button: string
  busy: string
  disabled?: boolean
  action: (fd: FormData) => Promise<ActionState>
  onDone: (message?: string) => void
  children: (fieldErrors: Record<string, string>) => ReactNode
}) {
  const router = useRouter()
  const [state, setState] = useState<ActionState>({})
  const [pending, start] = useTransition()
  const submit = (e: FormEvent<HTMLFormElement>) => {
    e.preventDefault()
    const fd = new FormData(e.currentTarget)
    start(async () => {
      const result = await props.action(fd)
      setState(result)
      if (result.ok) {
        props.onDone(result.message)
        router.refresh()
      }
    })
  }
  return (
    <form onSubmit={submit} className="flex flex-col gap-2 rounded border border-accent/40 bg-accent-soft/40 p-3" aria-label={props.label}>
      {props.children(state.fieldErrors ?? {})}
      <FormMessage state={state} />
      <div className="flex gap-2">
        <button type="submit" className="btn" disabled={pending || props.disabled}>
          {pending ? props.busy : props.button}
        </button>
        <button type="button" className="btn-quiet" onClick={() => props.onDone()}>
          Cancel
        </button>
      </div>
    </form>
  )
}

const text = (fd: FormData, name: string) => String(fd.get(name) ?? '')

/** Submitting the working inputs: reason, the checker and approver named, a failing calc confirmed. */
function SubmitForm(props: RevisionsPanelProps & { onDone: (message?: string) => void }) {
  const id = useId()
  const [confirm, setConfirm] = useState(false)
  const action = (fd: FormData) =>
    saveRevisionAction(props.projectId, props.calcId, {
      reason: text(fd, 'reason'),
      checkerId: text(fd, 'checkerId') || undefined,
      approverId: text(fd, 'approverId') || undefined,
      confirmFailing: confirm,
    })
  return (
    <ConfirmForm
      label="Save a revision for check"
      button="Save revision and send to check"
      busy="Running the calc and writing the package…"
      disabled={!!props.workingFails && !confirm}
      action={action}
      onDone={props.onDone}
    >
      {(err) => (
        <>
          <label className="label" htmlFor={`${id}-reason`}>
            Why this revision (shown in the history)
          </label>
          <input id={`${id}-reason`} name="reason" className="field" required maxLength={500} placeholder="e.g. stroke raised to 140 mm for the CE-40 B model" />
          <FieldError message={err.reason} />
          <PersonSelect id={`${id}-checker`} name="checkerId" label="Checker" people={props.checkers} suggested={props.suggestedChecker} anyLabel="Any checker of the project" error={err.checkerId} />
          <PersonSelect id={`${id}-approver`} name="approverId" label="Approver" people={props.approvers} suggested={props.suggestedApprover} anyLabel="Any approver of the project" error={err.approverId} />
          {props.workingFails && (
            <label className="flex items-start gap-2 rounded bg-fail-soft p-2 text-sm text-fail">
              <input type="checkbox" checked={confirm} onChange={(e) => setConfirm(e.target.checked)} className="mt-1" />
              <span>The calc fails: {props.workingFails}. Submit it anyway; the revision will record that it was submitted failing.</span>
            </label>
          )}
        </>
      )}
    </ConfirmForm>
  )
}

function PersonSelect(p: { id: string; name: string; label: string; people: Person[]; suggested: string; anyLabel: string; error?: string }) {
  return (
    <>
      <label className="label" htmlFor={p.id}>
        {p.label}
      </label>
      <select id={p.id} name={p.name} className="field" defaultValue={p.suggested} aria-invalid={p.error ? true : undefined}>
        {p.people.length !== 1 && <option value="">{p.anyLabel}</option>}
        {p.people.map((x) => (
          <option key={x.id} value={x.id}>
            {x.name}
          </option>
        ))}
      </select>
      <FieldError message={p.error} />
    </>
  )
}

/** A transition, confirmed: what will be signed, the password, the reason, the material values to confirm. */
function TransitionForm({ t, rev, props, onDone }: { t: TransitionSpec; rev: RevisionRow; props: RevisionsPanelProps; onDone: (message?: string) => void }) {
  const id = useId()
  const [materials, setMaterials] = useState(false)
  const needsMaterials = t.to === 'issued' && rev.memoryValues.length > 0
  const blocked = t.blockedBy === 'must-resolve' ? rev.openRemarks.mustResolve : t.blockedBy === 'any' ? rev.openRemarks.any : 0
  const action = (fd: FormData) =>
    transitionAction(props.projectId, props.calcId, rev.id, t.action, {
      password: t.password ? text(fd, 'password') : undefined,
      reason: t.reason ? text(fd, 'reason') : undefined,
      confirmMaterials: needsMaterials && materials ? (true as const) : undefined,
    })
  return (
    <ConfirmForm label={t.button} button={t.button} busy="Signing…" disabled={blocked > 0 || (needsMaterials && !materials)} action={action} onDone={onDone}>
      {(err) => (
        <>
          <p className="text-sm font-semibold">{t.confirm}</p>
          <dl className="grid grid-cols-[7rem_1fr] gap-x-2 text-xs">
            <dt className="text-ink/70">Calc</dt>
            <dd>
              {props.calcNumber} rev {rev.label}
            </dd>
            <dt className="text-ink/70">Content SHA-256</dt>
            <dd className="font-mono break-all">{rev.contentHash}</dd>
          </dl>
          {blocked > 0 && (
            <p role="alert" className="rounded bg-fail-soft p-2 text-sm text-fail">
              {blocked} {t.blockedBy === 'must-resolve' ? 'remark(s) that must be resolved' : 'remark(s)'} still open: close them first.
            </p>
          )}
          {t.reason && (
            <>
              <label className="label" htmlFor={`${id}-reason`}>
                Reason
              </label>
              <textarea id={`${id}-reason`} name="reason" rows={2} className="field" aria-invalid={err.reason ? true : undefined} />
              <FieldError message={err.reason} />
            </>
          )}
          {needsMaterials && (
            <fieldset className="rounded border border-caution bg-caution-soft p-2 text-xs">
              <legend className="px-1 font-semibold">Material values marked “from memory”</legend>
              <ul className="list-disc pl-4">
                {rev.memoryValues.map((m) => (
                  <li key={m.key}>
                    <span className="font-mono">{m.key}</span>: {m.source}
                  </li>
                ))}
              </ul>
              <label className="mt-1 flex items-start gap-2">
                <input type="checkbox" checked={materials} onChange={(e) => setMaterials(e.target.checked)} className="mt-0.5" />I checked each value against its standard (recorded with my name).
              </label>
            </fieldset>
          )}
          {t.password && (
            <>
              <label className="label" htmlFor={`${id}-password`}>
                Your password (to sign)
              </label>
              <input id={`${id}-password`} name="password" type="password" autoComplete="current-password" className="field" aria-invalid={err.password ? true : undefined} />
              <FieldError message={err.password} />
            </>
          )}
        </>
      )}
    </ConfirmForm>
  )
}

export function RevisionsPanel(props: RevisionsPanelProps) {
  const { projectId, calcId, revisions, allowed } = props
  const router = useRouter()
  // While a package is being rendered, look again every few seconds.
  const waiting = revisions.some((r) => r.preparing && !r.preparing.startsWith('The package could not'))
  useEffect(() => {
    if (!waiting) return
    const timer = setInterval(() => router.refresh(), 2500)
    return () => clearInterval(timer)
  }, [waiting, router])
  const [open, setOpen] = useState<string | null>(null)
  const [done, setDone] = useState<string | null>(null)
  const close = (message?: string) => {
    setOpen(null)
    setDone(message ?? null)
  }
  const pdf = (id: string, paper: string) => `/api/v1/projects/${projectId}/calcs/${calcId}/revisions/${id}/pdf?paper=${paper}`
  return (
    <section className="panel flex flex-col gap-3 p-4" data-testid="revisions">
      <div className="flex items-center justify-between">
        <h2 className="h2">Revisions</h2>
        {props.canSave && open !== 'submit' && (
          <button type="button" className="btn" onClick={() => { setDone(null); setOpen('submit') }}>
            Save revision for check
          </button>
        )}
      </div>
      {done && (
        <p role="status" className="rounded bg-accent-soft px-3 py-2 text-sm text-accent">
          {done}
        </p>
      )}
      {open === 'submit' && <SubmitForm {...props} onDone={close} />}
      {revisions.length === 0 && <p className="text-ink/70">No revision yet. Save one when the working inputs are ready for check.</p>}
      <ul className="flex flex-col divide-y divide-rule">
        {revisions.map((r) => {
          const next = r.preparing ? [] : transitionsFrom(r.state).filter((t) => allowed.includes(t.action))
          return (
            <li key={r.id} className="flex flex-col gap-1 py-2" data-testid={`revision-${r.label}`}>
              <div className="flex items-center gap-2">
                <span className="font-mono font-semibold">Rev {r.label}</span>
                <StateBadge state={r.state} />
                <span className="ml-auto text-xs text-ink/70">{r.createdAt.slice(0, 10)}</span>
              </div>
              {r.reason && <p className="text-xs">{r.reason}</p>}
              {r.submittedFailing && <p className="text-xs font-semibold text-fail">Submitted with a failing check.</p>}
              <p className="text-xs text-ink/70">
                Checker {r.assignedChecker ?? 'any'} · approver {r.assignedApprover ?? 'any'}
                {r.openRemarks.any > 0 && ` · ${r.openRemarks.any} open remark${r.openRemarks.any === 1 ? '' : 's'}`}
              </p>
              {r.verificationCode && (
                <p className="text-xs">
                  Verification code <span className="font-mono font-semibold">{r.verificationCode}</span>
                </p>
              )}
              <div className="font-mono text-[10px] text-ink/70" title="SHA-256 of canonical inputs + result / of the stored PDF">
                content {r.contentHash?.slice(0, 16)}… · pdf {r.pdfHash?.slice(0, 16)}…
              </div>
              {r.preparing && (
                <p role="status" className="text-xs text-caution" data-testid="preparing">
                  {r.preparing}
                </p>
              )}
              <div className="flex flex-wrap items-center gap-2">
                <a className="text-xs text-accent underline" href={pdf(r.id, 'A4')}>
                  PDF (A4)
                </a>
                <a className="text-xs text-accent underline" href={pdf(r.id, 'LETTER')}>
                  PDF (US Letter)
                </a>
                <span className="ml-auto flex flex-wrap gap-1">
                  {next.map((t) => (
                    <button key={t.action} type="button" className="btn-quiet" onClick={() => { setDone(null); setOpen(`${r.id}:${t.action}`) }} aria-expanded={open === `${r.id}:${t.action}`}>
                      {t.button}
                    </button>
                  ))}
                </span>
              </div>
              {next.map((t) => open === `${r.id}:${t.action}` && <TransitionForm key={t.action} t={t} rev={r} props={props} onDone={close} />)}
            </li>
          )
        })}
      </ul>
    </section>
  )
}
