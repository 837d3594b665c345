import { randomUUID } from 'node:crypto'
import { and, eq } from 'drizzle-orm'
import { db } from '@/db'
import { audit } from '@/db/audit'
import { mailTokens, projectMembers, users } from '@/db/schema'
import { AppError } from '@/lib/errors'
import { lucia } from './lucia'
import { hashPassword } from './password'
import { hashToken } from './tokens'

export const INVITE_TTL_MS = 7 * 24 * 3600 * 1000

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
