/**
 * Straightness under tolerances and pin clearance (lib/tolerance) as part of the calc: the link
 * lengths within a general tolerance class (or their own ± values), the pins in the clearance of the
 * check inputs, pushed along the force of the first load case; worst case and a seeded Monte Carlo
 * run over the working range. The confirmed worst case joins the verdict as a criterion beside the
 * ideal straightness.
 */
import { checksInputToSI } from '@/lib/checks/to-si'
import type { ChecksInput } from '@/lib/checks'
import type { Criterion, MechanismResult, Table } from '@/lib/contract'
import { analyseTolerances, clearancesFromChecks, eyeForcesFromLoad, ToleranceInputError, toleranceModelFor } from '@/lib/tolerance'
import { formatNumber } from '@/lib/units/format'

export interface ToleranceOptions {
  /** General tolerance class of ISO 2768-1 for every length without its own (default m). */
  toleranceClass?: 'f' | 'm' | 'c' | 'v'
  /** ± tolerance per link or frame item, mm (`OA`, `frame:OC`). */
  lengths?: Record<string, number>
  /** Monte Carlo samples (0: worst case only). */
  samples?: number
  seed?: number
  distribution?: 'normal' | 'uniform'
  /** Per item: its own distribution. */
  distributions?: Record<string, 'normal' | 'uniform'>
}

interface Inputs {
  mechanism: string
  geometry: unknown
  loads: { name: string; fx: number; fy: number }[]
  straightnessTolerance: number
  tolerances?: ToleranceOptions
}

type Outcome = { ok: true; result: MechanismResult } | { ok: false; fieldErrors: Record<string, string> }

export const DEFAULT_SAMPLES = 2000

/** The ranked contributions as the package prints them: the largest ten, the rest counted in the title. */
function topContributions(table: Table, shown = 10): Table {
  if (table.rows.length <= shown) return table
  return { ...table, title: `${table.title} (the ${shown} largest of ${table.rows.length})`, rows: table.rows.slice(0, shown) }
}

/** The Monte Carlo histogram as data for the package's figure (not printed as a table): one row per bin, and the limit. */
function histogramTable(bins: { centre: number; width: number; count: number }[], limit: number): Table {
  return {
    id: 'tol.histogram',
    section: 'tolerance',
    title: 'Straightness deviation of the built mechanisms (Monte Carlo)',
    columns: [
      { key: 'from', label: 'from', unit: 'mm' },
      { key: 'to', label: 'to', unit: 'mm' },
      { key: 'count', label: 'samples' },
      { key: 'limit', label: 'limit', unit: 'mm' },
    ],
    rows: bins.map((b) => ({ from: b.centre - b.width / 2, to: b.centre + b.width / 2, count: b.count, limit })),
  }
}

export function withTolerances(mech: MechanismResult, input: Inputs, checks: ChecksInput | null, onProgress?: (done: number, total: number) => void): Outcome {
  const opts = input.tolerances
  if (!opts || !mech.feasibility.ok || !mech.workingRange) return { ok: true, result: mech }
  const model = toleranceModelFor(input.mechanism, input.geometry)
  const load = input.loads[0]
  try {
    const t = analyseTolerances({
      model,
      workingRange: mech.workingRange,
      toleranceClass: opts.toleranceClass ?? 'm',
      tolerances: opts.lengths,
      clearances: checks ? clearancesFromChecks(checksInputToSI(checks), model) : undefined,
      eyeForces: load ? eyeForcesFromLoad(model, mech.workingRange, load) : undefined,
      limit: input.straightnessTolerance,
      monteCarlo: (opts.samples ?? DEFAULT_SAMPLES) > 0 ? { samples: opts.samples ?? DEFAULT_SAMPLES, seed: opts.seed ?? 1, distribution: opts.distribution ?? 'normal', perItem: opts.distributions, onProgress } : undefined,
    })
    const worst = t.worstCase.confirmed
    const criterion: Criterion = {
      id: 'toleranced-straightness',
      label: 'Straightness of the built guide (tolerances and pin clearance, worst case)',
      required: `δ ≤ ${formatNumber(input.straightnessTolerance)} mm`,
      provided: `δ_wc = ${formatNumber(worst.deviation)} mm`,
      pass: worst.deviation <= input.straightnessTolerance,
      stepId: 'tol.worst-confirmed',
    }
    return {
      ok: true,
      result: {
        ...mech,
        criteria: [...(mech.criteria ?? []), criterion],
        // The ideal line is proved in the kinematics, and the RSS figure is an estimate beside the Monte Carlo run: both support.
        steps: [...mech.steps, ...t.steps.map((x) => (x.id === 'tol.ideal' || x.id === 'tol.rss' ? { ...x, appendix: true } : x))],
        tables: [...mech.tables, topContributions(t.table), ...(t.histogram.length ? [histogramTable(t.histogram, input.straightnessTolerance)] : [])],
      },
    }
  } catch (err) {
    if (err instanceof ToleranceInputError) return { ok: false, fieldErrors: { [`tolerances.${err.path.replace(/^tolerances\./, 'lengths.')}`]: err.message } }
    throw err
  }
}
