import { and, eq } from 'drizzle-orm'
import { db } from '@/db'
import { listMembers, listRevisions } from '@/db/queries'
import { calcs, revisions, type Calc } from '@/db/schema'
import { calculate, parseCalcInput, type CalcResult } from '@/lib/calc/run'
import { memoryValuesIn } from '@/lib/checks/memory-values'
import { AppError } from '@/lib/errors'
import { authoriseCalc, type Caller } from './access'
import { pendingAttachments } from './attachments'
import { listMaterials } from './materials'
import { openRemarks, remarksWithThreads } from './remarks'
import { renderStatus } from './render-jobs'
import { draftReportPackage, loadReportPackage } from './report-package'
import { ticksOf } from './ticks'

/** Calcs saved before the working result was stored with the inputs get it on first view, once. */
async function withWorkingResult(calc: Calc): Promise<Calc> {
  if (calc.draftResult || !calc.draftInputs) return calc
  const run = calculate(calc.draftInputs)
  if (!run.ok) return calc
  await db.update(calcs).set({ draftResult: run.result }).where(eq(calcs.id, calc.id))
  return { ...calc, draftResult: run.result }
}

function preparingText(job: { state: string; stage: string | null; error: string | null } | undefined): string {
  if (!job) return 'Preparing the package…'
  if (job.state === 'failed') return `The package could not be prepared (${job.error ?? 'unknown error'}). Save the revision again, or tell an administrator.`
  return `Preparing the package… ${job.stage ?? 'waiting for the renderer'}`
}

/** The package of the revision asked for (`view` as for the page), or null when the working inputs have errors. */
export async function getCalcPackage(caller: Caller | null, projectId: string, calcId: string, view?: string) {
  const access = await authoriseCalc(caller, projectId, calcId, 'project.view')
  const calc = await withWorkingResult(access.calc)
  if (view && view !== 'working') {
    const [rev] = await db.select({ id: revisions.id }).from(revisions).where(and(eq(revisions.calcId, calc.id), eq(revisions.id, view)))
    if (!rev) throw new AppError('not_found', 'No such revision.')
    return loadReportPackage(rev.id)
  }
  const [newest] = view ? [] : await listRevisions(calc.id)
  return newest ? loadReportPackage(newest.id) : draftReportPackage(access.project, calc)
}

/**
 * Everything the calc page shows: the calc, its revisions (with what blocks each), the package of
 * the revision asked for's result (`view` = a revision id, or 'working' for the working inputs; by default
 * the newest revision), its remarks with threads and its ticks, pending appendices, the project's
 * materials and the people who can be named checker and approver.
 */
export async function getCalcWorkspace(caller: Caller | null, projectId: string, calcId: string, view?: string) {
  const access = await authoriseCalc(caller, projectId, calcId, 'project.view')
  const calc = await withWorkingResult(access.calc)
  const [revisions, members] = await Promise.all([listRevisions(calcId), listMembers(projectId)])
  if (view && view !== 'working' && !revisions.some((r) => r.id === view)) throw new AppError('not_found', 'No such revision.')
  const shown = view === 'working' || revisions.length === 0 ? null : (revisions.find((r) => r.id === view) ?? revisions[0])
  // The result whose steps the page numbers (remarks and ticks refer to them); the package itself is fetched when asked for.
  const result = shown ? (shown.result as CalcResult) : parseCalcInput(calc.draftInputs).ok ? (calc.draftResult as CalcResult | null) : null
  const [remarks, ticks, pending, materials, blockers, renders] = await Promise.all([
    shown ? remarksWithThreads(shown.id) : [],
    shown ? ticksOf(shown.id) : [],
    pendingAttachments(caller, projectId, calcId),
    listMaterials(caller, projectId),
    Promise.all(revisions.map((r) => openRemarks(r.id))),
    renderStatus(revisions.filter((r) => !r.pdfKey).map((r) => r.id)),
  ])
  const name = (id: string | null) => (id ? (members.find((m) => m.userId === id)?.name ?? '—') : null)
  const people = (role: string) => members.filter((m) => m.role === role && m.active).map((m) => ({ id: m.userId, name: m.name }))
  // A new revision goes to whoever signed off the last one by default (or the only one there is).
  const suggested = (list: { id: string }[], last: string | null | undefined) => (list.some((p) => p.id === last) ? last! : list.length === 1 ? list[0].id : '')
  const checkers = people('checker')
  const approvers = people('approver')
  const working = calc.draftResult as CalcResult | null
  return {
    ...access,
    calc,
    shown,
    result,
    remarks,
    ticks,
    pending,
    materials,
    checkers,
    approvers,
    suggestedChecker: suggested(checkers, revisions[0]?.assignedCheckerId ?? revisions[0]?.checkerId),
    suggestedApprover: suggested(approvers, revisions[0]?.assignedApproverId ?? revisions[0]?.approverId),
    workingFails: working && working.feasibility.ok && !working.verdict.pass ? working.verdict.governing : null,
    revisions: revisions.map((r, i) => ({
      ...r,
      assignedChecker: name(r.assignedCheckerId),
      assignedApprover: name(r.assignedApproverId),
      openRemarks: blockers[i],
      memoryValues: r.state === 'approved' ? memoryValuesIn(r.inputs) : [],
      /** While the package is rendered off the request path: what the job is doing, or why it failed. */
      preparing: r.pdfKey ? null : preparingText(renders.get(r.id)),
    })),
  }
}
