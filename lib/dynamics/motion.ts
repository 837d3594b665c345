/**
 * How the crank turns: its speed ω and angular acceleration α as functions of the crank angle θ,
 * which is all the kinetostatics needs (q̇ = ω q′, q̈ = ω² q″ + α q′ with ′ = d/dθ).
 * Counter-clockwise positive, rad/s and rad/s².
 */

export type MotionLaw =
  /** The crank turns at a constant speed: ω = 2π n/60, α = 0. */
  | { kind: 'constant'; rpm: number }
  /**
   * The crank swings between two end stops with simple harmonic motion, one swing there and one
   * back per cycle: θ(t) = θ_m − Δ cos Ωt with θ_m, Δ the middle and half of the swing and
   * Ω = 2π n/60 (n cycles per minute). Then ω = Ω √(Δ² − (θ − θ_m)²) (forward swing; the return
   * has −ω and the same inertia loads) and α = −Ω² (θ − θ_m).
   */
  | { kind: 'harmonic'; cyclesPerMinute: number; fromDeg: number; toDeg: number }
  /** Any law given as a function of the crank angle (code only; not serialisable). */
  | { kind: 'custom'; label: string; at: (crankRad: number) => { omega: number; alpha: number } }

export interface CrankRate {
  /** rad/s */
  omega: number
  /** rad/s² */
  alpha: number
}

const DEG = Math.PI / 180

/** 2π/60: revolutions per minute to rad/s. */
export const RPM = (2 * Math.PI) / 60

export function crankRate(law: MotionLaw, crankRad: number): CrankRate {
  switch (law.kind) {
    case 'constant':
      return { omega: law.rpm * RPM, alpha: 0 }
    case 'harmonic': {
      const w = law.cyclesPerMinute * RPM
      const mid = ((law.fromDeg + law.toDeg) / 2) * DEG
      const half = (Math.abs(law.toDeg - law.fromDeg) / 2) * DEG
      const u = crankRad - mid
      // Outside the swing the crank never is; rounding at the end stops leaves tiny negatives.
      return { omega: w * Math.sqrt(Math.max(0, half * half - u * u)), alpha: -w * w * u }
    }
    case 'custom':
      return law.at(crankRad)
  }
}

/** The law in words, for the package. */
export function describeMotion(law: MotionLaw): string {
  switch (law.kind) {
    case 'constant':
      return `constant crank speed ${law.rpm} rpm`
    case 'harmonic':
      return `harmonic swing of the crank between ${law.fromDeg}° and ${law.toDeg}°, ${law.cyclesPerMinute} cycles per minute`
    case 'custom':
      return law.label
  }
}
