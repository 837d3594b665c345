import 'server-only'
import { notFound } from 'next/navigation'
import { cache } from 'react'
import { AppError } from '@/lib/errors'
import { getProjectAccess } from '@/server/projects'
import { requirePageUser } from './session'

/** For project pages: the user, the project and the actor; a non-member gets a 404, not a hint. */
export const loadProjectContext = cache(async (projectId: string) => {
  const user = await requirePageUser()
  try {
    const { project, actor } = await getProjectAccess(user, projectId)
    return { user, project, actor }
  } catch (err) {
    if (err instanceof AppError && err.code === 'not_found') notFound()
    throw err
  }
})
