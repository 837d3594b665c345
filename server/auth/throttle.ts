import { eq, inArray, sql } from 'drizzle-orm'
import { db } from '@/db'
import { authThrottle } from '@/db/schema'

/**
 * Attempt counters with exponential back-off, for sign-in and password-reset requests.
 *
 * A limit lets `free` attempts through, then each further one must wait 1 s · 2^(n − free) after
 * the previous (capped at `maxDelayMs`); a refused attempt is not counted, so waiting always
 * helps. Counts forget after an hour without attempts. Checking and counting happen in one write
 * transaction, so 40 concurrent tries are counted as 40, not as 20.
 */
export interface Limit {
  key: string
  free: number
  maxDelayMs: number
}

const BASE_DELAY_MS = 1000
export const QUIET_MS = 3600_000

export function backoffMs(count: number, limit: Pick<Limit, 'free' | 'maxDelayMs'>): number {
  return count < limit.free ? 0 : Math.min(limit.maxDelayMs, BASE_DELAY_MS * 2 ** (count - limit.free))
}

/** Counts one attempt on every limit, or — when any of them is in back-off — none, and says how long to wait. */
export async function takeAttempt(limits: Limit[], now = new Date()): Promise<{ ok: true } | { ok: false; retryAfterMs: number }> {
  return db.transaction(async (tx) => {
    const rows = await tx.select().from(authThrottle).where(inArray(authThrottle.key, limits.map((l) => l.key)))
    let wait = 0
    for (const limit of limits) {
      const row = rows.find((r) => r.key === limit.key)
      if (!row || now.getTime() - row.lastAt.getTime() >= QUIET_MS) continue
      const delay = backoffMs(row.count, limit)
      if (delay > 0) wait = Math.max(wait, row.lastAt.getTime() + delay - now.getTime())
    }
    if (wait > 0) return { ok: false as const, retryAfterMs: wait }
    for (const limit of limits) {
      await tx
        .insert(authThrottle)
        .values({ key: limit.key, count: 1, lastAt: now })
        .onConflictDoUpdate({
          target: authThrottle.key,
          set: {
            count: sql`case when ${now.getTime()} - ${authThrottle.lastAt} >= ${QUIET_MS} then 1 else ${authThrottle.count} + 1 end`,
            lastAt: now,
          },
        })
    }
    return { ok: true as const }
  })
}

/** After a success: forget `reset` keys entirely and take the counted attempt back from `undo` keys. */
export async function settleAttempt(opts: { reset?: string[]; undo?: string[] }): Promise<void> {
  await db.transaction(async (tx) => {
    if (opts.reset?.length) await tx.delete(authThrottle).where(inArray(authThrottle.key, opts.reset))
    for (const key of opts.undo ?? []) {
      await tx.update(authThrottle).set({ count: sql`max(0, ${authThrottle.count} - 1)` }).where(eq(authThrottle.key, key))
    }
  })
}

/** "3 seconds", "2 minutes": how long to wait, for a message. */
export function waitText(ms: number): string {
  const s = Math.ceil(ms / 1000)
  if (s < 60) return `${s} second${s === 1 ? '' : 's'}`
  const m = Math.ceil(s / 60)
  return `${m} minute${m === 1 ? '' : 's'}`
}
