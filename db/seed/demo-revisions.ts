import { eq } from 'drizzle-orm'
import { advanceRevision, saveRevision, type RevisionDeps } from '../revisions'
import { calcs } from '../schema'
import type { SeedHook } from './seed'

/** Walks each demo calc to its demo state through the same functions the app uses. */
export function demoRevisions(deps: RevisionDeps): SeedHook {
  return async (db, { id, state }, people) => {
    if (state === 'draft') return
    const load = async () => (await db.select().from(calcs).where(eq(calcs.id, id)))[0]
    const revisionId = await saveRevision(await load(), people.engineer, deps)
    if (state === 'in-check') return
    await advanceRevision(await load(), revisionId, 'check', people.checker, deps)
    await advanceRevision(await load(), revisionId, 'approve', people.approver, deps)
    await advanceRevision(await load(), revisionId, 'issue', people.approver, deps)
  }
}
