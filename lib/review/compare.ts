/**
 * What changed between two revisions of a calc: inputs, results (absolute and %), verdicts and the
 * governing check. Pure, so the comparison page, the API and the "changes since" section of a
 * revision's package all read the same differences.
 */
import type { InputRow } from '../calc/input-rows'
import type { CalcResult, CalcVerdict } from '../contract'

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

/** A changed row of the inputs table, by its printed group and label. */
export interface InputRowChange {
  input: string
  unit: string
  from: number | string | null
  to: number | string | null
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

export interface CheckChange extends ValueChange {
  fromPass: boolean | null
  toPass: boolean | null
}

export interface ResultChanges {
  verdict: { from: CalcVerdict; to: CalcVerdict; changed: boolean }
  values: ValueChange[]
  checks: CheckChange[]
}

function valueChange(id: string, title: string, unit: string, from: number | null, to: number | null): ValueChange {
  const change = from !== null && to !== null ? to - from : null
  const percent = change !== null && from ? (100 * change) / Math.abs(from) : null
  return { id, title, unit, from, to, change, percent }
}

const num = (v: unknown) => (typeof v === 'number' && Number.isFinite(v) ? v : null)

/** Compares two results: every numeric step value and every check's utilisation, matched by id. */
export function compareResults(a: Pick<CalcResult, 'steps' | 'checks' | 'verdict'>, b: Pick<CalcResult, 'steps' | 'checks' | 'verdict'>): ResultChanges {
  const stepsA = new Map(a.steps.map((s) => [s.id, s]))
  const stepsB = new Map(b.steps.map((s) => [s.id, s]))
  const values: ValueChange[] = []
  for (const id of new Set([...stepsA.keys(), ...stepsB.keys()])) {
    const sa = stepsA.get(id)
    const sb = stepsB.get(id)
    const va = num(sa?.value)
    const vb = num(sb?.value)
    if (va === vb) continue
    const s = (sb ?? sa)!
    values.push(valueChange(id, s.title, s.unit ?? '', va, vb))
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

/** Changed leaves of two input documents, by dotted path (for scripts). */
export function compareInputs(a: unknown, b: unknown): InputChange[] {
  const la = leaves(a)
  const lb = leaves(b)
  return [...new Set([...la.keys(), ...lb.keys()])]
    .filter((p) => la.get(p) !== lb.get(p))
    .sort()
    .map((path) => ({ path, from: la.get(path), to: lb.get(path) }))
}

/** Changed rows of two inputs tables, keyed by group and label (a repeated label by its occurrence), in the newer table's order. */
export function compareInputRows(a: InputRow[], b: InputRow[]): InputRowChange[] {
  const keyed = (rows: InputRow[]) => {
    const seen = new Map<string, number>()
    return new Map(
      rows.map((r) => {
        const base = `${r.group} · ${r.label}`
        const n = (seen.get(base) ?? 0) + 1
        seen.set(base, n)
        return [n > 1 ? `${base} (${n})` : base, r] as const
      }),
    )
  }
  const ka = keyed(a)
  const kb = keyed(b)
  const out: InputRowChange[] = []
  for (const key of new Set([...kb.keys(), ...ka.keys()])) {
    const ra = ka.get(key)
    const rb = kb.get(key)
    if (ra?.value === rb?.value && ra?.unit === rb?.unit) continue
    out.push({ input: key, unit: (rb ?? ra)!.unit, from: ra?.value ?? null, to: rb?.value ?? null })
  }
  return out
}
