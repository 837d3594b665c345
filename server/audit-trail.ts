import { and, asc, eq, type SQL } from 'drizzle-orm'
import { db } from '@/db'
import { auditEvents, calcs, users } from '@/db/schema'
import { authorise, authoriseCalc, type Caller } from './access'

const ACTION_LABELS: Record<string, string> = {
  'calc.created': 'created the calc',
  'calc.inputs-saved': 'saved the working inputs',
  'revision.saved': 'saved a revision for check',
  'revision.return': 'returned the revision',
  'revision.resubmit': 'resubmitted the revision',
  'revision.check': 'signed as checked',
  'revision.approve': 'signed as approved',
  'revision.issue': 'issued the revision',
  'revision.withdraw': 'withdrew the revision',
  'revision.void': 'voided the revision',
  'remark.added': 'wrote a remark',
  'remark.replied': 'replied to a remark',
  'remark.closed': 'closed a remark',
  'step.ticked': 'ticked a step',
  'step.unticked': 'took back a tick',
  'pdf.downloaded': 'downloaded the issued package',
  'attachment.added': 'added an appendix',
  'material.added': 'added a project material',
  'member.added': 'added a member',
  'member.invited': 'invited a member',
  'member.role-changed': 'changed a member’s role',
  'member.removed': 'removed a member',
  'project.created': 'created the project',
}

async function rows(where: SQL) {
  const out = await db
    .select({ at: auditEvents.at, who: users.name, action: auditEvents.action, calc: calcs.number, detail: auditEvents.detail })
    .from(auditEvents)
    .leftJoin(users, eq(users.id, auditEvents.userId))
    .leftJoin(calcs, eq(calcs.id, auditEvents.calcId))
    .where(where)
    .orderBy(asc(auditEvents.at), asc(auditEvents.id))
  return out.map((r) => ({ at: r.at.toISOString(), who: r.who ?? '—', action: r.action, what: ACTION_LABELS[r.action] ?? r.action, calc: r.calc, detail: (r.detail ?? {}) as Record<string, unknown> }))
}

export type AuditRow = Awaited<ReturnType<typeof rows>>[number]

/** Everything that happened to one calc: transitions, remarks, replies, ticks, signatures, confirmations, downloads. */
export async function calcAuditTrail(caller: Caller | null, projectId: string, calcId: string) {
  const { calc } = await authoriseCalc(caller, projectId, calcId, 'project.view')
  return rows(eq(auditEvents.calcId, calc.id))
}

export async function projectAuditTrail(caller: Caller | null, projectId: string) {
  await authorise(caller, projectId, 'project.view')
  return rows(and(eq(auditEvents.projectId, projectId))!)
}

const cell = (v: unknown) => {
  const s = typeof v === 'string' ? v : v === null || v === undefined ? '' : JSON.stringify(v)
  // Quote every cell; a leading = + - @ is defused so a spreadsheet does not run it as a formula (common practice).
  return `"${(/^[=+\-@]/.test(s) ? `'${s}` : s).replace(/"/g, '""')}"`
}

export function auditCsv(list: AuditRow[]): string {
  const head = ['when (UTC)', 'who', 'calc', 'what', 'action', 'detail']
  return [head, ...list.map((r) => [r.at, r.who, r.calc ?? '', r.what, r.action, r.detail])].map((row) => row.map(cell).join(',')).join('\r\n') + '\r\n'
}
