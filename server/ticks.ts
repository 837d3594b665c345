import { and, asc, eq, sql } from 'drizzle-orm'
import { db } from '@/db'
import { audit } from '@/db/audit'
import { revisions, stepTicks, users } from '@/db/schema'
import type { CalcResult } from '@/lib/calc/run'
import { AppError } from '@/lib/errors'
import { authoriseCalc, type Caller } from './access'

export async function ticksOf(revisionId: string) {
  return db
    .select({ stepId: stepTicks.stepId, by: sql<string>`coalesce(${stepTicks.userName}, ${users.name})`, userId: stepTicks.userId, at: stepTicks.at })
    .from(stepTicks)
    .innerJoin(users, eq(users.id, stepTicks.userId))
    .where(eq(stepTicks.revisionId, revisionId))
    .orderBy(asc(stepTicks.at))
}

/** The checker ticks a step as verified (or takes the tick back) while the revision is in check. */
export async function setTick(caller: Caller | null, projectId: string, calcId: string, revisionId: string, stepId: string, ticked: boolean) {
  const { calc, caller: who } = await authoriseCalc(caller, projectId, calcId, 'calc.check')
  const [rev] = await db.select().from(revisions).where(and(eq(revisions.id, revisionId), eq(revisions.calcId, calc.id)))
  if (!rev) throw new AppError('not_found', 'No such revision.')
  if (rev.state !== 'in-check') throw new AppError('conflict', `Steps are ticked while a revision is in check; revision ${rev.label} is not.`)
  if (rev.assignedCheckerId && rev.assignedCheckerId !== who.id) throw new AppError('forbidden', `Only the checker named for revision ${rev.label} ticks its steps.`)
  if (!((rev.result as CalcResult | null)?.steps ?? []).some((s) => s.id === stepId)) throw new AppError('not_found', `Revision ${rev.label} has no step ${stepId}.`)
  if (ticked) {
    await db.insert(stepTicks).values({ revisionId, stepId, userId: who.id, userName: who.name, at: new Date() }).onConflictDoNothing()
  } else {
    await db.delete(stepTicks).where(and(eq(stepTicks.revisionId, revisionId), eq(stepTicks.stepId, stepId)))
  }
  await audit({ userId: who.id, action: ticked ? 'step.ticked' : 'step.unticked', projectId, calcId: calc.id, detail: { revisionId, stepId } })
  return ticksOf(revisionId)
}

export async function listTicks(caller: Caller | null, projectId: string, calcId: string, revisionId: string) {
  const { calc } = await authoriseCalc(caller, projectId, calcId, 'project.view')
  const [rev] = await db.select({ id: revisions.id }).from(revisions).where(and(eq(revisions.id, revisionId), eq(revisions.calcId, calc.id)))
  if (!rev) throw new AppError('not_found', 'No such revision.')
  return ticksOf(revisionId)
}
