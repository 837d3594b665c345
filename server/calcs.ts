import { randomUUID } from 'node:crypto'
import { and, eq, sql } from 'drizzle-orm'
import { z } from 'zod'
import { db } from '@/db'
import { audit } from '@/db/audit'
import { listRegister, listRevisions } from '@/db/queries'
import { calcs, checkRemarks, revisions, type Calc } from '@/db/schema'
import { defaultCalcInputs } from '@/lib/calc/defaults'
import { findMechanism, mechanismChoiceMessage } from '@/lib/mechanisms'
import type { CalcResult } from '@/lib/calc/run'
import { benchCalculate } from '@/lib/bench/validate'
import { AppError } from '@/lib/errors'
import type { createCalcSchema } from '@/lib/schemas/project'
import { authorise, authoriseCalc, type Caller } from './access'
import { withProjectMaterials } from './materials'

export type CreateCalcInput = z.infer<typeof createCalcSchema>

/** What a script or the register needs to know of a result without reading the package. */
export interface ResultSummary {
  feasible: boolean
  feasibility: string
  pass: boolean
  maxUtilisation: number
  governing: string
  inversionConstant: number
  lineOffset: number
  usableStroke: number
  straightness: number
  checks: number
  steps: number
}

export function summariseResult(result: CalcResult): ResultSummary {
  return {
    feasible: result.feasibility.ok,
    feasibility: result.feasibility.message,
    pass: result.verdict.pass,
    maxUtilisation: result.verdict.maxUtilisation,
    governing: result.verdict.governing,
    inversionConstant: result.inversionConstant,
    lineOffset: result.lineOffset,
    usableStroke: 2 * result.stroke.usable.half,
    straightness: result.straightness,
    checks: result.checks.length,
    steps: result.steps.length,
  }
}

/** Verdict and governing utilisation of the working result, and open remarks on the newest revision, per calc. */
async function registerFigures(projectId: string) {
  const rows = await db
    .select({
      id: calcs.id,
      figures: sql<string | null>`json_extract(${calcs.draftResult}, '$.feasibility.ok', '$.verdict.pass', '$.verdict.maxUtilisation', '$.verdict.governing')`,
      openRemarks: sql<number>`(select count(*) from ${checkRemarks} where ${checkRemarks.revisionId} = (select ${revisions.id} from ${revisions} where ${revisions.calcId} = ${calcs.id} order by ${revisions.createdAt} desc limit 1) and ${checkRemarks.status} <> 'closed')`,
    })
    .from(calcs)
    .where(eq(calcs.projectId, projectId))
  return new Map(
    rows.map((r) => {
      const [feasible, pass, maxUtilisation, governing] = (r.figures ? JSON.parse(r.figures) : [null, null, null, null]) as [number | null, number | null, number | null, string | null]
      const verdict = feasible === null ? null : !feasible ? ('infeasible' as const) : pass ? ('pass' as const) : ('fail' as const)
      return [r.id, { verdict, maxUtilisation: feasible ? maxUtilisation : null, governing, openRemarks: Number(r.openRemarks) }]
    }),
  )
}

/** The register: every calc with its state, people, and the working verdict, governing utilisation and open remarks. */
export async function listCalcs(caller: Caller | null, projectId: string) {
  await authorise(caller, projectId, 'project.view')
  const [rows, figures] = await Promise.all([listRegister(projectId), registerFigures(projectId)])
  const none = { verdict: null, maxUtilisation: null, governing: null, openRemarks: 0 }
  return rows.map((r) => ({ ...r, ...(figures.get(r.id) ?? none) }))
}

/** The calc with this number in the project, regardless of case, if there is one. */
async function numberClash(projectId: string, number: string) {
  const [clash] = await db
    .select({ number: calcs.number })
    .from(calcs)
    .where(and(eq(calcs.projectId, projectId), sql`lower(${calcs.number}) = lower(${number})`))
  return clash ?? null
}

/**
 * The number to propose for the next calc: the highest number of the project's commonest pattern
 * (`LC-003` → `LC-004`, digits kept), never one that exists in any case. `LC-001` in an empty project.
 */
export function nextNumberOf(existing: readonly string[]): string {
  const taken = new Set(existing.map((n) => n.toLowerCase()))
  const parsed = existing.map((n) => /^(.*?)(\d+)$/.exec(n)).filter((m): m is RegExpExecArray => !!m)
  const counts = new Map<string, number>()
  for (const m of parsed) counts.set(m[1], (counts.get(m[1]) ?? 0) + 1)
  const prefix = [...counts].sort((a, b) => b[1] - a[1])[0]?.[0] ?? 'LC-'
  const same = parsed.filter((m) => m[1] === prefix)
  const width = same[0]?.[2].length ?? 3
  let n = Math.max(0, ...same.map((m) => Number(m[2]))) + 1
  const make = (k: number) => `${prefix}${String(k).padStart(width, '0')}`
  while (taken.has(make(n).toLowerCase())) n++
  return make(n)
}

export async function nextCalcNumber(caller: Caller | null, projectId: string): Promise<string> {
  await authorise(caller, projectId, 'project.view')
  const rows = await db.select({ number: calcs.number }).from(calcs).where(eq(calcs.projectId, projectId))
  return nextNumberOf(rows.map((r) => r.number))
}

/**
 * A new calc starts as a draft owned by the engineer who created it, with the mechanism's feasible
 * defaults (or the given inputs, e.g. a sizing proposal or an imported file) saved and run, so the
 * first view shows a full result. Numbers are unique in a project regardless of case.
 */
