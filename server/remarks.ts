import { randomUUID } from 'node:crypto'
import { and, asc, eq, inArray, ne, sql } from 'drizzle-orm'
import { db } from '@/db'
import { audit } from '@/db/audit'
import { checkRemarks, remarkReplies, revisions, users, type Revision } from '@/db/schema'
import type { CalcResult } from '@/lib/calc/run'
import { AppError } from '@/lib/errors'
import { STATES, type RemarkSeverity } from '@/lib/review/workflow'
import { authoriseCalc, type Caller } from './access'
import { notify } from './notices'

type Tx = Parameters<Parameters<typeof db.transaction>[0]>[0]

async function revisionOf(calcId: string, revisionId: string) {
  const [rev] = await db.select().from(revisions).where(and(eq(revisions.id, revisionId), eq(revisions.calcId, calcId)))
  if (!rev) throw new AppError('not_found', 'No such revision.')
  return rev
}

async function remarkOf(calcId: string, remarkId: string) {
  const [row] = await db
    .select({ remark: checkRemarks, revision: revisions })
    .from(checkRemarks)
    .innerJoin(revisions, eq(revisions.id, checkRemarks.revisionId))
    .where(and(eq(checkRemarks.id, remarkId), eq(revisions.calcId, calcId)))
  if (!row) throw new AppError('not_found', 'No such remark.')
  return row
}

function refuseSealed(rev: Revision) {
  if (STATES[rev.state].sealed) throw new AppError('conflict', `Revision ${rev.label} is ${STATES[rev.state].label.toLowerCase()}: its remarks are part of the signed record and can no longer change.`)
}

/** The anchors a remark may take: a step, a table or a figure of the revision's result. */
function anchorsOf(rev: Revision): Set<string> {
  const result = rev.result as (CalcResult & { figures?: { id: string }[] }) | null
  return new Set([...(result?.steps ?? []).map((s) => s.id), ...(result?.tables ?? []).map((t) => t.id), ...(result?.figures ?? []).map((f) => f.id)])
}

/** Remarks of one revision with their threads, oldest first. */
export async function remarksWithThreads(revisionId: string) {
  const rows = await db
    .select({
      id: checkRemarks.id,
      stepId: checkRemarks.stepId,
      severity: checkRemarks.severity,
      text: checkRemarks.text,
      status: checkRemarks.status,
      author: sql<string>`coalesce(${checkRemarks.authorName}, ${users.name})`,
      authorId: checkRemarks.authorId,
      carriedFromId: checkRemarks.carriedFromId,
      closedAt: checkRemarks.closedAt,
      createdAt: checkRemarks.createdAt,
    })
    .from(checkRemarks)
    .innerJoin(users, eq(users.id, checkRemarks.authorId))
    .where(eq(checkRemarks.revisionId, revisionId))
    .orderBy(asc(checkRemarks.createdAt))
  const replies = rows.length
    ? await db
        .select({ id: remarkReplies.id, remarkId: remarkReplies.remarkId, text: remarkReplies.text, author: sql<string>`coalesce(${remarkReplies.authorName}, ${users.name})`, createdAt: remarkReplies.createdAt })
        .from(remarkReplies)
        .innerJoin(users, eq(users.id, remarkReplies.authorId))
        .where(inArray(remarkReplies.remarkId, rows.map((r) => r.id)))
        .orderBy(asc(remarkReplies.createdAt))
    : []
  return rows.map((r) => ({ ...r, replies: replies.filter((x) => x.remarkId === r.id).map(({ remarkId: _, ...x }) => x) }))
}

export type RemarkRow = Awaited<ReturnType<typeof remarksWithThreads>>[number]

export async function listRemarks(caller: Caller | null, projectId: string, calcId: string, revisionId: string) {
  const { calc } = await authoriseCalc(caller, projectId, calcId, 'project.view')
  await revisionOf(calc.id, revisionId)
  return remarksWithThreads(revisionId)
}

/** Open remarks of a revision: how many block checking (must be resolved) and how many block approval (any). */
export async function openRemarks(revisionId: string) {
  const rows = await db
    .select({ severity: checkRemarks.severity })
    .from(checkRemarks)
    .where(and(eq(checkRemarks.revisionId, revisionId), ne(checkRemarks.status, 'closed')))
  return { mustResolve: rows.filter((r) => r.severity === 'must-resolve').length, any: rows.length }
}

/**
 * A checker's remark while the revision is in check, anchored to a step, table or figure id (kept
 * across revisions) or, without one, to the whole calc. The engineer is told.
 */
