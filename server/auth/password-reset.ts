import { and, eq, isNotNull } from 'drizzle-orm'
import { db } from '@/db'
import { audit } from '@/db/audit'
import { mailTokens, users } from '@/db/schema'
import { AppError } from '@/lib/errors'
import { passwordResetMail } from '@/lib/mail/messages'
import { enqueueMail } from '../mail/outbox'
import { consumeToken, expireOutstandingTokens } from './invitations'
import { lucia } from './lucia'
import { hashPassword } from './password'
import { normaliseEmail } from './sign-in'
import { takeAttempt, waitText } from './throttle'
import { newToken } from './tokens'

const RESET_TTL_MS = 3600 * 1000

/** Reset requests: per address 3 free an hour, then back-off; per source 10, then back-off. */
export const RESET_LIMITS = {
  account: { free: 3, maxDelayMs: 60 * 60_000 },
  source: { free: 10, maxDelayMs: 60 * 60_000 },
} as const

/**
 * Every request takes at least this long, whether or not an account uses the address, so the
 * answer's timing tells nothing (the work itself takes a few ms either way: the mail goes through
 * the outbox).
 */
export const RESET_MIN_MS = 250

/**
 * Mails a reset link if an active account uses the address; says and costs the same either way.
 * A new link ends the older ones of the address.
 */
export async function requestPasswordReset(rawEmail: string, ctx: { source: string }): Promise<void> {
  const started = Date.now()
  try {
    const email = normaliseEmail(rawEmail)
    const attempt = await takeAttempt([
      { key: `reset:account:${email}`, ...RESET_LIMITS.account },
      { key: `reset:source:${ctx.source}`, ...RESET_LIMITS.source },
    ])
    if (!attempt.ok) {
      const message = `Too many reset requests. Try again in ${waitText(attempt.retryAfterMs)}.`
      throw new AppError('rate_limited', message, { email: message })
    }
    const { token, tokenHash } = newToken()
    await db.transaction(async (tx) => {
      const [user] = await tx.select({ id: users.id }).from(users).where(and(eq(users.email, email), isNotNull(users.passwordHash)))
      if (!user) return
      await expireOutstandingTokens(tx, email, 'reset')
      await tx.insert(mailTokens).values({ tokenHash, kind: 'reset', email, expiresAt: new Date(Date.now() + RESET_TTL_MS) })
      await enqueueMail(passwordResetMail(email, token), tx)
    })
  } finally {
    const left = started + RESET_MIN_MS - Date.now()
    if (left > 0) await new Promise((r) => setTimeout(r, left))
  }
}

/** Sets a new password with a reset link (used once, atomically), ends every session of the account and opens a new one. */
export async function resetPassword(token: string, password: string) {
  const passwordHash = await hashPassword(password)
  const userId = await db.transaction(async (tx) => {
    const { row } = await consumeToken(tx, token, 'reset')
    const [user] = await tx.update(users).set({ passwordHash }).where(eq(users.email, row.email)).returning({ id: users.id })
    if (!user) throw new AppError('not_found', 'No account uses this address any more.')
    return user.id
  })
  // A reset ends every other session of the account.
  await lucia.invalidateUserSessions(userId)
  await audit({ userId, action: 'password.reset' })
  const session = await lucia.createSession(userId, {})
  return { session, cookie: lucia.createSessionCookie(session.id) }
}