export async function createCalc(caller: Caller | null, projectId: string, input: CreateCalcInput, inputs?: unknown): Promise<Calc> {
  const { caller: who } = await authorise(caller, projectId, 'calc.create')
  const clash = await numberClash(projectId, input.number)
  if (clash) throw new AppError('conflict', 'This calc number is taken.', { number: `Calc ${clash.number} already exists in this project.` })
  const draftInputs = inputs === undefined ? defaultCalcInputs(input.calcType) : await withProjectMaterials(projectId, inputs)
  const run = benchCalculate(draftInputs)
  if (inputs !== undefined) {
    if (!run.ok) throw new AppError('invalid', 'The inputs have errors; no calc was made.', run.fieldErrors)
    if ((draftInputs as { mechanism?: unknown }).mechanism !== input.calcType) throw new AppError('invalid', 'The inputs are for another mechanism.', { mechanism: `must be "${input.calcType}"` })
  }
  const row = {
    id: randomUUID(),
    projectId,
    ...input,
    state: 'draft' as const,
    engineerId: who.id,
    draftInputs,
    draftResult: run.ok ? run.result : null,
  }
  await db.insert(calcs).values(row)
  await audit({ userId: who.id, action: 'calc.created', projectId, calcId: row.id, detail: { number: input.number } })
  const [calc] = await db.select().from(calcs).where(eq(calcs.id, row.id))
  return calc
}

/** A copy of a calc's working inputs under a new number: no revisions, no remarks, a draft again. */
export async function cloneCalc(caller: Caller | null, projectId: string, calcId: string, opts: { number?: string; title?: string } = {}): Promise<Calc> {
  const { calc } = await authoriseCalc(caller, projectId, calcId, 'calc.create')
  const number = opts.number ?? (await nextCalcNumber(caller, projectId))
  const inputs = calc.draftInputs ?? defaultCalcInputs(calc.calcType)
  return createCalc(caller, projectId, { number, title: opts.title ?? `Copy of ${calc.title}`.slice(0, 200), calcType: calc.calcType }, inputs)
}

/** Number and title only, for a page title. */
export async function calcHeading(caller: Caller | null, projectId: string, calcId: string) {
  const { calc } = await authoriseCalc(caller, projectId, calcId, 'project.view')
  return { number: calc.number, title: calc.title }
}

/** The working inputs as the CLI reads them (`npm run calc -- file.json`), with the calc they came from. */
export async function exportCalcInputs(caller: Caller | null, projectId: string, calcId: string) {
  const { calc } = await authoriseCalc(caller, projectId, calcId, 'project.view')
  return { number: calc.number, inputs: (calc.draftInputs ?? defaultCalcInputs(calc.calcType)) as Record<string, unknown> }
}

/** A calc input file made into a new calc; its mechanism is the file's. Errors name the file's fields. */
export async function importCalc(caller: Caller | null, projectId: string, opts: { number?: string; title: string }, inputs: unknown): Promise<Calc> {
  const mechanism = (inputs as { mechanism?: unknown } | null)?.mechanism
  if (typeof mechanism !== 'string' || !findMechanism(mechanism)) throw new AppError('invalid', 'The file names no known mechanism.', { mechanism: mechanismChoiceMessage() })
  const number = opts.number || (await nextCalcNumber(caller, projectId))
  return createCalc(caller, projectId, { number, title: opts.title, calcType: mechanism }, inputs)
}

/** The calc, its working inputs, the working result's summary and its revisions. */
export async function getCalcDetail(caller: Caller | null, projectId: string, calcId: string) {
  const { calc } = await authoriseCalc(caller, projectId, calcId, 'project.view')
  const revisions = await listRevisions(calc.id)
  const result = calc.draftResult as CalcResult | null
  return {
    id: calc.id,
    number: calc.number,
    title: calc.title,
    mechanism: calc.calcType,
    state: calc.state,
    updatedAt: calc.updatedAt.toISOString(),
    inputs: calc.draftInputs ?? defaultCalcInputs(calc.calcType),
    summary: result ? summariseResult(result) : null,
    revisions: revisions.map((r) => ({
      id: r.id,
      label: r.label,
      state: r.state,
      createdAt: r.createdAt.toISOString(),
      contentHash: r.contentHash,
      pdfHash: r.pdfHash,
    })),
  }
}

export type SaveInputsOutcome = { ok: true; result: CalcResult; summary: ResultSummary } | { ok: false; fieldErrors: Record<string, string> }

/**
 * Stores the engineer's working inputs with their result, after validating them and running the
 * calc once: bad input is reported at its field and never replaces what was saved before.
 */
export async function saveInputs(caller: Caller | null, projectId: string, calcId: string, raw: unknown): Promise<SaveInputsOutcome> {
  const { calc, caller: who } = await authoriseCalc(caller, projectId, calcId, 'calc.edit')
  const values = await withProjectMaterials(projectId, raw)
  if ((values as { mechanism?: unknown } | null)?.mechanism !== calc.calcType) {
    return { ok: false, fieldErrors: { mechanism: `must stay "${calc.calcType}" for this calc; make a new calc for another mechanism` } }
  }
  // Ranges, the schema, the run and an infeasible geometry are all refused at their fields.
  const run = benchCalculate(values)
  if (!run.ok) return { ok: false, fieldErrors: run.fieldErrors }
  await db.update(calcs).set({ draftInputs: values, draftResult: run.result, updatedAt: new Date() }).where(eq(calcs.id, calc.id))
  await audit({ userId: who.id, action: 'calc.inputs-saved', projectId, calcId: calc.id })
  return { ok: true, result: run.result, summary: summariseResult(run.result) }
}
