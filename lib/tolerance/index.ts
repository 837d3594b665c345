/**
 * Tolerance analysis of an exact straight-line cell: how straight the built mechanism runs with its
 * link lengths within tolerance and its pins in clearance. Pure: no Next.js, no database.
 *
 *   const setup = prepareTolerance({ model, workingRange, toleranceClass: 'm', clearances, eyeForces })
 *   const wc = worstCase(setup)
 *   const mc = monteCarlo(setup, { samples: 10_000, seed: 1 })
 *
 * or all at once with `analyseTolerances`, which also gives the steps, the table and the histogram.
 */
import type { Step, Table } from '@/lib/contract'
import { getMechanism } from '@/lib/mechanisms'
import { histogramData, contributionsTable, toleranceSteps } from './report'
import { monteCarlo, monteCarloAsync, type MonteCarloOptions, type MonteCarloResult } from './monte-carlo'
import { CLEARANCE_ASSUMPTION, prepareTolerance, type ToleranceInput, type ToleranceItem, type ToleranceSetup } from './setup'
import { worstCase, type Contribution, type WorstCase } from './worst-case'
import type { MechanismModelLike } from './kinematics'
import type { ToleranceClass } from './iso2768'

export { generalTolerance, ISO2768_LINEAR, ISO2768_BANDS, ISO2768_SOURCE, TOLERANCE_CLASS_NAMES, type ToleranceClass } from './iso2768'
export { createRng, type Rng } from './prng'
export { fitLine, deviationOf, residualsOf, type LineFit } from './straightness'
export { compileLinkage, anglesOver, scratchFor, solvePositions, type CompiledLinkage, type MechanismModelLike } from './kinematics'
export { prepareTolerance, baseValues, CLEARANCE_ASSUMPTION, DEFAULT_POSITIONS, ToleranceInputError } from './setup'
export type { ToleranceInput, ToleranceItem, ToleranceSetup, EyeForceInput, EyeQuery } from './setup'
export { worstCase, deviationFor, evaluatePath, type WorstCase, type Contribution } from './worst-case'
export { monteCarlo, monteCarloAsync, PERCENTILES, type MonteCarloOptions, type MonteCarloResult, type HistogramBin, type Distribution } from './monte-carlo'
export { eyeForcesFromLoad, clearancesFromChecks } from './inputs'
export { toleranceSteps, contributionsTable, histogramData, TOLERANCE_SECTION, TOLERANCE_SOURCES } from './report'

/** The engine's model of a registered mechanism for a geometry (parsed by its schema here). */
export function toleranceModelFor(mechanism: string, geometry: unknown): MechanismModelLike {
  const def = getMechanism(mechanism)
  return def.model(def.geometry.parse(geometry))
}

export interface ToleranceResult {
  mechanism: string
  toleranceClass: ToleranceClass
  /** Crank angles evaluated, degrees. */
  crankDeg: number[]
  items: ToleranceItem[]
  /** Exact lengths, pins centred; exact lengths with the clearance shifts; mm. */
  idealDeviation: number
  baseDeviation: number
  worstCase: {
    linear: WorstCase['linear']
    confirmed: WorstCase['confirmed']
    rss: WorstCase['rss']
    contributions: Contribution[]
  }
  /** Null when no Monte Carlo run was asked for. Its per-sample array is left out unless keepSamples. */
  monteCarlo: MonteCarloResult | null
  steps: Step[]
  table: Table
  histogram: { centre: number; width: number; count: number }[]
  assumptions: string[]
  notes: string[]
}

export interface AnalyseTolerancesInput extends ToleranceInput {
  /** Straightness the guide must hold, mm (the calc's straightnessTolerance): judged on the confirmed worst case. */
  limit?: number
  monteCarlo?: MonteCarloOptions
}

function assemble(input: AnalyseTolerancesInput, setup: ToleranceSetup, wc: WorstCase, mc: MonteCarloResult | null): ToleranceResult {
  return {
    mechanism: input.model.cell.mechanism,
    toleranceClass: setup.toleranceClass,
    crankDeg: wc.crankDeg,
    items: setup.items,
    idealDeviation: wc.idealDeviation,
    baseDeviation: wc.baseDeviation,
    worstCase: { linear: wc.linear, confirmed: wc.confirmed, rss: wc.rss, contributions: wc.contributions },
    monteCarlo: mc,
    steps: toleranceSteps(setup, wc, mc, input.limit),
    table: contributionsTable(wc),
    histogram: mc ? histogramData(mc.histogram) : [],
    assumptions: [
      CLEARANCE_ASSUMPTION,
      'Each link is dimensioned from its first hole; every hole-to-hole length and the frame distance O–C vary independently within its tolerance; the holes lie on the link axis.',
      'Straightness is the largest distance of the tracer from its total-least-squares line over the working range (not the minimum zone of ISO 1101).',
    ],
    notes: setup.notes,
  }
}

/** Worst case and (when asked) Monte Carlo in one call, with the package's steps, table and histogram. */
export function analyseTolerances(input: AnalyseTolerancesInput): ToleranceResult {
  const setup = prepareTolerance(input)
  const wc = worstCase(setup)
  const mc = input.monteCarlo ? monteCarlo(setup, { limit: input.limit, ...input.monteCarlo }) : null
  return assemble(input, setup, wc, mc)
}

/** The same, yielding between Monte Carlo chunks (progress, cancellation by AbortSignal). */
export async function analyseTolerancesAsync(input: AnalyseTolerancesInput): Promise<ToleranceResult> {
  const setup = prepareTolerance(input)
  const wc = worstCase(setup)
  const mc = input.monteCarlo ? await monteCarloAsync(setup, { limit: input.limit, ...input.monteCarlo }) : null
  return assemble(input, setup, wc, mc)
}
