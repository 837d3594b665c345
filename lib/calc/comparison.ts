/**
 * "Choice of mechanism": the approximate straight-line four-bars (lib/fourbar) sized for the same
 * stroke and load beside this calc's exact cell — its links, pins, footprint over the working range,
 * straightness (as built when analysed, else ideal), largest pin force and drive torque.
 */
import type { CalcResult, Step, Table } from '@/lib/contract'
import { compareStraightLineMechanisms, exactRow, tableRow, type Comparison, type ExactCellRow } from '@/lib/fourbar'
import { fourBars, mechanismLabel } from '@/lib/mechanisms'

/** The comparison's steps (in the appendix: the table carries the figures) and table, or nothing when the calc has no solved positions. */
export function mechanismComparison(result: Pick<CalcResult, 'mechanism' | 'feasibility' | 'positions' | 'steps' | 'links' | 'envelope' | 'straightness' | 'workingRange'>, load: { fx: number; fy: number }, requiredStroke?: number): { steps: Step[]; tables: Table[] } {
  const positions = result.positions
  if (!result.feasibility.ok || positions.length < 2) return { steps: [], tables: [] }
  const ys = positions.map((p) => p.tracer.y)
  const stroke = requiredStroke ?? Math.max(...ys) - Math.min(...ys)
  // A sweep that does not move the tracer (one angle given twice) has no stroke to compare over.
  if (!(stroke > 0)) return { steps: [], tables: [] }
  const xs = positions.flatMap((p) => Object.values(p.joints).map((j) => j.x))
  const yj = positions.flatMap((p) => Object.values(p.joints).map((j) => j.y))
  const built = result.steps.find((s) => s.id === 'tol.worst-confirmed')
  const exact: ExactCellRow = {
    name: mechanismLabel(result.mechanism),
    // The frame counts as a link, as for the four-bars.
    links: result.links.length + 1,
    pins: new Set(result.links.flatMap((l) => l.joints)).size,
    footprint: { width: Math.max(...xs) - Math.min(...xs), height: Math.max(...yj) - Math.min(...yj) },
    straightness: typeof built?.value === 'number' ? built.value : result.straightness,
    straightnessBasis: built ? 'toleranced' : 'ideal',
    // The first load case, statically, as the four-bars are loaded.
    peakPinForce: Math.max(0, ...Object.values(result.envelope[0]?.pins ?? {}).map((p) => p.value)),
    peakTorque: Math.abs(result.envelope[0]?.driveTorque.value ?? 0),
    inputSpanDeg: result.workingRange ? result.workingRange.crankMaxDeg - result.workingRange.crankMinDeg : undefined,
    stepId: built?.id,
  }
  const c = fourBarsFor(stroke, load)
  return { steps: c.steps.map((s) => ({ ...s, appendix: true })), tables: [{ ...c.table, rows: [...c.table.rows, tableRow(exactRow(exact))] }] }
}

/**
 * The four-bars (every one the registry offers, each sized by its rule) depend on the stroke and the
 * load only, not on the cell: the bench recomputes the calc as the engineer types the cell's sizes,
 * so the last few are kept (they are about two thirds of a calc's time).
 */
const fourBarCache = new Map<string, Comparison>()
function fourBarsFor(stroke: number, load: { fx: number; fy: number }): Comparison {
  const offered = fourBars()
  const key = `${stroke}|${load.fx}|${load.fy}|${offered.map((f) => f.id).join()}`
  let c = fourBarCache.get(key)
  if (!c) {
    c = compareStraightLineMechanisms({ stroke, load, fourBars: offered.map((f) => f.size(stroke, f.rule)) })
    if (fourBarCache.size >= 8) fourBarCache.delete(fourBarCache.keys().next().value!)
    fourBarCache.set(key, c)
  }
  return c
}
