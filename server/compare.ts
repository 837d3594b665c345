import { and, eq, inArray } from 'drizzle-orm'
import { db } from '@/db'
import { revisions } from '@/db/schema'
import type { CalcResult } from '@/lib/calc/run'
import { AppError } from '@/lib/errors'
import { authoriseCalc, type Caller } from './access'

type Scalar = string | number | boolean | null

/** Leaves of a JSON value by dotted path (`geometry.arm`, `loads.0.fx`). */
function leaves(value: unknown, prefix = '', out = new Map<string, Scalar>()): Map<string, Scalar> {
  if (value !== null && typeof value === 'object') {
    for (const [k, v] of Object.entries(value)) leaves(v, prefix ? `${prefix}.${k}` : k, out)
  } else out.set(prefix, (value ?? null) as Scalar)
  return out
}

export interface InputChange {
  path: string
  from: Scalar | undefined
  to: Scalar | undefined
}

export interface ValueChange {
  id: string
  title: string
  unit: string
  from: number | null
  to: number | null
  /** to − from */
  change: number | null
  /** (to − from)/|from|, %; null when from is 0 or missing */
  percent: number | null
}

function valueChange(id: string, title: string, unit: string, from: number | null, to: number | null): ValueChange {
  const change = from !== null && to !== null ? to - from : null
  const percent = change !== null && from ? (100 * change) / Math.abs(from) : null
  return { id, title, unit, from, to, change, percent }
}

/** Compares two revisions' results: every numeric step value and every check's utilisation, matched by id. */
export function compareResults(a: CalcResult, b: CalcResult) {
  const num = (v: unknown) => (typeof v === 'number' && Number.isFinite(v) ? v : null)
  const stepsA = new Map(a.steps.map((s) => [s.id, s]))
  const stepsB = new Map(b.steps.map((s) => [s.id, s]))
  const values: ValueChange[] = []
  for (const id of new Set([...stepsA.keys(), ...stepsB.keys()])) {
    const sa = stepsA.get(id)
    const sb = stepsB.get(id)
    const va = num(sa?.value)
    const vb = num(sb?.value)
    if (va === vb) continue
    values.push(valueChange(id, (sb ?? sa)!.title, (sb ?? sa)!.unit ?? '', va, vb))
  }
  const key = (c: CalcResult['checks'][number]) => `${c.component} · ${c.check}`
  const checksA = new Map(a.checks.map((c) => [key(c), c]))
  const checksB = new Map(b.checks.map((c) => [key(c), c]))
  const checks = [...new Set([...checksA.keys(), ...checksB.keys()])]
    .map((k) => ({ ...valueChange(k, k, '—', checksA.get(k)?.utilisation ?? null, checksB.get(k)?.utilisation ?? null), fromPass: checksA.get(k)?.pass ?? null, toPass: checksB.get(k)?.pass ?? null }))
    .filter((c) => c.from !== c.to || c.fromPass !== c.toPass)
  return {
    verdict: { from: a.verdict, to: b.verdict, changed: a.verdict.pass !== b.verdict.pass || a.verdict.governing !== b.verdict.governing },
    values,
    checks,
  }
}

export function compareInputs(a: unknown, b: unknown): InputChange[] {
  const la = leaves(a)
  const lb = leaves(b)
  return [...new Set([...la.keys(), ...lb.keys()])]
    .filter((p) => la.get(p) !== lb.get(p))
    .sort()
    .map((path) => ({ path, from: la.get(path), to: lb.get(path) }))
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
    ...compareResults(from.result as CalcResult, to.result as CalcResult),
  }
}
