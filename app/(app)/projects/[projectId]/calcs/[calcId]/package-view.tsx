'use client'

import { useEffect, useRef, useState, useTransition } from 'react'
import { createPortal } from 'react-dom'
import { SEVERITY_LABELS, type RemarkSeverity } from '@/lib/review/workflow'
import { tickStepAction } from './actions'
import { useReview } from './review-context'

export interface StepRemark {
  id: string
  stepId: string | null
  severity: RemarkSeverity
  status: 'open' | 'answered' | 'closed'
  text: string
  author: string
  replies: { id: string; author: string; text: string; createdAt: string }[]
}

export interface StepTick {
  stepId: string
  by: string
  at: string
}

interface PackageViewProps {
  html: string
  projectId: string
  calcId: string
  revisionId: string | null
  remarks: StepRemark[]
  ticks: StepTick[]
  /** The viewer may pick steps to remark on. */
  canRemark: boolean
  /** The viewer may tick steps as verified. */
  canTick: boolean
  /** The viewer's name, shown on a tick before the server confirms it. */
  viewer: string
}

const STATUS = { open: 'open', answered: 'answered', closed: 'closed' } as const

/**
 * The package as HTML, with the review laid onto it: each step shows its remarks with their
 * threads and whether the checker ticked it; clicking a step picks it for a new remark.
 */
export function PackageView(props: PackageViewProps) {
  const root = useRef<HTMLDivElement>(null)
  const { step: picked, pick } = useReview()
  const [slots, setSlots] = useState<Map<string, HTMLElement>>(new Map())
  const [ticks, setTicks] = useState(props.ticks)
  const [, start] = useTransition()
  useEffect(() => setTicks(props.ticks), [props.ticks])

  // One slot per step, inside the step's box, that the review is portalled into.
  useEffect(() => {
    const map = new Map<string, HTMLElement>()
    root.current?.querySelectorAll<HTMLElement>('.inv-step[id^="step-"]').forEach((el) => {
      const id = el.id.slice('step-'.length)
      let slot = el.querySelector<HTMLElement>(':scope > .inv-review')
      if (!slot) {
        slot = document.createElement('div')
        slot.className = 'inv-review'
        el.appendChild(slot)
      }
      map.set(id, slot)
    })
    setSlots(map)
  }, [props.html])

  useEffect(() => {
    root.current?.querySelectorAll('.inv-step.inv-picked').forEach((el) => el.classList.remove('inv-picked'))
    if (picked) root.current?.querySelector(`#${CSS.escape(`step-${picked.id}`)}`)?.classList.add('inv-picked')
  }, [picked])

  const onClick = (e: React.MouseEvent) => {
    if (!props.canRemark) return
    const target = e.target as HTMLElement
    if (target.closest('a, button, input, .inv-review')) return
    const box = target.closest<HTMLElement>('.inv-step[id^="step-"]')
    if (!box) return
    const n = box.querySelector('.inv-step-n')?.textContent ?? ''
    const title = box.querySelector('.inv-step-title')?.textContent ?? ''
    pick({ id: box.id.slice('step-'.length), label: `Step ${n} — ${title}` })
  }

  const [tickError, setTickError] = useState<string | null>(null)
  const toggle = (stepId: string, ticked: boolean) => {
    // Shown at once; the server's list replaces it, or the old one comes back with the reason.
    const before = ticks
    setTicks(ticked ? [...ticks, { stepId, by: props.viewer, at: new Date().toISOString() }] : ticks.filter((t) => t.stepId !== stepId))
    setTickError(null)
    start(async () => {
      const out = await tickStepAction(props.projectId, props.calcId, props.revisionId!, stepId, ticked)
      if (out.ok && out.data?.ticks) setTicks(out.data.ticks as StepTick[])
      else {
        setTicks(before)
        setTickError(out.message ?? 'The tick was not saved.')
      }
    })
  }

  return (
    <>
      {props.canRemark && <p className="px-6 pt-3 text-xs text-ink/70">Click a step to write a remark on it.</p>}
      {tickError && (
        <p role="alert" className="mx-6 mt-2 rounded bg-fail-soft px-3 py-2 text-sm text-fail">
          {tickError}
        </p>
      )}
      <div ref={root} className={`inverso-report px-6 py-4 ${props.canRemark ? 'inv-pickable' : ''}`} onClick={onClick} dangerouslySetInnerHTML={{ __html: props.html }} />
      {[...slots].map(([stepId, slot]) => {
        const remarks = props.remarks.filter((r) => r.stepId === stepId)
        const tick = ticks.find((t) => t.stepId === stepId)
        if (remarks.length === 0 && !tick && !(props.canTick && props.revisionId)) return null
        return createPortal(
          <div className="inv-review-box" data-testid={`review-${stepId}`}>
            {props.canTick && props.revisionId ? (
              <label className="inv-tick">
                <input type="checkbox" checked={!!tick} onChange={(e) => toggle(stepId, e.target.checked)} /> Verified
                {tick ? ` — ${tick.by}, ${tick.at.slice(0, 10)}` : ''}
              </label>
            ) : tick ? (
              <p className="inv-tick">✓ Verified by {tick.by}, {tick.at.slice(0, 10)}</p>
            ) : null}
            {remarks.map((r) => (
              <div key={r.id} className={`inv-remark inv-remark-${r.status}`}>
                <p>
                  <strong>{SEVERITY_LABELS[r.severity]}</strong> · {STATUS[r.status]} · {r.author}: {r.text}
                </p>
                {r.replies.map((x) => (
                  <p key={x.id} className="inv-reply">
                    {x.author}, {x.createdAt.slice(0, 10)}: {x.text}
                  </p>
                ))}
              </div>
            ))}
          </div>,
          slot,
          stepId,
        )
      })}
    </>
  )
}
