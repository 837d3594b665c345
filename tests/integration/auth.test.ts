import { eq } from 'drizzle-orm'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { db } from '@/db'
import { mailTokens, projectMembers, users } from '@/db/schema'
import { seedDemo } from '@/server/demo/seed'
import { DEMO_PASSWORD, DEMO_USERS } from '@/server/demo/demo-data'
import { acceptInvitation, findToken } from '@/server/auth/invitations'
import { inviteMember } from '@/server/members'
import { requestPasswordReset, resetPassword } from '@/server/auth/password-reset'
import { SIGN_IN_REFUSED, signIn } from '@/server/auth/sign-in'
import { hashToken } from '@/server/auth/tokens'
import { drainOutbox } from '@/server/mail/outbox'
import { AppError } from '@/lib/errors'
import { firstLink, listCaughtMail } from '@/lib/mail/inbox'
import { useTempEnvironment } from '../helpers/temp-env'

let env: Awaited<ReturnType<typeof useTempEnvironment>>
beforeAll(async () => {
  env = await useTempEnvironment()
  await seedDemo(db)
})
afterAll(() => env.close())

const here = { source: '203.0.113.10' }
const admin = () => db.select().from(users).where(eq(users.email, DEMO_USERS[0].email)).then((r) => r[0])
const tokenFromLatestMail = async (to: string) => {
  await drainOutbox()
  const mail = listCaughtMail(env.mailDir).find((m) => m.to.includes(to))
  expect(mail, `a mail to ${to} was caught`).toBeDefined()
  return firstLink(mail!)!.split('/').pop()!
}

async function expectAppError(p: Promise<unknown>, code: string, field?: string) {
  const err = await p.then(() => null, (e: unknown) => e)
  expect(err).toBeInstanceOf(AppError)
  expect((err as AppError).code).toBe(code)
  if (field) expect((err as AppError).fieldErrors?.[field]).toBeTruthy()
  return err as AppError
}

describe('sign-in', () => {
  it('opens a session for a demo account and stores an argon2id hash', async () => {
    const { session, cookie } = await signIn(DEMO_USERS[1].email.toUpperCase(), DEMO_PASSWORD, here)
    expect(session.id).toBeTruthy()
    expect(cookie.name).toBe('inverso_session')
    const [u] = await db.select().from(users).where(eq(users.email, DEMO_USERS[1].email))
    expect(u.passwordHash).toMatch(/^\$argon2id\$/)
  })

  it('refuses an unknown e-mail and a wrong password with one message, at the password field', async () => {
    const a = await expectAppError(signIn('nobody@feldmark.example', 'whatever-123', here), 'invalid', 'password')
    const b = await expectAppError(signIn(DEMO_USERS[2].email, 'not-the-password', here), 'invalid', 'password')
    expect(a.message).toBe(SIGN_IN_REFUSED)
    expect(b.message).toBe(SIGN_IN_REFUSED)
    expect(a.fieldErrors).toEqual(b.fieldErrors)
  })
})

describe('invitations', () => {
  it('sends an invitation the fake catches; its link sets a password and adds the membership', async () => {
    const a = await admin()
    const [{ projectId }] = await db.select({ projectId: projectMembers.projectId }).from(projectMembers).limit(1)
    await inviteMember({ ...a, isAdmin: true }, projectId, { email: 'New.Checker@Feldmark.example', role: 'checker' })
    const token = await tokenFromLatestMail('new.checker@feldmark.example')
    const out = await acceptInvitation({ token, name: 'Nela Checker', password: 'a-long-password' })
    if (out.kind !== 'signed-in') throw new Error('expected a new account')
    const [m] = await db.select().from(projectMembers).where(eq(projectMembers.userId, out.session.userId))
    expect(m.role).toBe('checker')
    // The link is single-use.
    await expectAppError(acceptInvitation({ token, name: 'Again', password: 'a-long-password' }), 'invalid')
    await signIn('new.checker@feldmark.example', 'a-long-password', here)
  })

  it('an expired invitation gets a clear message and creates nothing', async () => {
    const a = await admin()
    const [{ projectId }] = await db.select({ projectId: projectMembers.projectId }).from(projectMembers).limit(1)
    await inviteMember({ ...a, isAdmin: true }, projectId, { email: 'late@feldmark.example', role: 'approver' })
    const token = await tokenFromLatestMail('late@feldmark.example')
    await db.update(mailTokens).set({ expiresAt: new Date(Date.now() - 1000) }).where(eq(mailTokens.tokenHash, hashToken(token)))
    const err = await findToken(token, 'invite').catch((e: AppError) => e)
    expect((err as AppError).message).toMatch(/invitation has expired/)
    await expectAppError(acceptInvitation({ token, name: 'Late', password: 'a-long-password' }), 'invalid')
    expect(await db.select().from(users).where(eq(users.email, 'late@feldmark.example'))).toHaveLength(0)
  })

  it('inviting an existing member is refused at the e-mail field', async () => {
    const a = await admin()
    const [{ projectId }] = await db.select({ projectId: projectMembers.projectId }).from(projectMembers).limit(1)
    await expectAppError(
      inviteMember({ ...a, isAdmin: true }, projectId, { email: DEMO_USERS[1].email, role: 'checker' }),
      'conflict',
      'email',
    )
  })
})

describe('password reset', () => {
  it('mails a link that sets a new password and ends old sessions', async () => {
    const email = DEMO_USERS[2].email
    await requestPasswordReset(email, here)
    const token = await tokenFromLatestMail(email)
    await resetPassword(token, 'brand-new-password')
    await signIn(email, 'brand-new-password', here)
    await expectAppError(signIn(email, DEMO_PASSWORD, here), 'invalid', 'password')
  })

  it('an unknown address sends nothing and raises nothing', async () => {
    const before = listCaughtMail(env.mailDir).length
    await requestPasswordReset('ghost@feldmark.example', here)
    await drainOutbox()
    expect(listCaughtMail(env.mailDir)).toHaveLength(before)
  })
})
