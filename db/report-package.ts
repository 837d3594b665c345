import { asc, eq, inArray } from 'drizzle-orm'
import { inputRowsOf } from '@/lib/calc/input-rows'
import { calculate, parseCalcInput, type CalcResult } from '@/lib/calc/run'
import { ENGINE_VERSION } from '@/lib/calc/version'
import { STATE_LABELS } from '@/lib/review/roles'
import type { Paper, ReportPackage } from '@/reports/types'
import { TEMPLATE_VERSION } from '@/reports/version'
import { db } from './index'
import { calcs, checkRemarks, projects, revisions, users, type Calc, type Project, type Revision } from './schema'

export { TEMPLATE_VERSION }

const day = (d: Date | null | undefined) => (d ? d.toISOString().slice(0, 10) : undefined)

async function namesOf(ids: (string | null)[]) {
  const wanted = ids.filter((x): x is string => !!x)
  const rows = wanted.length ? await db.select({ id: users.id, name: users.name }).from(users).where(inArray(users.id, wanted)) : []
  const map = new Map(rows.map((u) => [u.id, u.name]))
  return (id: string | null) => (id ? (map.get(id) ?? '—') : '—')
}

function historyOf(all: Revision[]) {
  return all.map((r) => ({
    label: r.label,
    state: r.state,
    date: day(r.issuedAt ?? r.approvedAt ?? r.checkedAt ?? r.createdAt) ?? '',
    note: STATE_LABELS[r.state],
  }))
}

function common(project: Project, calc: Calc, paper: Paper) {
  return {
    paper,
    project: { code: project.code, name: project.name, client: project.client },
    calc: { number: calc.number, title: calc.title, type: calc.calcType },
    attachments: [],
  }
}

/** Everything the report pipeline needs for one saved revision, read from the database. */
export async function loadReportPackage(revisionId: string, paper: Paper = 'A4', pending?: Partial<Revision>): Promise<ReportPackage> {
  const [stored] = await db.select().from(revisions).where(eq(revisions.id, revisionId))
  if (!stored) throw new Error(`revision ${revisionId} not found`)
  // `pending`: a state change and signature about to be written, rendered before it is committed.
  const rev = { ...stored, ...pending }
  const [calc] = await db.select().from(calcs).where(eq(calcs.id, rev.calcId))
  const [project] = await db.select().from(projects).where(eq(projects.id, calc.projectId))
  const all = await db.select().from(revisions).where(eq(revisions.calcId, calc.id)).orderBy(asc(revisions.createdAt))
  const remarks = await db.select().from(checkRemarks).where(eq(checkRemarks.revisionId, rev.id)).orderBy(asc(checkRemarks.createdAt))
  const name = await namesOf([rev.engineerId, rev.checkerId, rev.approverId, ...remarks.map((r) => r.authorId)])
  const parsed = parseCalcInput(rev.inputs)
  if (!parsed.ok) throw new Error(`stored inputs of revision ${rev.label} no longer parse: ${JSON.stringify(parsed.fieldErrors)}`)
  return {
    ...common(project, calc, paper),
    revision: {
      label: rev.label,
      state: rev.state,
      engineer: { name: name(rev.engineerId), date: day(rev.createdAt) },
      checker: { name: name(rev.checkerId), date: day(rev.checkedAt) },
      approver: { name: name(rev.approverId), date: day(rev.approvedAt) },
    },
    // Issuing this revision supersedes the one issued before, in the same transaction.
    history: historyOf(all.map((r) => (r.id === rev.id ? rev : rev.state === 'issued' && r.state === 'issued' ? { ...r, state: 'superseded' as const } : r))),
    remarks: remarks.map((r) => ({
      stepId: r.stepId,
      author: name(r.authorId),
      role: 'checker',
      text: r.response ? `${r.text} — Response: ${r.response}` : r.text,
      status: r.status,
      date: day(r.createdAt) ?? '',
    })),
    inputRows: inputRowsOf(parsed.input),
    result: rev.result as CalcResult,
    generatedAt: rev.frozenAt ?? rev.createdAt.toISOString(),
    engineVersion: rev.engineVersion,
    templateVersion: rev.templateVersion ?? TEMPLATE_VERSION,
  }
}

/** A package for the working inputs (not yet a revision): shown as a draft preview, never stored. */
export async function draftReportPackage(project: Project, calc: Calc): Promise<ReportPackage | { fieldErrors: Record<string, string> }> {
  const run = calculate(calc.draftInputs)
  if (!run.ok) return run
  const all = await db.select().from(revisions).where(eq(revisions.calcId, calc.id)).orderBy(asc(revisions.createdAt))
  const name = await namesOf([calc.engineerId])
  return {
    ...common(project, calc, 'A4'),
    revision: { label: 'working copy', state: 'draft', engineer: { name: name(calc.engineerId) }, checker: { name: '—' }, approver: { name: '—' } },
    history: historyOf(all),
    remarks: [],
    inputRows: inputRowsOf(run.input),
    result: run.result,
    generatedAt: calc.updatedAt.toISOString(),
    engineVersion: ENGINE_VERSION,
    templateVersion: TEMPLATE_VERSION,
  }
}
