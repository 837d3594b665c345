import { and, eq, inArray, isNull, or } from 'drizzle-orm'
import { db } from '@/db'
import { calcs, checkRemarks, notices, projectMembers, projects, revisions } from '@/db/schema'
import type { RevisionState } from '@/lib/review/workflow'
import { requireCaller, type Caller } from './access'

export interface TodoItem {
  kind: 'check' | 'approve' | 'issue' | 'returned' | 'answer' | 'review-answers'
  label: string
  project: string
  calc: string
  revision: string
  count?: number
  link: string
}

const ROLE_ACTS: Record<string, { role: 'checker' | 'approver'; state: RevisionState; kind: TodoItem['kind']; label: string }[]> = {
  checker: [{ role: 'checker', state: 'in-check', kind: 'check', label: 'to check' }],
  approver: [
    { role: 'approver', state: 'checked', kind: 'approve', label: 'to approve' },
    { role: 'approver', state: 'approved', kind: 'issue', label: 'to issue' },
  ],
}

/**
 * What waits for the caller across their projects: revisions to check, approve or issue (where
 * they are the person named, or nobody was named and they hold the role), revisions returned to
 * them, remarks to answer and answers to review.
 */
export async function todoFor(caller: Caller | null): Promise<TodoItem[]> {
  const who = requireCaller(caller)
  const memberships = await db.select({ projectId: projectMembers.projectId, role: projectMembers.role }).from(projectMembers).where(eq(projectMembers.userId, who.id))
  if (memberships.length === 0) return []
  const open = await db
    .select({ rev: revisions, calcId: calcs.id, number: calcs.number, title: calcs.title, projectId: calcs.projectId, project: projects.code })
    .from(revisions)
    .innerJoin(calcs, eq(calcs.id, revisions.calcId))
    .innerJoin(projects, eq(projects.id, calcs.projectId))
    .where(and(inArray(calcs.projectId, memberships.map((m) => m.projectId)), inArray(revisions.state, ['in-check', 'returned', 'checked', 'approved'])))
  const roleIn = new Map(memberships.map((m) => [m.projectId, m.role]))
  const items: TodoItem[] = []
  const item = (o: (typeof open)[number], kind: TodoItem['kind'], label: string, count?: number): TodoItem => ({
    kind,
    label,
    project: o.project,
    calc: `${o.number} ${o.title}`,
    revision: o.rev.label,
    count,
    link: `/projects/${o.projectId}/calcs/${o.calcId}?view=${o.rev.id}`,
  })
  const remarks = open.length
    ? await db
        .select({ revisionId: checkRemarks.revisionId, status: checkRemarks.status })
        .from(checkRemarks)
        .where(and(inArray(checkRemarks.revisionId, open.map((o) => o.rev.id)), or(eq(checkRemarks.status, 'open'), eq(checkRemarks.status, 'answered'))))
    : []
  for (const o of open) {
    const role = roleIn.get(o.projectId)
    for (const act of ROLE_ACTS[role ?? ''] ?? []) {
      const named = act.role === 'checker' ? o.rev.assignedCheckerId : o.rev.assignedApproverId
      if (o.rev.state === act.state && (named ? named === who.id : true)) items.push(item(o, act.kind, act.label))
    }
    if (o.rev.engineerId === who.id) {
      if (o.rev.state === 'returned') items.push(item(o, 'returned', 'returned to you'))
      const toAnswer = remarks.filter((r) => r.revisionId === o.rev.id && r.status === 'open').length
      if (toAnswer) items.push(item(o, 'answer', toAnswer === 1 ? 'remark to answer' : 'remarks to answer', toAnswer))
    }
    if (role === 'checker' && (!o.rev.assignedCheckerId || o.rev.assignedCheckerId === who.id)) {
      const answered = remarks.filter((r) => r.revisionId === o.rev.id && r.status === 'answered').length
      if (answered) items.push(item(o, 'review-answers', answered === 1 ? 'answer to review' : 'answers to review', answered))
    }
  }
  return items
}

/** Unread in-app notices, for the count in the navigation. */
export async function unreadNoticeCount(caller: Caller): Promise<number> {
  const rows = await db.select({ id: notices.id }).from(notices).where(and(eq(notices.userId, caller.id), isNull(notices.readAt)))
  return rows.length
}
