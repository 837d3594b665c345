import { randomUUID } from 'node:crypto'
import { and, asc, eq, inArray } from 'drizzle-orm'
import { db } from '@/db'
import { audit } from '@/db/audit'
import { attachments, calcs, materialConfirmations, projectMembers, revisionEvents, revisions, users, type Revision } from '@/db/schema'
import { canonicalJson, sha256Hex } from '@/lib/calc/hash'
import { calculate } from '@/lib/calc/run'
import { ENGINE_VERSION } from '@/lib/calc/version'
import { memoryValuesIn } from '@/lib/checks/memory-values'
import { AppError } from '@/lib/errors'
import { stripControl } from '@/lib/schemas/clean-text'
import type { ProjectRole } from '@/lib/review/roles'
import { STATES, SUBMIT, transitionOf, type TransitionAction, type TransitionSpec } from '@/lib/review/workflow'
import type { Paper } from '@/reports/types'
import { authorise, authoriseCalc, type Caller } from './access'
import { pendingAttachmentRows } from './attachments'
import { bodyKey, type RevisionDeps } from './package-deps'
import { enqueueRender, kickRenderRunner } from './render-jobs'
import { verifyPassword } from './auth/password'
import { notify } from './notices'
import { carryOverRemarks, openRemarks } from './remarks'
import { packageToRender, TEMPLATE_VERSION, type PendingEvent } from './report-package'
import { signStatement, verificationCodeOf } from './signing'

export type { ReportRenderer, RevisionDeps } from './package-deps'

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

async function storePdf(bytes: Uint8Array, deps: RevisionDeps) {
  const pdfHash = sha256Hex(bytes)
  const pdfKey = `pdf/${pdfHash}.pdf`
  await deps.store.put(pdfKey, bytes)
  return { pdfKey, pdfHash }
}

/** The package of `rev` as it will stand (with `pending`, an event about to be written), stamped onto its stored body. */
async function stamp(rev: Revision, others: Revision[], deps: RevisionDeps, pending?: PendingEvent, paper: Paper = 'A4') {
  const pkg = await packageToRender(rev, others, deps.store, paper, pending)
  const body = paper === 'A4' ? await deps.store.get(bodyKey(rev.id)) : await deps.renderer.renderBody(pkg)
  return deps.renderer.finishPdf(body, pkg)
}

const superseding = (all: Revision[], states: readonly string[], except: string) =>
  all.filter((r) => r.id !== except && states.includes(r.state)).map((r) => ({ ...r, state: 'superseded' as const }))

/** A named signer must be a member with that role, and never the engineer who submits. */
async function namedMember(projectId: string, userId: string | undefined, role: ProjectRole, engineerId: string, field: string) {
  if (!userId) return null
  if (userId === engineerId) throw new AppError('invalid', 'You cannot check or approve your own revision.', { [field]: 'Name someone other than yourself.' })
  const [m] = await db
    .select({ role: projectMembers.role })
    .from(projectMembers)
    .where(and(eq(projectMembers.projectId, projectId), eq(projectMembers.userId, userId)))
  if (m?.role !== role) throw new AppError('invalid', `The person named is not a ${role} of this project.`, { [field]: `Choose a member with the ${role} role.` })
  return userId
}

/** How long after a save the same content counts as the same save (double click, concurrent requests). */
const DUPLICATE_SAVE_MS = 2 * 60_000

export interface SubmitOptions {
  reason?: string
  checkerId?: string
  approverId?: string
  /** The engineer confirms submitting a calc whose verdict is FAIL. */
  confirmFailing?: boolean
}

/**
 * Freezes the calc's working inputs into a new revision that goes to check: runs the calc, then
 * writes the revision, the superseding of open revisions (whose open remarks follow it), the
 * pending appendices, the history entry and the job that renders its package in one transaction —
 * a failure anywhere before it changes nothing. The package is rendered by the render runner
 * (server/render-jobs.ts), off the request path. The named checker is told.
 */
