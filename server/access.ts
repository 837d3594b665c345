import { getActor, getCalc, getProject } from '@/db/queries'
import type { Calc, Project } from '@/db/schema'
import { AppError } from '@/lib/errors'
import { assertCan, type Actor, type Permission } from '@/lib/review/permissions'

/** The person acting: from the session cookie or an API token, or null when nobody signed in. */
export interface Caller {
  id: string
  email: string
  name: string
  isAdmin: boolean
}

export interface ProjectAccess {
  caller: Caller
  actor: Actor
  project: Project
}

export function requireCaller(caller: Caller | null): Caller {
  if (!caller) throw new AppError('unauthenticated', 'Sign in first.')
  return caller
}

/** Site-wide permissions (create projects, read caught mail): the role part is empty. */
export function authoriseSite(caller: Caller | null, permission: Permission): Caller {
  const who = requireCaller(caller)
  assertCan({ userId: who.id, isAdmin: who.isAdmin, role: null }, permission)
  return who
}

/**
 * The one permission check every service function makes. A project the caller cannot see is a
 * 404 whether or not it exists, so ids cannot be probed; a member without the permission gets 403.
 */
export async function authorise(caller: Caller | null, projectId: string, permission: Permission): Promise<ProjectAccess> {
  const who = requireCaller(caller)
  const project = await getProject(projectId)
  const actor: Actor = project ? await getActor(who, projectId) : { userId: who.id, isAdmin: who.isAdmin, role: null }
  if (!project || (!actor.role && !actor.isAdmin)) throw new AppError('not_found', 'No such project.')
  assertCan(actor, permission)
  return { caller: who, actor, project }
}

/** `authorise`, then the calc, only if it belongs to the project (ownership in the WHERE clause). */
export async function authoriseCalc(caller: Caller | null, projectId: string, calcId: string, permission: Permission): Promise<ProjectAccess & { calc: Calc }> {
  const access = await authorise(caller, projectId, permission)
  const calc = await getCalc(projectId, calcId)
  if (!calc) throw new AppError('not_found', 'No such calc in this project.')
  return { ...access, calc }
}
