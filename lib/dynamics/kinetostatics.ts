/**
 * Kinetostatics by d'Alembert's principle: at each solved position the inertia force −m a_G at
 * every link's centroid, its inertia couple −I_G α, and −m a at every added mass are applied as
 * loads beside the static ones, and the same joint equilibrium as the statics (lib/linkage:
 * 3 equations per body, 2 unknowns per pin connection, the drive torque) is solved. One
 * factorisation serves the case at speed and the same case without inertia.
 *
 * Inside a link the inertia load is distributed: a point at distance s from the first pin has
 * acceleration a₁ + s(α n − ω² e), so the load per mm is linear in s. Its resultant and moment are
 * exactly −m a_G and −I_G α for a uniform slender bar; the member forces (axial force and bending
 * moment along the link) and the recomputed equilibrium use the distributed form.
 *
 * Units: masses kg, accelerations mm/s², so forces carry 10⁻³ (kg·mm/s² = 10⁻³ N).
 */
import { solveInPlace, solveScratch, type SolveScratch } from '@/lib/linkage/dense'
import { equilibriumMatrix, equilibriumPattern } from '@/lib/linkage/equations'
import type { MemberForces } from '@/lib/linkage/members'
import { linkLength, type LinkageModel } from '@/lib/linkage/model'
import type { CaseStatics } from '@/lib/linkage/statics'
import type { Vec } from '@/lib/linkage/vec'

/** kg·mm/s² → N. */
export const KG_MM_S2_TO_N = 1e-3

/** A load distributed along link b, per mm of length from its first pin: q(s) = q0 + q1·s (N/mm, N/mm²). */
export interface LinkLoad {
  q0: Vec
  q1: Vec
}

/** The loads of one case at one position: point forces at joints, a load along every link, an extra couple per link. */
export interface PositionLoads {
  point: { joint: string; force: Vec }[]
  /** Per link in model order. */
  along: LinkLoad[]
  /**
   * Per link: the resultant force and couple the equilibrium equations receive. For inertia this is
   * −m a_G at the centroid and −I_G α; it equals the resultant of `along` (checked by the residual).
   */
  resultant: { force: Vec; at: Vec; couple: number }[]
}

export interface SolvedCase extends CaseStatics {
  /** Largest force any pin passes between two bodies, N. */
  largestConnection: number
}

export interface KinetoWorkspace {
  a: Float64Array
  solver: SolveScratch
}

export function kinetoWorkspace(model: LinkageModel): KinetoWorkspace {
  const n = model.size
  return { a: new Float64Array(n * n), solver: solveScratch(n, equilibriumPattern(model)) }
}

/** Flat index of a joint's point on the body that takes loads applied there; −1 for a ground joint. */
export function loadPoint(model: LinkageModel, joint: string): number {
  const b = model.primary[joint]
  if (b === undefined) throw new Error(`no joint ${joint} in the mechanism`)
  return b < 0 ? -1 : model.offset[b] + model.links[b].points.indexOf(joint)
}

function rhsOf(model: LinkageModel, pts: Float64Array, loads: PositionLoads): Float64Array {
  const n = model.size
  const rhs = new Float64Array(n)
  const put = (b: number, x: number, y: number, fx: number, fy: number, couple: number) => {
    const o = 2 * model.offset[b]
    rhs[3 * b] -= fx
    rhs[3 * b + 1] -= fy
    rhs[3 * b + 2] -= ((x - pts[o]) * fy - (y - pts[o + 1]) * fx + couple) / model.lc
  }
  for (const p of loads.point) {
    const i = loadPoint(model, p.joint)
    if (i >= 0) put(model.primary[p.joint], pts[2 * i], pts[2 * i + 1], p.force.x, p.force.y, 0)
  }
  loads.resultant.forEach((r, b) => put(b, r.at.x, r.at.y, r.force.x, r.force.y, r.couple))
  return rhs
}

/**
 * Joint equilibrium of every body for several load sets at one position: one factorisation.
 * Null when the equilibrium matrix is singular (a toggle).
 */
export function solveLoadSets(model: LinkageModel, pts: Float64Array, sets: PositionLoads[], ws: KinetoWorkspace = kinetoWorkspace(model)): SolvedCase[] | null {
  const n = model.size
  const a = equilibriumMatrix(model, pts, ws.a)
  const rhs = sets.map((s) => rhsOf(model, pts, s))
  if (!solveInPlace(a, n, rhs, undefined, ws.solver).ok) return null
  return rhs.map((x, q) => {
    let largest = 0
    for (let i = 0; i < model.connections.length; i++) largest = Math.max(largest, Math.hypot(x[2 * i], x[2 * i + 1]))
    return { ...endForces(model, sets[q], x), largestConnection: largest }
  })
}

function endForces(model: LinkageModel, loads: PositionLoads, x: Float64Array): CaseStatics {
  const f = new Float64Array(2 * model.pointCount)
  model.connections.forEach((c, i) => {
    const s = 2 * (model.offset[c.body] + model.connBodyK[i])
    f[s] += x[2 * i]
    f[s + 1] += x[2 * i + 1]
    if (c.other >= 0) {
      const o = 2 * (model.offset[c.other] + model.connOtherK[i])
      f[o] -= x[2 * i]
      f[o + 1] -= x[2 * i + 1]
    }
  })
  // A load at a pin acts on the link that carries it there, as in the statics.
  for (const p of loads.point) {
    const i = loadPoint(model, p.joint)
    if (i >= 0) {
      f[2 * i] += p.force.x
      f[2 * i + 1] += p.force.y
    }
  }
  return { endForces: f, torque: x[model.size - 1] * model.lc }
}

