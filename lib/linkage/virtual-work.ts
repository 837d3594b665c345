import { linkLength, type LinkageModel } from './model'
import type { CaseLoads } from './statics'
import { dot, norm, type Vec } from './vec'

/** Central-difference step in crank angle, rad: small enough for 1e-9, large enough for rounding. */
export const VW_STEP = 1e-5

export interface VirtualWork {
  /** Drive torque from τ·δθ + Σ F·δX = 0, N·mm. */
  torque: number
  /**
   * Σ |F|·|dX/dθ|, N·mm per rad: the most work the loads could do, the scale for
   * a relative error (a load square to its point's motion does no work, and the
   * relative error of a zero torque would be rounding over rounding).
   */
  scale: number
}

// Module level rather than a closure per call: the sweep calls this at every position.
const rate = (before: Record<string, Vec>, after: Record<string, Vec>, j: string): Vec => ({
  x: (after[j].x - before[j].x) / (2 * VW_STEP),
  y: (after[j].y - before[j].y) / (2 * VW_STEP),
})

/**
 * Principle of virtual work: the drive torque that balances the loads follows
 * from how fast their points move, τ = −Σ F·dX/dθ, with dX/dθ taken by central
 * differences of the solved positions — no force analysis involved, which
 * makes it an independent check on the equilibrium solution.
 */
export function virtualWorkTorque(
  model: LinkageModel,
  before: Record<string, Vec>,
  after: Record<string, Vec>,
  loads: CaseLoads,
): VirtualWork {
  let power = 0
  let scale = 0
  for (const p of loads.pointLoads) {
    const v = rate(before, after, p.joint)
    power += dot(p.force, v)
    scale += norm(p.force) * norm(v)
  }
  if (loads.weightPerMm) {
    for (const l of model.links) {
      const a = rate(before, after, l.points[0])
      const b = rate(before, after, l.points[l.points.length - 1])
      const v = { x: (a.x + b.x) / 2, y: (a.y + b.y) / 2 }
      power += linkLength(l) * dot(loads.weightPerMm, v)
      scale += linkLength(l) * norm(loads.weightPerMm) * norm(v)
    }
  }
  return { torque: -power, scale }
}
