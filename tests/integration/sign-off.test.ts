import { randomUUID } from 'node:crypto'
import { eq } from 'drizzle-orm'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { db } from '@/db'
import { calcs, checkRemarks, notices, outbox, projectMembers, renderJobs, revisions, users } from '@/db/schema'
import { AppError } from '@/lib/errors'
import { PERMISSIONS } from '@/lib/review/permissions'
import { REVISION_STATES, TRANSITIONS, type RevisionState } from '@/lib/review/workflow'
import { localFileStore } from '@/lib/storage'
import { finishPdf, renderBody } from '@/reports'
import type { Caller } from '@/server/access'
import { DEMO_CALCS, DEMO_PASSWORD } from '@/server/demo/demo-data'
import { saveInputs } from '@/server/calcs'
import { drainOutbox } from '@/server/mail/outbox'
import { addRemark, closeRemark, listRemarks, replyToRemark } from '@/server/remarks'
import { drainRenderJobs } from '@/server/render-jobs'
import { revisionPdf, saveRevision, transitionRevision, type RevisionDeps } from '@/server/revisions'
import { verifyCode, verifyPdf } from '@/server/verify'
import { listCaughtMail } from '@/lib/mail/inbox'
import { formatNumber } from '@/lib/units/format'
import { seededDemo, type DemoRole } from '../helpers/demo'
import { pdfText } from '../reports/helpers'
import { useTempEnvironment } from '../helpers/temp-env'

let env: Awaited<ReturnType<typeof useTempEnvironment>>
let saves = 0
let people: Record<DemoRole, Caller>
let projectId = ''
let calcId: (n: string) => Promise<string>
let real: RevisionDeps
// For the matrix: no rendering, just bytes, so hundreds of transitions stay fast.
const fake: RevisionDeps = {
  renderer: { renderBody: async () => new Uint8Array([37, 80, 68, 70]), finishPdf: async (b) => b },
  store: { put: async () => {}, get: async () => new Uint8Array([37, 80, 68, 70]) },
}
const outsider: Caller = { id: 'u-out', email: 'x@elsewhere.example', name: 'Outsider', isAdmin: false }

beforeAll(async () => {
  env = await useTempEnvironment()
  real = { renderer: { renderBody, finishPdf }, store: localFileStore(`${env.dir}/files`) }
  ;({ people, projectId, calcId } = await seededDemo())
}, 120_000)
afterAll(() => env.close())

const submit = async (n: string, deps = fake) => {
  const id = await saveRevision(people.engineer, projectId, await calcId(n), deps, { reason: `test ${++saves}`, confirmFailing: true })
  await drainRenderJobs(deps)
  return id
}
const act = async (n: string, rev: string, action: string, who: Caller, deps = fake, extra: object = {}) =>
  transitionRevision(who, projectId, await calcId(n), rev, action, deps, { password: DEMO_PASSWORD, confirmMaterials: true, reason: 'because', ...extra })

async function code(p: Promise<unknown>): Promise<string> {
  try {
    await p
    return 'ok'
  } catch (err) {
    if (!(err instanceof AppError)) throw err
    return err.code
  }
}

describe('every transition from every state by every role', () => {
  // A template revision of LC-003 to copy into each state; the copies have no remarks, so nothing blocks.
  let template: typeof revisions.$inferSelect
  beforeAll(async () => {
    const id = await submit('LC-003')
    template = (await db.select().from(revisions).where(eq(revisions.id, id)))[0]
  })

  const roles = ['engineer', 'checker', 'approver', 'admin', 'outsider'] as const
  const rows = TRANSITIONS.flatMap((t) => REVISION_STATES.map((state) => [t.action, state] as const))
  let n = 0

  it.each(rows)('%s from %s: allowed for its roles from its states, 403 without the permission, 409 from another state', async (action, state) => {
    const t = TRANSITIONS.find((x) => x.action === action)!
    for (const role of roles) {
      const id = randomUUID()
      await db.insert(revisions).values({ ...template, id, label: `M${++n}`, state: state as RevisionState, checkerId: null, approverId: null, createdAt: new Date() })
      const who = role === 'outsider' ? outsider : people[role]
      const permitted = role !== 'admin' && role !== 'outsider' && (PERMISSIONS[t.permission] as readonly string[]).includes(role)
      const expected = role === 'outsider' ? 'not_found' : !permitted ? 'forbidden' : t.from.includes(state as RevisionState) ? 'ok' : 'conflict'
      expect(await code(act('LC-003', id, action, who)), `${role} ${action} from ${state}`).toBe(expected)
      if (expected === 'ok') expect((await db.select().from(revisions).where(eq(revisions.id, id)))[0].state).toBe(t.to)
    }
  })
})

