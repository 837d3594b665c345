import { linkLength, type LinkageModel } from './model'
import type { CaseLoads } from './statics'
import { dot, mag, norm, type Vec } from './vec'

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

/**
 * virtualWorkTorque on joint positions in flat arrays (x at 2i, y at 2i + 1, joints numbered by
 * `index`), with the same arithmetic: the sweep keeps its positions flat. Writes torque and scale
 * to out[0], out[1].
 */
export function virtualWorkInto(
  model: LinkageModel,
  before: Float64Array,
  after: Float64Array,
  index: Record<string, number>,
  loads: CaseLoads,
  out: Float64Array,
): void {
  const h = 2 * VW_STEP
  let power = 0
  let scale = 0
  for (const p of loads.pointLoads) {
    const i = 2 * index[p.joint]
    const vx = (after[i] - before[i]) / h
    const vy = (after[i + 1] - before[i + 1]) / h
    power += p.force.x * vx + p.force.y * vy
    scale += mag(p.force.x, p.force.y) * mag(vx, vy)
  }
  const w = loads.weightPerMm
  if (w) {
    for (const l of model.links) {
      const i = 2 * index[l.points[0]]
      const j = 2 * index[l.points[l.points.length - 1]]
      const ax = (after[i] - before[i]) / h
      const ay = (after[i + 1] - before[i + 1]) / h
      const bx = (after[j] - before[j]) / h
      const by = (after[j + 1] - before[j + 1]) / h
      const vx = (ax + bx) / 2
      const vy = (ay + by) / 2
      power += linkLength(l) * (w.x * vx + w.y * vy)
      scale += linkLength(l) * mag(w.x, w.y) * mag(vx, vy)
    }
  }
  out[0] = -power
  out[1] = scale
}
