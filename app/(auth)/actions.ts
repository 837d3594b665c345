'use server'

import { redirect } from 'next/navigation'
import { cookies } from 'next/headers'
import { errorState, formValues, type ActionState } from '@/app/_lib/action'
import { setSessionCookie } from '@/app/_lib/session'
import { acceptInvitation } from '@/server/auth/invitations'
import { lucia } from '@/server/auth/lucia'
import { requestPasswordReset, resetPassword } from '@/server/auth/password-reset'
import { signIn } from '@/server/auth/sign-in'
import { acceptInvitationSchema, resetPasswordSchema, resetRequestSchema, signInSchema } from '@/lib/schemas/auth'
import { fieldErrorsOf } from '@/lib/schemas/field-errors'
import type { z } from 'zod'

/** Validates, runs, and on success sets the session cookie; redirect happens outside the try. */
async function withSession<S extends z.ZodType>(
  schema: S,
  fd: FormData,
  run: (data: z.infer<S>) => Promise<{ cookie: { name: string; value: string; attributes: object } }>,
): Promise<ActionState> {
  const values = formValues(fd)
  delete values.password
  delete values.confirm
  const parsed = schema.safeParse(formValues(fd))
  if (!parsed.success) return { fieldErrors: fieldErrorsOf(parsed.error), values }
  try {
    const { cookie } = await run(parsed.data)
    await setSessionCookie(cookie)
  } catch (err) {
    return errorState(err, values)
  }
  redirect('/projects')
}

export async function signInAction(_prev: ActionState, fd: FormData): Promise<ActionState> {
  return withSession(signInSchema, fd, (d) => signIn(d.email, d.password))
}

export async function acceptInvitationAction(_prev: ActionState, fd: FormData): Promise<ActionState> {
  return withSession(acceptInvitationSchema, fd, (d) => acceptInvitation(d))
}

export async function resetPasswordAction(_prev: ActionState, fd: FormData): Promise<ActionState> {
  return withSession(resetPasswordSchema, fd, (d) => resetPassword(d.token, d.password))
}

export async function requestResetAction(_prev: ActionState, fd: FormData): Promise<ActionState> {
  const values = formValues(fd)
  const parsed = resetRequestSchema.safeParse(values)
  if (!parsed.success) return { fieldErrors: fieldErrorsOf(parsed.error), values }
  try {
    await requestPasswordReset(parsed.data.email)
  } catch (err) {
    return errorState(err, values)
  }
  return { ok: true, message: 'If an account uses this address, a reset link is on its way. It works for one hour.', values }
}

export async function signOutAction(): Promise<void> {
  const jar = await cookies()
  const sessionId = jar.get(lucia.sessionCookieName)?.value
  if (sessionId) await lucia.invalidateSession(sessionId)
  const blank = lucia.createBlankSessionCookie()
  jar.set(blank.name, blank.value, blank.attributes)
  redirect('/sign-in')
}
