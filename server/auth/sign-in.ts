import { randomBytes } from 'node:crypto'
import { eq } from 'drizzle-orm'
import { db } from '@/db'
import { signInDevices, users } from '@/db/schema'
import { AppError } from '@/lib/errors'
import { lucia } from './lucia'
import { hashPassword, verifyPassword } from './password'
import { settleAttempt, takeAttempt, waitText, type Limit } from './throttle'
import { hashToken } from './tokens'

export function normaliseEmail(email: string): string {
  return email.trim().toLowerCase()
}

/** The one refusal for an unknown address, an account without a password yet, and a wrong password. */
export const SIGN_IN_REFUSED = 'E-mail or password is wrong.'

/**
 * The limits one sign-in attempt counts against (see throttle.ts for the back-off):
 * - this address from this source: 5 free tries, then 1 s, 2 s, 4 s … up to 15 min;
 * - this source, any address (one host trying many accounts): 20 free, then the same back-off;
 * - this address, any source (an attack spread over many hosts): 20 free, up to 15 min — but a
 *   browser that signed in to the account before (its device cookie) is exempt, so the owner is
 *   never locked out by someone else's failures.
 */
export const SIGN_IN_LIMITS = {
  accountAndSource: { free: 5, maxDelayMs: 15 * 60_000 },
  source: { free: 20, maxDelayMs: 15 * 60_000 },
  account: { free: 20, maxDelayMs: 15 * 60_000 },
} as const

export const DEVICE_COOKIE = 'inverso_device'
const DEVICE_MAX_AGE_S = 400 * 24 * 3600

export interface SignInContext {
  /** The client address (server/auth/client-address.ts). */
  source: string
  /** The device cookie this browser sent, if any. */
  deviceToken?: string | null
  /** The session cookie this browser still had: ended on success, so a sign-in never leaves an old session valid. */
  previousSessionId?: string | null
}

// Verified against when there is no hash to check, so an unknown address costs what a known one does.
let dummyHash: Promise<string> | undefined
function dummy(): Promise<string> {
  dummyHash ??= hashPassword(randomBytes(16).toString('hex'))
  return dummyHash
}
dummy().catch(() => undefined)

async function deviceKnownFor(email: string, token: string | null | undefined): Promise<boolean> {
  if (!token) return false
  const [row] = await db
    .select({ email: users.email })
    .from(signInDevices)
    .innerJoin(users, eq(users.id, signInDevices.userId))
    .where(eq(signInDevices.tokenHash, hashToken(token)))
  return row?.email === email
}

function limitsFor(email: string, source: string, deviceKnown: boolean): { all: Limit[]; pair: string; shared: string[] } {
  const pair = `sign-in:account+source:${email}|${source}`
  const bySource = `sign-in:source:${source}`
  const byAccount = `sign-in:account:${email}`
  const all: Limit[] = [
    { key: pair, ...SIGN_IN_LIMITS.accountAndSource },
    { key: bySource, ...SIGN_IN_LIMITS.source },
    ...(deviceKnown ? [] : [{ key: byAccount, ...SIGN_IN_LIMITS.account }]),
  ]
  return { all, pair, shared: all.slice(1).map((l) => l.key) }
}

/**
 * Checks the credentials and opens a session. Every refusal reads the same and costs one argon2
 * verification; the limits are counted before the password is checked, atomically.
 */
export async function signIn(rawEmail: string, password: string, ctx: SignInContext) {
  const email = normaliseEmail(rawEmail)
  const deviceKnown = await deviceKnownFor(email, ctx.deviceToken)
  const { all, pair, shared } = limitsFor(email, ctx.source, deviceKnown)
  const attempt = await takeAttempt(all)
  if (!attempt.ok) {
    const message = `Too many failed sign-ins. Try again in ${waitText(attempt.retryAfterMs)}.`
    throw new AppError('rate_limited', message, { password: message })
  }

  const [user] = await db.select().from(users).where(eq(users.email, email))
  const matches = await verifyPassword(user?.passwordHash ?? (await dummy()), password)
  if (!user?.passwordHash || !matches) throw new AppError('invalid', SIGN_IN_REFUSED, { password: SIGN_IN_REFUSED })

  // The owner got in: this pair starts afresh, and the shared counters do not hold the success against others.
  await settleAttempt({ reset: [pair], undo: shared })
  let device: { name: string; value: string; attributes: object } | undefined
  if (!deviceKnown) {
    const token = randomBytes(32).toString('base64url')
    await db.insert(signInDevices).values({ tokenHash: hashToken(token), userId: user.id, lastUsedAt: new Date() })
    device = { name: DEVICE_COOKIE, value: token, attributes: { httpOnly: true, sameSite: 'lax', path: '/', maxAge: DEVICE_MAX_AGE_S, secure: (process.env.APP_URL ?? '').startsWith('https://') } }
  } else if (ctx.deviceToken) {
    await db.update(signInDevices).set({ lastUsedAt: new Date() }).where(eq(signInDevices.tokenHash, hashToken(ctx.deviceToken)))
  }
  await endSession(ctx.previousSessionId)
  const session = await lucia.createSession(user.id, {})
  return { session, cookie: lucia.createSessionCookie(session.id), device }
}

/** Ends one session (the one a browser had before signing in again, or signing out). */
export async function endSession(sessionId: string | undefined | null): Promise<void> {
  if (sessionId) await lucia.invalidateSession(sessionId)
}

