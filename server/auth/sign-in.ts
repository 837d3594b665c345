import { and, eq, gt, sql } from 'drizzle-orm'
import { db } from '@/db'
import { signInFailures, users } from '@/db/schema'
import { AppError } from '@/lib/errors'
import { lucia } from './lucia'
import { verifyPassword } from './password'

export const MAX_FAILURES = 5
export const FAILURE_WINDOW_MS = 15 * 60 * 1000

export function normaliseEmail(email: string): string {
  return email.trim().toLowerCase()
}

async function recentFailures(email: string): Promise<number> {
  const [row] = await db
    .select({ n: sql<number>`count(*)` })
    .from(signInFailures)
    .where(and(eq(signInFailures.email, email), gt(signInFailures.at, new Date(Date.now() - FAILURE_WINDOW_MS))))
  return row?.n ?? 0
}

/** Checks the credentials and opens a session; every refusal says which field is wrong. */
export async function signIn(rawEmail: string, password: string) {
  const email = normaliseEmail(rawEmail)
  if ((await recentFailures(email)) >= MAX_FAILURES) {
    throw new AppError('rate_limited', 'Too many failed sign-ins for this address. Wait 15 minutes and try again.', {
      password: 'Too many failed attempts — wait 15 minutes.',
    })
  }
  const [user] = await db.select().from(users).where(eq(users.email, email))
  const fail = async (field: 'email' | 'password', message: string) => {
    await db.insert(signInFailures).values({ email, at: new Date() })
    throw new AppError('invalid', message, { [field]: message })
  }
  if (!user) return fail('email', 'No account uses this e-mail address.')
  if (!user.passwordHash) return fail('email', 'This account has no password yet — use the link in your invitation mail.')
  if (!(await verifyPassword(user.passwordHash, password))) return fail('password', 'Wrong password.')

  await db.delete(signInFailures).where(eq(signInFailures.email, email))
  const session = await lucia.createSession(user.id, {})
  return { session, cookie: lucia.createSessionCookie(session.id) }
}
