import { eq } from 'drizzle-orm'
import { db } from '@/db'
import { listRevisions } from '@/db/queries'
import { calcs, type Calc } from '@/db/schema'
import { calculate } from '@/lib/calc/run'
import { AppError } from '@/lib/errors'
import { authoriseCalc, type Caller } from './access'
import { pendingAttachments } from './attachments'
import { listMaterials } from './materials'
import { listRemarks } from './remarks'
import { draftReportPackage, loadReportPackage } from './report-package'

/** Calcs saved before the working result was stored with the inputs get it on first view, once. */
async function withWorkingResult(calc: Calc): Promise<Calc> {
  if (calc.draftResult || !calc.draftInputs) return calc
  const run = calculate(calc.draftInputs)
  if (!run.ok) return calc
  await db.update(calcs).set({ draftResult: run.result }).where(eq(calcs.id, calc.id))
  return { ...calc, draftResult: run.result }
}

/**
 * Everything the calc page shows: the calc, its revisions, the package of the revision asked for
 * (`view` = a revision id, or 'working' for the working inputs; by default the newest revision),
 * its remarks, pending appendices and the project's materials.
 */
export async function getCalcWorkspace(caller: Caller | null, projectId: string, calcId: string, view?: string) {
  const access = await authoriseCalc(caller, projectId, calcId, 'project.view')
  const calc = await withWorkingResult(access.calc)
  const revisions = await listRevisions(calcId)
  if (view && view !== 'working' && !revisions.some((r) => r.id === view)) throw new AppError('not_found', 'No such revision.')
  const shown = view === 'working' || revisions.length === 0 ? null : (revisions.find((r) => r.id === view) ?? revisions[0])
  const [pkg, remarks, pending, materials] = await Promise.all([
    shown ? loadReportPackage(shown.id) : draftReportPackage(access.project, calc),
    shown ? listRemarks(caller, projectId, calcId, shown.id) : [],
    pendingAttachments(caller, projectId, calcId),
    listMaterials(caller, projectId),
  ])
  return { ...access, calc, revisions, shown, pkg, remarks, pending, materials }
}
