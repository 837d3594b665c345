import { randomUUID } from 'node:crypto'
import { and, eq, inArray } from 'drizzle-orm'
import { calculate } from '@/lib/calc/run'
import { ENGINE_VERSION } from '@/lib/calc/version'
import { AppError } from '@/lib/errors'
import type { RevisionState } from '@/lib/review/roles'
import type { FileStore } from '@/lib/storage'
import { canonicalJson, sha256Hex } from '@/lib/calc/hash'
import type { Paper, ReportPackage } from '@/reports/types'
import { attachmentBytes, attachPendingTo } from './attachments'
import { audit } from './audit'
import { db } from './index'
import { loadReportPackage, TEMPLATE_VERSION } from './report-package'
import { calcs, revisions, type Calc, type Revision } from './schema'

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

/** Renders the revision's PDF, appendices included, as it stands now (plus a pending change). */
export async function renderRevisionPdf(revisionId: string, deps: RevisionDeps, paper: Paper = 'A4', pending?: Partial<Revision>) {
  const pkg = await loadReportPackage(revisionId, paper, pending)
  return deps.renderer.renderPdf({ ...pkg, attachments: await attachmentBytes(revisionId, deps.store) })
}

/** Renders the revision's record PDF and stores it under its hash. */
async function renderAndStorePdf(revisionId: string, deps: RevisionDeps, pending?: Partial<Revision>) {
  const bytes = await renderRevisionPdf(revisionId, deps, 'A4', pending)
  const pdfHash = sha256Hex(bytes)
  const pdfKey = `pdf/${pdfHash}.pdf`
  await deps.store.put(pdfKey, bytes)
  return { bytes, pdfHash, pdfKey }
}

/**
 * Freezes the calc's working inputs into a new revision: runs the calc, stores inputs, result,
 * engine and template versions, the content hash and the rendered PDF. The revision goes to check.
 */
export async function saveRevision(calc: Calc, userId: string, deps: RevisionDeps) {
  const run = calculate(calc.draftInputs)
  if (!run.ok) throw new AppError('invalid', 'The inputs have errors; fix them before saving a revision.', run.fieldErrors)
  if (!run.result.feasibility.ok) {
    throw new AppError('invalid', `The mechanism is not feasible: ${run.result.feasibility.message}`)
  }
  const existing = await db.select({ label: revisions.label, id: revisions.id, state: revisions.state }).from(revisions).where(eq(revisions.calcId, calc.id))
  const id = randomUUID()
  const frozenAt = new Date()
  // The stored JSON is the canonical text, so the hash can be recomputed from the row alone.
  const inputs = JSON.parse(canonicalJson(calc.draftInputs)) as unknown
  const result = JSON.parse(canonicalJson(run.result)) as unknown
  await db.insert(revisions).values({
    id,
    calcId: calc.id,
    label: nextRevisionLabel(existing.length),
    state: 'in-check',
    inputs,
    result,
    engineVersion: ENGINE_VERSION,
    templateVersion: TEMPLATE_VERSION,
    contentHash: sha256Hex(canonicalJson({ inputs, result })),
    frozenAt: frozenAt.toISOString(),
    engineerId: userId,
    createdAt: frozenAt,
  })
  // A newer revision replaces any older one still in progress; issued ones stay until the new one is issued.
  const open = existing.filter((r) => r.state !== 'issued' && r.state !== 'superseded').map((r) => r.id)
  if (open.length) await db.update(revisions).set({ state: 'superseded' }).where(inArray(revisions.id, open))
  await attachPendingTo(calc.id, id)
  const pdf = await renderAndStorePdf(id, deps)
  await db.update(revisions).set({ pdfKey: pdf.pdfKey, pdfHash: pdf.pdfHash }).where(eq(revisions.id, id))
  await db.update(calcs).set({ state: 'in-check', updatedAt: frozenAt }).where(eq(calcs.id, calc.id))
  await audit({ userId, action: 'revision.saved', projectId: calc.projectId, calcId: calc.id, detail: { revisionId: id } })
  return id
}

type Transition = { from: RevisionState; to: RevisionState; who: 'checker' | 'approver' }

export const TRANSITIONS = {
  check: { from: 'in-check', to: 'checked', who: 'checker' },
  approve: { from: 'checked', to: 'approved', who: 'approver' },
  issue: { from: 'approved', to: 'issued', who: 'approver' },
} as const satisfies Record<string, Transition>

/**
 * Moves a revision one step and signs it. The same person may not sign twice in different roles
 * (independence). The PDF is re-rendered so it shows the new state and signatures; once issued,
 * the database refuses any further change to it.
 */
export async function advanceRevision(calc: Calc, revisionId: string, step: keyof typeof TRANSITIONS, userId: string, deps: RevisionDeps) {
  const t = TRANSITIONS[step]
  const [rev] = await db.select().from(revisions).where(and(eq(revisions.id, revisionId), eq(revisions.calcId, calc.id)))
  if (!rev) throw new AppError('not_found', 'No such revision.')
  if (rev.state !== t.from) throw new AppError('conflict', `Revision ${rev.label} is ${rev.state}; only a revision that is ${t.from} can be moved to ${t.to}.`)
  const signers = [rev.engineerId, t.who === 'approver' ? rev.checkerId : null]
  if (signers.includes(userId)) throw new AppError('forbidden', 'The same person cannot sign a revision in two roles.')

  const now = new Date()
  const sign =
    step === 'check' ? { checkerId: userId, checkedAt: now } : step === 'approve' ? { approverId: userId, approvedAt: now } : { issuedAt: now }
  const change = { ...sign, state: t.to, frozenAt: now.toISOString() }
  // Render first with the change applied, then write it all at once: a failed render changes nothing,
  // and once the row says issued the database freezes it.
  const pdf = await renderAndStorePdf(rev.id, deps, change)
  await db.transaction(async (tx) => {
    if (step === 'issue') {
      await tx.update(revisions).set({ state: 'superseded' }).where(and(eq(revisions.calcId, calc.id), eq(revisions.state, 'issued')))
    }
    await tx.update(revisions).set({ ...change, pdfKey: pdf.pdfKey, pdfHash: pdf.pdfHash }).where(eq(revisions.id, rev.id))
    await tx
      .update(calcs)
      .set({ state: t.to, updatedAt: now, ...(step === 'check' ? { checkerId: userId } : step === 'approve' ? { approverId: userId } : {}) })
      .where(eq(calcs.id, calc.id))
  })
  await audit({ userId, action: `revision.${step}`, projectId: calc.projectId, calcId: calc.id, detail: { revisionId: rev.id } })
}
