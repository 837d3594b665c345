import { eq } from 'drizzle-orm'
import { db } from '@/db'
import { audit } from '@/db/audit'
import { mailTokens, users } from '@/db/schema'
import { passwordResetMail } from '@/lib/mail/messages'
import { sendMail } from '@/lib/mail/transport'
import { findToken } from './invitations'
import { lucia } from './lucia'
import { hashPassword } from './password'
import { normaliseEmail } from './sign-in'
import { newToken } from './tokens'

const RESET_TTL_MS = 3600 * 1000

/** Sends a reset link if the account exists; says the same either way so addresses can't be probed here. */
export async function requestPasswordReset(rawEmail: string): Promise<void> {
  const email = normaliseEmail(rawEmail)
  const [user] = await db.select().from(users).where(eq(users.email, email))
  if (!user?.passwordHash) return
  const { token, tokenHash } = newToken()
  await db.insert(mailTokens).values({ tokenHash, kind: 'reset', email, expiresAt: new Date(Date.now() + RESET_TTL_MS) })
  await sendMail(passwordResetMail(email, token))
}

export async function resetPassword(token: string, password: string) {
  const row = await findToken(token, 'reset')
  const [user] = await db.select().from(users).where(eq(users.email, row.email))
  if (!user) throw new Error(`reset token for missing user ${row.email}`)
  await db.update(users).set({ passwordHash: await hashPassword(password) }).where(eq(users.id, user.id))
  await db.update(mailTokens).set({ usedAt: new Date() }).where(eq(mailTokens.tokenHash, row.tokenHash))
  // A reset ends every other session of the account.
  await lucia.invalidateUserSessions(user.id)
  await audit({ userId: user.id, action: 'password.reset' })
  const session = await lucia.createSession(user.id, {})
  return { session, cookie: lucia.createSessionCookie(session.id) }
}
