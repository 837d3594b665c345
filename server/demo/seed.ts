import { randomUUID } from 'node:crypto'
import { eq } from 'drizzle-orm'
import type { Db } from '@/db'
import { projectMembers, projects, users } from '@/db/schema'
import { PERMISSIONS } from '@/lib/review/permissions'
import { SUBMIT, TRANSITIONS, type RevisionState } from '@/lib/review/workflow'
import type { Caller } from '../access'
import { hashPassword } from '../auth/password'
import { createCalc, saveInputs } from '../calcs'
import { drainRenderJobs } from '../render-jobs'
import { saveRevision, transitionRevision, type RevisionDeps } from '../revisions'
import { DEMO_CALCS, DEMO_PASSWORD, DEMO_PROJECT, DEMO_USERS } from './demo-data'

type DemoRole = (typeof DEMO_USERS)[number]['key']

/** The actions that take a revision from where saving leaves it to `target`, read from the workflow table. */
export function pathTo(target: RevisionState): string[] {
  const path: string[] = []
  let at: RevisionState = SUBMIT.to
  while (at !== target) {
    // The main line: the signing transitions that need no reason (check, approve, issue).
    const next = TRANSITIONS.find((t) => t.from.includes(at) && t.password && !t.reason)
    if (!next) throw new Error(`the workflow has no path from ${SUBMIT.to} to ${target}`)
    path.push(next.action)
    at = next.to
  }
  return path
}

/** Who takes each action in the demo: the first role the permission table allows it. */
const actorOf = (action: string): DemoRole => PERMISSIONS[TRANSITIONS.find((t) => t.action === action)!.permission][0]!

/**
 * Loads the demo scenario into an empty database through the same services the app uses; does
 * nothing if the demo admin exists. With `deps` (the report renderer and file store) each demo calc
 * is walked to its demo state; without, calcs stay drafts (enough for tests of other areas).
 */
export async function seedDemo(db: Db, deps?: RevisionDeps): Promise<boolean> {
  const [existing] = await db.select({ id: users.id }).from(users).where(eq(users.email, DEMO_USERS[0].email))
  if (existing) return false

  const passwordHash = await hashPassword(DEMO_PASSWORD)
  const people = {} as Record<DemoRole, Caller>
  for (const u of DEMO_USERS) {
    people[u.key] = { id: randomUUID(), email: u.email, name: u.name, isAdmin: u.isAdmin }
    await db.insert(users).values({ ...people[u.key], passwordHash })
  }
  const projectId = randomUUID()
  await db.insert(projects).values({ id: projectId, ...DEMO_PROJECT })
  for (const role of ['engineer', 'checker', 'approver'] as const) {
    await db.insert(projectMembers).values({ projectId, userId: people[role].id, role })
  }
  for (const c of DEMO_CALCS) {
    const calc = await createCalc(people.engineer, projectId, { number: c.number, title: c.title, calcType: c.calcType })
    const saved = await saveInputs(people.engineer, projectId, calc.id, c.inputs)
    if (!saved.ok) throw new Error(`demo calc ${c.number} does not validate: ${JSON.stringify(saved.fieldErrors)}`)
    if (!deps || c.state === 'draft') continue
    const revisionId = await saveRevision(people.engineer, projectId, calc.id, deps, {
      reason: 'First issue for the CE-40 build',
      checkerId: people.checker.id,
      approverId: people.approver.id,
      confirmFailing: true,
    })
    await drainRenderJobs(deps)
    for (const action of pathTo(c.state)) {
      await transitionRevision(people[actorOf(action)], projectId, calc.id, revisionId, action, deps, { password: DEMO_PASSWORD, confirmMaterials: true })
    }
  }
  return true
}