export async function saveRevision(caller: Caller | null, projectId: string, calcId: string, deps: RevisionDeps, opts: SubmitOptions = {}) {
  const { calc, caller: who } = await authoriseCalc(caller, projectId, calcId, SUBMIT.permission)
  const run = calculate(calc.draftInputs)
  if (!run.ok) throw new AppError('invalid', 'The inputs have errors; fix them before saving a revision.', run.fieldErrors)
  if (!run.result.feasibility.ok) throw new AppError('invalid', `The mechanism is not feasible: ${run.result.feasibility.message}`)
  const failing = !run.result.verdict.pass
  if (failing && !opts.confirmFailing) {
    throw new AppError('conflict', `The calc fails (${run.result.verdict.governing}). Confirm to submit it failing; the revision will say so.`, {
      confirmFailing: 'The calc fails a check: confirm to submit it anyway.',
    })
  }
  const checkerId = await namedMember(projectId, opts.checkerId, 'checker', who.id, 'checkerId')
  const approverId = await namedMember(projectId, opts.approverId, 'approver', who.id, 'approverId')
  const now = new Date()
  // The stored JSON is the canonical text, so the hash can be recomputed from the row alone.
  const inputs = JSON.parse(canonicalJson(calc.draftInputs)) as unknown
  const result = JSON.parse(canonicalJson(run.result)) as unknown
  const rev: Revision = {
    id: randomUUID(),
    calcId: calc.id,
    label: '', // given inside the write transaction, from the revisions there at that moment
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
    reason: stripControl(opts.reason ?? '').trim().slice(0, 500) || null,
    submittedFailing: failing,
    assignedCheckerId: checkerId,
    assignedApproverId: approverId,
    verificationCode: null,
    createdAt: now,
  }
  const appendices = await pendingAttachmentRows(calc.id)
  // One write transaction: saves of one calc are serialised here (two instances included, by SQLite's write lock).
  await db.transaction(async (tx) => {
    const existing = await tx.select().from(revisions).where(eq(revisions.calcId, calc.id))
    const newest = [...existing].sort((a, b) => b.createdAt.getTime() - a.createdAt.getTime())[0]
    // A second save of the same content for the same reason moments after the first (a double
    // click, two tabs, two instances) is the same revision: one wins, the other is told that
    // nothing changed.
    const same = newest && newest.contentHash === rev.contentHash && newest.reason === rev.reason && newest.state === SUBMIT.to
    if (same && now.getTime() - newest.createdAt.getTime() < DUPLICATE_SAVE_MS) {
      throw new AppError('conflict', `Revision ${newest!.label} with exactly these inputs and reason was saved a moment ago; nothing was changed.`)
    }
    rev.label = nextRevisionLabel(existing.length)
    const replaced = superseding(existing, SUBMIT.supersedes, rev.id)
    await tx.insert(revisions).values(rev)
    if (replaced.length) await tx.update(revisions).set({ state: 'superseded' }).where(inArray(revisions.id, replaced.map((r) => r.id)))
    await carryOverRemarks(tx, replaced.map((r) => r.id), rev)
    if (appendices.length) await tx.update(attachments).set({ revisionId: rev.id }).where(inArray(attachments.id, appendices.map((a) => a.id)))
    await tx.insert(revisionEvents).values({ revisionId: rev.id, action: 'submit', fromState: null, toState: rev.state, userId: who.id, actorName: who.name, reason: rev.reason, at: now })
    await tx
      .update(calcs)
      .set({ state: SUBMIT.to, updatedAt: now, checkerId: checkerId ?? calc.checkerId, approverId: approverId ?? calc.approverId })
      .where(eq(calcs.id, calc.id))
    // The package is rendered off the request path; the revision cannot be signed until it is there.
    await enqueueRender(tx, rev.id)
  })
  kickRenderRunner()
  await audit({ userId: who.id, action: 'revision.saved', projectId, calcId: calc.id, detail: { revisionId: rev.id, failing } })
  await notify({ to: SUBMIT.notice, kind: 'submit', calc, revision: rev, by: who, text: `${calc.number} rev ${rev.label} waits for your check` })
  return rev.id
}

export interface TransitionOptions {
  password?: string
  reason?: string
  /** The approver confirms every "from memory" material value the revision uses (issue only). */
  confirmMaterials?: boolean
}

async function checkPassword(who: Caller, password: string | undefined) {
  if (!password) throw new AppError('invalid', 'Enter your password to sign.', { password: 'Enter your password to sign.' })
  const [u] = await db.select({ hash: users.passwordHash }).from(users).where(eq(users.id, who.id))
  if (!u?.hash || !(await verifyPassword(u.hash, password))) throw new AppError('invalid', 'The password is not right; nothing was signed.', { password: 'Wrong password.' })
}

