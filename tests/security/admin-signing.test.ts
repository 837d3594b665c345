/**
 * Issue 13, item 9: admins do not sign. An admin cannot invite or add themself, or any other site
 * admin, to a project (every project role signs), nor give an admin a role; ordinary people can.
 */
import { eq } from 'drizzle-orm'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { db } from '@/db'
import { mailTokens, projectMembers, users } from '@/db/schema'
import { ADMIN_CANNOT_SIGN, changeMemberRole, inviteMember } from '@/server/members'
import type { Caller } from '@/server/access'
import { AppError } from '@/lib/errors'
import { seededDemo, type DemoRole } from '../helpers/demo'
import { useTempEnvironment } from '../helpers/temp-env'

let env: Awaited<ReturnType<typeof useTempEnvironment>>
let who: Record<DemoRole, Caller>
let projectId = ''
beforeAll(async () => {
  env = await useTempEnvironment()
  ;({ people: who, projectId } = await seededDemo())
  await db.insert(users).values({ id: 'second-admin', email: 'it@feldmark.example', name: 'Second Admin', passwordHash: 'x', isAdmin: true })
})
afterAll(() => env.close())

async function refusedAt(p: Promise<unknown>, field: string) {
  const err = await p.then(() => null, (e: unknown) => e)
  expect(err).toBeInstanceOf(AppError)
  expect((err as AppError).code).toBe('invalid')
  expect((err as AppError).fieldErrors?.[field]).toBe(ADMIN_CANNOT_SIGN)
}

describe('admins do not sign', () => {
  it.each(['engineer', 'checker', 'approver'] as const)('an admin cannot invite their own address as %s', async (role) => {
    await refusedAt(inviteMember(who.admin, projectId, { email: who.admin.email.toUpperCase(), role }), 'email')
  })

  it('an admin cannot invite another site admin', async () => {
    await refusedAt(inviteMember(who.admin, projectId, { email: 'it@feldmark.example', role: 'checker' }), 'email')
  })

  it('nothing was written by the refusals', async () => {
    const adminIds = (await db.select({ id: users.id }).from(users).where(eq(users.isAdmin, true))).map((u) => u.id)
    for (const id of adminIds) expect(await db.select().from(projectMembers).where(eq(projectMembers.userId, id))).toHaveLength(0)
    for (const email of [who.admin.email, 'it@feldmark.example']) expect(await db.select().from(mailTokens).where(eq(mailTokens.email, email))).toHaveLength(0)
  })

  it('an admin who is somehow a member cannot be given a signing role', async () => {
    await db.insert(projectMembers).values({ projectId, userId: 'second-admin', role: 'engineer' })
    await refusedAt(changeMemberRole(who.admin, projectId, 'second-admin', 'approver'), 'role')
  })

  it('an ordinary address is still invited', async () => {
    expect((await inviteMember(who.admin, projectId, { email: 'new.engineer@feldmark.example', role: 'engineer' })).invited).toBe(true)
  })
})
