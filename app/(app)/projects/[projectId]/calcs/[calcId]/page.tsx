import type { Metadata } from 'next'
import Link from 'next/link'
import { notFound } from 'next/navigation'
import 'katex/dist/katex.min.css'
import '@/reports/web/report.css'
import { StateBadge } from '@/app/_components/state-badge'
import { loadProjectContext } from '@/app/_lib/project-context'
import { reports } from '@/app/_lib/renderer'
import type { CalcType } from '@/reports/types'
import { defaultCalcInputs } from '@/lib/calc/defaults'
import type { CalcResult } from '@/lib/calc/run'
import { MATERIALS } from '@/lib/checks'
import { AppError } from '@/lib/errors'
import { mechanismLabel } from '@/lib/mechanisms'
import { can } from '@/lib/review/permissions'
import { STATES, TRANSITIONS } from '@/lib/review/workflow'
import { getCalcWorkspace } from '@/server/calc-view'
import { calcHeading } from '@/server/calcs'
import { AttachmentsForm } from './attachments-form'
import { Bench } from './bench'
import { CalcActions } from './calc-actions'
import { PackageLoader } from './package-loader'
import { RemarksPanel } from './remarks-panel'
import { ReviewProvider } from './review-context'
import { RevisionsPanel } from './revisions-panel'
import type { Tree } from './tree'

type Props = { params: Promise<{ projectId: string; calcId: string }>; searchParams: Promise<{ view?: string }> }

async function orNotFound<T>(p: Promise<T>): Promise<T> {
  try {
    return await p
  } catch (err) {
    if (err instanceof AppError && err.code === 'not_found') notFound()
    throw err
  }
}

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const { projectId, calcId } = await params
  const { user } = await loadProjectContext(projectId)
  const { number, title } = await orNotFound(calcHeading(user, projectId, calcId))
  return { title: `${number} ${title}` }
}

/**
 * The calc page: key results and the bench (inputs, drawing, plots, positions) first, computed in
 * the browser; the sign-off panels and the package below, the package fetched when asked for.
 */
