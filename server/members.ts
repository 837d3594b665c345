import { and, eq } from 'drizzle-orm'
import { db } from '@/db'
import { audit } from '@/db/audit'
import { listMembers as membersOf } from '@/db/queries'
import { mailTokens, projectMembers, users } from '@/db/schema'
import { AppError } from '@/lib/errors'
import { addedToProjectMail, invitationMail } from '@/lib/mail/messages'
import { ROLE_LABELS, type ProjectRole } from '@/lib/review/roles'
import { authorise, type Caller } from './access'
import { INVITE_TTL_MS } from './auth/invitations'
import { normaliseEmail } from './auth/sign-in'
import { newToken } from './auth/tokens'
import { enqueueMail } from './mail/outbox'

export async function listMembers(caller: Caller | null, projectId: string) {
  await authorise(caller, projectId, 'project.view')
  return membersOf(projectId)
}

/**
 * Admins do not sign. A site administrator manages projects and people; a signature on a calc
 * must come from someone who holds only their project role, so an admin account — the acting
 * admin's own or another's — never takes a project role (every project role signs: the engineer
 * prepares, the checker checks, the approver approves). A person who is both uses two accounts.
 */
export const ADMIN_CANNOT_SIGN = 'Site administrators do not sign calcs, so an administrator account cannot take a project role. Invite a separate, non-admin account.'

/**
 * Adds a person to a project. A known account is added at once and told by mail; a new address
 * gets an invitation link to set a password. The membership or token and its mail are written in
 * one transaction; the mail goes out through the outbox, so a mail server that is down delays it
 * but never loses it or fails the action.
 */
export async function inviteMember(caller: Caller | null, projectId: string, input: { email: string; role: ProjectRole }) {
  const { caller: who, project } = await authorise(caller, projectId, 'member.manage')
  const email = normaliseEmail(input.email)
  const [existing] = await db.select().from(users).where(eq(users.email, email))
  if (existing?.isAdmin || (who.isAdmin && email === normaliseEmail(who.email))) {
    throw new AppError('invalid', ADMIN_CANNOT_SIGN, { email: ADMIN_CANNOT_SIGN })
  }

  if (existing?.passwordHash) {
    const added = await db.transaction(async (tx) => {
      const inserted = await tx.insert(projectMembers).values({ projectId: project.id, userId: existing.id, role: input.role }).onConflictDoNothing().returning()
      if (inserted.length === 0) return false
      await enqueueMail(addedToProjectMail(email, project.name, ROLE_LABELS[input.role], who.name), tx)
      return true
    })
    if (!added) {
      const [member] = await db.select().from(projectMembers).where(and(eq(projectMembers.projectId, project.id), eq(projectMembers.userId, existing.id)))
      throw new AppError('conflict', 'This person is already a member.', { email: `Already a member as ${ROLE_LABELS[member?.role ?? input.role]}.` })
    }
    await audit({ userId: who.id, action: 'member.added', projectId: project.id, detail: { email, role: input.role } })
    return { invited: false as const }
  }

  const { token, tokenHash } = newToken()
  await db.transaction(async (tx) => {
    await tx.insert(mailTokens).values({
      tokenHash,
      kind: 'invite',
      email,
      projectId: project.id,
      role: input.role,
      createdBy: who.id,
      expiresAt: new Date(Date.now() + INVITE_TTL_MS),
    })
    await enqueueMail(invitationMail(email, token, project.name, ROLE_LABELS[input.role], who.name), tx)
  })
  await audit({ userId: who.id, action: 'member.invited', projectId: project.id, detail: { email, role: input.role } })
  return { invited: true as const, token }
}

/** Changes a member's role; signatures already on revisions keep the role they were given in. */
export async function changeMemberRole(caller: Caller | null, projectId: string, userId: string, role: ProjectRole) {
  const { caller: who } = await authorise(caller, projectId, 'member.manage')
  const [target] = await db.select({ isAdmin: users.isAdmin }).from(users).where(eq(users.id, userId))
  if (target?.isAdmin) throw new AppError('invalid', ADMIN_CANNOT_SIGN, { role: ADMIN_CANNOT_SIGN })
  const result = await db.update(projectMembers).set({ role }).where(and(eq(projectMembers.projectId, projectId), eq(projectMembers.userId, userId)))
  if (result.rowsAffected === 0) throw new AppError('not_found', 'This person is not a member of the project.')
  await audit({ userId: who.id, action: 'member.role-changed', projectId, detail: { userId, role } })
}

/** Removes a member from the project; the account and everything they signed stay. */
export async function removeMember(caller: Caller | null, projectId: string, userId: string) {
  const { caller: who } = await authorise(caller, projectId, 'member.manage')
  const result = await db.delete(projectMembers).where(and(eq(projectMembers.projectId, projectId), eq(projectMembers.userId, userId)))
  if (result.rowsAffected === 0) throw new AppError('not_found', 'This person is not a member of the project.')
  await audit({ userId: who.id, action: 'member.removed', projectId, detail: { userId } })
}
