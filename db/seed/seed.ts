import { randomUUID } from 'node:crypto'
import { eq } from 'drizzle-orm'
import { hashPassword } from '@/lib/auth/password'
import type { Db } from '../index'
import { calcs, projectMembers, projects, users } from '../schema'
import { DEMO_CALCS, DEMO_PASSWORD, DEMO_PROJECT, DEMO_USERS } from './demo-data'

export type SeedHook = (db: Db, calc: { id: string; state: string; inputs: unknown }, people: Record<string, string>) => Promise<void>

/**
 * Loads the demo scenario into an empty database; does nothing if the demo admin exists.
 * `afterCalc` lets the caller add revisions (the calc pipeline lives outside db/).
 */
export async function seedDemo(db: Db, afterCalc?: SeedHook): Promise<boolean> {
  const [existing] = await db.select({ id: users.id }).from(users).where(eq(users.email, DEMO_USERS[0].email))
  if (existing) return false

  const passwordHash = await hashPassword(DEMO_PASSWORD)
  const people: Record<string, string> = {}
  for (const u of DEMO_USERS) {
    people[u.key] = randomUUID()
    await db.insert(users).values({ id: people[u.key], email: u.email, name: u.name, isAdmin: u.isAdmin, passwordHash })
  }
  const projectId = randomUUID()
  await db.insert(projects).values({ id: projectId, ...DEMO_PROJECT })
  for (const role of ['engineer', 'checker', 'approver'] as const) {
    await db.insert(projectMembers).values({ projectId, userId: people[role], role })
  }
  for (const c of DEMO_CALCS) {
    const id = randomUUID()
    await db.insert(calcs).values({
      id,
      projectId,
      number: c.number,
      title: c.title,
      calcType: c.calcType,
      state: c.state,
      draftInputs: c.inputs,
      engineerId: people.engineer,
      checkerId: c.state === 'draft' ? null : people.checker,
      approverId: c.state === 'issued' ? people.approver : null,
    })
    await afterCalc?.(db, { id, state: c.state, inputs: c.inputs }, people)
  }
  return true
}