export default async function CalcPage({ params, searchParams }: Props) {
  const [{ projectId, calcId }, { view }] = await Promise.all([params, searchParams])
  const { user, project, actor } = await loadProjectContext(projectId)
  const w = await orNotFound(getCalcWorkspace(user, projectId, calcId, view))
  const { calc, revisions, shown, result } = w
  const outline = result ? (await reports()).stepOutline({ calc: { type: calc.calcType as CalcType }, result }) : []
  const byId = new Map(outline.map((s) => [s.id, s]))
  const base = `/projects/${projectId}/calcs/${calcId}`
  const iso = (d: Date) => d.toISOString()
  const remarks = w.remarks.map((rm) => ({
    id: rm.id,
    stepId: rm.stepId,
    severity: rm.severity,
    status: rm.status,
    text: rm.text,
    author: rm.author,
    carried: !!rm.carriedFromId,
    stepNumber: rm.stepId ? (byId.get(rm.stepId)?.number ?? null) : null,
    stepTitle: rm.stepId ? (byId.get(rm.stepId)?.title ?? null) : null,
    replies: rm.replies.map((x) => ({ ...x, createdAt: iso(x.createdAt) })),
  }))
  const inCheck = shown?.state === 'in-check'
  const namedChecker = !shown?.assignedCheckerId || shown.assignedCheckerId === user.id
  const canRemark = !!shown && can(actor, 'remark.create') && inCheck && namedChecker
  const canTick = !!shown && can(actor, 'calc.check') && inCheck && namedChecker
  const newest = revisions[0]
  const newestResult = newest?.result as CalcResult | null | undefined
  const editable = can(actor, 'calc.edit')

  return (
    <ReviewProvider>
      <div className="flex flex-col gap-4">
        <div className="flex flex-wrap items-end gap-3">
          <div>
            <Link href={`/projects/${projectId}`} className="font-mono text-xs text-accent underline">
              {project.code} register
            </Link>
            <h1 className="h1">
              <span className="font-mono">{calc.number}</span> {calc.title}
            </h1>
            <div className="mt-1 flex flex-wrap items-center gap-3 text-xs text-ink/80">
              {mechanismLabel(calc.calcType)} <StateBadge state={calc.state} />
              {revisions.length > 1 && (
                <Link className="text-accent underline" href={`${base}/compare?from=${revisions[1].id}&to=${revisions[0].id}`}>
                  Compare revisions
                </Link>
              )}
              <Link className="text-accent underline" href={`${base}/audit`}>
                Audit trail
              </Link>
              <a className="text-accent underline" href="#sign-off">
                Revisions and remarks
              </a>
            </div>
          </div>
          <CalcActions projectId={projectId} calcId={calcId} calcNumber={calc.number} canCreate={can(actor, 'calc.create')} />
        </div>
        <Bench
          projectId={projectId}
          calcId={calcId}
          calcType={calc.calcType}
          initial={(calc.draftInputs ?? defaultCalcInputs(calc.calcType)) as Tree}
          savedAt={calc.updatedAt.toISOString()}
          materials={[...Object.keys(MATERIALS), ...w.materials.map((m) => m.name)]}
          editable={editable}
          revision={
            newest && newestResult
              ? { label: newest.label, stateLabel: STATES[newest.state].label, feasible: newestResult.feasibility.ok, pass: newestResult.verdict.pass, maxUtilisation: newestResult.verdict.maxUtilisation }
              : null
          }
        />
        <div id="sign-off" className="grid scroll-mt-4 items-start gap-4 lg:grid-cols-[24rem_1fr]">
          <div className="flex flex-col gap-4">
            <RevisionsPanel
              projectId={projectId}
              calcId={calcId}
              calcNumber={calc.number}
              canSave={can(actor, 'calc.submit')}
              allowed={TRANSITIONS.filter((t) => can(actor, t.permission)).map((t) => t.action)}
              checkers={w.checkers}
              approvers={w.approvers}
              suggestedChecker={w.suggestedChecker}
              suggestedApprover={w.suggestedApprover}
              workingFails={w.workingFails}
              revisions={revisions.map((rev) => ({
                id: rev.id,
                label: rev.label,
                state: rev.state,
                reason: rev.reason,
                submittedFailing: rev.submittedFailing,
                contentHash: rev.contentHash,
                pdfHash: rev.pdfHash,
                createdAt: iso(rev.createdAt),
                verificationCode: rev.verificationCode,
                assignedChecker: rev.assignedChecker,
                assignedApprover: rev.assignedApprover,
                openRemarks: rev.openRemarks,
                memoryValues: rev.memoryValues.map((m) => ({ key: m.key, source: m.source })),
                preparing: rev.preparing,
              }))}
            />
            {shown && (
              <RemarksPanel
                projectId={projectId}
                calcId={calcId}
                revisionId={shown.id}
                revisionLabel={shown.label}
                remarks={remarks}
                canRemark={canRemark}
                canReply={can(actor, 'remark.respond') && !['issued', 'superseded', 'voided'].includes(shown.state)}
                canClose={can(actor, 'remark.close') && !['issued', 'superseded', 'voided'].includes(shown.state)}
              />
            )}
            {editable && <AttachmentsForm projectId={projectId} calcId={calcId} pending={w.pending.map((a) => ({ id: a.id, name: a.name, size: a.size }))} />}
          </div>
          <section id="package" className="panel min-w-0 scroll-mt-4 p-0" aria-labelledby="package-heading">
            <div className="flex flex-wrap items-center gap-2 border-b border-rule px-3 py-2">
              <h2 id="package-heading" className="h2 mr-2">
                Calc package
              </h2>
              <nav className="flex flex-wrap gap-1 text-xs" aria-label="Package shown">
                <Link href={`${base}?view=working#package`} className={`rounded px-2 py-1 ${shown ? 'hover:bg-paper' : 'bg-accent text-white'}`} aria-current={shown ? undefined : 'page'}>
                  Working inputs (saved, not a revision)
                </Link>
                {revisions.map((rev) => (
                  <Link key={rev.id} href={`${base}?view=${rev.id}#package`} className={`rounded px-2 py-1 ${shown?.id === rev.id ? 'bg-accent text-white' : 'hover:bg-paper'}`} aria-current={shown?.id === rev.id ? 'page' : undefined}>
                    Rev {rev.label}
                  </Link>
                ))}
              </nav>
            </div>
            {result ? (
              <PackageLoader
                key={shown?.id ?? 'working'}
                view={shown?.id ?? 'working'}
                auto={!!view || canRemark || canTick}
                version={shown ? shown.id : calc.updatedAt.toISOString()}
                stepCount={outline.length}
                projectId={projectId}
                calcId={calcId}
                revisionId={shown?.id ?? null}
                remarks={remarks}
                ticks={w.ticks.map((t) => ({ stepId: t.stepId, by: t.by, at: iso(t.at) }))}
                canRemark={canRemark}
                canTick={canTick}
                viewer={user.name}
              />
            ) : (
              <p role="alert" className="m-4 rounded bg-fail-soft p-3 text-fail">
                The saved working inputs have errors; fix them in the form to see the package.
              </p>
            )}
          </section>
        </div>
      </div>
    </ReviewProvider>
  )
}
