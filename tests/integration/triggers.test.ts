import { eq } from 'drizzle-orm'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { db } from '@/db'
import { calcs, projects, revisions } from '@/db/schema'
import { REVISION_STATES, STATES, type RevisionState } from '@/lib/review/workflow'
import { useTempEnvironment } from '../helpers/temp-env'

/*
 * The database enforces what the workflow table declares, even against a direct SQL write:
 * a revision's content never changes; a sealed state's signatures and PDF never change and the
 * row is never deleted. Every state of the table is tried, so a state added without teaching the
 * triggers about it fails here.
 */

let env: Awaited<ReturnType<typeof useTempEnvironment>>
beforeAll(async () => {
  env = await useTempEnvironment()
  await db.insert(projects).values({ id: 'p', code: 'TR-1', name: 'Trigger test' })
  await db.insert(calcs).values({ id: 'c', projectId: 'p', number: 'T-1', title: 'Trigger test', calcType: 'peaucellier' })
  for (const [i, state] of REVISION_STATES.entries()) {
    await db.insert(revisions).values({ id: `r-${state}`, calcId: 'c', label: String.fromCharCode(65 + i), state, inputs: {}, result: {}, engineVersion: 't', pdfHash: 'h', pdfKey: 'k' })
  }
})
afterAll(() => env.close())

async function refused(p: Promise<unknown>): Promise<boolean> {
  return p.then(
    () => false,
    () => true,
  )
}

describe.each(REVISION_STATES)('a revision that is %s', (state: RevisionState) => {
  const id = `r-${state}`
  const sealed = STATES[state].sealed

  it('keeps its content whatever its state', async () => {
    expect(await refused(db.update(revisions).set({ inputs: { tampered: true } }).where(eq(revisions.id, id)))).toBe(true)
    expect(await refused(db.update(revisions).set({ result: { tampered: true } }).where(eq(revisions.id, id)))).toBe(true)
  })

  it(sealed ? 'refuses a change of its PDF or signatures (sealed)' : 'may still be signed and re-rendered (not sealed)', async () => {
    expect(await refused(db.update(revisions).set({ pdfHash: 'other' }).where(eq(revisions.id, id)))).toBe(sealed)
    expect(await refused(db.update(revisions).set({ approvedAt: new Date() }).where(eq(revisions.id, id)))).toBe(sealed)
  })

  it(sealed ? 'cannot be deleted' : 'can be deleted', async () => {
    expect(await refused(db.delete(revisions).where(eq(revisions.id, id)))).toBe(sealed)
  })
})

describe('a revision superseded before its package was rendered', () => {
  it('gets its package once; nothing else of it changes, and the package does not change again', async () => {
    await db.insert(revisions).values({ id: 'r-late', calcId: 'c', label: 'Z', state: 'superseded', inputs: {}, result: {}, engineVersion: 't' })
    // The first package may only come with nothing else changed.
    expect(await refused(db.update(revisions).set({ pdfKey: 'k1', pdfHash: 'h1', approvedAt: new Date() }).where(eq(revisions.id, 'r-late')))).toBe(true)
    expect(await refused(db.update(revisions).set({ pdfKey: 'k1' }).where(eq(revisions.id, 'r-late')))).toBe(true)
    expect(await refused(db.update(revisions).set({ pdfKey: 'k1', pdfHash: 'h1' }).where(eq(revisions.id, 'r-late')))).toBe(false)
    expect(await refused(db.update(revisions).set({ pdfKey: 'k2', pdfHash: 'h2' }).where(eq(revisions.id, 'r-late')))).toBe(true)
  })
})
