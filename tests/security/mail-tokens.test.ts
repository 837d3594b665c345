/**
 * Issue 13, item 6: invitation and reset tokens are used once (atomically), a newer link ends the
 * older ones, and an invitation never touches an existing account's credentials or name.
 */
import { and, eq, isNull } from 'drizzle-orm'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { db } from '@/db'
import { mailTokens, projectMembers, users } from '@/db/schema'
import { acceptInvitation, findToken } from '@/server/auth/invitations'
import { requestPasswordReset, resetPassword } from '@/server/auth/password-reset'
import { verifyPassword } from '@/server/auth/password'
import { signIn } from '@/server/auth/sign-in'
import { hashToken } from '@/server/auth/tokens'
import { drainOutbox } from '@/server/mail/outbox'
import { inviteMember } from '@/server/members'
import type { Caller } from '@/server/access'
import { AppError } from '@/lib/errors'
import { firstLink, listCaughtMail } from '@/lib/mail/inbox'
import { seededDemo, type DemoRole } from '../helpers/demo'
import { useTempEnvironment } from '../helpers/temp-env'

let env: Awaited<ReturnType<typeof useTempEnvironment>>
let who: Record<DemoRole, Caller>
let projectId = ''
let secondProjectId = ''
beforeAll(async () => {
  env = await useTempEnvironment()
  ;({ people: who, projectId } = await seededDemo())
  const { createProject } = await import('@/server/projects')
  secondProjectId = await createProject(who.admin, { code: 'FM-T2', name: 'Second project', client: '' })
})
afterAll(() => env.close())

const here = { source: '198.51.100.7' }

/** Every link mailed to `to`, oldest first. */
async function linksTo(to: string): Promise<string[]> {
  await drainOutbox()
  return listCaughtMail(env.mailDir)
    .filter((m) => m.to.includes(to))
    .reverse()
    .map((m) => firstLink(m)!.split('/').pop()!)
}

const settle = (ps: Promise<unknown>[]) => Promise.all(ps.map((p) => p.then(() => 'ok', (e: unknown) => e)))

describe('invitation tokens', () => {
  it('two concurrent accepts of one invitation: exactly one wins, the other is told the link was used', async () => {
    await inviteMember(who.admin, projectId, { email: 'race@feldmark.example', role: 'checker' })
    const [token] = await linksTo('race@feldmark.example')
    const outcomes = await settle([
      acceptInvitation({ token, name: 'Racer One', password: 'first-long-password' }),
      acceptInvitation({ token, name: 'Racer Two', password: 'second-long-password' }),
    ])
    expect(outcomes.filter((o) => o === 'ok')).toHaveLength(1)
    const loser = outcomes.find((o) => o !== 'ok') as AppError
    expect(loser).toBeInstanceOf(AppError)
    expect(loser.message).toMatch(/already been used/)
    const accounts = await db.select().from(users).where(eq(users.email, 'race@feldmark.example'))
    expect(accounts).toHaveLength(1)
    // The name and password are those of the winner, consistently.
    const winnerFirst = accounts[0].name === 'Racer One'
    expect(await verifyPassword(accounts[0].passwordHash!, winnerFirst ? 'first-long-password' : 'second-long-password')).toBe(true)
  })

  it('five concurrent accepts: still one account, one membership, four refusals', async () => {
    await inviteMember(who.admin, projectId, { email: 'crowd@feldmark.example', role: 'approver' })
    const [token] = await linksTo('crowd@feldmark.example')
    const outcomes = await settle([1, 2, 3, 4, 5].map((i) => acceptInvitation({ token, name: `Crowd ${i}`, password: `crowd-password-${i}` })))
    expect(outcomes.filter((o) => o === 'ok')).toHaveLength(1)
    const [u] = await db.select().from(users).where(eq(users.email, 'crowd@feldmark.example'))
    expect(await db.select().from(projectMembers).where(eq(projectMembers.userId, u.id))).toHaveLength(1)
  })

  it('an invitation for an address that has since activated never changes its password or name; it only adds the project', async () => {
    const email = 'twice@feldmark.example'
    await inviteMember(who.admin, projectId, { email, role: 'checker' })
    await inviteMember(who.admin, secondProjectId, { email, role: 'engineer' })
    const [first, second] = await linksTo(email)
    await acceptInvitation({ token: first, name: 'Real Owner', password: 'owner-long-password' })
    // The second invitation ended with the first (its project was granted with it)…
    await expect(findToken(second, 'invite')).rejects.toThrow(/already been used/)
    const [u] = await db.select().from(users).where(eq(users.email, email))
    const memberships = await db.select().from(projectMembers).where(eq(projectMembers.userId, u.id))
    expect(memberships.map((m) => m.projectId).sort()).toEqual([projectId, secondProjectId].sort())
    // …and a fresh invitation sent after activation adds the membership without touching the account.
    const { removeMember } = await import('@/server/members')
    await removeMember(who.admin, secondProjectId, u.id)
    // inviteMember adds an active account at once; an invitation token issued before activation is the risky case:
    const { newToken } = await import('@/server/auth/tokens')
    const stale = newToken()
    await db.insert(mailTokens).values({ tokenHash: stale.tokenHash, kind: 'invite', email, projectId: secondProjectId, role: 'engineer', expiresAt: new Date(Date.now() + 3600_000) })
    const out = await acceptInvitation({ token: stale.token, name: 'Attacker Name', password: 'attacker-password' })
    expect(out.kind).toBe('joined-existing')
    const [after] = await db.select().from(users).where(eq(users.email, email))
    expect(after.name).toBe('Real Owner')
    expect(after.passwordHash).toBe(u.passwordHash)
    expect(await verifyPassword(after.passwordHash!, 'attacker-password')).toBe(false)
    await signIn(email, 'owner-long-password', here)
    expect(await db.select().from(projectMembers).where(and(eq(projectMembers.userId, u.id), eq(projectMembers.projectId, secondProjectId)))).toHaveLength(1)
  })
})