/** What still stops a transition that the table guards with open remarks or unconfirmed material values. */
async function refuseBlocked(t: TransitionSpec, rev: Revision, who: Caller, opts: TransitionOptions) {
  if (t.blockedBy) {
    const open = await openRemarks(rev.id)
    const n = t.blockedBy === 'must-resolve' ? open.mustResolve : open.any
    if (n > 0) {
      const what = t.blockedBy === 'must-resolve' ? 'remark that must be resolved is' : 'remark is'
      throw new AppError('conflict', `${n} ${what.replace('remark', n === 1 ? 'remark' : 'remarks').replace(' is', n === 1 ? ' is' : ' are')} still open on revision ${rev.label}: close ${n === 1 ? 'it' : 'them'} first.`)
    }
  }
  if (t.to !== 'issued') return []
  const confirmed = new Set((await db.select({ value: materialConfirmations.value }).from(materialConfirmations).where(eq(materialConfirmations.revisionId, rev.id))).map((r) => r.value))
  const missing = memoryValuesIn(rev.inputs).filter((m) => !confirmed.has(m.key))
  if (missing.length && !opts.confirmMaterials) {
    throw new AppError(
      'conflict',
      `Confirm these material values against their standards before issue: ${missing.map((m) => `${m.key} (${m.source})`).join('; ')}.`,
      Object.fromEntries(missing.map((m) => [`materials.${m.key}`, m.source])),
    )
  }
  return missing.map((m) => ({ revisionId: rev.id, value: m.key, userId: who.id, userName: who.name }))
}

/**
 * Moves a revision along one transition of the workflow table. Signing transitions ask for the
 * person's password and record an Ed25519 signature of the server over the revision's content hash,
 * the action, the person and the time. The same person may not sign one revision in two roles; a
 * person named at submission is the only one who may take that role's actions. The write only
 * happens if the revision is still in the expected state, so of two people acting at once exactly
 * one wins. Whoever must act next is told.
 */
