'use client'

import { useRouter } from 'next/navigation'
import { useMemo, useState } from 'react'
import { parseDecimal } from '@/lib/bench/number'
import { GOAL_LABELS, SIZING_GOALS, type SizingGoal } from '@/lib/sizing/schema'
import type { SizingOutput, SizingProposal } from '@/lib/sizing'
import { frameOf, jointsAt } from '../calcs/[calcId]/mechanism-geometry'
import { MechanismSvg } from '../calcs/[calcId]/mechanism-svg'
import { calcFromProposalAction } from '../actions'

const FIELDS = [
  { key: 'stroke', label: 'Stroke needed', unit: 'mm', hint: 'full travel along the line', required: true },
  { key: 'offsetMin', label: 'Line offset from O, from', unit: 'mm', hint: 'leave both empty to let the assistant choose' },
  { key: 'offsetMax', label: 'to', unit: 'mm', hint: 'the same value for one offset (±0.5 mm)' },
  { key: 'width', label: 'Envelope across the line', unit: 'mm', hint: 'every joint, over the stroke; empty: no limit' },
  { key: 'height', label: 'Envelope along the line', unit: 'mm' },
  { key: 'minTransmissionDeg', label: 'Smallest transmission angle', unit: '°', hint: 'anywhere in the cell over the stroke' },
  { key: 'fx', label: 'Load Fx (across the line)', unit: 'N', required: true },
  { key: 'fy', label: 'Load Fy (along the line)', unit: 'N', required: true },
] as const

type Key = (typeof FIELDS)[number]['key']

function Preview({ p }: { p: SizingProposal }) {
  const frame = useMemo(() => frameOf(p.mechanism, p.geometry, 5), [p])
  if (!frame) return null
  return (
    <div className="w-40 shrink-0">
      <MechanismSvg mechanism={p.mechanism} frame={frame} joints={jointsAt(frame, frame.usable[1] * 0.6)} forces={null} load={null} showValues={false} />
    </div>
  )
}

const fmt = (x: number) => (Math.abs(x) >= 100 ? x.toFixed(0) : x.toFixed(1))

