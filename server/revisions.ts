import { randomUUID } from 'node:crypto'
import { and, eq, inArray } from 'drizzle-orm'
import { db } from '@/db'
import { audit } from '@/db/audit'
import { attachments, calcs, revisions, type Revision } from '@/db/schema'
import { canonicalJson, sha256Hex } from '@/lib/calc/hash'
import { calculate } from '@/lib/calc/run'
import { ENGINE_VERSION } from '@/lib/calc/version'
import { AppError } from '@/lib/errors'
import { SUBMIT, STATES, transitionOf, type TransitionAction } from '@/lib/review/workflow'
import type { FileStore } from '@/lib/storage'
import type { Paper, ReportPackage } from '@/reports/types'
import { authoriseCalc, type Caller } from './access'
import { attachmentBytes, pendingAttachmentFiles } from './attachments'
import { reportPackageOf, TEMPLATE_VERSION } from './report-package'

/** The report pipeline, passed in: the app loads it outside the Next bundle, tests import it directly. */
export interface ReportRenderer {
  renderPdf(pkg: ReportPackage): Promise<Uint8Array>
}

export interface RevisionDeps {
  renderer: ReportRenderer
  store: FileStore
}

/** A, B, …, Z, AA, AB, … */
export function nextRevisionLabel(count: number): string {
  let n = count
  let label = ''
  do {
    label = String.fromCharCode(65 + (n % 26)) + label
    n = Math.floor(n / 26) - 1
  } while (n >= 0)
  return label
}

async function revisionsOf(calcId: string) {
  return db.select().from(revisions).where(eq(revisions.calcId, calcId))
}

/** Renders `rev` (stored or about to be) with the other revisions as they will stand, and stores the PDF under its hash. */
async function renderAndStore(rev: Revision, others: Revision[], deps: RevisionDeps, attachments: { name: string; bytes: Uint8Array }[]) {
  const pkg = await reportPackageOf(rev, others)
  const bytes = await deps.renderer.renderPdf({ ...pkg, attachments })
  const pdfHash = sha256Hex(bytes)
  const pdfKey = `pdf/${pdfHash}.pdf`
  await deps.store.put(pdfKey, bytes)
  return { pdfKey, pdfHash }
}

const superseding = (all: Revision[], states: readonly string[], except: string) =>
  all.filter((r) => r.id !== except && states.includes(r.state)).map((r) => ({ ...r, state: 'superseded' as const }))

/**
 * Freezes the calc's working inputs into a new revision that goes to check: runs the calc, renders
 * the PDF, then writes the revision, its PDF reference, the superseding of open revisions and the
 * pending appendices in one transaction — a failure anywhere before it changes nothing.
 */
export async function saveRevision(caller: Caller | null, projectId: string, calcId: string, deps: RevisionDeps) {
  const { calc, caller: who } = await authoriseCalc(caller, projectId, calcId, SUBMIT.permission)
  const run = calculate(calc.draftInputs)
  if (!run.ok) throw new AppError('invalid', 'The inputs have errors; fix them before saving a revision.', run.fieldErrors)
  if (!run.result.feasibility.ok) throw new AppError('invalid', `The mechanism is not feasible: ${run.result.feasibility.message}`)
  const existing = await revisionsOf(calc.id)
  const now = new Date()
  // The stored JSON is the canonical text, so the hash can be recomputed from the row alone.
  const inputs = JSON.parse(canonicalJson(calc.draftInputs)) as unknown
  const result = JSON.parse(canonicalJson(run.result)) as unknown
  const rev: Revision = {
    id: randomUUID(),
    calcId: calc.id,
    label: nextRevisionLabel(existing.length),
    state: SUBMIT.to,
    inputs,
    result,
    engineVersion: ENGINE_VERSION,
    templateVersion: TEMPLATE_VERSION,
    contentHash: sha256Hex(canonicalJson({ inputs, result })),
    pdfHash: null,
    pdfKey: null,
    frozenAt: now.toISOString(),
    engineerId: who.id,
    checkerId: null,
    approverId: null,
    checkedAt: null,
    approvedAt: null,
    issuedAt: null,
    createdAt: now,
  }
  const replaced = superseding(existing, SUBMIT.supersedes, rev.id)
  const others = [...existing.filter((r) => !replaced.some((x) => x.id === r.id)), ...replaced]
  const appendices = await pendingAttachmentFiles(calc.id, deps.store)
  const pdf = await renderAndStore(rev, others, deps, appendices.map(({ name, bytes }) => ({ name, bytes })))
  await db.transaction(async (tx) => {
    await tx.insert(revisions).values({ ...rev, ...pdf })
    if (replaced.length) await tx.update(revisions).set({ state: 'superseded' }).where(inArray(revisions.id, replaced.map((r) => r.id)))
    if (appendices.length) await tx.update(attachments).set({ revisionId: rev.id }).where(inArray(attachments.id, appendices.map((a) => a.id)))
    await tx.update(calcs).set({ state: SUBMIT.to, updatedAt: now }).where(eq(calcs.id, calc.id))
  })
  await audit({ userId: who.id, action: 'revision.saved', projectId, calcId: calc.id, detail: { revisionId: rev.id } })
  return rev.id
}

