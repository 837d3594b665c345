import { inArray } from 'drizzle-orm'
import type { z } from 'zod'
import { db } from '@/db'
import { users, type Revision } from '@/db/schema'
import type { remarkOut, revisionOut } from '@/lib/schemas/api'
import type { RemarkRow } from './remarks'

/** API v1's JSON of a revision: no internal keys (storage paths), names instead of user ids. */
export async function revisionJson(r: Revision): Promise<z.infer<typeof revisionOut>> {
  const ids = [r.engineerId, r.checkerId, r.approverId].filter((x): x is string => !!x)
  const names = new Map((ids.length ? await db.select({ id: users.id, name: users.name }).from(users).where(inArray(users.id, ids)) : []).map((u) => [u.id, u.name]))
  const sig = (id: string | null, at: Date | null) => ({ name: id ? (names.get(id) ?? null) : null, at: at?.toISOString() ?? null })
  return {
    id: r.id,
    calcId: r.calcId,
    label: r.label,
    state: r.state,
    createdAt: r.createdAt.toISOString(),
    contentHash: r.contentHash,
    pdfHash: r.pdfHash,
    inputs: r.inputs,
    result: r.result,
    engineVersion: r.engineVersion,
    templateVersion: r.templateVersion,
    frozenAt: r.frozenAt,
    signatures: {
      engineer: sig(r.engineerId, r.createdAt),
      checker: sig(r.checkerId, r.checkedAt),
      approver: sig(r.approverId, r.approvedAt),
      issuedAt: r.issuedAt?.toISOString() ?? null,
    },
  }
}

export function remarkJson(r: RemarkRow): z.infer<typeof remarkOut> {
  return {
    id: r.id,
    stepId: r.stepId,
    severity: r.severity,
    text: r.text,
    status: r.status,
    author: r.author,
    createdAt: r.createdAt.toISOString(),
    closedAt: r.closedAt?.toISOString() ?? null,
    carriedFromId: r.carriedFromId,
    replies: r.replies.map((x) => ({ ...x, createdAt: x.createdAt.toISOString() })),
  }
}
