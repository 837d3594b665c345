import { eq } from 'drizzle-orm'
import { calculate } from '@/lib/calc/run'
import { audit } from './audit'
import { withProjectMaterials } from './materials'
import { db } from './index'
import { calcs, type Calc } from './schema'

export type DraftOutcome = { ok: true; feasible: boolean; message: string } | { ok: false; fieldErrors: Record<string, string> }

/**
 * Stores the engineer's working inputs after validating them and running the calc once, so that
 * bad input is reported at its field and never replaces what was saved before. Saved revisions are
 * never touched: the working inputs become a revision only through saveRevision.
 */
export async function saveDraftInputs(calc: Calc, raw: unknown, userId: string): Promise<DraftOutcome> {
  const values = await withProjectMaterials(calc.projectId, raw)
  const run = calculate(values)
  if (!run.ok) return run
  await db.update(calcs).set({ draftInputs: values, updatedAt: new Date() }).where(eq(calcs.id, calc.id))
  await audit({ userId, action: 'calc.inputs-saved', projectId: calc.projectId, calcId: calc.id })
  return { ok: true, feasible: run.result.feasibility.ok, message: run.result.feasibility.message }
}
