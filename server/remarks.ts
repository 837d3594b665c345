import { randomUUID } from 'node:crypto'
import { and, asc, eq } from 'drizzle-orm'
import { db } from '@/db'
import { audit } from '@/db/audit'
import { checkRemarks, revisions, users } from '@/db/schema'
import type { CalcResult } from '@/lib/calc/run'
import { AppError } from '@/lib/errors'
import { authoriseCalc, type Caller } from './access'

async function revisionOf(calcId: string, revisionId: string) {
  const [rev] = await db.select().from(revisions).where(and(eq(revisions.id, revisionId), eq(revisions.calcId, calcId)))
  if (!rev) throw new AppError('not_found', 'No such revision.')
  return rev
}

async function remarkOf(calcId: string, remarkId: string) {
  const [row] = await db
    .select({ remark: checkRemarks })
    .from(checkRemarks)
    .innerJoin(revisions, eq(revisions.id, checkRemarks.revisionId))
    .where(and(eq(checkRemarks.id, remarkId), eq(revisions.calcId, calcId)))
  if (!row) throw new AppError('not_found', 'No such remark.')
  return row.remark
}

function remarksOf(revisionId: string) {
  return db
    .select({
      id: checkRemarks.id,
      stepId: checkRemarks.stepId,
      text: checkRemarks.text,
      status: checkRemarks.status,
      response: checkRemarks.response,
      author: users.name,
      createdAt: checkRemarks.createdAt,
    })
    .from(checkRemarks)
    .innerJoin(users, eq(users.id, checkRemarks.authorId))
    .where(eq(checkRemarks.revisionId, revisionId))
    .orderBy(asc(checkRemarks.createdAt))
}

export type RemarkRow = Awaited<ReturnType<typeof remarksOf>>[number]

export async function listRemarks(caller: Caller | null, projectId: string, calcId: string, revisionId: string) {
  const { calc } = await authoriseCalc(caller, projectId, calcId, 'project.view')
  await revisionOf(calc.id, revisionId)
  return remarksOf(revisionId)
}

/** A checker's remark, anchored to a step id so it still points at the same step in later revisions. */
export async function addRemark(caller: Caller | null, projectId: string, calcId: string, input: { revisionId: string; stepId: string; text: string }) {
  const { calc, caller: who } = await authoriseCalc(caller, projectId, calcId, 'remark.create')
  const rev = await revisionOf(calc.id, input.revisionId)
  if (rev.state !== 'in-check') throw new AppError('conflict', `Remarks are written while a revision is in check; revision ${rev.label} is ${rev.state}.`)
  const steps = (rev.result as CalcResult | null)?.steps ?? []
  if (!steps.some((s) => s.id === input.stepId)) throw new AppError('invalid', 'Unknown step.', { stepId: `Revision ${rev.label} has no step ${input.stepId}.` })
  const id = randomUUID()
  await db.insert(checkRemarks).values({ id, revisionId: rev.id, stepId: input.stepId, authorId: who.id, text: input.text })
  await audit({ userId: who.id, action: 'remark.added', projectId, calcId: calc.id, detail: { revisionId: rev.id, stepId: input.stepId } })
  return id
}

/** The engineer answers a remark; the checker then closes it or keeps it open. */
export async function respondToRemark(caller: Caller | null, projectId: string, calcId: string, remarkId: string, response: string) {
  const { calc, caller: who } = await authoriseCalc(caller, projectId, calcId, 'remark.respond')
  const remark = await remarkOf(calc.id, remarkId)
  if (remark.status === 'closed') throw new AppError('conflict', 'This remark is closed.')
  await db.update(checkRemarks).set({ response, status: 'answered' }).where(eq(checkRemarks.id, remark.id))
  await audit({ userId: who.id, action: 'remark.answered', projectId, calcId: calc.id, detail: { remarkId } })
}

export async function closeRemark(caller: Caller | null, projectId: string, calcId: string, remarkId: string) {
  const { calc, caller: who } = await authoriseCalc(caller, projectId, calcId, 'remark.close')
  const remark = await remarkOf(calc.id, remarkId)
  await db.update(checkRemarks).set({ status: 'closed' }).where(eq(checkRemarks.id, remark.id))
  await audit({ userId: who.id, action: 'remark.closed', projectId, calcId: calc.id, detail: { remarkId } })
}
