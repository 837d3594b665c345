import { eq } from 'drizzle-orm'
import { afterAll, beforeAll } from 'vitest'
import { db } from '@/db'
import { calcs, projects, users } from '@/db/schema'
import type { Caller } from '@/server/access'
import { DEMO_USERS } from '@/server/demo/demo-data'
import { seedDemo } from '@/server/demo/seed'
import type { RevisionDeps } from '@/server/revisions'
import { useTempEnvironment } from './temp-env'

export type DemoRole = (typeof DEMO_USERS)[number]['key']

/** Seeds the demo (calcs as drafts unless `deps` is given) and returns its people as callers, the project id and a calc finder. */
export async function seededDemo(deps?: RevisionDeps) {
  await seedDemo(db, deps)
  const people = {} as Record<DemoRole, Caller>
  for (const u of DEMO_USERS) {
    const [row] = await db.select().from(users).where(eq(users.email, u.email))
    people[u.key] = { id: row.id, email: row.email, name: row.name, isAdmin: row.isAdmin }
  }
  const [project] = await db.select().from(projects).where(eq(projects.code, 'FM-CE40'))
  const calcId = async (number: string) => (await db.select().from(calcs).where(eq(calcs.number, number)))[0].id
  return { people, projectId: project.id, calcId }
}

/**
 * A test file's whole set-up: a temporary environment with the demo seeded before its tests and
 * closed after them. Read the fields inside tests (they are filled in `beforeAll`).
 */
export function useSeededDemo(timeoutMs = 120_000) {
  const demo = {} as Awaited<ReturnType<typeof seededDemo>>
  let env: Awaited<ReturnType<typeof useTempEnvironment>> | undefined
  beforeAll(async () => {
    env = await useTempEnvironment()
    Object.assign(demo, await seededDemo())
  }, timeoutMs)
  afterAll(() => env?.close())
  return demo
}
