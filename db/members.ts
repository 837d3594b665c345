import { and, eq } from 'drizzle-orm'
import { AppError } from '@/lib/errors'
import type { ProjectRole } from '@/lib/review/roles'
import { audit } from './audit'
import { db } from './index'
import { projectMembers } from './schema'

/** Changes a member's role; signatures already on revisions keep the role they were given in. */
export async function changeMemberRole(projectId: string, userId: string, role: ProjectRole, by: string) {
  const result = await db.update(projectMembers).set({ role }).where(and(eq(projectMembers.projectId, projectId), eq(projectMembers.userId, userId)))
  if (result.rowsAffected === 0) throw new AppError('not_found', 'This person is not a member of the project.')
  await audit({ userId: by, action: 'member.role-changed', projectId, detail: { userId, role } })
}

/** Removes a member from the project; the account and everything they signed stay. */
export async function removeMember(projectId: string, userId: string, by: string) {
  const result = await db.delete(projectMembers).where(and(eq(projectMembers.projectId, projectId), eq(projectMembers.userId, userId)))
  if (result.rowsAffected === 0) throw new AppError('not_found', 'This person is not a member of the project.')
  await audit({ userId: by, action: 'member.removed', projectId, detail: { userId } })
}
