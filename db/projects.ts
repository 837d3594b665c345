import { randomUUID } from 'node:crypto'
import { and, eq } from 'drizzle-orm'
import type { z } from 'zod'
import { AppError } from '@/lib/errors'
import type { createCalcSchema, createProjectSchema } from '@/lib/schemas/project'
import { audit } from './audit'
import { db } from './index'
import { calcs, projects } from './schema'

export async function createProject(input: z.infer<typeof createProjectSchema>, userId: string) {
  const [clash] = await db.select({ id: projects.id }).from(projects).where(eq(projects.code, input.code))
  if (clash) throw new AppError('conflict', 'A project already uses this code.', { code: `A project already uses the code ${input.code}.` })
  const id = randomUUID()
  await db.insert(projects).values({ id, ...input })
  await audit({ userId, action: 'project.created', projectId: id, detail: { code: input.code } })
  return id
}

/** A new calc starts as a draft owned by the engineer who created it. */
export async function createCalc(projectId: string, input: z.infer<typeof createCalcSchema>, userId: string) {
  const [clash] = await db
    .select({ id: calcs.id })
    .from(calcs)
    .where(and(eq(calcs.projectId, projectId), eq(calcs.number, input.number)))
  if (clash) {
    throw new AppError('conflict', 'This calc number is taken.', { number: `Calc ${input.number} already exists in this project.` })
  }
  const id = randomUUID()
  await db.insert(calcs).values({ id, projectId, ...input, state: 'draft', engineerId: userId })
  await audit({ userId, action: 'calc.created', projectId, calcId: id, detail: { number: input.number } })
  return id
}
