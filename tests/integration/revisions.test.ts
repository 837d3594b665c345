import { eq } from 'drizzle-orm'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { db } from '@/db'
import { loadReportPackage } from '@/server/report-package'
import { drainRenderJobs } from '@/server/render-jobs'
import { nextRevisionLabel, saveRevision, transitionRevision, type RevisionDeps } from '@/server/revisions'
import { calcs, revisions } from '@/db/schema'
import { saveInputs } from '@/server/calcs'
import { changeMemberRole } from '@/server/members'
import type { Caller } from '@/server/access'
import { DEMO_PASSWORD } from '@/server/demo/demo-data'
import { localFileStore } from '@/lib/storage'
import { finishPdf, renderBody, renderPdf } from '@/reports'
import { canonicalJson, sha256Hex } from '@/reports/hash'
import { seededDemo, type DemoRole } from '../helpers/demo'
import { useTempEnvironment } from '../helpers/temp-env'

let env: Awaited<ReturnType<typeof useTempEnvironment>>
let saves = 0
let deps: RevisionDeps
let people: Record<DemoRole, Caller>
let projectId = ''
let calcId: (n: string) => Promise<string>

beforeAll(async () => {
  env = await useTempEnvironment()
  deps = { renderer: { renderBody, finishPdf }, store: localFileStore(`${env.dir}/files`) }
  ;({ people, projectId, calcId } = await seededDemo())
}, 120_000)
afterAll(() => env.close())

/** Drizzle wraps the driver's error; the trigger's message is in its cause. */
async function refused(p: Promise<unknown>, pattern: RegExp) {
  const err = await p.then(() => null, (e: unknown) => e as Error & { cause?: Error })
  expect(err, 'the database refused the change').toBeTruthy()
  expect(`${err!.message} ${err!.cause?.message ?? ''}`).toMatch(pattern)
}

const calcByNumber = async (n: string) => (await db.select().from(calcs).where(eq(calcs.number, n)))[0]
const save = async (n: string, who: Caller) => {
  const id = await saveRevision(who, projectId, await calcId(n), deps, { reason: `test ${++saves}`, confirmFailing: true })
  await drainRenderJobs(deps)
  return id
}
const move = async (n: string, rev: string, action: string, who: Caller) =>
  transitionRevision(who, projectId, await calcId(n), rev, action, deps, { password: DEMO_PASSWORD, confirmMaterials: true, reason: 'test' })
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
    revId = await save('LC-001', people.engineer)
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

  it('the engineer’s role cannot check a revision (permission table)', async () => {
    await expect(move('LC-001', revId, 'check', people.engineer)).rejects.toThrow(/does not allow this \(calc.check\)/)
  })

  it('steps must go in order: approving an unchecked revision is refused', async () => {
    await expect(move('LC-001', revId, 'approve', people.approver)).rejects.toThrow(/needs a revision that is checked/)
  })

  it('check → approve → issue signs the revision, and an issued revision can no longer change', async () => {
    await move('LC-001', revId, 'check', people.checker)
    await move('LC-001', revId, 'approve', people.approver)
    await move('LC-001', revId, 'issue', people.approver)
    const rev = await revision(revId)
    expect(rev.state).toBe('issued')
    expect(rev.checkerId).toBe(people.checker.id)
    expect(rev.approverId).toBe(people.approver.id)
    expect((await calcByNumber('LC-001')).state).toBe('issued')
    // The signed PDF is reproducible from the frozen row.
    expect(sha256Hex(await renderPdf(await loadReportPackage(revId)))).toBe(rev.pdfHash)
    await refused(db.update(revisions).set({ pdfHash: 'x' }).where(eq(revisions.id, revId)), /issued revision is frozen/)
    await refused(db.update(revisions).set({ state: 'draft' }).where(eq(revisions.id, revId)), /can only be superseded/)
    await refused(db.delete(revisions).where(eq(revisions.id, revId)), /cannot be deleted/)
  }, 120_000)

  it('issuing revision B supersedes the issued revision A', async () => {
    const b = await save('LC-001', people.engineer)
    await move('LC-001', b, 'check', people.checker)
    await move('LC-001', b, 'approve', people.approver)
    await move('LC-001', b, 'issue', people.approver)
    expect((await revision(revId)).state).toBe('superseded')
    expect((await revision(b)).label).toBe('B')
    expect(sha256Hex(await renderPdf(await loadReportPackage(b)))).toBe((await revision(b)).pdfHash)
  }, 120_000)
})

describe('independence', () => {
  it('a checker who signed a revision cannot approve it, even after being made approver', async () => {
    const rev = await save('LC-002', people.engineer)
    await move('LC-002', rev, 'check', people.checker)
    await changeMemberRole(people.admin, projectId, people.checker.id, 'approver')
    await expect(move('LC-002', rev, 'approve', people.checker)).rejects.toThrow(/two roles/)
    await changeMemberRole(people.admin, projectId, people.checker.id, 'checker')
  }, 60_000)
})

describe('working inputs', () => {
  it('invalid inputs are refused at their field and the saved inputs stay as they were', async () => {
    const calc = await calcByNumber('LC-003')
    const before = calc.draftInputs
    const bad = { ...(before as object), geometry: { arm: 80, side: -100, crank: 60 } }
    const outcome = await saveInputs(people.engineer, projectId, calc.id, bad)
    expect(outcome.ok).toBe(false)
    if (!outcome.ok) expect(Object.keys(outcome.fieldErrors)).toContain('geometry.side')
    expect((await calcByNumber('LC-003')).draftInputs).toEqual(before)
  })
})

describe('checker remarks', () => {
  it('anchor to an existing step of a revision in check; unknown steps are refused at the step field', async () => {
    const { addRemark, closeRemark, listRemarks, replyToRemark } = await import('@/server/remarks')
    const calc = await calcId('LC-002')
    const rev = await save('LC-002', people.engineer)
    const err = await addRemark(people.checker, projectId, calc, { revisionId: rev, stepId: 'no.such.step', text: 'Why?' }).catch((e: { fieldErrors?: Record<string, string> }) => e)
    expect((err as { fieldErrors?: Record<string, string> }).fieldErrors?.stepId).toMatch(/no step/)
    const id = await addRemark(people.checker, projectId, calc, { revisionId: rev, stepId: 'geo.inversion-constant', text: 'Please state the source of k.' })
    await replyToRemark(people.engineer, projectId, calc, id, 'Source added: Coxeter §6.1.')
    await closeRemark(people.checker, projectId, calc, id)
    const [remark] = await listRemarks(people.checker, projectId, calc, rev)
    expect(remark).toMatchObject({ stepId: 'geo.inversion-constant', status: 'closed', replies: [{ text: 'Source added: Coxeter §6.1.', author: 'Ines Vogt' }] })
    // The remarks log of the package lists it.
    const pkg = await loadReportPackage(rev)
    expect(pkg.remarks[0]).toMatchObject({ stepId: 'geo.inversion-constant', status: 'closed' })
  }, 60_000)
})
