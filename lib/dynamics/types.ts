/**
 * The shapes of the forces-at-speed result (kept apart from run.ts so the step builders can read
 * them without an import cycle).
 */
import type { Extreme, Step, Table, ToggleFlag } from '@/lib/contract'
import type { CaseSample } from '@/lib/linkage/sweep'
import type { Vec } from '@/lib/linkage/vec'
import type { LinkMotion, PointMotion } from './kinematics'
import type { AddedMass, LinkMass } from './mass'
import type { MotionLaw } from './motion'
import type { VirtualPower } from './virtual-power'

/** Kinematics at speed at one position (the same for every load case). */
export interface PositionKinematics {
  crankDeg: number
  /** Crank speed and acceleration, rad/s, rad/s². */
  omega: number
  alpha: number
  joints: Record<string, PointMotion>
  links: Record<string, LinkMotion>
}

/** One position of the case at speed: a static sweep sample plus the speed terms and the check. */
export interface DynamicSample extends CaseSample {
  omega: number
  alpha: number
  /** Drive torque of the same case without inertia (ω → 0), N·mm. */
  staticTorque: number
  /** Inertia load per link: −m a_G (N) and −I_G α (N·mm). */
  inertia: Record<string, { force: Vec; couple: number }>
  power: VirtualPower | null
  /** Sum of the magnitudes of the loads, weights and inertia forces applied, N: the scale of `residual`. */
  applied: number
}

export interface DynamicCase {
  name: string
  /** The static case it adds inertia to. */
  staticName: string
  slug: string
  samples: DynamicSample[]
  /** The same positions without inertia (the static case, with the input's gravity on the masses). */
  withoutInertia: CaseSample[]
}

export interface DynamicsResult {
  /** The joint reported as tracer. */
  tracer: string
  motion: { kind: MotionLaw['kind']; description: string; rpm?: number; cyclesPerMinute?: number }
  masses: LinkMass[]
  addedMasses: AddedMass[]
  gravity: Vec | null
  kinematics: PositionKinematics[]
  cases: DynamicCase[]
  toggles: ToggleFlag[]
  peaks: {
    crankSpeed: Extreme
    crankAcceleration: Extreme
    /** |a| of the tracer joint, mm/s². */
    tracerAcceleration: Extreme
    /** Per link: largest |a_G| (mm/s²) and |α| (rad/s²). */
    links: Record<string, { acceleration: Extreme; angular: Extreme }>
    /** Per case: largest |τ| at speed and without inertia (signed values kept), N·mm. */
    torque: { loadCase: string; slug: string; atSpeed: Extreme; static: Extreme }[]
  }
  checks: {
    /** Largest relative virtual-power residual over all cases and positions. */
    virtualPower: { worst: number; crankDeg: number; loadCase: string; checked: number; positions: number }
    /** Largest out-of-balance force over the bodies relative to the applied loads. */
    equilibrium: { worst: number; loadCase: string }
  }
  steps: Step[]
  tables: Table[]
}
