import { AppError } from '../errors'
import type { ProjectRole } from './roles'

/**
 * The one permission table. Every server action and route handler asks `can`/`assertCan`;
 * hiding a button in the UI is a courtesy, never the check.
 */
export const PERMISSIONS = {
  'project.view': ['engineer', 'checker', 'approver'],
  'project.create': [],
  'member.manage': [],
  'mail.view': [],
  'calc.create': ['engineer'],
  'calc.edit': ['engineer'],
  'calc.submit': ['engineer'],
  'material.create': ['engineer', 'checker', 'approver'],
  'remark.create': ['checker'],
  'remark.respond': ['engineer', 'checker'],
  'remark.close': ['checker'],
  'calc.check': ['checker'],
  'calc.approve': ['approver'],
  'calc.issue': ['approver'],
  'pdf.download': ['engineer', 'checker', 'approver'],
} as const satisfies Record<string, readonly ProjectRole[]>

export type Permission = keyof typeof PERMISSIONS

/** Who is asking: a site admin flag and their role in the project at hand (if any). */
export interface Actor {
  userId: string
  isAdmin: boolean
  role: ProjectRole | null
}

/** Site admins manage people and projects and may read any project; they do not write or sign calcs. */
const ADMIN_PERMISSIONS: readonly Permission[] = ['project.view', 'project.create', 'member.manage', 'mail.view', 'pdf.download']

export function can(actor: Actor, permission: Permission): boolean {
  if (actor.isAdmin && ADMIN_PERMISSIONS.includes(permission)) return true
  const roles: readonly ProjectRole[] = PERMISSIONS[permission]
  return actor.role !== null && roles.includes(actor.role)
}

export class ForbiddenError extends AppError {
  constructor(readonly permission: Permission) {
    super('forbidden', `Your role in this project does not allow this (${permission}).`)
  }
}

export function assertCan(actor: Actor, permission: Permission): void {
  if (!can(actor, permission)) throw new ForbiddenError(permission)
}