export async function transitionRevision(
  caller: Caller | null,
  projectId: string,
  calcId: string,
  revisionId: string,
  action: TransitionAction | string,
  deps: RevisionDeps,
  opts: TransitionOptions = {},
) {
  const t = transitionOf(action)
  if (!t) throw new AppError('invalid', `Unknown action "${action}".`, { action: 'must be one of the workflow’s actions' })
  const { calc, caller: who } = await authoriseCalc(caller, projectId, calcId, t.permission)
  const all = await revisionsOf(calc.id)
  const rev = all.find((r) => r.id === revisionId)
  if (!rev) throw new AppError('not_found', 'No such revision.')
  const label = (s: string) => STATES[s as Revision['state']].label.toLowerCase()
  if (!t.from.includes(rev.state)) {
    throw new AppError('conflict', `Revision ${rev.label} is ${label(rev.state)}; “${t.button}” needs a revision that is ${t.from.map(label).join(' or ')}.`)
  }
  const named = t.named === 'checker' ? rev.assignedCheckerId : t.named === 'approver' ? rev.assignedApproverId : null
  if (named && named !== who.id) throw new AppError('forbidden', `Only the ${t.named} named when revision ${rev.label} was submitted may do this.`)
  if (t.signs && [rev.engineerId, rev.checkerId, rev.approverId].includes(who.id)) throw new AppError('forbidden', 'The same person cannot sign a revision in two roles.')
  if (t.reason && !opts.reason?.trim()) throw new AppError('invalid', 'Give a reason.', { reason: 'Say why; it is kept in the history.' })
  if (!rev.pdfKey) throw new AppError('conflict', `The package of revision ${rev.label} is still being prepared; try again in a moment.`)
  if (t.password) await checkPassword(who, opts.password)
  const confirmations = await refuseBlocked(t, rev, who, opts)

  const now = new Date()
  const signed = t.password ? signStatement({ revision: rev.id, calc: calc.number, label: rev.label, contentHash: rev.contentHash, action: t.action, state: t.to, signer: { id: who.id, name: who.name }, at: now.toISOString() }) : null
  const sign = t.signs === 'checker' ? { checkerId: who.id, checkedAt: now } : t.signs === 'approver' ? { approverId: who.id, approvedAt: now } : {}
  const issue = t.to === 'issued' && signed ? { issuedAt: now, verificationCode: verificationCodeOf(signed.signature) } : {}
  // The sealed record's PDF never changes (the triggers refuse it): voiding only changes the state.
  const restamp = !STATES[rev.state].sealed
  const change = { ...sign, ...issue, state: t.to, ...(restamp ? { frozenAt: now.toISOString() } : {}) }
  const replaced = superseding(all, t.supersedes, rev.id)
  const others = [...all.filter((r) => !replaced.some((x) => x.id === r.id)), ...replaced]
  const reason = stripControl(opts.reason ?? '').trim().slice(0, 500) || null
  const event: PendingEvent = { action: t.action, by: who.name, at: now, reason, signature: signed?.signature ?? null, confirms: confirmations.map((c) => c.value) }
  const pdf = restamp ? await storePdf(await stamp({ ...rev, ...change }, others, deps, event), deps) : {}
  await db.transaction(async (tx) => {
    const moved = await tx
      .update(revisions)
      .set({ ...change, ...pdf })
      .where(and(eq(revisions.id, rev.id), eq(revisions.state, rev.state)))
    if (moved.rowsAffected === 0) throw new AppError('conflict', `Revision ${rev.label} was changed by someone else a moment ago; reload to see its state.`)
    if (replaced.length) await tx.update(revisions).set({ state: 'superseded' }).where(inArray(revisions.id, replaced.map((r) => r.id)))
    if (confirmations.length) await tx.insert(materialConfirmations).values(confirmations.map((c) => ({ ...c, at: now })))
    await tx.insert(revisionEvents).values({
      revisionId: rev.id,
      action: t.action,
      fromState: rev.state,
      toState: t.to,
      userId: who.id,
      actorName: who.name,
      reason,
      statement: signed?.statement ?? null,
      signature: signed?.signature ?? null,
      at: now,
    })
    await tx
      .update(calcs)
      .set({ state: t.to, updatedAt: now, ...(t.signs === 'checker' ? { checkerId: who.id } : t.signs === 'approver' ? { approverId: who.id } : {}) })
      .where(eq(calcs.id, calc.id))
  })
  await audit({ userId: who.id, action: `revision.${t.action}`, projectId, calcId: calc.id, detail: { revisionId: rev.id, reason, materialsConfirmed: confirmations.map((c) => c.value) } })
  await notify({ to: t.notice, kind: t.action, calc, revision: rev, by: who, text: `${calc.number} rev ${rev.label} ${t.ask}` })
  return { ...rev, ...change }
}

/** The history of one revision: every transition with who, when, why, and its signature if signed. */
export async function revisionHistory(revisionId: string) {
  return db
    .select({ action: revisionEvents.action, from: revisionEvents.fromState, to: revisionEvents.toState, by: users.name, reason: revisionEvents.reason, signed: revisionEvents.signature, at: revisionEvents.at })
    .from(revisionEvents)
    .innerJoin(users, eq(users.id, revisionEvents.userId))
    .where(eq(revisionEvents.revisionId, revisionId))
    .orderBy(asc(revisionEvents.at), asc(revisionEvents.id))
}

export async function getRevision(caller: Caller | null, projectId: string, calcId: string, revisionId: string) {
  const { calc } = await authoriseCalc(caller, projectId, calcId, 'project.view')
  const [rev] = await db.select().from(revisions).where(and(eq(revisions.id, revisionId), eq(revisions.calcId, calc.id)))
  if (!rev) throw new AppError('not_found', 'No such revision.')
  return { calc, revision: rev }
}

/** States whose stored A4 PDF is the one to hand out; in the others a copy is stamped with the state's watermark. */
const STORED_PDF_STATES: readonly Revision['state'][] = ['in-check', 'checked', 'approved', 'issued']

/**
 * A revision's PDF. A4 is the stored, hashed record (checked against its hash before sending).
 * A revision no longer current (superseded, voided, returned, withdrawn) is stamped on demand from
 * its stored body, so it carries that watermark; US Letter is rendered from the same frozen
 * revision. The stored record stays as it was signed.
 */
