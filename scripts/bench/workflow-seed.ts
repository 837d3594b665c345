import { db } from '@/db'
import { calcs } from '@/db/schema'
import { seedDemo } from '@/server/demo/seed'
import type { Caller } from '@/server/access'
import { users } from '@/db/schema'
import { DEMO_USERS } from '@/server/demo/demo-data'
import { eq } from 'drizzle-orm'

/** The demo, seeded as drafts, with its people as callers (not a bench of its own: no default export). */
export async function seededPeople() {
  await seedDemo(db)
  const people = {} as Record<(typeof DEMO_USERS)[number]['key'], Caller>
  for (const u of DEMO_USERS) {
    const [row] = await db.select().from(users).where(eq(users.email, u.email))
    people[u.key] = { id: row.id, email: row.email, name: row.name, isAdmin: row.isAdmin }
  }
  const rows = await db.select().from(calcs)
  return { people, projectId: rows[0].projectId, calcIds: Object.fromEntries(rows.map((c) => [c.number, c.id])) }
}