describe('remarks block signing', () => {
  it('a must-be-resolved remark blocks check; a note does not, but blocks approve until closed; replies thread; only the checker closes', async () => {
    const rev = await submit('LC-002')
    const c = await calcId('LC-002')
    const must = await addRemark(people.checker, projectId, c, { revisionId: rev, stepId: 'geo.inversion-constant', severity: 'must-resolve', text: 'Source of k?' })
    await addRemark(people.checker, projectId, c, { revisionId: rev, severity: 'note', text: 'Nice figure.' })
    expect(await code(act('LC-002', rev, 'check', people.checker))).toBe('conflict')
    await replyToRemark(people.engineer, projectId, c, must, 'Added the source.')
    await replyToRemark(people.checker, projectId, c, must, 'Thanks, and the edition?')
    await replyToRemark(people.engineer, projectId, c, must, 'Second edition.')
    expect(await code(closeRemark(people.engineer, projectId, c, must))).toBe('forbidden')
    await closeRemark(people.checker, projectId, c, must)
    const thread = (await listRemarks(people.checker, projectId, c, rev)).find((r) => r.id === must)!
    expect(thread.replies.map((r) => r.author)).toEqual(['Ines Vogt', 'Tomas Brandt', 'Ines Vogt'])
    expect(await code(act('LC-002', rev, 'check', people.checker))).toBe('ok')
    expect(await code(act('LC-002', rev, 'approve', people.approver))).toBe('conflict')
    const note = (await listRemarks(people.checker, projectId, c, rev)).find((r) => r.severity === 'note')!
    await closeRemark(people.checker, projectId, c, note.id)
    expect(await code(act('LC-002', rev, 'approve', people.approver))).toBe('ok')
  })

  it('open remarks follow the step into the next revision and can be closed there', async () => {
    const a = await submit('LC-001')
    const c = await calcId('LC-001')
    await addRemark(people.checker, projectId, c, { revisionId: a, stepId: 'kin.line-offset', severity: 'must-resolve', text: 'Offset looks off.' })
    await act('LC-001', a, 'return', people.checker)
    const b = await submit('LC-001')
    expect((await db.select().from(revisions).where(eq(revisions.id, a)))[0].state).toBe('superseded')
    const [carried] = await listRemarks(people.checker, projectId, c, b)
    expect(carried).toMatchObject({ stepId: 'kin.line-offset', status: 'open', text: 'Offset looks off.' })
    expect(carried.carriedFromId).toBeTruthy()
    await closeRemark(people.checker, projectId, c, carried.id)
    // The superseded revision's own remark is part of its record now.
    const old = (await db.select().from(checkRemarks).where(eq(checkRemarks.revisionId, a)))[0]
    expect(await code(closeRemark(people.checker, projectId, c, old.id))).toBe('conflict')
  })
})

describe('signing', () => {
  it('needs the signer’s own password; a wrong one signs nothing', async () => {
    const rev = await submit('LC-002')
    expect(await code(act('LC-002', rev, 'check', people.checker, fake, { password: 'not-it' }))).toBe('invalid')
    expect((await db.select().from(revisions).where(eq(revisions.id, rev)))[0].state).toBe('in-check')
  })

  it('only the checker named at submission may check', async () => {
    const c = await calcId('LC-002')
    const second: Caller = { id: 'u-second-checker', email: 'second.checker@feldmark.example', name: 'Second Checker', isAdmin: false }
    await db.insert(users).values({ ...second, passwordHash: (await db.select().from(users).where(eq(users.id, people.checker.id)))[0].passwordHash })
    await db.insert(projectMembers).values({ projectId, userId: second.id, role: 'checker' })
    const rev = await saveRevision(people.engineer, projectId, c, fake, { reason: 'named', checkerId: people.checker.id, confirmFailing: true })
    await drainRenderJobs(fake)
    expect(await code(saveRevision(people.engineer, projectId, c, fake, { checkerId: people.engineer.id, confirmFailing: true }))).toBe('invalid')
    const err = await act('LC-002', rev, 'check', second).catch((e: AppError) => e)
    expect(err).toMatchObject({ code: 'forbidden', message: expect.stringMatching(/Only the checker named/) })
    expect(await code(act('LC-002', rev, 'check', people.checker))).toBe('ok')
  })

  it('issuing asks the approver to confirm the "from memory" material values, and records who did', async () => {
    // Links of EN AW-6082 T6, whose library values are marked "from memory" (shared MATERIAL-SOURCES.md lists no public copy).
    const c = await calcId('LC-003')
    const inputs = DEMO_CALCS.find((d) => d.number === 'LC-003')!.inputs
    const saved = await saveInputs(people.engineer, projectId, c, { ...inputs, defaults: { ...inputs.defaults, link: { ...inputs.defaults.link, material: '6082-T6' } } })
    expect(saved.ok).toBe(true)
    const rev = await submit('LC-003')
    await act('LC-003', rev, 'check', people.checker)
    await act('LC-003', rev, 'approve', people.approver)
    const err = await act('LC-003', rev, 'issue', people.approver, fake, { confirmMaterials: undefined }).catch((e: AppError) => e)
    expect((err as AppError).code).toBe('conflict')
    expect((err as AppError).message).toMatch(/6082-T6\.strength/)
    expect(await code(act('LC-003', rev, 'issue', people.approver))).toBe('ok')
  })
})