export function SizingForm({ projectId, canCreate }: { projectId: string; canCreate: boolean }) {
  const router = useRouter()
  const [text, setText] = useState<Record<Key, string>>({ stroke: '120', offsetMin: '', offsetMax: '', width: '', height: '', minTransmissionDeg: '30', fx: '0', fy: '-150' })
  const [goal, setGoal] = useState<SizingGoal>('pin-force')
  const [errors, setErrors] = useState<Record<string, string>>({})
  const [out, setOut] = useState<SizingOutput | null>(null)
  const [request, setRequest] = useState<unknown>(null)
  const [busy, setBusy] = useState(false)
  const [alert, setAlert] = useState<string | null>(null)

  const run = async () => {
    const errs: Record<string, string> = {}
    const v: Partial<Record<Key, number>> = {}
    for (const f of FIELDS) {
      const p = parseDecimal(text[f.key])
      if (!p.ok) errs[f.key] = p.message
      else if (p.value === undefined && 'required' in f && f.required) errs[f.key] = 'is required'
      else v[f.key] = p.value
    }
    if ((v.width === undefined) !== (v.height === undefined)) errs[v.width === undefined ? 'width' : 'height'] = 'give both sides of the envelope, or neither'
    if ((v.offsetMin === undefined) !== (v.offsetMax === undefined)) errs[v.offsetMin === undefined ? 'offsetMin' : 'offsetMax'] = 'give both ends, or neither'
    setErrors(errs)
    if (Object.keys(errs).length) return
    const body = {
      stroke: v.stroke,
      ...(v.offsetMin !== undefined ? { offset: v.offsetMin === v.offsetMax ? v.offsetMin : { min: v.offsetMin, max: v.offsetMax } } : {}),
      ...(v.width !== undefined ? { envelope: { width: v.width, height: v.height } } : {}),
      ...(v.minTransmissionDeg !== undefined ? { minTransmissionDeg: v.minTransmissionDeg } : {}),
      load: { fx: v.fx, fy: v.fy },
      goal,
    }
    setBusy(true)
    setAlert(null)
    try {
      const res = await fetch('/api/v1/size', { method: 'POST', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify(body) })
      const json = await res.json()
      if (!res.ok) {
        const fields = (json.error?.fields ?? {}) as Record<string, string>
        const map: Record<string, string> = { 'offset': 'offsetMin', 'offset.min': 'offsetMin', 'offset.max': 'offsetMax', 'envelope.width': 'width', 'envelope.height': 'height', 'load.fx': 'fx', 'load.fy': 'fy' }
        setErrors(Object.fromEntries(Object.entries(fields).map(([k, m]) => [map[k] ?? k, m])))
        setAlert(json.error?.message ?? 'The request was refused.')
        return
      }
      setOut(json as SizingOutput)
      setRequest(body)
    } catch {
      setAlert('Could not reach the server. Your entries are kept; try again.')
    } finally {
      setBusy(false)
    }
  }

  const makeCalc = async (p: SizingProposal) => {
    setAlert(null)
    try {
      const res = await calcFromProposalAction(projectId, request, p, '')
      if (res.ok && res.redirectTo) router.push(res.redirectTo)
      else setAlert(res.message ?? 'No calc was made.')
    } catch {
      setAlert('Could not reach the server; no calc was made.')
    }
  }

  return (
    <div className="flex flex-col gap-4">
      <form
        className="panel flex flex-col gap-3 p-4"
        noValidate
        onSubmit={(e) => {
          e.preventDefault()
          run()
        }}
        data-testid="sizing-form"
        aria-labelledby="sizing-title"
      >
        <h2 id="sizing-title" className="h2">
          What the machine needs
        </h2>
        <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
          {FIELDS.map((f) => (
            <div key={f.key}>
              <label htmlFor={`sz-${f.key}`} className="label">
                {f.label} [{f.unit}]
              </label>
              <input
                id={`sz-${f.key}`}
                className="field"
                inputMode="decimal"
                value={text[f.key]}
                onChange={(e) => setText((t) => ({ ...t, [f.key]: e.target.value }))}
                aria-invalid={errors[f.key] ? true : undefined}
                aria-describedby={`sz-${f.key}-error`}
              />
              {'hint' in f && !errors[f.key] && <p className="mt-0.5 text-[11px] text-ink/80">{f.hint}</p>}
              <p id={`sz-${f.key}-error`} className="field-error" aria-live="polite">
                {errors[f.key]}
              </p>
            </div>
          ))}
          <div>
            <label htmlFor="sz-goal" className="label">
              Rank by
            </label>
            <select id="sz-goal" className="field" value={goal} onChange={(e) => setGoal(e.target.value as SizingGoal)}>
              {SIZING_GOALS.map((g) => (
                <option key={g} value={g}>
                  {GOAL_LABELS[g]}
                </option>
              ))}
            </select>
          </div>
        </div>
        {alert && (
          <p role="alert" className="rounded bg-fail-soft px-3 py-2 text-sm text-fail">
            {alert}
          </p>
        )}
        <div>
          <button type="submit" className="btn" aria-disabled={busy}>
            {busy ? 'Sizing…' : 'Propose dimensions'}
          </button>
        </div>
      </form>
      {out && (
        <section className="panel flex flex-col gap-3 p-4" aria-labelledby="proposals-title" data-testid="proposals" aria-live="polite">
          <h2 id="proposals-title" className="h2">
            Proposals, by {out.goalLabel}
          </h2>
          <p className="text-xs text-ink/80">
            {out.tried} candidates tried, {out.feasible} met every constraint.
          </p>
          {out.advice && <p className="text-sm text-fail">{out.advice}</p>}
          <ol className="flex flex-col gap-3">
            {out.proposals.map((p) => (
              <li key={p.rank} className="flex flex-wrap items-start gap-4 border-t border-rule pt-3" data-testid="proposal">
                <Preview p={p} />
                <div className="flex min-w-[16rem] flex-1 flex-col gap-1 text-sm">
                  <p className="font-semibold">
                    {p.rank}. {p.label}
                  </p>
                  <p className="font-mono text-xs" data-testid="proposal-geometry">
                    {Object.entries(p.geometry)
                      .filter(([k]) => k !== 'crankPivotOffset')
                      .map(([k, x]) => `${k} ${fmt(x)}`)
                      .join(' · ')}
                    {' · e = r'}
                  </p>
                  <p className="text-xs text-ink/80">
                    usable stroke {fmt(p.metrics.usableStroke)} mm · line offset {fmt(p.metrics.lineOffset)} mm · crank ±{fmt(p.metrics.crankRangeDeg)}° over the stroke
                  </p>
                  <p className="text-xs">{p.tradeoff}</p>
                </div>
                {canCreate && (
                  <button type="button" className="btn-quiet" onClick={() => makeCalc(p)}>
                    Make a draft calc
                  </button>
                )}
              </li>
            ))}
          </ol>
        </section>
      )}
    </div>
  )
}
