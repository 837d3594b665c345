import type { LinkageModel } from './model'
import type { TracerPath } from './geometry'
import { dist, norm, type Vec } from './vec'

/** Largest |distance between two points of a link − their design distance|, mm. */
export function linkLengthError(model: LinkageModel, joints: Record<string, Vec>): number {
  let worst = 0
  for (const l of model.links) {
    for (let i = 0; i < l.points.length; i++) {
      for (let k = i + 1; k < l.points.length; k++) {
        const d = dist(joints[l.points[i]], joints[l.points[k]])
        worst = Math.max(worst, Math.abs(d - (l.stations[k] - l.stations[i])))
      }
    }
  }
  return worst
}

/** |OP·OT/k − 1| and the tracer's distance from its predicted path, from solved joints. */
export function inversionError(k: number, joints: Record<string, Vec>): number {
  return Math.abs((norm(joints.P) * norm(joints.T)) / k - 1)
}

export function pathError(path: TracerPath, t: Vec): number {
  if (path.kind === 'line') return Math.abs((t.x - path.point.x) * path.direction.y - (t.y - path.point.y) * path.direction.x)
  return Math.abs(dist(t, path.centre) - path.radius)
}

/**
 * Straightness from the solved positions: the largest distance of a tracer
 * position from the chord through the tracer at the two extreme crank angles.
 * ≈ 0 on a true line; on an arc it is the sagitta of the swept arc.
 */
export function straightness(points: { crankDeg: number; tracer: Vec }[]): number {
  if (points.length < 3) return 0
  let lo = points[0]
  let hi = points[0]
  for (const p of points) {
    if (p.crankDeg < lo.crankDeg) lo = p
    if (p.crankDeg > hi.crankDeg) hi = p
  }
  const len = dist(lo.tracer, hi.tracer)
  // The two ends coincide after a full crank turn: measure across the x direction.
  const dir = len > 1e-9 ? { x: (hi.tracer.x - lo.tracer.x) / len, y: (hi.tracer.y - lo.tracer.y) / len } : { x: 0, y: 1 }
  let worst = 0
  for (const p of points) {
    const dx = p.tracer.x - lo.tracer.x
    const dy = p.tracer.y - lo.tracer.y
    worst = Math.max(worst, Math.abs(dx * dir.y - dy * dir.x))
  }
  return worst
}
