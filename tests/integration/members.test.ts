import { and, eq } from 'drizzle-orm'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { db } from '@/db'
import { getActor } from '@/db/queries'
import { changeMemberRole, removeMember } from '@/server/members'
import { projectMembers, users } from '@/db/schema'
import type { Caller } from '@/server/access'
import { seededDemo, type DemoRole } from '../helpers/demo'
import { AppError } from '@/lib/errors'
import { can } from '@/lib/review/permissions'
import { useTempEnvironment } from '../helpers/temp-env'

let env: Awaited<ReturnType<typeof useTempEnvironment>>
let projectId = ''
let who: Record<DemoRole, Caller>
const id = {} as Record<DemoRole, string>
beforeAll(async () => {
  env = await useTempEnvironment()
  ;({ people: who, projectId } = await seededDemo())
  for (const [k, c] of Object.entries(who)) id[k as DemoRole] = c.id
})
afterAll(() => env.close())

describe('member management', () => {
  it('a role change takes effect on the next permission check', async () => {
    await changeMemberRole(who.admin, projectId, id.approver, 'checker')
    const actor = await getActor({ id: id.approver, isAdmin: false }, projectId)
    expect(can(actor, 'calc.check')).toBe(true)
    expect(can(actor, 'calc.approve')).toBe(false)
  })

  it('a removed member loses access to the project but keeps the account', async () => {
    await removeMember(who.admin, projectId, id.checker)
    const actor = await getActor({ id: id.checker, isAdmin: false }, projectId)
    expect(can(actor, 'project.view')).toBe(false)
    expect(await db.select().from(users).where(eq(users.id, id.checker))).toHaveLength(1)
    expect(await db.select().from(projectMembers).where(and(eq(projectMembers.projectId, projectId), eq(projectMembers.userId, id.checker)))).toHaveLength(0)
  })

  it('changing someone who is not a member is a clear not-found', async () => {
    const err = await removeMember(who.admin, projectId, id.checker).catch((e: AppError) => e)
    expect((err as AppError).code).toBe('not_found')
  })
})

describe('projects', () => {
  it('a second project with the same code is refused at the code field', async () => {
    const { createProject } = await import('@/server/projects')
    await createProject(who.admin, { code: 'FM-LT12', name: 'Lid tucker LT-12', client: 'Feldmark' })
    const err = await createProject(who.admin, { code: 'FM-LT12', name: 'Again', client: '' }).catch((e: AppError) => e)
    expect((err as AppError).code).toBe('conflict')
    expect((err as AppError).fieldErrors?.code).toMatch(/already uses the code/)
  })
})
