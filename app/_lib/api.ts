import 'server-only'
import { getActor, getProject } from '@/db/queries'
import { AppError, HTTP_STATUS } from '@/lib/errors'
import { assertCan, type Actor, type Permission } from '@/lib/review/permissions'
import { requireUser } from './session'

/** Maps typed errors to HTTP in one place; anything else is logged and becomes a 500. */
export function handleApiError(err: unknown): Response {
  if (err instanceof AppError) {
    return Response.json({ error: err.code, message: err.message, fieldErrors: err.fieldErrors }, { status: HTTP_STATUS[err.code] })
  }
  console.error('[api]', err)
  return Response.json({ error: 'server_error', message: 'Internal error.' }, { status: 500 })
}

/** Authenticates the caller and checks `permission` in the project; throws AppError otherwise. */
export async function requireProjectPermission(projectId: string, permission: Permission): Promise<Actor> {
  const user = await requireUser()
  if (!(await getProject(projectId))) throw new AppError('not_found', 'No such project.')
  const actor = await getActor(user, projectId)
  assertCan(actor, permission)
  return actor
}
