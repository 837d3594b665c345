/**
 * Issue 13, load: the stored-PDF download reads only what it needs (no calc or revision JSON), so
 * 50 at once stay cheap; it still checks the bytes against the stored hash, keeps ownership in the
 * WHERE clause (a revision of another calc, or a calc of another project, is not found), and records
 * who took a copy of a sealed record — once per person, revision and paper per minute, not once per
 * request of a burst.
 */
import { and, eq } from 'drizzle-orm'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { db } from '@/db'
import { auditEvents, calcs, revisions } from '@/db/schema'
import { sha256Hex } from '@/lib/calc/hash'
import { AppError } from '@/lib/errors'
import type { Caller } from '@/server/access'
import { revisionPdf, type RevisionDeps } from '@/server/revisions'
import { seededDemo, type DemoRole } from '../helpers/demo'
import { useTempEnvironment } from '../helpers/temp-env'

let env: Awaited<ReturnType<typeof useTempEnvironment>>
let people: Record<DemoRole, Caller>
let projectId = ''
const files = new Map<string, Uint8Array>()
// Each body is its own bytes (the revision id inside), so stored PDFs differ and hashes are checked for real.
const deps: RevisionDeps = {
  renderer: { renderBody: async (pkg) => new TextEncoder().encode(`%PDF-1.7 ${JSON.stringify(pkg).length}`), finishPdf: async (b, pkg) => new Uint8Array([...b, ...new TextEncoder().encode(` ${pkg.revision.state} ${Math.random()}`)]) },
  store: {
    put: async (key, bytes) => void files.set(key, bytes),
    get: async (key) => {
      const b = files.get(key)
      if (!b) throw new Error(`no file ${key}`)
      return b
    },
  },
}

beforeAll(async () => {
  env = await useTempEnvironment()
  ;({ people, projectId } = await seededDemo(deps))
}, 120_000)
afterAll(() => env.close())

const codeOf = async (p: Promise<unknown>) => {
  try {
    await p
    return 'ok'
  } catch (e) {
    return e instanceof AppError ? e.code : String(e)
  }
}

describe('stored PDF download', () => {
  it('a burst of downloads of an issued revision: the stored bytes every time, one audit record per person and paper', async () => {
    const [issued] = await db.select({ id: revisions.id, calcId: revisions.calcId, pdfHash: revisions.pdfHash }).from(revisions).where(eq(revisions.state, 'issued'))
    expect(issued).toBeDefined()
    const before = await db.select().from(auditEvents).where(and(eq(auditEvents.action, 'pdf.downloaded'), eq(auditEvents.userId, people.checker.id)))
    const all = await Promise.all(Array.from({ length: 20 }, () => revisionPdf(people.checker, projectId, issued.calcId, issued.id, 'A4', deps)))
    for (const r of all) expect(sha256Hex(r.bytes)).toBe(issued.pdfHash)
    const after = await db.select().from(auditEvents).where(and(eq(auditEvents.action, 'pdf.downloaded'), eq(auditEvents.userId, people.checker.id)))
    expect(after.length - before.length).toBe(1)
    expect(after.at(-1)?.detail).toMatchObject({ revisionId: issued.id, paper: 'A4', state: 'issued' })
    // Another person's download is their own record.
    await revisionPdf(people.approver, projectId, issued.calcId, issued.id, 'A4', deps)
    expect(await db.select().from(auditEvents).where(and(eq(auditEvents.action, 'pdf.downloaded'), eq(auditEvents.userId, people.approver.id)))).toHaveLength(1)
  })

  it('a stored file that does not match its hash is refused (checked when read; afterwards only the checked bytes are served)', async () => {
    // A revision not downloaded before in this process, so its file is read now.
    const [rev] = await db.select({ id: revisions.id, calcId: revisions.calcId, pdfKey: revisions.pdfKey }).from(revisions).where(eq(revisions.state, 'in-check'))
    const good = files.get(rev.pdfKey!)!
    files.set(rev.pdfKey!, new Uint8Array([...good, 32]))
    try {
      await expect(revisionPdf(people.checker, projectId, rev.calcId, rev.id, 'A4', deps)).rejects.toThrow(/does not match its hash/)
    } finally {
      files.set(rev.pdfKey!, good)
    }
  })

  it('ownership stays in the WHERE clause: a revision under another calc, or a calc id of another project, is not found', async () => {
    const [rev] = await db.select({ id: revisions.id, calcId: revisions.calcId }).from(revisions).where(eq(revisions.state, 'issued'))
    const [other] = (await db.select({ id: calcs.id }).from(calcs).where(eq(calcs.projectId, projectId))).filter((c) => c.id !== rev.calcId)
    expect(await codeOf(revisionPdf(people.checker, projectId, other.id, rev.id, 'A4', deps))).toBe('not_found')
    expect(await codeOf(revisionPdf(people.checker, projectId, 'no-such-calc', rev.id, 'A4', deps))).toBe('not_found')
    expect(await codeOf(revisionPdf(people.checker, 'no-such-project', rev.calcId, rev.id, 'A4', deps))).toBe('not_found')
  })
})
