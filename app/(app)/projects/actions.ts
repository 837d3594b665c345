'use server'

import { redirect } from 'next/navigation'
import { errorState, formValues, type ActionState } from '@/app/_lib/action'
import { requireUser } from '@/app/_lib/session'
import { fieldErrorsOf } from '@/lib/schemas/field-errors'
import { createProjectSchema } from '@/lib/schemas/project'
import { createProject } from '@/server/projects'

export async function createProjectAction(_prev: ActionState, fd: FormData): Promise<ActionState> {
  const values = formValues(fd)
  let id: string
  try {
    const parsed = createProjectSchema.safeParse(values)
    if (!parsed.success) return { fieldErrors: fieldErrorsOf(parsed.error), values }
    id = await createProject(await requireUser(), parsed.data)
  } catch (err) {
    return errorState(err, values)
  }
  redirect(`/projects/${id}/members`)
}
