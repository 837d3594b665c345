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
  /** Largest of tension and compression; what eye geometry rules are sized for. */
  axial: Demand
}

export interface CheckSpec {
  /** Last part of the step id: `shear`, `buckling`, … */
  key: string
  title: string
  clause: string
  formula: string
  substituted: string
  demand: number
  capacity: number
  unit: string
  /** Which design force governs the check (for load case and crank angle). */
  governedBy?: Demand
  note?: string
}

/** Plain number for TeX and notes: 4 significant digits, no exponent for ordinary sizes. */
export function fmt(x: number): string {
  if (!Number.isFinite(x)) return String(x)
  if (x === 0) return '0'
  const a = Math.abs(x)
  if (a >= 1e6 || a < 1e-3) return x.toExponential(3).replace(/e\+?(-?\d+)/, ' \\cdot 10^{$1}')
  return String(Number(x.toPrecision(4)))
}

export function maxDemand(a: Demand, b: Demand): Demand {
  return b.value > a.value ? b : a
}
