import { randomUUID } from 'node:crypto'
import { and, eq, gt, isNull, ne } from 'drizzle-orm'
import { db, type Tx } from '@/db'
import { audit } from '@/db/audit'
import { mailTokens, projectMembers, users } from '@/db/schema'
import { AppError } from '@/lib/errors'
import { lucia } from './lucia'
import { hashPassword } from './password'
import { cleanText } from './text'
import { hashToken } from './tokens'

export const INVITE_TTL_MS = 7 * 24 * 3600 * 1000

type Kind = 'invite' | 'reset'
type TokenRow = typeof mailTokens.$inferSelect

const EXPIRED: Record<Kind, string> = {
  invite: 'This invitation has expired. Ask your administrator for a new one.',
  reset: 'This reset link has expired or a newer one was sent. Ask for a new link under "Forgot your password?" on the sign-in page.',
}

/** Finds a usable token or explains why it is not usable (for showing the page; using it is `consumeToken`). */
export async function findToken(token: string, kind: Kind): Promise<TokenRow> {
  const [row] = await db
    .select()
    .from(mailTokens)
    .where(and(eq(mailTokens.tokenHash, hashToken(token)), eq(mailTokens.kind, kind)))
  if (!row) throw new AppError('not_found', 'This link is not valid. Ask for a new one.')
  if (row.usedAt) throw new AppError('invalid', 'This link has already been used. Sign in, or ask for a new link.')
  if (row.expiresAt.getTime() <= Date.now()) throw new AppError('invalid', EXPIRED[kind])
  return row
}

/**
 * Uses a token once, atomically: one UPDATE … WHERE used_at IS NULL AND expires_at > now. Of two
 * requests with one token exactly one gets the row; the other is told the link was used. The
 * other outstanding tokens of the same address and kind die with it (an older reset link, a
 * second invitation — whose membership `acceptInvitation` grants all the same).
 */
export async function consumeToken(tx: Tx, token: string, kind: Kind): Promise<{ row: TokenRow; others: TokenRow[] }> {
  const now = new Date()
  const [row] = await tx
    .update(mailTokens)
    .set({ usedAt: now })
    .where(and(eq(mailTokens.tokenHash, hashToken(token)), eq(mailTokens.kind, kind), isNull(mailTokens.usedAt), gt(mailTokens.expiresAt, now)))
    .returning()
  if (!row) {
    await findToken(token, kind) // throws the reason
    throw new AppError('invalid', 'This link has already been used. Sign in, or ask for a new link.')
  }
  const others = await expireOutstandingTokens(tx, row.email, kind, { except: row.tokenHash, now })
  return { row, others }
}

/** Ends every unused, unexpired token of `email` and `kind` (but `except`); returns those it ended. */
export async function expireOutstandingTokens(tx: Tx, email: string, kind: Kind, opts: { except?: string; now?: Date } = {}): Promise<TokenRow[]> {
  const now = opts.now ?? new Date()
  return tx
    .update(mailTokens)
    .set({ expiresAt: now })
    .where(
      and(
        eq(mailTokens.email, email),
        eq(mailTokens.kind, kind),
        isNull(mailTokens.usedAt),
        gt(mailTokens.expiresAt, now),
        ...(opts.except ? [ne(mailTokens.tokenHash, opts.except)] : []),
      ),
    )
    .returning()
}

/** Whether the invited address already has an active account (then the invitation only adds the project). */
export async function invitationForActiveAccount(row: { email: string }): Promise<boolean> {
  const [u] = await db.select({ passwordHash: users.passwordHash }).from(users).where(eq(users.email, row.email))
  return Boolean(u?.passwordHash)
}

export type AcceptOutcome =
  | { kind: 'signed-in'; session: Awaited<ReturnType<typeof lucia.createSession>>; cookie: ReturnType<typeof lucia.createSessionCookie> }
  | { kind: 'joined-existing'; email: string }

/**
 * Accepts an invitation. A new address gets its account (name and password) and a session. An
 * address whose account is already active — it accepted another invitation meanwhile — only gets
 * the memberships: its name and password are never touched, and it signs in with its own
 * password. Memberships of every outstanding invitation of the address are granted together.
 */
export async function acceptInvitation(input: { token: string; name?: string; password?: string }): Promise<AcceptOutcome> {
  // Hash before the transaction: the write lock is never held across argon2's 100 ms.
  const passwordHash = input.password ? await hashPassword(input.password) : null
  const name = input.name !== undefined ? cleanText(input.name, 'name') : undefined
  const outcome = await db.transaction(async (tx) => {
    const { row, others } = await consumeToken(tx, input.token, 'invite')
    const [existing] = await tx.select().from(users).where(eq(users.email, row.email))
    let userId: string
    let created = false
    if (existing?.passwordHash) {
      userId = existing.id
    } else {
      if (!passwordHash || !name) throw new AppError('invalid', 'Choose your name and a password.', { ...(name ? {} : { name: 'Enter your name.' }), ...(passwordHash ? {} : { password: 'Choose a password.' }) })
      if (existing) {
        // Invited earlier but never activated: the row has no credentials to protect yet.
        userId = existing.id
        await tx.update(users).set({ name, passwordHash }).where(and(eq(users.id, userId), isNull(users.passwordHash)))
      } else {
        userId = randomUUID()
        await tx.insert(users).values({ id: userId, email: row.email, name, passwordHash })
      }
      created = true
    }
    const joined: string[] = []
    for (const t of [row, ...others]) {
      // Admins do not sign (server/members.ts): an address that became an admin meanwhile gets no project role.
      if (!t.projectId || !t.role || existing?.isAdmin) continue
      await tx.insert(projectMembers).values({ projectId: t.projectId, userId, role: t.role }).onConflictDoNothing()
      joined.push(t.projectId)
    }
    // The other invitations were granted, so they count as used rather than merely expired.
    for (const t of others) await tx.update(mailTokens).set({ usedAt: new Date() }).where(eq(mailTokens.tokenHash, t.tokenHash))
    return { userId, created, email: row.email, joined }
  })
  for (const projectId of outcome.joined) await audit({ userId: outcome.userId, action: 'member.joined', projectId, detail: { email: outcome.email, newAccount: outcome.created } })
  if (!outcome.created) return { kind: 'joined-existing', email: outcome.email }
  const session = await lucia.createSession(outcome.userId, {})
  return { kind: 'signed-in', session, cookie: lucia.createSessionCookie(session.id) }
}
