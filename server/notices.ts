import { randomUUID } from 'node:crypto'
import { and, desc, eq, isNull } from 'drizzle-orm'
import { db } from '@/db'
import { notices, projectMembers, users, type Calc, type Revision } from '@/db/schema'
import { appUrl } from '@/lib/mail/messages'
import type { Addressee } from '@/lib/review/workflow'
import { requireCaller, type Caller } from './access'
import { enqueueMail } from './mail/outbox'

/** The people a notice is addressed to: the named checker or approver, else everyone with that role. */
async function addressees(to: Addressee, calc: Calc, revision: Pick<Revision, 'engineerId' | 'assignedCheckerId' | 'assignedApproverId'> | null) {
  const members = await db
    .select({ id: users.id, email: users.email, name: users.name, role: projectMembers.role })
    .from(projectMembers)
    .innerJoin(users, eq(users.id, projectMembers.userId))
    .where(eq(projectMembers.projectId, calc.projectId))
  if (to === 'members') return members
  if (to === 'engineer') return members.filter((m) => m.id === (revision?.engineerId ?? calc.engineerId))
  const named = to === 'checker' ? revision?.assignedCheckerId : revision?.assignedApproverId
  return members.filter((m) => (named ? m.id === named : m.role === to))
}

export interface NoticeInput {
  to: Addressee
  kind: string
  calc: Calc
  revision: Pick<Revision, 'id' | 'engineerId' | 'assignedCheckerId' | 'assignedApproverId'> | null
  by: Caller
  text: string
}

/**
 * Tells whoever must act next: an entry in their in-app list and an e-mail that links straight to
 * the page to act on. The mail goes into the outbox in the same transaction as the entry, so a mail
 * server that is down or slow never fails or hangs the action, and the mail is sent once it is back.
 */
export async function notify(n: NoticeInput) {
  const people = (await addressees(n.to, n.calc, n.revision)).filter((p) => p.id !== n.by.id)
  if (people.length === 0) return
  const link = `/projects/${n.calc.projectId}/calcs/${n.calc.id}${n.revision ? `?view=${n.revision.id}` : ''}`
  await db.transaction(async (tx) => {
    await tx
      .insert(notices)
      .values(people.map((p) => ({ id: randomUUID(), userId: p.id, projectId: n.calc.projectId, calcId: n.calc.id, revisionId: n.revision?.id ?? null, kind: n.kind, text: n.text, link })))
    for (const p of people) {
      await enqueueMail(
        {
          to: p.email,
          subject: `${n.calc.number}: ${n.text}`,
          text: `${n.text}.\n\nOpen it here: ${appUrl()}${link}\n\n— Inverso\nYou receive this because you are a member of the project.`,
        },
        tx,
      )
    }
  })
}

/** The caller's in-app notices, newest first. */
export async function listNotices(caller: Caller | null, limit = 50) {
  const who = requireCaller(caller)
  return db.select().from(notices).where(eq(notices.userId, who.id)).orderBy(desc(notices.createdAt)).limit(limit)
}

export async function markNoticesRead(caller: Caller | null) {
  const who = requireCaller(caller)
  await db.update(notices).set({ readAt: new Date() }).where(and(eq(notices.userId, who.id), isNull(notices.readAt)))
}
