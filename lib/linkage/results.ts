import type { Vec } from './vec'

/**
 * Output shapes of the engine. They match lib/calc/types.ts field for field;
 * the calc layer assigns them to its own types, so the compiler flags drift
 * without this layer importing upward.
 */
export interface ForceOut extends Vec {
  magnitude: number
}

export interface PositionOut {
  crankDeg: number
  tracer: Vec
  joints: Record<string, Vec>
  linkForces: Record<string, number>
  pinForces: Record<string, ForceOut>
  reactions: Record<string, ForceOut>
  driveTorque: number
  linkMoments?: Record<string, number>
  transmissionAngleDeg?: number
  transmissionAngles?: Record<string, number>
}

/** Why a requested crank angle has no statics: out of reach, or at or near a toggle. */
export interface ToggleOut {
  crankDeg: number
  reason: 'unreachable' | 'singular' | 'force-amplification'
  /** Largest pin force per newton of load at the tracer, when it could be computed. */
  amplification?: number
}

export interface ExtremeOut {
  value: number
  crankDeg: number
}

export interface EnvelopeOut {
  loadCase: string
  links: Record<string, { length: number; maxTension: ExtremeOut; maxCompression: ExtremeOut; maxMoment?: ExtremeOut }>
  pins: Record<string, ExtremeOut>
  driveTorque: ExtremeOut
}

export interface StepOut {
  id: string
  section: string
  title: string
  formula?: string
  substituted?: string
  value?: number | string | boolean
  unit?: string
  source?: string
  verdict?: 'pass' | 'fail' | 'warn' | 'info'
  note?: string
}

export interface TableOut {
  id: string
  section: string
  title: string
  columns: { key: string; label: string; unit?: string; digits?: number }[]
  rows: Record<string, number | string | boolean | null>[]
}
