/**
 * The one check of working inputs the form (in the browser, as you type) and the server (before
 * saving) both make: ranges at the fields, the schema, then the run, with an infeasible geometry
 * reported at its fields. Only inputs that pass are saved, so a saved calc always runs.
 */
import { calculate, type CalcResult, type RunOptions } from '@/lib/calc/run'
import { feasibilityErrors } from './feasibility'
import { rangeErrors } from './ranges'

export type BenchOutcome =
  | { ok: true; result: CalcResult }
  /** `result` is present when the inputs ran but the geometry is infeasible (the drawing can still show why). */
  | { ok: false; fieldErrors: Record<string, string>; result?: CalcResult }

export function benchCalculate(raw: unknown, opts: RunOptions = {}): BenchOutcome {
  const ranges = rangeErrors(raw)
  const run = calculate(raw, opts)
  if (!run.ok) return { ok: false, fieldErrors: { ...ranges, ...run.fieldErrors } }
  if (Object.keys(ranges).length) return { ok: false, fieldErrors: ranges, result: run.result }
  const r = raw as { mechanism: string; geometry: Record<string, number> }
  const infeasible = feasibilityErrors(r.mechanism, r.geometry, run.result)
  if (Object.keys(infeasible).length) return { ok: false, fieldErrors: infeasible, result: run.result }
  return { ok: true, result: run.result }
}
