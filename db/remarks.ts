import { randomUUID } from 'node:crypto'
import { and, asc, eq } from 'drizzle-orm'
import type { CalcResult } from '@/lib/calc/run'
import { AppError } from '@/lib/errors'
import { audit } from './audit'
import { db } from './index'
import { checkRemarks, revisions, users, type Calc } from './schema'

async function revisionOf(calc: Calc, revisionId: string) {
  const [rev] = await db.select().from(revisions).where(and(eq(revisions.id, revisionId), eq(revisions.calcId, calc.id)))
  if (!rev) throw new AppError('not_found', 'No such revision.')
  return rev
}

/** A checker's remark, anchored to a step id so it still points at the same step in later revisions. */
export async function addRemark(calc: Calc, input: { revisionId: string; stepId: string; text: string }, userId: string) {
  const rev = await revisionOf(calc, input.revisionId)
  if (rev.state !== 'in-check') throw new AppError('conflict', `Remarks are written while a revision is in check; revision ${rev.label} is ${rev.state}.`)
  const steps = (rev.result as CalcResult | null)?.steps ?? []
  if (!steps.some((s) => s.id === input.stepId)) throw new AppError('invalid', 'Unknown step.', { stepId: `Revision ${rev.label} has no step ${input.stepId}.` })
  const id = randomUUID()
  await db.insert(checkRemarks).values({ id, revisionId: rev.id, stepId: input.stepId, authorId: userId, text: input.text })
  await audit({ userId, action: 'remark.added', projectId: calc.projectId, calcId: calc.id, detail: { revisionId: rev.id, stepId: input.stepId } })
  return id
}

async function remarkOf(calc: Calc, remarkId: string) {
  const [row] = await db
    .select({ remark: checkRemarks, calcId: revisions.calcId })
    .from(checkRemarks)
    .innerJoin(revisions, eq(revisions.id, checkRemarks.revisionId))
    .where(and(eq(checkRemarks.id, remarkId), eq(revisions.calcId, calc.id)))
  if (!row) throw new AppError('not_found', 'No such remark.')
  return row.remark
}

/** The engineer answers a remark; the checker then closes it or keeps it open. */
export async function respondToRemark(calc: Calc, remarkId: string, response: string, userId: string) {
  const remark = await remarkOf(calc, remarkId)
  if (remark.status === 'closed') throw new AppError('conflict', 'This remark is closed.')
  await db.update(checkRemarks).set({ response, status: 'answered' }).where(eq(checkRemarks.id, remark.id))
  await audit({ userId, action: 'remark.answered', projectId: calc.projectId, calcId: calc.id, detail: { remarkId } })
}

export async function closeRemark(calc: Calc, remarkId: string, userId: string) {
  const remark = await remarkOf(calc, remarkId)
  await db.update(checkRemarks).set({ status: 'closed' }).where(eq(checkRemarks.id, remark.id))
  await audit({ userId, action: 'remark.closed', projectId: calc.projectId, calcId: calc.id, detail: { remarkId } })
}

export async function listRemarks(revisionId: string) {
  return db
    .select({ id: checkRemarks.id, stepId: checkRemarks.stepId, text: checkRemarks.text, status: checkRemarks.status, response: checkRemarks.response, author: users.name, createdAt: checkRemarks.createdAt })
    .from(checkRemarks)
    .innerJoin(users, eq(users.id, checkRemarks.authorId))
    .where(eq(checkRemarks.revisionId, revisionId))
    .orderBy(asc(checkRemarks.createdAt))
}
