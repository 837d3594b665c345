/**
 * Velocities and accelerations from the loop-closure equations (lib/linkage/equations.ts).
 *
 * The constraints Φ(q, θ) = 0 of the model — every connection's two body points coincide, and the
 * crank's angle equals θ — have the Jacobian J = ∂Φ/∂q, the transpose of the equilibrium matrix,
 * with body coordinates q = (x, y, L_c·φ) of each body's first point and axis angle. Differentiating
 * Φ along the motion once and twice in the crank angle:
 *
 *   J q′ = L_c e_n                       (velocity equations, unit crank speed)
 *   J q″ = γ,  γ_i = φ′_a² d_a − φ′_b² d_b   (acceleration equations)
 *
 * where ′ = d/dθ, e_n picks the crank row and d is a connection point's offset from its body's first
 * point (its centripetal term; nothing for the ground). At a crank speed ω and acceleration α the
 * time rates are q̇ = ω q′ and q̈ = ω² q″ + α q′, so one solve per position serves every speed.
 * A singular J (a toggle) makes the equilibrium matrix singular too: both are left out together.
 */
import { solveInPlace, solveScratch, type SolveScratch } from '@/lib/linkage/dense'
import { equilibriumMatrix, equilibriumPattern } from '@/lib/linkage/equations'
import type { LinkageModel } from '@/lib/linkage/model'
import type { Vec } from '@/lib/linkage/vec'

/** Pose rates of every body at unit crank speed: q′ and q″, 3 entries per body (x, y, L_c·φ). */
export interface UnitRates {
  dq: Float64Array
  ddq: Float64Array
}

/** Reusable storage for one model's velocity and acceleration solves. */
export interface KinematicsWorkspace {
  eq: Float64Array
  jac: Float64Array
  work: Float64Array
  solver: SolveScratch
}

export function kinematicsWorkspace(model: LinkageModel): KinematicsWorkspace {
  const n = model.size
  // The Jacobian's nonzeros are the equilibrium matrix's, transposed.
  const pattern = Int32Array.from(equilibriumPattern(model), (p) => (p % n) * n + Math.floor(p / n)).sort()
  return { eq: new Float64Array(n * n), jac: new Float64Array(n * n), work: new Float64Array(n * n), solver: solveScratch(n, pattern) }
}

/**
 * q′ and q″ at one solved position (body points in the flat layout), or null when the Jacobian is
 * singular there.
 */
export function unitRates(model: LinkageModel, pts: Float64Array, ws: KinematicsWorkspace = kinematicsWorkspace(model)): UnitRates | null {
  const n = model.size
  const eq = equilibriumMatrix(model, pts, ws.eq)
  const jac = ws.jac
  for (let r = 0; r < n; r++) for (let c = 0; c < n; c++) jac[c * n + r] = eq[r * n + c]
  const dq = new Float64Array(n)
  dq[n - 1] = model.lc
  ws.work.set(jac)
  if (!solveInPlace(ws.work, n, [dq], undefined, ws.solver).ok) return null
  const ddq = new Float64Array(n)
  const conns = model.connections
  for (let i = 0; i < conns.length; i++) {
    const c = conns[i]
    const wa = dq[3 * c.body + 2] / model.lc
    const oa = 2 * model.offset[c.body]
    const pa = oa + 2 * model.connBodyK[i]
    let gx = (pts[pa] - pts[oa]) * wa * wa
    let gy = (pts[pa + 1] - pts[oa + 1]) * wa * wa
    if (c.other >= 0) {
      const wb = dq[3 * c.other + 2] / model.lc
      const ob = 2 * model.offset[c.other]
      const pb = ob + 2 * model.connOtherK[i]
      gx -= (pts[pb] - pts[ob]) * wb * wb
      gy -= (pts[pb + 1] - pts[ob + 1]) * wb * wb
    }
    ddq[2 * i] = gx
    ddq[2 * i + 1] = gy
  }
  ws.work.set(jac)
  if (!solveInPlace(ws.work, n, [ddq], undefined, ws.solver).ok) return null
  return { dq, ddq }
}

/** First and second derivative in θ of a point on body b at world position (x, y). */
export function pointRates(model: LinkageModel, pts: Float64Array, u: UnitRates, b: number, x: number, y: number): { d1: Vec; d2: Vec } {
  const o = 2 * model.offset[b]
  const dx = x - pts[o]
  const dy = y - pts[o + 1]
  const w = u.dq[3 * b + 2] / model.lc
  const al = u.ddq[3 * b + 2] / model.lc
  return {
    d1: { x: u.dq[3 * b] - w * dy, y: u.dq[3 * b + 1] + w * dx },
    d2: { x: u.ddq[3 * b] - al * dy - w * w * dx, y: u.ddq[3 * b + 1] + al * dx - w * w * dy },
  }
}

/** Velocity and acceleration of a point, mm/s and mm/s². */
export interface PointMotion {
  v: Vec
  a: Vec
}

/** Motion of a link: its centroid (the middle of its pins) and its axis. */
export interface LinkMotion {
  /** Centroid velocity and acceleration, mm/s, mm/s². */
  vG: Vec
  aG: Vec
  /** Angular velocity and acceleration, rad/s, rad/s², counter-clockwise positive. */
  omega: number
  alpha: number
}

/** Time rates at a crank speed ω and acceleration α from the unit rates: v = ω X′, a = ω² X″ + α X′. */
export function atSpeed(d1: Vec, d2: Vec, omega: number, alpha: number): PointMotion {
  return {
    v: { x: omega * d1.x, y: omega * d1.y },
    a: { x: omega * omega * d2.x + alpha * d1.x, y: omega * omega * d2.y + alpha * d1.y },
  }
}

/** Centroid of link b: the middle of its first and last points (a uniform straight bar). */
export function centroidOf(model: LinkageModel, pts: Float64Array, b: number): Vec {
  const o = 2 * model.offset[b]
  const e = o + 2 * (model.links[b].points.length - 1)
  return { x: (pts[o] + pts[e]) / 2, y: (pts[o + 1] + pts[e + 1]) / 2 }
}

/** Every link's motion at a crank speed and acceleration, in the model's link order. */
export function linkMotions(model: LinkageModel, pts: Float64Array, u: UnitRates, omega: number, alpha: number): LinkMotion[] {
  return model.links.map((_, b) => {
    const g = centroidOf(model, pts, b)
    const r = pointRates(model, pts, u, b, g.x, g.y)
    const m = atSpeed(r.d1, r.d2, omega, alpha)
    const w1 = u.dq[3 * b + 2] / model.lc
    const w2 = u.ddq[3 * b + 2] / model.lc
    return { vG: m.v, aG: m.a, omega: omega * w1, alpha: omega * omega * w2 + alpha * w1 }
  })
}

/** Every joint's motion (the ground joints at rest). */
export function jointMotions(model: LinkageModel, pts: Float64Array, u: UnitRates, omega: number, alpha: number): Record<string, PointMotion> {
  const out: Record<string, PointMotion> = {}
  for (const { joint, points } of model.jointPoints) {
    if (joint in model.ground) {
      out[joint] = { v: { x: 0, y: 0 }, a: { x: 0, y: 0 } }
      continue
    }
    const i = points[0]
    let b = 0
    while (b + 1 < model.links.length && model.offset[b + 1] <= i) b++
    const r = pointRates(model, pts, u, b, pts[2 * i], pts[2 * i + 1])
    out[joint] = atSpeed(r.d1, r.d2, omega, alpha)
  }
  return out
}
