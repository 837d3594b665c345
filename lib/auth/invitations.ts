import { randomUUID } from 'node:crypto'
import { and, eq } from 'drizzle-orm'
import { db } from '@/db'
import { audit } from '@/db/audit'
import { mailTokens, projectMembers, projects, users } from '@/db/schema'
import { AppError } from '@/lib/errors'
import { addedToProjectMail, invitationMail } from '@/lib/mail/messages'
import { sendMail } from '@/lib/mail/transport'
import { ROLE_LABELS, type ProjectRole } from '@/lib/review/roles'
import { lucia } from './lucia'
import { hashPassword } from './password'
import { normaliseEmail } from './sign-in'
import { hashToken, newToken } from './tokens'

export const INVITE_TTL_MS = 7 * 24 * 3600 * 1000

/**
 * Adds a person to a project. A known account is added at once and told by mail; a new address
 * gets an invitation link to set a password.
 */
export async function inviteMember(input: { projectId: string; email: string; role: ProjectRole; invitedBy: { id: string; name: string } }) {
  const email = normaliseEmail(input.email)
  const [project] = await db.select().from(projects).where(eq(projects.id, input.projectId))
  if (!project) throw new AppError('not_found', 'Project not found.')
  const [existing] = await db.select().from(users).where(eq(users.email, email))

  if (existing?.passwordHash) {
    const [member] = await db
      .select()
      .from(projectMembers)
      .where(and(eq(projectMembers.projectId, project.id), eq(projectMembers.userId, existing.id)))
    if (member) throw new AppError('conflict', 'This person is already a member.', { email: `Already a member as ${ROLE_LABELS[member.role]}.` })
    await db.insert(projectMembers).values({ projectId: project.id, userId: existing.id, role: input.role })
    await sendMail(addedToProjectMail(email, project.name, ROLE_LABELS[input.role], input.invitedBy.name))
    await audit({ userId: input.invitedBy.id, action: 'member.added', projectId: project.id, detail: { email, role: input.role } })
    return { invited: false as const }
  }

  const { token, tokenHash } = newToken()
  await db.insert(mailTokens).values({
    tokenHash,
    kind: 'invite',
    email,
    projectId: project.id,
    role: input.role,
    createdBy: input.invitedBy.id,
    expiresAt: new Date(Date.now() + INVITE_TTL_MS),
  })
  await sendMail(invitationMail(email, token, project.name, ROLE_LABELS[input.role], input.invitedBy.name))
  await audit({ userId: input.invitedBy.id, action: 'member.invited', projectId: project.id, detail: { email, role: input.role } })
  return { invited: true as const, token }
}

/** Finds a usable token or explains why it is not usable. */
export async function findToken(token: string, kind: 'invite' | 'reset') {
  const [row] = await db
    .select()
    .from(mailTokens)
    .where(and(eq(mailTokens.tokenHash, hashToken(token)), eq(mailTokens.kind, kind)))
  if (!row) throw new AppError('not_found', 'This link is not valid. Ask for a new one.')
  if (row.usedAt) throw new AppError('invalid', 'This link has already been used. Sign in, or ask for a new link.')
  if (row.expiresAt.getTime() < Date.now()) throw new AppError('invalid', 'This link has expired. Ask your administrator for a new invitation.')
  return row
}

export async function acceptInvitation(input: { token: string; name: string; password: string }) {
  const row = await findToken(input.token, 'invite')
  const passwordHash = await hashPassword(input.password)
  const [existing] = await db.select().from(users).where(eq(users.email, row.email))
  const userId = existing?.id ?? randomUUID()
  await db.transaction(async (tx) => {
    if (existing) await tx.update(users).set({ name: input.name, passwordHash }).where(eq(users.id, userId))
    else await tx.insert(users).values({ id: userId, email: row.email, name: input.name, passwordHash })
    if (row.projectId && row.role) {
      await tx.insert(projectMembers).values({ projectId: row.projectId, userId, role: row.role }).onConflictDoNothing()
    }
    await tx.update(mailTokens).set({ usedAt: new Date() }).where(eq(mailTokens.tokenHash, row.tokenHash))
  })
  await audit({ userId, action: 'member.joined', projectId: row.projectId, detail: { email: row.email } })
  const session = await lucia.createSession(userId, {})
  return { session, cookie: lucia.createSessionCookie(session.id) }
}
