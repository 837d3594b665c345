/** The figures an engineer reads first, taken from one result (working inputs or a revision). */
import type { MechanismResult, PositionResult } from '@/lib/contract'

export interface KeyFigures {
  feasible: boolean
  k: number
  lineOffset: number
  usableStroke: number
  straightness: number
  /** Smallest transmission angle over the solved positions, degrees (null without positions). */
  minTransmissionDeg: number | null
  peakTorque: { value: number; crankDeg: number; loadCase: string } | null
  peakLink: { value: number; link: string; crankDeg: number; loadCase: string } | null
  peakPin: { value: number; joint: string; crankDeg: number; loadCase: string } | null
}

function allPositions(result: MechanismResult): [string, PositionResult][] {
  return result.loadCases.flatMap((lc) => lc.positions.map((p) => [lc.name, p] as [string, PositionResult]))
}

export function keyFigures(result: MechanismResult): KeyFigures {
  let peakTorque: KeyFigures['peakTorque'] = null
  let peakLink: KeyFigures['peakLink'] = null
  let peakPin: KeyFigures['peakPin'] = null
  let minT: number | null = null
  for (const [loadCase, p] of allPositions(result)) {
    if (!peakTorque || Math.abs(p.driveTorque) > Math.abs(peakTorque.value)) peakTorque = { value: p.driveTorque, crankDeg: p.crankDeg, loadCase }
    for (const [link, f] of Object.entries(p.linkForces)) if (!peakLink || Math.abs(f) > Math.abs(peakLink.value)) peakLink = { value: f, link, crankDeg: p.crankDeg, loadCase }
    for (const [joint, f] of Object.entries(p.pinForces)) if (!peakPin || f.magnitude > peakPin.value) peakPin = { value: f.magnitude, joint, crankDeg: p.crankDeg, loadCase }
    if (p.transmissionAngleDeg !== undefined) minT = minT === null ? p.transmissionAngleDeg : Math.min(minT, p.transmissionAngleDeg)
  }
  return {
    feasible: result.feasibility.ok,
    k: result.inversionConstant,
    lineOffset: result.lineOffset,
    usableStroke: 2 * result.stroke.usable.half,
    straightness: result.straightness,
    minTransmissionDeg: minT,
    peakTorque,
    peakLink,
    peakPin,
  }
}
