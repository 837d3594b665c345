'use server'

import { redirect } from 'next/navigation'
import { errorState, formValues, type ActionState } from '@/app/_lib/action'
import { requireUser } from '@/app/_lib/session'
import { createProject } from '@/db/projects'
import { can } from '@/lib/review/permissions'
import { fieldErrorsOf } from '@/lib/schemas/field-errors'
import { createProjectSchema } from '@/lib/schemas/project'

export async function createProjectAction(_prev: ActionState, fd: FormData): Promise<ActionState> {
  const values = formValues(fd)
  let id: string
  try {
    const user = await requireUser()
    if (!can({ userId: user.id, isAdmin: user.isAdmin, role: null }, 'project.create')) {
      return { message: 'Only a site administrator can create projects.', values }
    }
    const parsed = createProjectSchema.safeParse(values)
    if (!parsed.success) return { fieldErrors: fieldErrorsOf(parsed.error), values }
    id = await createProject(parsed.data, user.id)
  } catch (err) {
    return errorState(err, values)
  }
  redirect(`/projects/${id}/members`)
}
