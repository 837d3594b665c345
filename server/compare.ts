import { and, eq, inArray } from 'drizzle-orm'
import { db } from '@/db'
import { revisions } from '@/db/schema'
import { inputRowsOf } from '@/lib/calc/input-rows'
import { parseCalcInput, type CalcResult } from '@/lib/calc/run'
import { AppError } from '@/lib/errors'
import { compareInputRows, compareInputs, compareResults } from '@/lib/review/compare'
import { authoriseCalc, type Caller } from './access'

/** The printed inputs table of stored inputs (empty if they no longer parse). */
export function storedInputRows(inputs: unknown) {
  const parsed = parseCalcInput(inputs, { stored: true })
  return parsed.ok ? inputRowsOf(parsed.input) : []
}

/** What changed from one revision of a calc to another: inputs, results (absolute and %), verdicts and governing checks. */
export async function compareRevisions(caller: Caller | null, projectId: string, calcId: string, fromId: string, toId: string) {
  const { calc } = await authoriseCalc(caller, projectId, calcId, 'project.view')
  const rows = await db.select().from(revisions).where(and(eq(revisions.calcId, calc.id), inArray(revisions.id, [fromId, toId])))
  const from = rows.find((r) => r.id === fromId)
  const to = rows.find((r) => r.id === toId)
  if (!from || !to) throw new AppError('not_found', 'No such revision of this calc.', { [from ? 'to' : 'from']: 'Choose a revision of this calc.' })
  return {
    from: { id: from.id, label: from.label },
    to: { id: to.id, label: to.label },
    inputs: compareInputs(from.inputs, to.inputs),
    inputRows: compareInputRows(storedInputRows(from.inputs), storedInputRows(to.inputs)),
    ...compareResults(from.result as CalcResult, to.result as CalcResult),
  }
}
