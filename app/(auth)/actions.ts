'use server'

import { redirect } from 'next/navigation'
import { cookies } from 'next/headers'
import { errorState, formValues, type ActionState } from '@/app/_lib/action'
import { currentSessionId, readCookie, requestSource, setSessionCookie } from '@/app/_lib/session'
import { acceptInvitation } from '@/server/auth/invitations'
import { lucia } from '@/server/auth/lucia'
import { requestPasswordReset, resetPassword } from '@/server/auth/password-reset'
import { DEVICE_COOKIE, endSession, signIn } from '@/server/auth/sign-in'
import { acceptInvitationSchema, resetPasswordSchema, resetRequestSchema, signInSchema } from '@/lib/schemas/auth'
import { fieldErrorsOf } from '@/lib/schemas/field-errors'
import { z } from 'zod'

const joinWithInvitationSchema = z.object({ token: z.string().min(1).max(200) })

type Cookie = { name: string; value: string; attributes: object }

/**
 * Validates, runs, and on success ends the session the browser had before (so a new sign-in
 * never leaves an old one valid) and sets the new cookie; redirect happens outside the try.
 */
async function withSession<S extends z.ZodType>(schema: S, fd: FormData, run: (data: z.infer<S>) => Promise<{ cookie: Cookie; device?: Cookie } | { redirectTo: string }>): Promise<ActionState> {
  const values = formValues(fd)
  delete values.password
  delete values.confirm
  const parsed = schema.safeParse(formValues(fd))
  if (!parsed.success) return { fieldErrors: fieldErrorsOf(parsed.error), values }
  let to = '/projects'
  try {
    const out = await run(parsed.data)
    if ('redirectTo' in out) to = out.redirectTo
    else {
      await endSession(await currentSessionId())
      await setSessionCookie(out.cookie)
      if (out.device) await setSessionCookie(out.device)
    }
  } catch (err) {
    return errorState(err, values)
  }
  redirect(to)
}

export async function signInAction(_prev: ActionState, fd: FormData): Promise<ActionState> {
  const source = await requestSource()
  const deviceToken = await readCookie(DEVICE_COOKIE)
  const previousSessionId = await currentSessionId()
  return withSession(signInSchema, fd, (d) => signIn(d.email, d.password, { source, deviceToken, previousSessionId }))
}

export async function acceptInvitationAction(_prev: ActionState, fd: FormData): Promise<ActionState> {
  return withSession(acceptInvitationSchema, fd, async (d) => {
    const out = await acceptInvitation(d)
    return out.kind === 'signed-in' ? out : { redirectTo: '/sign-in?joined=1' }
  })
}

/** For an address whose account is already active: the invitation only adds the project. */
export async function joinWithInvitationAction(_prev: ActionState, fd: FormData): Promise<ActionState> {
  return withSession(joinWithInvitationSchema, fd, async (d) => {
    await acceptInvitation({ token: d.token })
    return { redirectTo: '/sign-in?joined=1' }
  })
}

export async function resetPasswordAction(_prev: ActionState, fd: FormData): Promise<ActionState> {
  return withSession(resetPasswordSchema, fd, (d) => resetPassword(d.token, d.password))
}

export async function requestResetAction(_prev: ActionState, fd: FormData): Promise<ActionState> {
  const values = formValues(fd)
  const parsed = resetRequestSchema.safeParse(values)
  if (!parsed.success) return { fieldErrors: fieldErrorsOf(parsed.error), values }
  try {
    await requestPasswordReset(parsed.data.email, { source: await requestSource() })
  } catch (err) {
    return errorState(err, values)
  }
  return { ok: true, message: 'If an account uses this address, a reset link is on its way. It works for one hour.', values }
}

export async function signOutAction(): Promise<void> {
  const jar = await cookies()
  await endSession(jar.get(lucia.sessionCookieName)?.value)
  const blank = lucia.createBlankSessionCookie()
  jar.set(blank.name, blank.value, blank.attributes)
  redirect('/sign-in')
}
