import { solveInPlace } from './dense'
import { equilibriumMatrix, transpose } from './equations'
import type { LinkageModel } from './model'
import type { Vec } from './vec'

/**
 * Generic loop-closure position solver: body poses (x, y, lc·φ) such that every
 * connection's two body points coincide (or sit on their ground point) and the
 * crank is at the requested angle. Newton–Raphson on those 3·bodies equations.
 * The named cells have closed forms; this solver is what the tests hold them
 * against, and what a linkage without a closed form would use.
 */
export type Poses = Float64Array

export function posesFromJoints(model: LinkageModel, joints: Record<string, Vec>): Poses {
  const q = new Float64Array(model.size)
  model.links.forEach((l, b) => {
    const a = joints[l.points[0]]
    const z = joints[l.points[l.points.length - 1]]
    q[3 * b] = a.x
    q[3 * b + 1] = a.y
    q[3 * b + 2] = model.lc * Math.atan2(z.y - a.y, z.x - a.x)
  })
  return q
}

/** World position of a link's point from the body pose. */
function pointOf(model: LinkageModel, q: Poses, b: number, joint: string): Vec {
  const l = model.links[b]
  const s = l.stations[l.points.indexOf(joint)]
  const phi = q[3 * b + 2] / model.lc
  return { x: q[3 * b] + s * Math.cos(phi), y: q[3 * b + 1] + s * Math.sin(phi) }
}

export function jointsFromPoses(model: LinkageModel, q: Poses): Record<string, Vec> {
  const out: Record<string, Vec> = {}
  model.links.forEach((l, b) => {
    for (const j of l.points) out[j] ??= pointOf(model, q, b, j)
  })
  for (const [j, p] of Object.entries(model.ground)) out[j] = { ...p }
  return out
}

/** Every body point from the poses, in the flat layout the equilibrium matrix reads. */
function bodyPoints(model: LinkageModel, q: Poses): Float64Array {
  const pts = new Float64Array(2 * model.pointCount)
  model.links.forEach((l, b) => {
    const phi = q[3 * b + 2] / model.lc
    l.stations.forEach((s, k) => {
      pts[2 * (model.offset[b] + k)] = q[3 * b] + s * Math.cos(phi)
      pts[2 * (model.offset[b] + k) + 1] = q[3 * b + 1] + s * Math.sin(phi)
    })
  })
  return pts
}

function residual(model: LinkageModel, q: Poses, thetaRad: number): Float64Array {
  const r = new Float64Array(model.size)
  model.connections.forEach((c, i) => {
    const a = pointOf(model, q, c.body, c.joint)
    const b = c.other >= 0 ? pointOf(model, q, c.other, c.joint) : model.ground[c.joint]
    r[2 * i] = a.x - b.x
    r[2 * i + 1] = a.y - b.y
  })
  const phi = q[3 * model.crankIndex + 2] / model.lc
  // Wrapped so that a guess one turn away still counts as the same crank angle.
  r[model.size - 1] = model.lc * Math.atan2(Math.sin(phi - thetaRad), Math.cos(phi - thetaRad))
  return r
}

export interface NewtonResult {
  ok: boolean
  poses: Poses
  iterations: number
  residual: number
}

export function solvePositionNewton(
  model: LinkageModel,
  thetaRad: number,
  guess: Poses,
  opts: { tol?: number; maxIter?: number } = {},
): NewtonResult {
  const tol = (opts.tol ?? 1e-12) * model.lc
  const maxIter = opts.maxIter ?? 50
  const q = Float64Array.from(guess)
  const n = model.size
  for (let it = 0; it < maxIter; it++) {
    const r = residual(model, q, thetaRad)
    const res = Math.max(...r.map(Math.abs))
    if (res <= tol) return { ok: true, poses: q, iterations: it, residual: res }
    const jac = transpose(equilibriumMatrix(model, bodyPoints(model, q)), n)
    for (let i = 0; i < n; i++) r[i] = -r[i]
    if (!solveInPlace(jac, n, [r]).ok) return { ok: false, poses: q, iterations: it, residual: res }
    for (let i = 0; i < n; i++) q[i] += r[i]
  }
  const res = Math.max(...residual(model, q, thetaRad).map(Math.abs))
  return { ok: res <= tol, poses: q, iterations: maxIter, residual: res }
}
