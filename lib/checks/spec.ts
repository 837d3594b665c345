import { shownPair, texNumber } from '@/lib/units/format'
/**
 * What a basis returns for one check, before it becomes a CheckItem and a
 * Step. Keeping the bases to this one shape is what lets the runner, the
 * summary table and the governing flag be written once.
 */

/** A design force and where it came from. */
export interface Demand {
  value: number
  loadCase: string
  crankDeg?: number
  /** The envelope value before the user's factors. */
  raw: number
  /** The engine's step that shows the envelope value (absent for a force given directly). */
  stepId?: string
}

/** The force between a link and its pins (the eye or hole it bears on), and whether it turns across the link. */
export interface EyeDemand extends Demand {
  /** True when the force has a component across the link's axis somewhere in the working range. */
  across: boolean
  /** The pin where the largest force acts. */
  joint?: string
}

export interface JointForces {
  /** Design resultant pin force, N. */
  force: Demand
  /** Serviceability force (dynamic factor only, no load factor), N. */
  service: number
}

export interface LinkForces {
  tension: Demand
  compression: Demand
  moment?: Demand
  /** Largest of tension and compression. */
  axial: Demand
  /** The largest pin force on the link's eyes and holes in its worst direction: what the eye rules are sized for. */
  eye: EyeDemand
}

export interface CheckSpec {
  /** Last part of the step id: `shear`, `buckling`, … */
  key: string
  title: string
  /** Clause with its rule in words, for the API and CLI. */
  clause: string
  /** The reference alone (code, clause, table or equation), as the package prints it beside the working. */
  ref?: string
  /** `detailing`: a dimensional rule, met or not met; never the headline utilisation. Default `strength`. */
  kind?: 'strength' | 'detailing'
  formula: string
  substituted: string
  demand: number
  capacity: number
  unit: string
  /** Which design force governs the check (for load case and crank angle). */
  governedBy?: Demand
  note?: string
}

/** A number for TeX: the one formatter of lib/units (four significant figures). */
export function fmt(x: number): string {
  return texNumber(x)
}

/**
 * The closing comparison of a check's working, `demand ≤ capacity` or `demand > capacity`: a failing
 * check rounds its demand up and its capacity down, so it never reads as met.
 */
export function cmp(demand: number, capacity: number): string {
  const fails = demand > capacity * (1 + 1e-9)
  const [d, c] = shownPair(demand, capacity, fails)
  return `${texNumber(d)} ${fails ? '>' : '\\le'} ${texNumber(c)}`
}

/** `≤` or `>` for a comparison whose two sides are printed separately. */
export function op(demand: number, capacity: number): string {
  return demand > capacity * (1 + 1e-9) ? '>' : '\\le'
}

/** Demand as printed in a comparison (rounded up when the check fails). */
export function shownDemand(demand: number, capacity: number): string {
  return texNumber(demand, demand > capacity * (1 + 1e-9) ? 'up' : 'nearest')
}

/** Capacity as printed in a comparison (rounded down when the check fails). */
export function shownCapacity(demand: number, capacity: number): string {
  return texNumber(capacity, demand > capacity * (1 + 1e-9) ? 'down' : 'nearest')
}

export function maxDemand(a: Demand, b: Demand): Demand {
  return b.value > a.value ? b : a
}
