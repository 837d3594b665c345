import { randomUUID } from 'node:crypto'
import { and, eq, sql } from 'drizzle-orm'
import { z } from 'zod'
import { db } from '@/db'
import { audit } from '@/db/audit'
import { listRegister, listRevisions } from '@/db/queries'
import { calcs, type Calc } from '@/db/schema'
import { defaultCalcInputs } from '@/lib/calc/defaults'
import { calculate, type CalcResult } from '@/lib/calc/run'
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

export async function listCalcs(caller: Caller | null, projectId: string) {
  await authorise(caller, projectId, 'project.view')
  return listRegister(projectId)
}

/**
 * A new calc starts as a draft owned by the engineer who created it, with the mechanism's feasible
 * defaults saved and run, so the first view shows a full package. Numbers are unique in a project
 * regardless of case.
 */
export async function createCalc(caller: Caller | null, projectId: string, input: CreateCalcInput): Promise<Calc> {
  const { caller: who } = await authorise(caller, projectId, 'calc.create')
  const [clash] = await db
    .select({ number: calcs.number })
    .from(calcs)
    .where(and(eq(calcs.projectId, projectId), sql`lower(${calcs.number}) = lower(${input.number})`))
  if (clash) throw new AppError('conflict', 'This calc number is taken.', { number: `Calc ${clash.number} already exists in this project.` })
  const draftInputs = defaultCalcInputs(input.calcType)
  const run = calculate(draftInputs)
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
  const run = calculate(values)
  if (!run.ok) return run
  if ((values as { mechanism?: unknown }).mechanism !== calc.calcType) {
    return { ok: false, fieldErrors: { mechanism: `must stay "${calc.calcType}" for this calc; make a new calc for another mechanism` } }
  }
  await db.update(calcs).set({ draftInputs: values, draftResult: run.result, updatedAt: new Date() }).where(eq(calcs.id, calc.id))
  await audit({ userId: who.id, action: 'calc.inputs-saved', projectId, calcId: calc.id })
  return { ok: true, result: run.result, summary: summariseResult(run.result) }
}
