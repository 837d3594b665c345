import type { InversorCell } from '../cells/cell'
import type { GeometryVerdict } from '../geometry'
import type { LoadCaseEnvelope, StrokeLimits } from '@/lib/contract'
import type { LoadInput, SweepPositions } from '../sweep'

/** Everything the step and table builders read; they compute nothing new but checks. */
export interface ReportContext {
  cell: InversorCell
  crank: number
  offset: number
  marginDeg: number
  amplificationLimit: number
  verdict: GeometryVerdict
  loads: LoadInput[]
  selfWeight: { density: number; area: number; g: number; perMm: number } | null
  sweep: SweepPositions | null
  envelopes: LoadCaseEnvelope[]
  straightness: number
  /** The crank range statics is solved over; null when the geometry is infeasible. */
  working: (StrokeLimits & { source: 'positions' | 'end-stops' | 'required-stroke' | 'usable' }) | null
  /** Smallest transmission angle over the working range, degrees. */
  minTransmissionWorking: number
  minTransmissionDeg: number
  straightnessTolerance: number
  requiredStroke?: number
}

/**
 * Step-id fragment for a load case name. Ids must survive number changes, so
 * they derive from the name only; the position in the list breaks ties.
 */
export function caseSlugs(names: string[]): string[] {
  const seen = new Set<string>()
  return names.map((n, i) => {
    let s = n.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '') || `case-${i + 1}`
    if (seen.has(s)) s = `${s}-${i + 1}`
    seen.add(s)
    return s
  })
}