describe('the issued PDF verifies, a changed copy does not', () => {
  it('signs, stamps and verifies; one changed byte fails; superseded and voided are said plainly', async () => {
    const c = await calcId('LC-002')
    const rev = await saveRevision(people.engineer, projectId, c, real, { reason: 'to issue', confirmFailing: true })
    await drainRenderJobs(real)
    await act('LC-002', rev, 'check', people.checker, real)
    await act('LC-002', rev, 'approve', people.approver, real)
    await act('LC-002', rev, 'issue', people.approver, real)
    const { bytes, revision } = await revisionPdf(people.checker, projectId, c, rev, 'A4', real)
    const good = await verifyPdf(bytes)
    expect(good).toMatchObject({ issued: true, signatureValid: true, superseded: false, voided: false, revision: revision.label })
    const byCode = await verifyCode(revision.verificationCode!.toLowerCase())
    expect(byCode).toMatchObject({ issued: true, signatureValid: true })
    const tampered = Uint8Array.from(bytes)
    tampered[Math.floor(tampered.length / 2)] ^= 1
    const bad = await verifyPdf(tampered)
    expect(bad.issued).toBe(false)
    expect(bad.message).toMatch(/changed/)
    // A direct SQL change of the issued row is refused by the database.
    await expect(db.update(revisions).set({ pdfHash: 'x' }).where(eq(revisions.id, rev))).rejects.toThrow()
    await expect(db.delete(revisions).where(eq(revisions.id, rev))).rejects.toThrow()
    // The record prints names as they were: a later rename changes no copy of it.
    const letter = (await revisionPdf(people.checker, projectId, c, rev, 'LETTER', real)).bytes
    await db.update(users).set({ name: 'Mara Lind-Renamed' }).where(eq(users.id, people.approver.id))
    await db.update(users).set({ name: 'Tomas Brandt-Renamed' }).where(eq(users.id, people.checker.id))
    expect(Buffer.from((await revisionPdf(people.checker, projectId, c, rev, 'LETTER', real)).bytes).equals(Buffer.from(letter))).toBe(true)
    expect(Buffer.from((await revisionPdf(people.checker, projectId, c, rev, 'A4', real)).bytes).equals(Buffer.from(bytes))).toBe(true)
    await db.update(users).set({ name: 'Mara Lind' }).where(eq(users.id, people.approver.id))
    await db.update(users).set({ name: 'Tomas Brandt' }).where(eq(users.id, people.checker.id))
    await act('LC-002', rev, 'void', people.approver, real, { reason: 'wrong load case' })
    expect(await verifyPdf(bytes)).toMatchObject({ issued: true, voided: true })
  }, 240_000)
})

describe('a later revision says what changed', () => {
  it('its package carries a "changes since" section: the changed input, the step values, the verdict', async () => {
    const c = await calcId('LC-001')
    const [previous] = await db.select().from(revisions).where(eq(revisions.id, await submit('LC-001')))
    const [calc] = await db.select().from(calcs).where(eq(calcs.id, c))
    const inputs = structuredClone(calc.draftInputs) as { loads: { name: string; fy: number }[] }
    const load = inputs.loads[0]
    const was = load.fy
    load.fy = was * 2
    expect((await saveInputs(people.engineer, projectId, c, inputs)).ok).toBe(true)
    const rev = await saveRevision(people.engineer, projectId, c, real, { reason: 'load doubled', confirmFailing: true })
    await drainRenderJobs(real)
    const text = pdfText((await revisionPdf(people.checker, projectId, c, rev, 'A4', real)).bytes)
    expect(text).toContain(`Changes since rev ${previous.label}`)
    expect(text).toMatch(new RegExp(`Load cases \\(at the tracer\\) · ${load.name}: Fy N ${formatNumber(was)} ${formatNumber(2 * was)}`))
    expect(text).toMatch(/Step values changed \(\d+\)/)
    expect(text).toMatch(/The verdict (is unchanged|changed)/)
  }, 240_000)
})