/**
 * Moves a revision along one transition of the workflow table and signs it. The same person may
 * not sign one revision in two roles (independence). The PDF is rendered with the change applied
 * before anything is written; the write only happens if the revision is still in the expected
 * state, so of two people acting at once exactly one wins.
 */
export async function transitionRevision(caller: Caller | null, projectId: string, calcId: string, revisionId: string, action: TransitionAction | string, deps: RevisionDeps) {
  const t = transitionOf(action)
  if (!t) throw new AppError('invalid', `Unknown action "${action}".`, { action: `must be one of the workflow's actions` })
  const { calc, caller: who } = await authoriseCalc(caller, projectId, calcId, t.permission)
  const all = await revisionsOf(calc.id)
  const rev = all.find((r) => r.id === revisionId)
  if (!rev) throw new AppError('not_found', 'No such revision.')
  if (rev.state !== t.from) {
    throw new AppError('conflict', `Revision ${rev.label} is ${STATES[rev.state].label.toLowerCase()}; only a revision that is ${STATES[t.from].label.toLowerCase()} can be moved to ${STATES[t.to].label.toLowerCase()}.`)
  }
  const signers = [rev.engineerId, rev.checkerId, rev.approverId]
  if (t.signs && signers.includes(who.id)) throw new AppError('forbidden', 'The same person cannot sign a revision in two roles.')

  const now = new Date()
  const sign = t.signs === 'checker' ? { checkerId: who.id, checkedAt: now } : t.signs === 'approver' ? { approverId: who.id, approvedAt: now } : {}
  const change = { ...sign, state: t.to, frozenAt: now.toISOString(), ...(t.to === 'issued' ? { issuedAt: now } : {}) }
  const replaced = superseding(all, t.supersedes, rev.id)
  const others = [...all.filter((r) => !replaced.some((x) => x.id === r.id)), ...replaced]
  const pdf = await renderAndStore({ ...rev, ...change }, others, deps, await attachmentBytes(rev.id, deps.store))
  await db.transaction(async (tx) => {
    const moved = await tx
      .update(revisions)
      .set({ ...change, ...pdf })
      .where(and(eq(revisions.id, rev.id), eq(revisions.state, t.from)))
    if (moved.rowsAffected === 0) throw new AppError('conflict', `Revision ${rev.label} was changed by someone else a moment ago; reload to see its state.`)
    if (replaced.length) await tx.update(revisions).set({ state: 'superseded' }).where(inArray(revisions.id, replaced.map((r) => r.id)))
    await tx
      .update(calcs)
      .set({ state: t.to, updatedAt: now, ...(t.signs === 'checker' ? { checkerId: who.id } : t.signs === 'approver' ? { approverId: who.id } : {}) })
      .where(eq(calcs.id, calc.id))
  })
  await audit({ userId: who.id, action: `revision.${t.action}`, projectId, calcId: calc.id, detail: { revisionId: rev.id } })
  return { ...rev, ...change }
}

export async function getRevision(caller: Caller | null, projectId: string, calcId: string, revisionId: string) {
  const { calc } = await authoriseCalc(caller, projectId, calcId, 'project.view')
  const [rev] = await db.select().from(revisions).where(and(eq(revisions.id, revisionId), eq(revisions.calcId, calc.id)))
  if (!rev) throw new AppError('not_found', 'No such revision.')
  return { calc, revision: rev }
}

/**
 * A revision's PDF. A4 is the stored, hashed record (checked against its hash before sending).
 * US Letter, and a superseded revision (so it carries the SUPERSEDED watermark), are rendered on
 * demand from the same frozen revision; the stored record stays as it was signed.
 */
export async function revisionPdf(caller: Caller | null, projectId: string, calcId: string, revisionId: string, paper: Paper, deps: RevisionDeps) {
  const { project } = await authoriseCalc(caller, projectId, calcId, 'pdf.download')
  const { calc, revision: rev } = await getRevision(caller, projectId, calcId, revisionId)
  let bytes: Uint8Array
  if (paper === 'A4' && rev.pdfKey && rev.state !== 'superseded') {
    bytes = await deps.store.get(rev.pdfKey)
    if (sha256Hex(bytes) !== rev.pdfHash) throw new Error(`stored PDF of revision ${rev.id} does not match its hash`)
  } else {
    const pkg = await reportPackageOf(rev, await revisionsOf(calc.id), paper)
    bytes = await deps.renderer.renderPdf({ ...pkg, attachments: await attachmentBytes(rev.id, deps.store) })
  }
  const filename = `${project.code}_${calc.number}_rev${rev.label}_${paper}.pdf`.replace(/[^A-Za-z0-9._-]/g, '_')
  return { bytes, filename }
}
