import { solveInPlace, solveScratch, type SolveScratch } from './dense'
import { equilibriumMatrix, equilibriumPattern } from './equations'
import { linkLength, type LinkageModel } from './model'
import { mag, type Vec } from './vec'

/** Loads of one case: point forces at joints, N, and an optional weight per mm of link, N/mm. */
export interface CaseLoads {
  name: string
  pointLoads: { joint: string; force: Vec }[]
  weightPerMm: Vec | null
}

export interface CaseStatics {
  /**
   * Force on each link at each of its points from the pin there (a load at the
   * pin included), N, in the model's flat point layout: x at 2i, y at 2i + 1.
   */
  endForces: Float64Array
  /** Torque the drive applies to the crank, N·mm, counter-clockwise positive. */
  torque: number
}

export type StaticsOutcome =
  /**
   * largestConnection: per case, the largest force any pin passes from one
   * body to another, N; with a unit load it measures force amplification.
   * cases: end forces, only for the first `detailed` cases.
   */
  | { ok: true; minPivot: number; cases: CaseStatics[]; largestConnection: number[] }
  | { ok: false; minPivot: number }

/**
 * Storage for solving one model's statics at many positions with a fixed
 * number of load cases. Allocating the matrix, right-hand sides and end
 * forces per position was a large share of a sweep's time. Results solved
 * with a workspace point into it and are overwritten by the next solve.
 */
export interface StaticsWorkspace {
  a: Float64Array
  rhs: Float64Array[]
  endForces: Float64Array[]
  solver: SolveScratch
}

export function staticsWorkspace(model: LinkageModel, caseCount: number): StaticsWorkspace {
  const n = model.size
  return {
    a: new Float64Array(n * n),
    rhs: Array.from({ length: caseCount }, () => new Float64Array(n)),
    endForces: Array.from({ length: caseCount }, () => new Float64Array(2 * model.pointCount)),
    solver: solveScratch(n, equilibriumPattern(model)),
  }
}

/** Flat index of a joint on the body that receives loads applied there (−1: a ground joint). */
export function loadPoint(model: LinkageModel, joint: string): number {
  const b = model.primary[joint]
  return b < 0 ? -1 : model.offset[b] + model.links[b].points.indexOf(joint)
}

/**
 * Equilibrium of every body for every load case at one solved position (body
 * points in the flat layout): one factorisation, one back-substitution per case.
 */
export function solveStatics(model: LinkageModel, pts: Float64Array, cases: CaseLoads[], detailed = cases.length, ws?: StaticsWorkspace): StaticsOutcome {
  const n = model.size
  if (ws && ws.rhs.length !== cases.length) throw new Error(`statics workspace holds ${ws.rhs.length} load cases, not ${cases.length}`)
  const a = equilibriumMatrix(model, pts, ws?.a)
  const rhs = cases.map((lc, q) => loadsInto(model, pts, lc, ws ? ws.rhs[q].fill(0) : new Float64Array(n)))
  const out = solveInPlace(a, n, rhs, undefined, ws?.solver)
  if (!out.ok) return { ok: false, minPivot: out.minPivot }
  const largest = rhs.map((x) => largestConnection(x, n))
  const detail = rhs.slice(0, detailed).map((x, i) => endForces(model, cases[i], x, ws?.endForces[i].fill(0)))
  return { ok: true, minPivot: out.minPivot, cases: detail, largestConnection: largest }
}

/** Largest connection force |(x[2i], x[2i + 1])| of a solution of size n (the last unknown is the torque), N. */
export function largestConnection(x: Float64Array, n: number): number {
  let m = 0
  for (let i = 0; i < n - 1; i += 2) m = Math.max(m, mag(x[i], x[i + 1]))
  return m
}

