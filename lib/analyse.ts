import { calculate } from '@/lib/calc/run'
import { checksInUnits, runChecksCli } from '@/lib/checks'

export type Analysed = { ok: true; output: Record<string, unknown> } | { ok: false; fieldErrors: Record<string, string> }

/**
 * The stateless calc behind `npm run calc` and `POST /api/v1/analyse`: an input with `mechanism`
 * runs the linkage (and the pin and link checks when it has a `basis`); one without checks a single
 * component with its force given directly (docs/checks.md). Both print exactly this output.
 */
export function analyse(json: unknown): Analysed {
  if (typeof json === 'object' && json !== null && !('mechanism' in json)) {
    const r = runChecksCli(json)
    if (!r.ok) return { ok: false, fieldErrors: Object.fromEntries(r.issues.map((i) => [i.path || '_form', i.message])) }
    return { ok: true, output: { units: r.units, ...r.result } }
  }
  const run = calculate(json)
  if (!run.ok) return run
  const units = run.input.checks?.units ?? 'SI'
  return { ok: true, output: { ...run.result, checks: checksInUnits(run.result.checks, units) } }
}
