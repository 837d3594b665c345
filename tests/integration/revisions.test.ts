import { eq } from 'drizzle-orm'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { db } from '@/db'
import { loadReportPackage } from '@/server/report-package'
import { advanceRevision, nextRevisionLabel, saveRevision, type RevisionDeps } from '@/server/revisions'
import { calcs, revisions, users } from '@/db/schema'
import { seedDemo } from '@/server/demo/seed'
import { DEMO_USERS } from '@/server/demo/demo-data'
import { saveDraftInputs } from '@/server/calc-drafts'
import { localFileStore } from '@/lib/storage'
import { renderPdf } from '@/reports'
import { canonicalJson, sha256Hex } from '@/reports/hash'
import { useTempEnvironment } from '../helpers/temp-env'

let env: Awaited<ReturnType<typeof useTempEnvironment>>
let deps: RevisionDeps
const people: Record<string, string> = {}

beforeAll(async () => {
  env = await useTempEnvironment()
  deps = { renderer: { renderPdf }, store: localFileStore(`${env.dir}/files`) }
  await seedDemo(db)
  for (const u of DEMO_USERS) people[u.key] = (await db.select().from(users).where(eq(users.email, u.email)))[0].id
}, 120_000)
afterAll(() => env.close())

/** Drizzle wraps the driver's error; the trigger's message is in its cause. */
async function refused(p: Promise<unknown>, pattern: RegExp) {
  const err = await p.then(() => null, (e: unknown) => e as Error & { cause?: Error })
  expect(err, 'the database refused the change').toBeTruthy()
  expect(`${err!.message} ${err!.cause?.message ?? ''}`).toMatch(pattern)
}

const calcByNumber = async (n: string) => (await db.select().from(calcs).where(eq(calcs.number, n)))[0]
const revision = async (id: string) => (await db.select().from(revisions).where(eq(revisions.id, id)))[0]

describe('revision labels', () => {
  it.each([
    [0, 'A'],
    [1, 'B'],
    [25, 'Z'],
    [26, 'AA'],
    [27, 'AB'],
  ])('revision number %i is labelled %s (spreadsheet-style lettering, common practice)', (n, label) => {
    expect(nextRevisionLabel(n)).toBe(label)
  })
})

describe('saving and signing a revision', () => {
  let revId = ''

  it('freezes inputs, result, versions and hashes; the content hash is recomputable from the row', async () => {
    revId = await saveRevision(await calcByNumber('LC-001'), people.engineer, deps)
    const rev = await revision(revId)
    expect(rev.label).toBe('A')
    expect(rev.state).toBe('in-check')
    expect(rev.contentHash).toBe(sha256Hex(canonicalJson({ inputs: rev.inputs, result: rev.result })))
    const pdf = await deps.store.get(rev.pdfKey!)
    expect(sha256Hex(pdf)).toBe(rev.pdfHash)
    expect(Buffer.from(pdf.subarray(0, 5)).toString()).toBe('%PDF-')
  }, 60_000)

  it('rendering the same revision again gives byte-identical PDF output', async () => {
    const rev = await revision(revId)
    const again = await renderPdf(await loadReportPackage(revId))
    expect(sha256Hex(again)).toBe(rev.pdfHash)
  }, 60_000)

  it('the database refuses to change a saved revision’s content', async () => {
    await refused(db.update(revisions).set({ inputs: { tampered: true } }).where(eq(revisions.id, revId)), /revision content is frozen/)
  })

  it('independence: the engineer cannot check their own revision', async () => {
    await expect(advanceRevision(await calcByNumber('LC-001'), revId, 'check', people.engineer, deps)).rejects.toThrow(/two roles/)
  })

  it('steps must go in order: approving an unchecked revision is refused', async () => {
    await expect(advanceRevision(await calcByNumber('LC-001'), revId, 'approve', people.approver, deps)).rejects.toThrow(/in-check/)
  })

  it('check → approve → issue signs the revision, and an issued revision can no longer change', async () => {
    const calc = await calcByNumber('LC-001')
    await advanceRevision(calc, revId, 'check', people.checker, deps)
    await advanceRevision(calc, revId, 'approve', people.approver, deps)
    await advanceRevision(calc, revId, 'issue', people.approver, deps)
    const rev = await revision(revId)
    expect(rev.state).toBe('issued')
    expect(rev.checkerId).toBe(people.checker)
    expect(rev.approverId).toBe(people.approver)
    expect((await calcByNumber('LC-001')).state).toBe('issued')
    // The signed PDF is reproducible from the frozen row.
    expect(sha256Hex(await renderPdf(await loadReportPackage(revId)))).toBe(rev.pdfHash)
    await refused(db.update(revisions).set({ pdfHash: 'x' }).where(eq(revisions.id, revId)), /issued revision is frozen/)
    await refused(db.update(revisions).set({ state: 'draft' }).where(eq(revisions.id, revId)), /can only be superseded/)
    await refused(db.delete(revisions).where(eq(revisions.id, revId)), /cannot be deleted/)
  }, 120_000)

  it('issuing revision B supersedes the issued revision A', async () => {
    const calc = await calcByNumber('LC-001')
    const b = await saveRevision(calc, people.engineer, deps)
    await advanceRevision(calc, b, 'check', people.checker, deps)
    await advanceRevision(calc, b, 'approve', people.approver, deps)
    await advanceRevision(calc, b, 'issue', people.approver, deps)
    expect((await revision(revId)).state).toBe('superseded')
    expect((await revision(b)).label).toBe('B')
    expect(sha256Hex(await renderPdf(await loadReportPackage(b)))).toBe((await revision(b)).pdfHash)
  }, 120_000)
})

describe('working inputs', () => {
  it('invalid inputs are refused at their field and the saved inputs stay as they were', async () => {
    const calc = await calcByNumber('LC-003')
    const before = calc.draftInputs
    const bad = { ...(before as object), geometry: { arm: 80, side: -100, crank: 60 } }
    const outcome = await saveDraftInputs(calc, bad, people.engineer)
    expect(outcome.ok).toBe(false)
    if (!outcome.ok) expect(Object.keys(outcome.fieldErrors)).toContain('geometry.side')
    expect((await calcByNumber('LC-003')).draftInputs).toEqual(before)
  })
})

describe('checker remarks', () => {
  it('anchor to an existing step of a revision in check; unknown steps are refused at the step field', async () => {
    const { addRemark, closeRemark, listRemarks, respondToRemark } = await import('@/server/remarks')
    const calc = await calcByNumber('LC-002')
    const rev = await saveRevision(calc, people.engineer, deps)
    const err = await addRemark(calc, { revisionId: rev, stepId: 'no.such.step', text: 'Why?' }, people.checker).catch((e: { fieldErrors?: Record<string, string> }) => e)
    expect((err as { fieldErrors?: Record<string, string> }).fieldErrors?.stepId).toMatch(/no step/)
    const id = await addRemark(calc, { revisionId: rev, stepId: 'geo.inversion-constant', text: 'Please state the source of k.' }, people.checker)
    await respondToRemark(calc, id, 'Source added: Coxeter §6.1.', people.engineer)
    await closeRemark(calc, id, people.checker)
    const [remark] = await listRemarks(rev)
    expect(remark).toMatchObject({ stepId: 'geo.inversion-constant', status: 'closed', response: 'Source added: Coxeter §6.1.' })
    // The remarks log of the package lists it.
    const pkg = await loadReportPackage(rev)
    expect(pkg.remarks[0]).toMatchObject({ stepId: 'geo.inversion-constant', status: 'closed' })
  }, 60_000)
})