/** Unit axis e of link b (first to last point) and its length. */
function axisOf(model: LinkageModel, pts: Float64Array, b: number): { ex: number; ey: number; len: number } {
  const o = 2 * model.offset[b]
  const last = o + 2 * (model.links[b].points.length - 1)
  const len = linkLength(model.links[b])
  return { ex: (pts[last] - pts[o]) / len, ey: (pts[last + 1] - pts[o + 1]) / len, len }
}

/**
 * Largest out-of-balance force (and moment/L_c) over all bodies, recomputed from the end forces,
 * the drive torque and the distributed loads (not the resultants the solver was given), N.
 */
export function equilibriumResidual(model: LinkageModel, pts: Float64Array, loads: PositionLoads, st: CaseStatics): number {
  let worst = 0
  const f = st.endForces
  model.links.forEach((l, b) => {
    const o = 2 * model.offset[b]
    const { ex, ey, len } = axisOf(model, pts, b)
    const { q0, q1 } = loads.along[b]
    let fx = len * q0.x + ((len * len) / 2) * q1.x
    let fy = len * q0.y + ((len * len) / 2) * q1.y
    // ∫ s e × q(s) ds about the first pin.
    let m = ((len * len) / 2) * (ex * q0.y - ey * q0.x) + ((len * len * len) / 3) * (ex * q1.y - ey * q1.x)
    if (b === model.crankIndex) m += st.torque
    for (let k = 0; k < l.points.length; k++) {
      const i = o + 2 * k
      fx += f[i]
      fy += f[i + 1]
      m += (pts[i] - pts[o]) * f[i + 1] - (pts[i + 1] - pts[o + 1]) * f[i]
    }
    worst = Math.max(worst, Math.abs(fx), Math.abs(fy), Math.abs(m) / model.lc)
  })
  return worst
}

/**
 * Axial force and bending moment along a straight link carrying point forces at its pins, the drive
 * couple (crank) and a load q(s) = q0 + q1 s per mm. Cutting at x, the part [0, x] is in balance:
 * N(x) = −Σ fᵢ·e − (q0e x + q1e x²/2) and M(x) = Σ (sᵢ − x) fᵢ·n + C − q0n x²/2 − q1n x³/6.
 * |M| is largest at a pin or where the shear Σ fᵢ·n + q0n x + q1n x²/2 vanishes; N at a pin or where
 * q_e(x) = 0. Same shape and conventions as lib/linkage/members.ts, which has a uniform load only.
 */
export function memberForcesAlong(model: LinkageModel, pts: Float64Array, b: number, along: LinkLoad, st: CaseStatics): MemberForces {
  const link = model.links[b]
  const o = 2 * model.offset[b]
  const { ex, ey, len } = axisOf(model, pts, b)
  const q0e = along.q0.x * ex + along.q0.y * ey
  const q0n = -along.q0.x * ey + along.q0.y * ex
  const q1e = along.q1.x * ex + along.q1.y * ey
  const q1n = -along.q1.x * ey + along.q1.y * ex
  const couple = b === model.crankIndex ? st.torque : 0
  const f = st.endForces
  let fe = 0
  let fn = 0
  let sfn = 0
  let feMid = 0
  let axialMax = -Infinity
  let axialMin = Infinity
  let moment = 0
  const axial = (x: number) => -fe - (q0e * x + (q1e * x * x) / 2)
  const bend = (x: number) => Math.abs(sfn - x * fn + couple - (q0n * x * x) / 2 - (q1n * x * x * x) / 6)
  for (let k = 0; k < link.points.length - 1; k++) {
    const fx = f[o + 2 * k]
    const fy = f[o + 2 * k + 1]
    const s0 = link.stations[k]
    const s1 = link.stations[k + 1]
    const fek = fx * ex + fy * ey
    const fnk = -fx * ey + fy * ex
    fe += fek
    fn += fnk
    sfn += s0 * fnk
    if (s0 <= len / 2) feMid += fek
    const xs = [s0, s1]
    if (q1e !== 0) xs.push(-q0e / q1e)
    for (const x of xs) {
      if (x < s0 || x > s1) continue
      const ax = axial(x)
      if (ax > axialMax) axialMax = ax
      if (ax < axialMin) axialMin = ax
    }
    // Roots of the shear q1n/2 x² + q0n x + fn = 0 inside the segment.
    const roots: number[] = [s0, s1]
    if (q1n !== 0) {
      const disc = q0n * q0n - 2 * q1n * fn
      if (disc >= 0) {
        const sq = Math.sqrt(disc)
        roots.push((-q0n + sq) / q1n, (-q0n - sq) / q1n)
      }
    } else if (q0n !== 0) roots.push(-fn / q0n)
    for (const x of roots) if (x >= s0 && x <= s1) moment = Math.max(moment, bend(x))
  }
  let eye = 0
  let eyeAt = 0
  let across = 0
  for (let k = 0; k < link.points.length; k++) {
    const fx = f[o + 2 * k]
    const fy = f[o + 2 * k + 1]
    const m = Math.hypot(fx, fy)
    if (m > eye) {
      eye = m
      eyeAt = k
    }
    across = Math.max(across, Math.abs(-fx * ey + fy * ex))
  }
  return { axialMid: -feMid - (q0e * len) / 2 - (q1e * len * len) / 8, axialMax, axialMin, moment, eye, eyeAt, across }
}
