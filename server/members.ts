import { and, eq } from 'drizzle-orm'
import { db } from '@/db'
import { audit } from '@/db/audit'
import { listMembers as membersOf } from '@/db/queries'
import { mailTokens, projectMembers, users } from '@/db/schema'
import { AppError } from '@/lib/errors'
import { addedToProjectMail, invitationMail } from '@/lib/mail/messages'
import { sendMail } from '@/lib/mail/transport'
import { ROLE_LABELS, type ProjectRole } from '@/lib/review/roles'
import { authorise, type Caller } from './access'
import { INVITE_TTL_MS } from './auth/invitations'
import { normaliseEmail } from './auth/sign-in'
import { newToken } from './auth/tokens'

export async function listMembers(caller: Caller | null, projectId: string) {
  await authorise(caller, projectId, 'project.view')
  return membersOf(projectId)
}

/**
 * Adds a person to a project. A known account is added at once and told by mail; a new address
 * gets an invitation link to set a password.
 */
export async function inviteMember(caller: Caller | null, projectId: string, input: { email: string; role: ProjectRole }) {
  const { caller: who, project } = await authorise(caller, projectId, 'member.manage')
  const email = normaliseEmail(input.email)
  const [existing] = await db.select().from(users).where(eq(users.email, email))

  if (existing?.passwordHash) {
    const [member] = await db
      .select()
      .from(projectMembers)
      .where(and(eq(projectMembers.projectId, project.id), eq(projectMembers.userId, existing.id)))
    if (member) throw new AppError('conflict', 'This person is already a member.', { email: `Already a member as ${ROLE_LABELS[member.role]}.` })
    await db.insert(projectMembers).values({ projectId: project.id, userId: existing.id, role: input.role })
    await sendMail(addedToProjectMail(email, project.name, ROLE_LABELS[input.role], who.name))
    await audit({ userId: who.id, action: 'member.added', projectId: project.id, detail: { email, role: input.role } })
    return { invited: false as const }
  }

  const { token, tokenHash } = newToken()
  await db.insert(mailTokens).values({
    tokenHash,
    kind: 'invite',
    email,
    projectId: project.id,
    role: input.role,
    createdBy: who.id,
    expiresAt: new Date(Date.now() + INVITE_TTL_MS),
  })
  await sendMail(invitationMail(email, token, project.name, ROLE_LABELS[input.role], who.name))
  await audit({ userId: who.id, action: 'member.invited', projectId: project.id, detail: { email, role: input.role } })
  return { invited: true as const, token }
}

/** Changes a member's role; signatures already on revisions keep the role they were given in. */
export async function changeMemberRole(caller: Caller | null, projectId: string, userId: string, role: ProjectRole) {
  const { caller: who } = await authorise(caller, projectId, 'member.manage')
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
