import { randomBytes, randomUUID } from 'node:crypto'
import { and, desc, eq, isNull, lt, or } from 'drizzle-orm'
import { db } from '@/db'
import { audit } from '@/db/audit'
import { apiTokens, users } from '@/db/schema'
import { AppError } from '@/lib/errors'
import { stripControl } from '@/lib/schemas/clean-text'
import { requireCaller, type Caller } from '../access'
import { hashToken } from './tokens'

const PREFIX = 'inv_'

/** Recognisable, 256 bits of randomness; only the SHA-256 is stored. */
function newApiToken() {
  const token = PREFIX + randomBytes(32).toString('base64url')
  return { token, tokenHash: hashToken(token), prefix: token.slice(0, PREFIX.length + 6) }
}

/** Issues a token for `userId` (the caller themself, or an operator on the server); the token is returned once. */
async function issue(userId: string, name: string) {
  const label = stripControl(name).trim()
  if (label.length < 1 || label.length > 80) throw new AppError('invalid', 'Give the token a name.', { name: 'Give the token a name of at most 80 characters.' })
  const { token, tokenHash, prefix } = newApiToken()
  const id = randomUUID()
  await db.insert(apiTokens).values({ id, userId, name: label, tokenHash, prefix })
  await audit({ userId, action: 'api-token.created', detail: { tokenId: id, name: label } })
  return { id, name: label, prefix, token }
}

export async function createApiToken(caller: Caller | null, name: string) {
  return issue(requireCaller(caller).id, name)
}

/** For `npm run token -- create`: an operator on the server makes a token for an account. */
export async function createApiTokenForEmail(email: string, name: string) {
  const [user] = await db.select({ id: users.id, passwordHash: users.passwordHash }).from(users).where(eq(users.email, email.trim().toLowerCase()))
  if (!user?.passwordHash) throw new AppError('not_found', `No active account uses ${email}.`)
  return issue(user.id, name)
}

export async function listApiTokens(caller: Caller | null) {
  const who = requireCaller(caller)
  return db
    .select({ id: apiTokens.id, name: apiTokens.name, prefix: apiTokens.prefix, createdAt: apiTokens.createdAt, lastUsedAt: apiTokens.lastUsedAt, revokedAt: apiTokens.revokedAt })
    .from(apiTokens)
    .where(eq(apiTokens.userId, who.id))
    .orderBy(desc(apiTokens.createdAt))
}

export async function revokeApiToken(caller: Caller | null, tokenId: string) {
  const who = requireCaller(caller)
  const done = await db
    .update(apiTokens)
    .set({ revokedAt: new Date() })
    .where(and(eq(apiTokens.id, tokenId), eq(apiTokens.userId, who.id), isNull(apiTokens.revokedAt)))
  if (done.rowsAffected === 0) throw new AppError('not_found', 'No such active token.')
  await audit({ userId: who.id, action: 'api-token.revoked', detail: { tokenId } })
}

/** The account a bearer token acts for, or null for an unknown or revoked token. Records when it was last used. */
export async function callerForApiToken(token: string): Promise<Caller | null> {
  if (!token.startsWith(PREFIX)) return null
  const [row] = await db
    .select({ tokenId: apiTokens.id, lastUsedAt: apiTokens.lastUsedAt, id: users.id, email: users.email, name: users.name, isAdmin: users.isAdmin, active: users.passwordHash })
    .from(apiTokens)
    .innerJoin(users, eq(users.id, apiTokens.userId))
    .where(and(eq(apiTokens.tokenHash, hashToken(token)), isNull(apiTokens.revokedAt)))
  if (!row?.active) return null
  // "Last used" to the minute: a write on every API call would queue every read behind SQLite's writer.
  const now = Date.now()
  if (!row.lastUsedAt || now - row.lastUsedAt.getTime() > 60_000) {
    await db.update(apiTokens).set({ lastUsedAt: new Date(now) }).where(and(eq(apiTokens.id, row.tokenId), or(isNull(apiTokens.lastUsedAt), lt(apiTokens.lastUsedAt, new Date(now - 60_000)))))
  }
  return { id: row.id, email: row.email, name: row.name, isAdmin: row.isAdmin }
}