export async function revisionPdf(caller: Caller | null, projectId: string, calcId: string, revisionId: string, paper: Paper, deps: RevisionDeps) {
  const { project, caller: who } = await authorise(caller, projectId, 'pdf.download')
  // Only the columns a download needs, with the calc's project in the WHERE clause: the calc's working
  // result and the revision's inputs and result (hundreds of kB of JSON each) stay in the database.
  const [row] = await db
    .select({ id: revisions.id, calcId: revisions.calcId, label: revisions.label, state: revisions.state, pdfKey: revisions.pdfKey, pdfHash: revisions.pdfHash, verificationCode: revisions.verificationCode, number: calcs.number })
    .from(revisions)
    .innerJoin(calcs, eq(calcs.id, revisions.calcId))
    .where(and(eq(revisions.id, revisionId), eq(revisions.calcId, calcId), eq(calcs.projectId, projectId)))
  // Not found: the full lookup says which of the two is missing, as before.
  if (!row) await getRevision(who, projectId, calcId, revisionId)
  if (!row) throw new AppError('not_found', 'No such revision.')
  if (!row.pdfKey) throw new AppError('conflict', `The package of revision ${row.label} is still being prepared; try again in a moment.`)
  let bytes: Uint8Array
  if (paper === 'A4' && STORED_PDF_STATES.includes(row.state)) {
    bytes = await storedPdf(deps, row.pdfKey, row.pdfHash, row.id)
  } else {
    const { calc, revision: rev } = await getRevision(who, projectId, calcId, revisionId)
    bytes = await stamp(rev, await revisionsOf(calc.id), deps, undefined, paper)
  }
  if (STATES[row.state].sealed && !downloadRecentlyAudited(who.id, row.id, paper)) {
    await audit({ userId: who.id, action: 'pdf.downloaded', projectId, calcId: row.calcId, detail: { revisionId: row.id, paper, state: row.state } })
  }
  const filename = `${project.code}_${row.number}_rev${row.label}_${paper}.pdf`.replace(/[^A-Za-z0-9._-]/g, '_')
  return { bytes, filename, revision: row }
}

/**
 * Stored PDFs are content-addressed (`pdf/<sha-256>.pdf`) and never change, so the bytes of one
 * that matched its hash are kept in memory (up to 64 MB, least recently used out first): a burst of
 * downloads neither reopens the file nor hashes it again. A file is checked against its hash when it
 * is read, so only bytes that matched are ever handed out.
 */
const PDF_CACHE_BYTES = 64 * 1024 * 1024
const pdfCache = new Map<string, Uint8Array>()
let pdfCacheSize = 0
async function storedPdf(deps: RevisionDeps, key: string, hash: string | null, revisionId: string): Promise<Uint8Array> {
  const cacheKey = `${key}\u0000${hash}`
  const hit = pdfCache.get(cacheKey)
  if (hit) {
    pdfCache.delete(cacheKey)
    pdfCache.set(cacheKey, hit)
    return hit
  }
  const bytes = await deps.store.get(key)
  if (sha256Hex(bytes) !== hash) throw new Error(`stored PDF of revision ${revisionId} does not match its hash`)
  if (bytes.byteLength <= PDF_CACHE_BYTES / 4) {
    pdfCache.set(cacheKey, bytes)
    pdfCacheSize += bytes.byteLength
    for (const [k, b] of pdfCache) {
      if (pdfCacheSize <= PDF_CACHE_BYTES) break
      pdfCache.delete(k)
      pdfCacheSize -= b.byteLength
    }
  }
  return bytes
}

/**
 * Downloads of a sealed record are audited once per person, revision and paper per minute (per
 * instance): who took a copy and when stays on record to the minute, while a burst of downloads
 * (a script, a reload, 50 at once) does not queue one audit write each behind SQLite's writer.
 */
const DOWNLOAD_AUDIT_MS = 60_000
const lastDownloadAudit = new Map<string, number>()
function downloadRecentlyAudited(userId: string, revisionId: string, paper: Paper): boolean {
  const now = Date.now()
  const key = `${userId}\u0000${revisionId}\u0000${paper}`
  const last = lastDownloadAudit.get(key)
  if (last !== undefined && now - last < DOWNLOAD_AUDIT_MS) return true
  if (lastDownloadAudit.size > 10_000) for (const [k, t] of lastDownloadAudit) if (now - t >= DOWNLOAD_AUDIT_MS) lastDownloadAudit.delete(k)
  lastDownloadAudit.set(key, now)
  return false
}
