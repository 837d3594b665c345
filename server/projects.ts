import { randomUUID } from 'node:crypto'
import { eq } from 'drizzle-orm'
import type { z } from 'zod'
import { db } from '@/db'
import { audit } from '@/db/audit'
import { listProjectsForUser } from '@/db/queries'
import { projects } from '@/db/schema'
import { AppError } from '@/lib/errors'
import type { createProjectSchema } from '@/lib/schemas/project'
import { authorise, authoriseSite, requireCaller, type Caller } from './access'

export async function listProjects(caller: Caller | null) {
  const who = requireCaller(caller)
  return listProjectsForUser(who.id, who.isAdmin)
}

/** The project and the caller's role in it; a project the caller cannot see is a 404. */
export async function getProjectAccess(caller: Caller | null, projectId: string) {
  return authorise(caller, projectId, 'project.view')
}

export async function createProject(caller: Caller | null, input: z.infer<typeof createProjectSchema>) {
  const who = authoriseSite(caller, 'project.create')
  const [clash] = await db.select({ id: projects.id }).from(projects).where(eq(projects.code, input.code))
  if (clash) throw new AppError('conflict', 'A project already uses this code.', { code: `A project already uses the code ${input.code}.` })
  const id = randomUUID()
  await db.insert(projects).values({ id, ...input })
  await audit({ userId: who.id, action: 'project.created', projectId: id, detail: { code: input.code } })
  return id
}
