import { and, eq } from 'drizzle-orm'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { db } from '@/db'
import { getActor } from '@/db/queries'
import { changeMemberRole, removeMember } from '@/server/members'
import { projectMembers, projects, users } from '@/db/schema'
import { DEMO_USERS } from '@/server/demo/demo-data'
import { seedDemo } from '@/server/demo/seed'
import { AppError } from '@/lib/errors'
import { can } from '@/lib/review/permissions'
import { useTempEnvironment } from '../helpers/temp-env'

let env: Awaited<ReturnType<typeof useTempEnvironment>>
let projectId = ''
const id: Record<string, string> = {}
beforeAll(async () => {
  env = await useTempEnvironment()
  await seedDemo(db)
  projectId = (await db.select().from(projects))[0].id
  for (const u of DEMO_USERS) id[u.key] = (await db.select().from(users).where(eq(users.email, u.email)))[0].id
})
afterAll(() => env.close())

describe('member management', () => {
  it('a role change takes effect on the next permission check', async () => {
    await changeMemberRole(projectId, id.approver, 'checker', id.admin)
    const actor = await getActor({ id: id.approver, isAdmin: false }, projectId)
    expect(can(actor, 'calc.check')).toBe(true)
    expect(can(actor, 'calc.approve')).toBe(false)
  })

  it('a removed member loses access to the project but keeps the account', async () => {
    await removeMember(projectId, id.checker, id.admin)
    const actor = await getActor({ id: id.checker, isAdmin: false }, projectId)
    expect(can(actor, 'project.view')).toBe(false)
    expect(await db.select().from(users).where(eq(users.id, id.checker))).toHaveLength(1)
    expect(await db.select().from(projectMembers).where(and(eq(projectMembers.projectId, projectId), eq(projectMembers.userId, id.checker)))).toHaveLength(0)
  })

  it('changing someone who is not a member is a clear not-found', async () => {
    const err = await removeMember(projectId, id.checker, id.admin).catch((e: AppError) => e)
    expect((err as AppError).code).toBe('not_found')
  })
})

describe('projects', () => {
  it('a second project with the same code is refused at the code field', async () => {
    const { createProject } = await import('@/server/projects')
    await createProject({ code: 'FM-LT12', name: 'Lid tucker LT-12', client: 'Feldmark' }, id.admin)
    const err = await createProject({ code: 'FM-LT12', name: 'Again', client: '' }, id.admin).catch((e: AppError) => e)
    expect((err as AppError).code).toBe('conflict')
    expect((err as AppError).fieldErrors?.code).toMatch(/already uses the code/)
  })
})
