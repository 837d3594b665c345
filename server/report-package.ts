import { asc, eq, inArray, sql } from 'drizzle-orm'
import { db } from '@/db'
import { calcs, materialConfirmations, projects, revisionEvents, revisions, users, type Calc, type Project, type Revision } from '@/db/schema'
import { inputRowsOf } from '@/lib/calc/input-rows'
import { parseCalcInput, type CalcResult } from '@/lib/calc/run'
import { ENGINE_VERSION } from '@/lib/calc/version'
import { SEVERITY_LABELS } from '@/lib/review/workflow'
import { remarksWithThreads } from './remarks'
import { stepOutline } from '@/reports/model/outline'
import type { CalcType, InputRow, Paper, ReportPackage, RevisionChanges, SignOff } from '@/reports/types'
import { ticksOf } from './ticks'
import { attachmentBytes } from './attachments'
import type { FileStore } from '@/lib/storage'
import { compareInputRows, compareResults } from '@/lib/review/compare'
import { storedInputRows } from './compare'
import { TEMPLATE_VERSION } from '@/reports/version'

export { TEMPLATE_VERSION }

const day = (d: Date | null | undefined) => (d ? d.toISOString().slice(0, 10) : undefined)

async function namesOf(ids: (string | null)[]) {
  const wanted = ids.filter((x): x is string => !!x)
  const rows = wanted.length ? await db.select({ id: users.id, name: users.name }).from(users).where(inArray(users.id, wanted)) : []
  const map = new Map(rows.map((u) => [u.id, u.name]))
  return (id: string | null) => (id ? (map.get(id) ?? '—') : '—')
}

function historyOf(all: Revision[]) {
  return all.map((r) => ({
    label: r.label,
    state: r.state,
    date: day(r.issuedAt ?? r.approvedAt ?? r.checkedAt ?? r.createdAt) ?? '',
    note: r.reason ?? (r.submittedFailing ? 'submitted with a failing check' : ''),
  }))
}

/** What changed since `earlier` (the calc's revision before), for the package's "changes since" section. */
function changesSince(earlier: Revision | undefined, rows: InputRow[], result: CalcResult): RevisionChanges | undefined {
  if (!earlier) return undefined
  return { since: earlier.label, inputs: compareInputRows(storedInputRows(earlier.inputs), rows), ...compareResults(earlier.result as CalcResult, result) }
}

/** The units a package prints in: US customary when the engineer works in them (the bench's choice or the checks' input units). */
function unitsOf(inputs: unknown, result: CalcResult): 'SI' | 'US' {
  return (inputs as { displayUnits?: unknown } | null)?.displayUnits === 'US' || result.units === 'US' ? 'US' : 'SI'
}

function common(project: Project, calc: Calc, paper: Paper) {
  return {
    paper,
    project: { code: project.code, name: project.name, client: project.client },
    calc: { number: calc.number, title: calc.title, type: calc.calcType as CalcType },
    attachments: [],
  }
}

const ACTION_WORDS: Record<string, string> = {
  submit: 'submitted the revision for check',
  return: 'returned it to the engineer',
  resubmit: 'resubmitted it for check',
  check: 'signed as checker',
  approve: 'signed as approver',
  issue: 'issued it',
  withdraw: 'withdrew it',
  void: 'voided it',
}

export interface PendingEvent {
  action: string
  by: string
  at: Date
  reason?: string | null
  signature?: string | null
  /** Material values the approver confirms with this event (issue). */
  confirms?: string[]
}

/** The sign-off record of a revision as it stands (plus an event about to be written). */
async function signOffOf(rev: Revision, stepNumber: (id: string) => number | null, pending?: PendingEvent): Promise<SignOff> {
  const [events, ticks, confirmations] = await Promise.all([
    db
      .select({ action: revisionEvents.action, by: sql<string>`coalesce(${revisionEvents.actorName}, ${users.name})`, at: revisionEvents.at, reason: revisionEvents.reason, signature: revisionEvents.signature })
      .from(revisionEvents)
      .innerJoin(users, eq(users.id, revisionEvents.userId))
      .where(eq(revisionEvents.revisionId, rev.id))
      .orderBy(asc(revisionEvents.at), asc(revisionEvents.id)),
    ticksOf(rev.id),
    db
      .select({ value: materialConfirmations.value, by: sql<string>`coalesce(${materialConfirmations.userName}, ${users.name})`, at: materialConfirmations.at })
      .from(materialConfirmations)
      .innerJoin(users, eq(users.id, materialConfirmations.userId))
      .where(eq(materialConfirmations.revisionId, rev.id)),
  ])
  const all = pending ? [...events, pending] : events
  const issued = [...all].reverse().find((e) => e.action === 'issue')
  return {
    events: all.map((e) => ({ what: ACTION_WORDS[e.action] ?? e.action, by: e.by, at: e.at.toISOString(), reason: e.reason, signature: e.signature })),
    ticks: ticks.map((t) => ({ stepId: t.stepId, number: stepNumber(t.stepId), by: t.by, date: day(t.at)! })),
    confirmations: [...confirmations, ...(pending?.confirms ?? []).map((value) => ({ value, by: pending!.by, at: pending!.at }))]
      .sort((a, b) => a.value.localeCompare(b.value))
      .map((c) => ({ value: c.value, by: c.by, date: day(c.at)! })),
    issue:
      issued && rev.verificationCode && rev.contentHash
        ? { approver: issued.by, date: day(issued.at)!, contentHash: rev.contentHash, code: rev.verificationCode }
        : undefined,
  }
}

