'use client'

import { keyFigures } from '@/lib/bench/key-results'
import type { CalcResult } from '@/lib/calc/run'
import { outputFromSI, type UnitSystem } from '@/lib/units'

/** The newest revision's answer, to read beside what is on screen. */
export interface RevisionSummary {
  label: string
  stateLabel: string
  feasible: boolean
  pass: boolean
  maxUtilisation: number
}

type Kind = 'length' | 'force' | 'moment' | 'area'
const UNIT: Record<UnitSystem, Record<Kind, string>> = {
  SI: { length: 'mm', force: 'N', moment: 'N·mm', area: 'mm²' },
  US: { length: 'in', force: 'lbf', moment: 'lbf·in', area: 'in²' },
}

function fmt(x: number, digits = 3): string {
  const a = Math.abs(x)
  const d = a === 0 ? 0 : a >= 1000 ? 0 : a >= 100 ? 1 : a >= 1 ? 2 : digits
  return x.toLocaleString('en-GB', { minimumFractionDigits: d, maximumFractionDigits: d }).replace(/,/g, '\u2009')
}

function Figure({ label, value, note, testId }: { label: string; value: string; note?: string; testId?: string }) {
  return (
    <div className="min-w-[8.5rem]" data-testid={testId}>
      <dt className="text-[11px] text-ink/80">{label}</dt>
      <dd className="font-mono text-base font-semibold">{value}</dd>
      {note && <dd className="text-[11px] text-ink/80">{note}</dd>}
    </div>
  )
}

interface KeyResultsProps {
  result: CalcResult | null
  infeasible: string | null
  hasErrors: boolean
  dirty: boolean
  savedAt: string
  system: UnitSystem
  revision: RevisionSummary | null
  requiredStroke?: number
}

/** Key results of the inputs on screen, with the verdict, marked as working inputs (saved or not) vs the newest revision. */
export function KeyResults({ result, infeasible, hasErrors, dirty, savedAt, system, revision, requiredStroke }: KeyResultsProps) {
  const u = (x: number, kind: Kind) => `${fmt(outputFromSI(x, system, kind))} ${UNIT[system][kind]}`
  const verdict = !result ? (infeasible ? 'INFEASIBLE' : 'NO RESULT') : !result.feasibility.ok ? 'INFEASIBLE' : result.verdict.pass ? 'PASS' : 'FAIL'
  const tone = verdict === 'PASS' ? 'border-pass bg-pass-soft text-pass' : 'border-fail bg-fail-soft text-fail'
  const f = result ? keyFigures(result) : null
  return (
    <section className="panel flex flex-col gap-3 p-4" aria-labelledby="key-results-title" data-testid="key-results">
      <div className="flex flex-wrap items-center gap-3">
        <h2 id="key-results-title" className="h2">
          Key results
        </h2>
        <span className={`rounded px-2 py-0.5 text-xs font-semibold ${dirty ? 'bg-caution-soft text-caution' : 'bg-accent-soft text-accent'}`} data-testid="key-results-source">
          {dirty ? 'Working inputs — unsaved changes' : `Working inputs — saved ${new Date(savedAt).toLocaleString([], { dateStyle: 'medium', timeStyle: 'short' })}`}
        </span>
        {revision && (
          <span className="text-xs text-ink/80" data-testid="revision-verdict">
            Newest saved revision: Rev {revision.label} ({revision.stateLabel}) —{' '}
            {!revision.feasible ? 'infeasible' : `${revision.pass ? 'PASS' : 'FAIL'}, largest utilisation ${fmt(revision.maxUtilisation)}`}
          </span>
        )}
      </div>
      <div className="flex flex-wrap items-stretch gap-4">
        <div className={`flex min-w-[12rem] max-w-md flex-col justify-center rounded border-l-4 px-3 py-2 ${tone}`} data-testid="verdict">
          <span className="text-lg font-bold tracking-wide">{hasErrors && !infeasible ? 'CHECK INPUTS' : verdict}</span>
          <span className="text-xs text-ink">
            {hasErrors && !infeasible
              ? 'Some inputs are out of range or not numbers: see the marked fields.'
              : infeasible
                ? infeasible
                : result && result.feasibility.ok
                  ? `Largest utilisation ${fmt(result.verdict.maxUtilisation)} — ${result.verdict.governing}`
                  : ''}
          </span>
        </div>
        {f && f.feasible && (
          <dl className="flex flex-1 flex-wrap gap-x-6 gap-y-2">
            <Figure label="Inversion constant k" value={u(f.k, 'area')} testId="kr-k" />
            <Figure label="Line offset d = k/(2r)" value={u(f.lineOffset, 'length')} testId="kr-offset" />
            <Figure
              label="Usable stroke"
              value={u(f.usableStroke, 'length')}
              note={requiredStroke ? `${f.usableStroke >= requiredStroke ? 'covers' : 'short of'} the ${u(requiredStroke, 'length')} needed` : undefined}
              testId="kr-stroke"
            />
            <Figure label="Straightness" value={u(f.straightness, 'length')} />
            {f.minTransmissionDeg !== null && <Figure label="Smallest transmission angle" value={`${fmt(f.minTransmissionDeg)}°`} />}
            {f.peakTorque && <Figure label="Peak drive torque" value={u(Math.abs(f.peakTorque.value), 'moment')} note={`at θ = ${fmt(f.peakTorque.crankDeg)}°, ${f.peakTorque.loadCase}`} testId="kr-torque" />}
            {f.peakLink && <Figure label="Largest link force" value={u(Math.abs(f.peakLink.value), 'force')} note={`${f.peakLink.link}, ${f.peakLink.value >= 0 ? 'tension' : 'compression'}`} />}
            {f.peakPin && <Figure label="Largest pin force" value={u(f.peakPin.value, 'force')} note={`pin ${f.peakPin.joint}`} />}
          </dl>
        )}
      </div>
    </section>
  )
}
