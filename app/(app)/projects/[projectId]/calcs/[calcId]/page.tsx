import type { Metadata } from 'next'
import Link from 'next/link'
import { notFound } from 'next/navigation'
import 'katex/dist/katex.min.css'
import '@/reports/web/report.css'
import { StateBadge } from '@/app/_components/state-badge'
import { loadProjectContext } from '@/app/_lib/project-context'
import { reports } from '@/app/_lib/renderer'
import { defaultCalcInputs } from '@/lib/calc/defaults'
import type { CalcResult } from '@/lib/calc/run'
import { MATERIALS } from '@/lib/checks'
import { AppError } from '@/lib/errors'
import { can } from '@/lib/review/permissions'
import { TRANSITIONS } from '@/lib/review/workflow'
import { CALC_TYPE_LABELS, type CalcType } from '@/lib/schemas/project'
import { getCalcWorkspace } from '@/server/calc-view'
import { AttachmentsForm } from './attachments-form'
import { InputsForm } from './inputs-form'
import { RemarksPanel } from './remarks-panel'
import { RevisionsPanel } from './revisions-panel'

export const metadata: Metadata = { title: 'Calc' }

type Props = { params: Promise<{ projectId: string; calcId: string }>; searchParams: Promise<{ view?: string }> }

async function workspace(...args: Parameters<typeof getCalcWorkspace>) {
  try {
    return await getCalcWorkspace(...args)
  } catch (err) {
    if (err instanceof AppError && err.code === 'not_found') notFound()
    throw err
  }
}

export default async function CalcPage({ params, searchParams }: Props) {
  const [{ projectId, calcId }, { view }] = await Promise.all([params, searchParams])
  const { user, project, actor } = await loadProjectContext(projectId)
  const { calc, revisions, shown, pkg, remarks, pending, materials } = await workspace(user, projectId, calcId, view)
  const r = await reports()
  const html = pkg ? await r.renderWebHtml(pkg) : null
  const base = `/projects/${projectId}/calcs/${calcId}`
  // Steps are numbered in the order the package shows them; read that order from the rendered anchors.
  const order = html ? [...html.matchAll(/id="step-([^"]+)"/g)].map((m) => m[1]) : []
  const numberOf = new Map(order.map((id, i) => [id, i + 1]))
  const titles = new Map(((shown?.result as CalcResult | null)?.steps ?? []).map((s) => [s.id, s.title]))
  const calcType = calc.calcType as CalcType

  return (
    <div className="flex flex-col gap-4">
      <div>
        <Link href={`/projects/${projectId}`} className="font-mono text-xs text-accent underline">
          {project.code} register
        </Link>
        <h1 className="h1">
          <span className="font-mono">{calc.number}</span> {calc.title}
        </h1>
        <div className="mt-1 flex items-center gap-2 text-xs text-ink/60">
          {CALC_TYPE_LABELS[calcType]} <StateBadge state={calc.state} />
        </div>
      </div>
      <div className="grid items-start gap-4 lg:grid-cols-[24rem_1fr]">
        <div className="flex flex-col gap-4">
          <RevisionsPanel
            projectId={projectId}
            calcId={calcId}
            shownId={shown?.id ?? null}
            canSave={can(actor, 'calc.submit')}
            allowed={TRANSITIONS.filter((t) => can(actor, t.permission)).map((t) => t.action)}
            revisions={revisions.map((r) => ({ id: r.id, label: r.label, state: r.state, contentHash: r.contentHash, pdfHash: r.pdfHash, createdAt: r.createdAt.toISOString() }))}
          />
          {shown && (
            <RemarksPanel
              projectId={projectId}
              calcId={calcId}
              revisionId={shown.id}
              revisionLabel={shown.label}
              steps={order.map((id, i) => ({ id, number: i + 1, title: titles.get(id) ?? id }))}
              remarks={remarks.map((rm) => ({ ...rm, stepNumber: numberOf.get(rm.stepId) ?? null }))}
              canRemark={can(actor, 'remark.create') && shown.state === 'in-check'}
              canRespond={can(actor, 'remark.respond')}
            />
          )}
          <InputsForm
            projectId={projectId}
            calcId={calcId}
            calcType={calcType}
            initial={(calc.draftInputs ?? defaultCalcInputs(calcType)) as Parameters<typeof InputsForm>[0]['initial']}
            materials={[...Object.keys(MATERIALS), ...materials.map((m) => m.name)]}
            editable={can(actor, 'calc.edit')}
          />
          {can(actor, 'calc.edit') && <AttachmentsForm projectId={projectId} calcId={calcId} pending={pending.map((a) => ({ id: a.id, name: a.name, size: a.size }))} />}
        </div>
        <section className="panel min-w-0 p-0" aria-label="Calc package">
          <nav className="flex flex-wrap gap-1 border-b border-rule px-3 py-2 text-xs">
            <Link href={`${base}?view=working`} className={`rounded px-2 py-1 ${shown ? 'hover:bg-paper' : 'bg-accent text-white'}`}>
              Working copy
            </Link>
            {revisions.map((rev) => (
              <Link key={rev.id} href={`${base}?view=${rev.id}`} className={`rounded px-2 py-1 ${shown?.id === rev.id ? 'bg-accent text-white' : 'hover:bg-paper'}`}>
                Rev {rev.label}
              </Link>
            ))}
          </nav>
          {html ? (
            <div className="inverso-report px-6 py-4" dangerouslySetInnerHTML={{ __html: html }} />
          ) : (
            <p role="alert" className="m-4 rounded bg-fail-soft p-3 text-fail">
              The working inputs have errors; fix them in the form to see the package.
            </p>
          )}
        </section>
      </div>
    </div>
  )
}
