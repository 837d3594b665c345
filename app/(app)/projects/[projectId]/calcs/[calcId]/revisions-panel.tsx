'use client'

import { useRouter } from 'next/navigation'
import { useState, useTransition } from 'react'
import { FormMessage } from '@/app/_components/form'
import { StateBadge } from '@/app/_components/state-badge'
import type { ActionState } from '@/app/_lib/action'
import { transitionsFrom, type RevisionState, type TransitionAction } from '@/lib/review/workflow'
import { saveRevisionAction, transitionAction } from './actions'

interface RevisionRow {
  id: string
  label: string
  state: RevisionState
  contentHash: string | null
  pdfHash: string | null
  createdAt: string
}

export function RevisionsPanel(props: {
  projectId: string
  calcId: string
  shownId: string | null
  canSave: boolean
  /** The workflow actions the viewer's role may take. */
  allowed: TransitionAction[]
  revisions: RevisionRow[]
}) {
  const { projectId, calcId, revisions, allowed } = props
  const router = useRouter()
  const [state, setState] = useState<ActionState>({})
  const [pending, start] = useTransition()
  const run = (fn: () => Promise<ActionState>) =>
    start(async () => {
      const result = await fn()
      setState(result)
      if (result.ok) router.refresh()
    })
  const pdf = (id: string, paper: string) => `/api/v1/projects/${projectId}/calcs/${calcId}/revisions/${id}/pdf?paper=${paper}`

  return (
    <section className="panel flex flex-col gap-3 p-4" data-testid="revisions">
      <div className="flex items-center justify-between">
        <h2 className="h2">Revisions</h2>
        {props.canSave && (
          <button type="button" className="btn" disabled={pending} onClick={() => run(() => saveRevisionAction(projectId, calcId))}>
            {pending ? 'Working…' : 'Save revision for check'}
          </button>
        )}
      </div>
      <FormMessage state={state} />
      {state.fieldErrors && (
        <ul className="list-disc pl-4 text-xs text-fail">
          {Object.entries(state.fieldErrors).map(([k, v]) => (
            <li key={k}>
              <span className="font-mono">{k}</span>: {v}
            </li>
          ))}
        </ul>
      )}
      {revisions.length === 0 && <p className="text-ink/60">No revision yet. Save one when the working copy is ready for check.</p>}
      <ul className="flex flex-col divide-y divide-rule">
        {revisions.map((r) => {
          const next = transitionsFrom(r.state).filter((t) => allowed.includes(t.action))
          return (
            <li key={r.id} className="flex flex-col gap-1 py-2">
              <div className="flex items-center gap-2">
                <span className="font-mono font-semibold">Rev {r.label}</span>
                <StateBadge state={r.state} />
                <span className="ml-auto text-xs text-ink/60">{r.createdAt.slice(0, 10)}</span>
              </div>
              <div className="font-mono text-[10px] text-ink/50" title="SHA-256 of canonical inputs + result / of the stored PDF">
                content {r.contentHash?.slice(0, 16)}… · pdf {r.pdfHash?.slice(0, 16)}…
              </div>
              <div className="flex flex-wrap items-center gap-2">
                <a className="text-xs text-accent underline" href={pdf(r.id, 'A4')}>
                  PDF (A4)
                </a>
                <a className="text-xs text-accent underline" href={pdf(r.id, 'LETTER')}>
                  PDF (US Letter)
                </a>
                {next.map((t) => (
                  <button
                    key={t.action}
                    type="button"
                    className="btn-quiet ml-auto"
                    disabled={pending}
                    onClick={() => window.confirm(t.confirm) && run(() => transitionAction(projectId, calcId, r.id, t.action))}
                  >
                    {t.button}
                  </button>
                ))}
              </div>
            </li>
          )
        })}
      </ul>
    </section>
  )
}