/**
 * Everything the report pipeline needs for one revision. `rev` may be a row not yet written (a
 * revision about to be saved, or a state change about to be signed), so the PDF is rendered before
 * anything is committed; `others` are the calc's stored revisions as they will stand after it.
 */
export async function reportPackageOf(rev: Revision, others: Revision[], paper: Paper = 'A4', pending?: PendingEvent): Promise<ReportPackage> {
  const [calc] = await db.select().from(calcs).where(eq(calcs.id, rev.calcId))
  const [project] = await db.select().from(projects).where(eq(projects.id, calc.projectId))
  const remarks = await remarksWithThreads(rev.id)
  const name = await namesOf([rev.engineerId, rev.checkerId, rev.approverId])
  const parsed = parseCalcInput(rev.inputs, { stored: true })
  if (!parsed.ok) throw new Error(`stored inputs of revision ${rev.label} no longer parse: ${JSON.stringify(parsed.fieldErrors)}`)
  const all = [...others.filter((r) => r.id !== rev.id), rev].sort((a, b) => a.createdAt.getTime() - b.createdAt.getTime())
  const inputRows = inputRowsOf(parsed.input)
  const outline = stepOutline({ calc: { type: calc.calcType }, result: rev.result as CalcResult })
  const numbers = new Map(outline.map((o) => [o.id, o.number]))
  const stepNumber = (id: string) => numbers.get(id) ?? null
  const signOff = await signOffOf(rev, stepNumber, pending)
  // The names printed are those the people had when they acted (kept with each event), so the
  // record reads the same whatever anyone is called later.
  const signer = (what: string, fallback: string | null) => [...signOff.events].reverse().find((e) => e.what === what)?.by ?? name(fallback)
  return {
    ...common(project, calc, paper),
    revision: {
      label: rev.label,
      state: rev.state,
      engineer: { name: signer(ACTION_WORDS.submit, rev.engineerId), date: day(rev.createdAt) },
      checker: { name: rev.checkerId ? signer(ACTION_WORDS.check, rev.checkerId) : '—', date: day(rev.checkedAt) },
      approver: { name: rev.approverId ? signer(ACTION_WORDS.approve, rev.approverId) : '—', date: day(rev.approvedAt) },
    },
    history: historyOf(all),
    remarks: remarks.map((r) => ({
      stepId: r.stepId,
      stepNumber: r.stepId ? stepNumber(r.stepId) : null,
      author: r.author,
      role: 'checker',
      text: [`[${SEVERITY_LABELS[r.severity]}] ${r.text}`, ...r.replies.map((x) => `${x.author}, ${day(x.createdAt)}: ${x.text}`)].join(' — '),
      status: r.status,
      date: day(r.createdAt) ?? '',
    })),
    inputRows,
    result: rev.result as CalcResult,
    changes: changesSince(all[all.indexOf(rev) - 1], inputRows, rev.result as CalcResult),
    units: unitsOf(rev.inputs, rev.result as CalcResult),
    // Fixed at submission: the body is rendered once and every stamp keeps its dates.
    generatedAt: rev.createdAt.toISOString(),
    engineVersion: rev.engineVersion,
    templateVersion: rev.templateVersion ?? TEMPLATE_VERSION,
    signOff,
  }
}

/** The package to render: as `reportPackageOf`, with the revision's attached documents read from the store. */
export async function packageToRender(rev: Revision, others: Revision[], store: FileStore, paper: Paper = 'A4', pending?: PendingEvent): Promise<ReportPackage> {
  return { ...(await reportPackageOf(rev, others, paper, pending)), attachments: await attachmentBytes(rev.id, store) }
}

/** The package of a stored revision, as it stands. */
export async function loadReportPackage(revisionId: string, paper: Paper = 'A4'): Promise<ReportPackage> {
  const [rev] = await db.select().from(revisions).where(eq(revisions.id, revisionId))
  if (!rev) throw new Error(`revision ${revisionId} not found`)
  const others = await db.select().from(revisions).where(eq(revisions.calcId, rev.calcId))
  return reportPackageOf(rev, others, paper)
}

/** A package for the working inputs (not yet a revision), from the result stored with them; never stored. */
export async function draftReportPackage(project: Project, calc: Calc): Promise<ReportPackage | null> {
  const parsed = parseCalcInput(calc.draftInputs)
  if (!parsed.ok || !calc.draftResult) return null
  const all = await db.select().from(revisions).where(eq(revisions.calcId, calc.id)).orderBy(asc(revisions.createdAt))
  const name = await namesOf([calc.engineerId])
  const inputRows = inputRowsOf(parsed.input)
  return {
    ...common(project, calc, 'A4'),
    revision: { label: 'working copy', state: 'draft', engineer: { name: name(calc.engineerId) }, checker: { name: '—' }, approver: { name: '—' } },
    history: historyOf(all),
    remarks: [],
    inputRows,
    result: calc.draftResult as CalcResult,
    changes: changesSince(all.at(-1), inputRows, calc.draftResult as CalcResult),
    units: unitsOf(calc.draftInputs, calc.draftResult as CalcResult),
    generatedAt: calc.updatedAt.toISOString(),
    engineVersion: ENGINE_VERSION,
    templateVersion: TEMPLATE_VERSION,
  }
}