describe('reset tokens', () => {
  it('an older reset link dies when a newer one is requested', async () => {
    const email = who.approver.email
    await requestPasswordReset(email, here)
    await requestPasswordReset(email, here)
    const [older, newer] = (await linksTo(email)).slice(-2)
    const err = await findToken(older, 'reset').catch((e: AppError) => e)
    expect((err as AppError).message).toMatch(/expired or a newer one was sent/)
    // The expired-reset message speaks of the reset link, never of an invitation.
    expect((err as AppError).message).not.toMatch(/invitation/i)
    await expect(resetPassword(older, 'older-link-password')).rejects.toThrow(AppError)
    await resetPassword(newer, 'newer-link-password')
    await signIn(email, 'newer-link-password', here)
  })

  it('two concurrent uses of one reset link: one wins', async () => {
    const email = who.checker.email
    await requestPasswordReset(email, here)
    const token = (await linksTo(email)).at(-1)!
    const outcomes = await settle([resetPassword(token, 'reset-race-one'), resetPassword(token, 'reset-race-two')])
    expect(outcomes.filter((o) => o === 'ok')).toHaveLength(1)
    const [row] = await db.select().from(mailTokens).where(eq(mailTokens.tokenHash, hashToken(token)))
    expect(row.usedAt).not.toBeNull()
  })

  it('using a reset link ends every other outstanding reset link of the address', async () => {
    const email = who.engineer.email
    const { newToken } = await import('@/server/auth/tokens')
    const a = newToken()
    const b = newToken()
    for (const t of [a, b]) await db.insert(mailTokens).values({ tokenHash: t.tokenHash, kind: 'reset', email, expiresAt: new Date(Date.now() + 3600_000) })
    await resetPassword(a.token, 'engineer-new-password')
    const left = await db.select().from(mailTokens).where(and(eq(mailTokens.email, email), eq(mailTokens.kind, 'reset'), isNull(mailTokens.usedAt)))
    expect(left.every((t) => t.expiresAt.getTime() <= Date.now())).toBe(true)
    await expect(resetPassword(b.token, 'engineer-other-password')).rejects.toThrow(/expired/)
  })

  it('an expired reset link says so without speaking of an invitation', async () => {
    const email = who.engineer.email
    await requestPasswordReset(email, { source: '198.51.100.8' })
    const token = (await linksTo(email)).at(-1)!
    await db.update(mailTokens).set({ expiresAt: new Date(Date.now() - 1000) }).where(eq(mailTokens.tokenHash, hashToken(token)))
    const err = (await findToken(token, 'reset').catch((e: AppError) => e)) as AppError
    expect(err.message).toMatch(/reset link has expired/)
    expect(err.message).not.toMatch(/invitation/i)
  })
})
