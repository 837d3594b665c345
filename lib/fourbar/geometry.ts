/**
 * Small plane geometry for the four-bars: vectors, the intersection of two circles, and the
 * total-least-squares line of a set of points with the largest distance from it. The vector
 * operations are the engine's (lib/linkage/vec).
 */
import type { Point } from '@/lib/contract'

import { add, cross, dist, dot, norm, perp, scale, sub } from '../linkage/vec'

export { add, cross, dist, dot, norm, perp, scale, sub }
export const pt = (x: number, y: number): Point => ({ x, y })
export const rotate = (a: Point, rad: number): Point => {
  const c = Math.cos(rad)
  const s = Math.sin(rad)
  return { x: c * a.x - s * a.y, y: s * a.x + c * a.y }
}

/**
 * The point X with |X − p| = rp and |X − q| = rq on the side `branch` of the directed line p → q
 * (branch +1: left, cross(q − p, X − p) > 0; −1: right). Null when the circles do not meet.
 * `h` is the distance of X from the line p q: zero at a toggle, where the two branches meet.
 */
export function circleCircle(p: Point, rp: number, q: Point, rq: number, branch: 1 | -1): { point: Point; h: number } | null {
  const d = sub(q, p)
  const L = norm(d)
  if (!(L > 0)) return null
  const along = (rp * rp - rq * rq + L * L) / (2 * L)
  const h2 = rp * rp - along * along
  if (h2 < -1e-12 * rp * rp) return null
  const h = Math.sqrt(Math.max(0, h2))
  const u = scale(d, 1 / L)
  return { point: add(p, add(scale(u, along), scale(perp(u), branch * h))), h }
}

export interface LineFit {
  /** A point of the line (the centroid of the points), mm. */
  point: Point
  /** Unit direction of the line. */
  direction: Point
}

/**
 * Total-least-squares line through the points: through their centroid, along the eigenvector of the
 * 2×2 scatter matrix [[Sxx, Sxy], [Sxy, Syy]] with the larger eigenvalue (the principal axis; it
 * minimises the sum of squared perpendicular distances).
 */
export function fitLine(points: readonly Point[]): LineFit {
  const n = points.length
  let cx = 0
  let cy = 0
  for (const p of points) {
    cx += p.x
    cy += p.y
  }
  cx /= n
  cy /= n
  let sxx = 0
  let syy = 0
  let sxy = 0
  for (const p of points) {
    const dx = p.x - cx
    const dy = p.y - cy
    sxx += dx * dx
    syy += dy * dy
    sxy += dx * dy
  }
  // Larger eigenvalue of the symmetric 2×2 matrix, then its eigenvector from whichever row is better conditioned.
  const mean = (sxx + syy) / 2
  const lam = mean + Math.hypot((sxx - syy) / 2, sxy)
  const v1 = { x: sxy, y: lam - sxx } // from row 1: (Sxx − λ) vx + Sxy vy = 0
  const v2 = { x: lam - syy, y: sxy } // from row 2: Sxy vx + (Syy − λ) vy = 0
  let v = norm(v1) >= norm(v2) ? v1 : v2
  if (norm(v) === 0) v = { x: 1, y: 0 } // all points alike, or isotropic scatter: any direction
  const len = norm(v)
  return { point: { x: cx, y: cy }, direction: { x: v.x / len, y: v.y / len } }
}

/** Signed distance of p from the line (positive on the left of its direction), mm. */
export const offsetFrom = (line: LineFit, p: Point): number => cross(line.direction, sub(p, line.point))