describe('notices', () => {
  it('tell whoever acts next, in the app and by mail through the outbox', async () => {
    await db.delete(outbox)
    const before = listCaughtMail(env.mailDir).length
    const rev = await submit('LC-001')
    const toChecker = await db.select().from(notices).where(eq(notices.userId, people.checker.id))
    expect(toChecker.some((n) => n.revisionId === rev && n.kind === 'submit' && n.link.includes(rev))).toBe(true)
    await drainOutbox()
    const mails = listCaughtMail(env.mailDir).slice(0, listCaughtMail(env.mailDir).length - before)
    expect(mails.some((m) => m.to.includes(people.checker.email) && m.text.includes(`view=${rev}`))).toBe(true)
    await act('LC-001', rev, 'return', people.checker)
    expect((await db.select().from(notices).where(eq(notices.userId, people.engineer.id))).some((n) => n.kind === 'return')).toBe(true)
  })
})

describe('the package is rendered off the request path', () => {
  it('a saved revision cannot be signed or downloaded until its package is there', async () => {
    const c = await calcId('LC-003')
    const rev = await saveRevision(people.engineer, projectId, c, fake, { reason: 'pending', confirmFailing: true })
    expect(await code(act('LC-003', rev, 'check', people.checker))).toBe('conflict')
    expect(await code(revisionPdf(people.checker, projectId, c, rev, 'A4', fake))).toBe('conflict')
    expect(await drainRenderJobs(fake)).toBe(1)
    expect(await code(act('LC-003', rev, 'check', people.checker))).toBe('ok')
  })

  it('a render that fails is retried, then left failed with its reason', async () => {
    const c = await calcId('LC-003')
    const broken: RevisionDeps = { ...fake, renderer: { ...fake.renderer, renderBody: async () => Promise.reject(new Error('out of memory')) } }
    const rev = await saveRevision(people.engineer, projectId, c, broken, { reason: 'broken', confirmFailing: true })
    for (let i = 0; i < 3; i++) await drainRenderJobs(broken)
    const [job] = await db.select().from(renderJobs).where(eq(renderJobs.revisionId, rev))
    expect(job).toMatchObject({ state: 'failed', attempts: 3, error: 'out of memory' })
  })

  it('a claim left by a crashed process is taken over once it runs out', async () => {
    const c = await calcId('LC-003')
    const rev = await saveRevision(people.engineer, projectId, c, fake, { reason: 'crash', confirmFailing: true })
    await db.update(renderJobs).set({ state: 'running', claimedBy: 'dead-instance', claimedUntil: new Date(Date.now() + 60_000) }).where(eq(renderJobs.revisionId, rev))
    expect(await drainRenderJobs(fake)).toBe(0)
    expect(await drainRenderJobs(fake, { now: new Date(Date.now() + 120_000) })).toBe(1)
    expect((await db.select().from(revisions).where(eq(revisions.id, rev)))[0].pdfKey).toBeTruthy()
  })
})

describe('races', () => {
  it('two saves of one calc at once: one revision, the other told that nothing changed', async () => {
    const c = await calcId('LC-001')
    const save = () => saveRevision(people.engineer, projectId, c, fake, { reason: 'race', confirmFailing: true })
    const outcomes = await Promise.all([code(save()), code(save()), code(save())])
    expect(outcomes.filter((o) => o === 'ok')).toHaveLength(1)
    expect(outcomes.filter((o) => o === 'conflict')).toHaveLength(2)
    const labels = (await db.select().from(revisions).where(eq(revisions.calcId, c))).map((r) => r.label)
    expect(new Set(labels).size).toBe(labels.length)
    await drainRenderJobs(fake)
    expect((await db.select().from(revisions).where(eq(revisions.calcId, c))).every((r) => r.pdfKey)).toBe(true)
  })

  it('two approvers at once: one signature, the other told the revision moved', async () => {
    const rev = await submit('LC-002')
    await act('LC-002', rev, 'check', people.checker)
    const second: Caller = { id: 'u-second-approver', email: 'second.approver@feldmark.example', name: 'Second Approver', isAdmin: false }
    await db.insert(users).values({ ...second, passwordHash: (await db.select().from(users).where(eq(users.id, people.approver.id)))[0].passwordHash })
    await db.insert(projectMembers).values({ projectId, userId: second.id, role: 'approver' })
    const outcomes = await Promise.all([code(act('LC-002', rev, 'approve', people.approver)), code(act('LC-002', rev, 'approve', second))])
    expect(outcomes.sort()).toEqual(['conflict', 'ok'])
    const [row] = await db.select().from(revisions).where(eq(revisions.id, rev))
    expect(row.state).toBe('approved')
    expect([people.approver.id, second.id]).toContain(row.approverId)
  })
})

describe('calc state follows the revision', () => {
  it('a withdrawn revision leaves the calc withdrawn and cannot be signed', async () => {
    const rev = await submit('LC-003')
    await act('LC-003', rev, 'withdraw', people.engineer)
    expect((await db.select().from(calcs).where(eq(calcs.number, 'LC-003')))[0].state).toBe('withdrawn')
    expect(await code(act('LC-003', rev, 'check', people.checker))).toBe('conflict')
  })
})