export async function addRemark(
  caller: Caller | null,
  projectId: string,
  calcId: string,
  input: { revisionId: string; stepId?: string | null; severity?: RemarkSeverity; text: string },
) {
  const { calc, caller: who } = await authoriseCalc(caller, projectId, calcId, 'remark.create')
  const rev = await revisionOf(calc.id, input.revisionId)
  if (rev.state !== 'in-check') throw new AppError('conflict', `Remarks are written while a revision is in check; revision ${rev.label} is ${STATES[rev.state].label.toLowerCase()}.`)
  const stepId = input.stepId || null
  if (stepId && !anchorsOf(rev).has(stepId)) throw new AppError('invalid', 'Unknown step.', { stepId: `Revision ${rev.label} has no step, table or figure ${stepId}.` })
  const id = randomUUID()
  await db.insert(checkRemarks).values({ id, revisionId: rev.id, stepId, severity: input.severity ?? 'must-resolve', authorId: who.id, authorName: who.name, text: input.text })
  await audit({ userId: who.id, action: 'remark.added', projectId, calcId: calc.id, detail: { revisionId: rev.id, stepId, remarkId: id } })
  await notify({ to: 'engineer', kind: 'remark', revision: rev, calc, by: who, text: `${who.name} wrote a remark on ${calc.number} rev ${rev.label}${stepId ? ` at ${stepId}` : ''}: answer it` })
  return id
}

/** A reply in a remark's thread (never overwriting earlier ones). An engineer's reply marks the remark answered. */
export async function replyToRemark(caller: Caller | null, projectId: string, calcId: string, remarkId: string, text: string) {
  const { calc, caller: who, actor } = await authoriseCalc(caller, projectId, calcId, 'remark.respond')
  const { remark, revision: rev } = await remarkOf(calc.id, remarkId)
  refuseSealed(rev)
  if (remark.status === 'closed') throw new AppError('conflict', 'This remark is closed.')
  const id = randomUUID()
  await db.transaction(async (tx) => {
    await tx.insert(remarkReplies).values({ id, remarkId, authorId: who.id, authorName: who.name, text })
    if (actor.role === 'engineer') await tx.update(checkRemarks).set({ status: 'answered' }).where(eq(checkRemarks.id, remarkId))
  })
  await audit({ userId: who.id, action: 'remark.replied', projectId, calcId: calc.id, detail: { remarkId, replyId: id } })
  await notify({
    to: actor.role === 'engineer' ? 'checker' : 'engineer',
    kind: 'reply',
    revision: rev,
    calc,
    by: who,
    text: `${who.name} replied to a remark on ${calc.number} rev ${rev.label}`,
  })
  return id
}

/** Only the checker closes a remark. */
export async function closeRemark(caller: Caller | null, projectId: string, calcId: string, remarkId: string) {
  const { calc, caller: who } = await authoriseCalc(caller, projectId, calcId, 'remark.close')
  const { remark, revision: rev } = await remarkOf(calc.id, remarkId)
  refuseSealed(rev)
  if (remark.status === 'closed') return
  await db.update(checkRemarks).set({ status: 'closed', closedBy: who.id, closedAt: new Date() }).where(eq(checkRemarks.id, remark.id))
  await audit({ userId: who.id, action: 'remark.closed', projectId, calcId: calc.id, detail: { remarkId } })
}

/**
 * Open remarks of the revisions a new revision replaces follow it, pinned to the same step ids,
 * with their threads, so they can be closed there; a step the new result no longer has leaves the
 * remark on the whole calc, with its old anchor in the text.
 */
export async function carryOverRemarks(tx: Tx, fromRevisionIds: string[], to: Revision) {
  if (fromRevisionIds.length === 0) return
  const open = await tx
    .select()
    .from(checkRemarks)
    .where(and(inArray(checkRemarks.revisionId, fromRevisionIds), ne(checkRemarks.status, 'closed')))
  const anchors = anchorsOf(to)
  for (const r of open) {
    const id = randomUUID()
    const kept = !r.stepId || anchors.has(r.stepId)
    await tx.insert(checkRemarks).values({
      id,
      revisionId: to.id,
      stepId: kept ? r.stepId : null,
      severity: r.severity,
      carriedFromId: r.id,
      authorId: r.authorId,
      authorName: r.authorName,
      text: kept ? r.text : `[was at ${r.stepId}] ${r.text}`,
      status: r.status,
      createdAt: r.createdAt,
    })
    const replies = await tx.select().from(remarkReplies).where(eq(remarkReplies.remarkId, r.id)).orderBy(asc(remarkReplies.createdAt))
    for (const reply of replies) await tx.insert(remarkReplies).values({ ...reply, id: randomUUID(), remarkId: id })
  }
}
