import 'server-only'
import type { z } from 'zod'
import { getActor } from '@/db/queries'
import type { SessionUser } from '@/lib/auth/lucia'
import { AppError } from '@/lib/errors'
import { can, type Actor, type Permission } from '@/lib/review/permissions'
import { fieldErrorsOf } from '@/lib/schemas/field-errors'
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
  return { message: 'Something went wrong on the server; nothing was changed. Try again or tell an administrator.', values }
}

export interface ActionContext {
  user: SessionUser
  actor: Actor
  projectId: string
  /** The raw form, for what a schema over strings cannot carry (uploaded files). */
  formData?: FormData
}

/** Who is calling and whether the permission table lets them do this in the project. */
async function authorise(projectId: string, permission: Permission) {
  const user = await requireUser()
  const actor = await getActor(user, projectId)
  if (!can(actor, permission)) throw new AppError('forbidden', 'Your role in this project does not allow this.')
  return { user, actor }
}

/**
 * Guard for project-scoped actions: authenticates, resolves the role in the project from the
 * form's `projectId`, checks the permission table, validates, then runs `fn`.
 */
export function projectAction<S extends z.ZodType>(
  permission: Permission,
  schema: S,
  fn: (data: z.infer<S>, ctx: ActionContext) => Promise<ActionState | void>,
) {
  return async (_prev: ActionState, fd: FormData): Promise<ActionState> => {
    const values = formValues(fd)
    try {
      const projectId = values.projectId ?? ''
      const { user, actor } = await authorise(projectId, permission)
      const parsed = schema.safeParse(values)
      if (!parsed.success) return { fieldErrors: fieldErrorsOf(parsed.error), values, message: 'Check the marked fields.' }
      return (await fn(parsed.data, { user, actor, projectId, formData: fd })) ?? { ok: true }
    } catch (err) {
      return errorState(err, values)
    }
  }
}

/**
 * The same guard for actions called with data rather than a form (the calc inputs editor):
 * authenticates, checks the permission in `projectId`, runs `fn`; typed errors become field messages.
 */
export function projectDataAction<A extends unknown[]>(
  permission: Permission,
  fn: (ctx: ActionContext, ...args: A) => Promise<ActionState | void>,
) {
  return async (projectId: string, ...args: A): Promise<ActionState> => {
    try {
      const { user, actor } = await authorise(projectId, permission)
      return (await fn({ user, actor, projectId }, ...args)) ?? { ok: true }
    } catch (err) {
      return errorState(err)
    }
  }
}