/** The right-hand side of one load case (b zeroed by the caller): A·x + F = 0. */
export function loadsInto(model: LinkageModel, pts: Float64Array, lc: CaseLoads, b: Float64Array): Float64Array {
  for (const p of lc.pointLoads) {
    const i = loadPoint(model, p.joint)
    if (i >= 0) applyLoad(model, pts, b, model.primary[p.joint], pts[2 * i], pts[2 * i + 1], p.force.x, p.force.y)
  }
  const w = lc.weightPerMm
  if (w) {
    model.links.forEach((l, body) => {
      const len = linkLength(l)
      const o = 2 * model.offset[body]
      const e = o + 2 * (l.points.length - 1)
      applyLoad(model, pts, b, body, (pts[o] + pts[e]) / 2, (pts[o + 1] + pts[e + 1]) / 2, w.x * len, w.y * len)
    })
  }
  return b
}

/** Moves an external force on `body` at (x, y) to the right-hand side: A·x + F = 0. */
function applyLoad(model: LinkageModel, pts: Float64Array, b: Float64Array, body: number, x: number, y: number, fx: number, fy: number): void {
  const o = 2 * model.offset[body]
  b[3 * body] -= fx
  b[3 * body + 1] -= fy
  b[3 * body + 2] -= ((x - pts[o]) * fy - (y - pts[o + 1]) * fx) / model.lc
}

function endForces(model: LinkageModel, loads: CaseLoads, x: Float64Array, into?: Float64Array): CaseStatics {
  const f = into ?? new Float64Array(2 * model.pointCount)
  endForcesInto(model, loads, x, f, 0)
  return { endForces: f, torque: x[model.size - 1] * model.lc }
}

/**
 * Adds the end forces of solution x (and the case's point loads) into f[fo …], which the caller
 * zeroed, in the model's flat point layout. The drive torque is x[size − 1]·lc.
 */
export function endForcesInto(model: LinkageModel, loads: CaseLoads, x: Float64Array, f: Float64Array, fo: number): void {
  const conns = model.connections
  for (let i = 0; i < conns.length; i++) {
    const c = conns[i]
    const s = fo + 2 * (model.offset[c.body] + model.connBodyK[i])
    f[s] += x[2 * i]
    f[s + 1] += x[2 * i + 1]
    if (c.other >= 0) {
      const o = fo + 2 * (model.offset[c.other] + model.connOtherK[i])
      f[o] -= x[2 * i]
      f[o + 1] -= x[2 * i + 1]
    }
  }
  for (const p of loads.pointLoads) {
    const i = loadPoint(model, p.joint)
    if (i >= 0) {
      f[fo + 2 * i] += p.force.x
      f[fo + 2 * i + 1] += p.force.y
    }
  }
}

/**
 * Largest out-of-balance force (and moment/lc) over all bodies, recomputed from
 * the reported end forces, weights and torque rather than from the solver's
 * matrix, so it also catches a wrong bookkeeping of the results.
 */
export function equilibriumResidual(model: LinkageModel, pts: Float64Array, loads: CaseLoads, st: CaseStatics): number {
  return equilibriumResidualAt(model, pts, loads.weightPerMm, st.endForces, 0, st.torque)
}

/** equilibriumResidual on end forces stored at f[fo …]. */
export function equilibriumResidualAt(model: LinkageModel, pts: Float64Array, w: Vec | null, f: Float64Array, fo: number, torque: number): number {
  let worst = 0
  const links = model.links
  for (let b = 0; b < links.length; b++) {
    const l = links[b]
    const o = 2 * model.offset[b]
    let fx = 0
    let fy = 0
    let m = b === model.crankIndex ? torque : 0
    for (let k = 0; k < l.points.length; k++) {
      const i = o + 2 * k
      fx += f[fo + i]
      fy += f[fo + i + 1]
      m += (pts[i] - pts[o]) * f[fo + i + 1] - (pts[i + 1] - pts[o + 1]) * f[fo + i]
    }
    if (w) {
      const len = linkLength(l)
      const e = o + 2 * (l.points.length - 1)
      fx += w.x * len
      fy += w.y * len
      m += ((pts[e] - pts[o]) / 2) * w.y * len - ((pts[e + 1] - pts[o + 1]) / 2) * w.x * len
    }
    worst = Math.max(worst, Math.abs(fx), Math.abs(fy), Math.abs(m) / model.lc)
  }
  return worst
}
