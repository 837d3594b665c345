import 'server-only'
import { notFound } from 'next/navigation'
import { cache } from 'react'
import { getActor, getProject } from '@/db/queries'
import { can } from '@/lib/review/permissions'
import { requirePageUser } from './session'

/** For project pages: the user, the project and the actor; a non-member gets a 404, not a hint. */
export const loadProjectContext = cache(async (projectId: string) => {
  const user = await requirePageUser()
  const project = await getProject(projectId)
  if (!project) notFound()
  const actor = await getActor(user, projectId)
  if (!can(actor, 'project.view')) notFound()
  return { user, project, actor }
})
