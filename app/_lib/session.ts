import 'server-only'
import { cookies, headers } from 'next/headers'
import { redirect } from 'next/navigation'
import { cache } from 'react'
import { lucia, type SessionUser } from '@/server/auth/lucia'
import { clientAddress } from '@/server/auth/client-address'
import { AppError } from '@/lib/errors'

/** The signed-in user for this request, or null. Refreshes the cookie when lucia extends the session. */
export const getCurrentUser = cache(async (): Promise<SessionUser | null> => {
  const jar = await cookies()
  const sessionId = jar.get(lucia.sessionCookieName)?.value
  if (!sessionId) return null
  const { user, session } = await lucia.validateSession(sessionId)
  try {
    if (session?.fresh) {
      const c = lucia.createSessionCookie(session.id)
      jar.set(c.name, c.value, c.attributes)
    }
    if (!session) {
      const c = lucia.createBlankSessionCookie()
      jar.set(c.name, c.value, c.attributes)
    }
  } catch {
    // Server Components may not set cookies; the next action or route handler will.
  }
  return user ? { id: user.id, email: user.email, name: user.name, isAdmin: user.isAdmin } : null
})

/** For pages: send a visitor without a session to sign-in. */
export async function requirePageUser(): Promise<SessionUser> {
  const user = await getCurrentUser()
  if (!user) redirect('/sign-in')
  return user
}

/** For actions and route handlers: an unauthenticated call is an error, not a redirect. */
export async function requireUser(): Promise<SessionUser> {
  const user = await getCurrentUser()
  if (!user) throw new AppError('unauthenticated', 'Sign in first.')
  return user
}

export async function setSessionCookie(cookie: { name: string; value: string; attributes: object }) {
  ;(await cookies()).set(cookie.name, cookie.value, cookie.attributes)
}

/** The session id the browser sent, if any (to end it when the browser signs in again). */
export async function currentSessionId(): Promise<string | undefined> {
  return (await cookies()).get(lucia.sessionCookieName)?.value
}

/** Where this request comes from, for the per-source limits (see server/auth/client-address.ts). */
export async function requestSource(): Promise<string> {
  return clientAddress(await headers())
}

export async function readCookie(name: string): Promise<string | undefined> {
  return (await cookies()).get(name)?.value
}
