import 'server-only'
import type { z } from 'zod'
import { AppError } from '@/lib/errors'
import { fieldErrorsOf } from '@/lib/schemas/field-errors'
import type { Caller } from '@/server/access'
import { requireUser } from './session'

/** The one shape every server action returns; the form shows `fieldErrors` beside each field. */
export interface ActionState {
  ok?: boolean
  message?: string
  fieldErrors?: Record<string, string>
  /** What the user typed, so a refused form keeps it. */
  values?: Record<string, string>
  redirectTo?: string
  data?: Record<string, unknown>
}

export function formValues(fd: FormData): Record<string, string> {
  const out: Record<string, string> = {}
  for (const [k, v] of fd.entries()) if (typeof v === 'string' && !k.startsWith('$ACTION')) out[k] = v
  return out
}

/** Maps a thrown error to the action result; unexpected errors are logged, never swallowed. */
export function errorState(err: unknown, values?: Record<string, string>): ActionState {
  if (err instanceof AppError) return { message: err.message, fieldErrors: err.fieldErrors, values }
  console.error('[action]', err)
  return { message: 'Something went wrong on the server. Reload the page to see what was saved, then try again or tell an administrator.', values }
}

export interface ActionContext {
  caller: Caller
  /** From the form's hidden `projectId` field; the service checks the caller's role in it. */
  projectId: string
  /** The raw form, for what a schema over strings cannot carry (uploaded files). */
  formData: FormData
}

/**
 * Guard for form actions: authenticates, validates the form with `schema`, then runs `fn`, which
 * calls a service (the service checks the permission). Errors become the form's messages, and a
 * refused form keeps what was typed.
 */
export function formAction<S extends z.ZodType>(schema: S, fn: (data: z.infer<S>, ctx: ActionContext) => Promise<ActionState | void>) {
  return async (_prev: ActionState, fd: FormData): Promise<ActionState> => {
    const values = formValues(fd)
    try {
      const caller = await requireUser()
      const parsed = schema.safeParse(values)
      if (!parsed.success) return { fieldErrors: fieldErrorsOf(parsed.error), values, message: 'Check the marked fields.' }
      return (await fn(parsed.data, { caller, projectId: values.projectId ?? '', formData: fd })) ?? { ok: true }
    } catch (err) {
      return errorState(err, values)
    }
  }
}

/** The same guard for actions called with data rather than a form (the calc inputs editor, the revision buttons). */
export function dataAction<A extends unknown[]>(fn: (caller: Caller, ...args: A) => Promise<ActionState | void>) {
  return async (...args: A): Promise<ActionState> => {
    try {
      return (await fn(await requireUser(), ...args)) ?? { ok: true }
    } catch (err) {
      return errorState(err)
    }
  }
}
