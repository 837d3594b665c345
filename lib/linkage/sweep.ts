import type { InversorCell } from './cells/cell'
import { linkageOf, placeAt } from './crank'
import { MASKED_MAX, maskScratch, recordPivots, solveInPlace, solveMasked, solvePlan, solvePlanned, solveScratch, type SolveOutcome } from './dense'
import { equilibriumMatrix, equilibriumPattern } from './equations'
import { MEMBER_FIELDS, memberForcesInto, pinPointInto, type MemberForces } from './members'
import { buildModel, type LinkageModel } from './model'
import type { Force, Point, PositionResult, ToggleFlag } from '@/lib/contract'
import { endForcesInto, equilibriumResidualAt, largestConnection, loadsInto, type CaseLoads } from './statics'
import { DEG, mag, type Vec } from './vec'
import { virtualWorkInto, VW_STEP } from './virtual-work'

export interface LoadInput {
  name: string
  /** Force at the tracer, N. */
  fx: number
  fy: number
}

export interface SweepInput {
  cell: InversorCell
  crank: number
  offset: number
  anglesDeg: number[]
  loads: LoadInput[]
  /** Link self-weight, N per mm of length, the same in every case. */
  weightPerMm: Vec | null
  /** Positions whose largest pin force per newton at the tracer exceeds this are reported as toggles. */
  amplificationLimit: number
}

/** One position under one load case, with the internals the envelope and checks need. */
export interface CaseSample {
  position: PositionResult
  members: Record<string, MemberForces>
  /** Largest out-of-balance force over the bodies, N. */
  residual: number
  vwTorque: number
  /** |τ − τ_vw| relative to the size of the work terms. */
  vwError: number
}

export interface SweepOutput {
  model: LinkageModel
  cases: { name: string; samples: CaseSample[] }[]
  toggles: ToggleFlag[]
}

/**
 * One load case of a sweep in flat arrays, position i (of SweepArrays.count) at stride offsets:
 * no object per position. The fields are those of CaseSample and PositionResult.
 */
export interface CaseArrays {
  name: string
  loads: CaseLoads
  /** End forces on every body point (model's flat layout), 2·pointCount per position, N. */
  endForces: Float64Array
  /** Drive torque, N·mm. */
  torque: Float64Array
  /** MemberForces per link, MEMBER_FIELDS per link, links in model order, per position. */
  members: Float64Array
  /** Per joint of model.jointPoints: the flat point index whose force is the pin force, and its magnitude. */
  pinPoint: Int32Array
  pinMagnitude: Float64Array
  /** Per ground joint (Object.keys(model.ground)): x, y, magnitude. */
  reactions: Float64Array
  residual: Float64Array
  vwTorque: Float64Array
  vwError: Float64Array
}

/** A sweep in flat arrays: what analyse() reads; runSweep builds the CaseSample objects from it. */
export interface SweepArrays {
  model: LinkageModel
  /** Positions solved (toggles left out). */
  count: number
  crankDeg: Float64Array
  /** Joint names in the order the cell places them, then C; joints holds 2 per joint per position. */
  jointNames: string[]
  joints: Float64Array
  /** Watched vertices (cell.transmission order); angles holds one per vertex per position, degrees. */
  angleNames: string[]
  angles: Float64Array
  minAngle: Float64Array
  grounds: string[]
  cases: CaseArrays[]
  toggles: ToggleFlag[]
}

/** Unit forces at the tracer: they measure force amplification whatever the user's loads are. */
const PROBES: CaseLoads[] = [
  { name: 'probe-x', pointLoads: [{ joint: 'T', force: { x: 1, y: 0 } }], weightPerMm: null },
  { name: 'probe-y', pointLoads: [{ joint: 'T', force: { x: 0, y: 1 } }], weightPerMm: null },
]

/** Every joint of the mechanism at crank angle θ into out (2 per joint, in `names` order); false out of reach. */
function placeFlat(cell: InversorCell, e: number, r: number, th: number, names: string[], out: Float64Array, at: number, flat: boolean): boolean {
  if (flat) {
    // crankPoint, then the cell's closed form straight into the array, then C = (e, 0).
    if (!cell.placeInto!(e + r * Math.cos(th), r * Math.sin(th), out, at)) return false
    const c = at + 2 * (names.length - 1)
    out[c] = e
    out[c + 1] = 0
    return true
  }
  const j = placeAt(cell, e, r, th)
  if (!j) return false
  for (let k = 0; k < names.length; k++) {
    const p = j[names[k]]
    out[at + 2 * k] = p.x
    out[at + 2 * k + 1] = p.y
  }
  return true
}

/** The joint names of a placed mechanism, in the order placeAt gives them. */
function jointOrder(cell: InversorCell, e: number, r: number, anglesDeg: number[]): string[] | null {
  for (const a of anglesDeg) {
    const j = placeAt(cell, e, r, a * DEG)
    if (j) return Object.keys(j)
  }
  return null
}

/**
 * The sweep with statics in flat typed arrays: per position the closed-form joints, one
 * factorisation of the equilibrium matrix (built in one reused matrix, solved in place) for every
 * load case and the two probes, member and pin forces, reactions, the equilibrium residual and the
 * virtual-work torque, each written at its offset. Nothing is allocated per position; the stable
 * output shape (PositionResult) is built by sampleObjects / positionAt, at the edge.
 */
export function sweepArrays(input: SweepInput): SweepArrays {
  const { cell, crank: r, offset: e, anglesDeg } = input
  const model = buildModel(linkageOf(cell, e, r))
  const loads: CaseLoads[] = input.loads.map((l) => ({
    name: l.name,
    pointLoads: [{ joint: 'T', force: { x: l.fx, y: l.fy } }],
    weightPerMm: input.weightPerMm,
  }))
  const nc = loads.length
  const solved = [...loads, ...PROBES]
  const n = model.size
  const nl = model.links.length
  const np = 2 * model.pointCount
  const njp = model.jointPoints.length
  const grounds = Object.keys(model.ground)
  const groundPoints = grounds.map((g) => model.jointPoints.find((p) => p.joint === g)?.points ?? new Int32Array(0))
  const angleNames = cell.transmission.map((t) => t[0])
  const nw = angleNames.length
  const toggles: ToggleFlag[] = []
  const names = jointOrder(cell, e, r, anglesDeg) ?? []
  const nj = names.length
  // The cell's flat closed form when it has one and names the joints as place() does.
  const flat = !!cell.placeInto && !!cell.joints && [...cell.joints, 'C'].join() === names.join()
  const index: Record<string, number> = {}
  names.forEach((nm, k) => (index[nm] = k))
  // Flat point i of the model sits at joint pointJoint[i].
  const pointJoint = new Int32Array(model.pointCount)
  model.links.forEach((l, b) => l.points.forEach((j, k) => (pointJoint[model.offset[b] + k] = index[j])))
  const tri = cell.transmission.map(([v, a, b]) => [index[v], index[a], index[b]])
  const cap = anglesDeg.length
  const crankDeg = new Float64Array(cap)
  const joints = new Float64Array(cap * 2 * nj)
  const angles = new Float64Array(cap * nw)
  const minAngle = new Float64Array(cap)
  const cases: CaseArrays[] = loads.map((lc) => ({
    name: lc.name,
    loads: lc,
    endForces: new Float64Array(cap * np),
    torque: new Float64Array(cap),
    members: new Float64Array(cap * nl * MEMBER_FIELDS),
    pinPoint: new Int32Array(cap * njp),
    pinMagnitude: new Float64Array(cap * njp),
    reactions: new Float64Array(cap * 3 * grounds.length),
    residual: new Float64Array(cap),
    vwTorque: new Float64Array(cap),
    vwError: new Float64Array(cap),
  }))
  // Reused at every position.
  const a = new Float64Array(n * n)
  const rhs = solved.map(() => new Float64Array(n))
  const pattern = equilibriumPattern(model)
  const masked = n <= MASKED_MAX ? maskScratch(n, pattern) : null
  const scratch = solveScratch(n, pattern)
  const pts = new Float64Array(np)
  const before = new Float64Array(2 * nj)
  const after = new Float64Array(2 * nj)
  const vw = new Float64Array(2)
  // Partial pivoting's eliminations met so far, replayed at the next positions (see SolvePlan).
  const plan = masked ? solvePlan(n, pattern) : null
  const pivots = new Int32Array(n)
  const build = () => {
    equilibriumMatrix(model, pts, a)
    for (let q = 0; q < solved.length; q++) loadsInto(model, pts, solved[q], rhs[q].fill(0))
  }
  /** Statics at the position in pts, into rhs: replayed from the plan, or solved and recorded. */
  const solveAt = (): SolveOutcome => {
    build()
    if (!masked || !plan) return solveInPlace(a, n, rhs, undefined, scratch)
    const fast = solvePlanned(plan, a, rhs)
    if (fast) return fast
    build()
    const out = solveMasked(a, n, rhs, masked, undefined, pivots)
    if (out.ok) recordPivots(plan, pivots)
    return out
  }
  const top = new Float64Array(1)
  let count = 0
  for (const deg of anglesDeg) {
    const th = deg * DEG
    const jo = count * 2 * nj
    if (!nj || !placeFlat(cell, e, r, th, names, joints, jo, flat)) {
      toggles.push({ crankDeg: deg, reason: 'unreachable' })
      continue
    }
    for (let i = 0; i < model.pointCount; i++) {
      const q = jo + 2 * pointJoint[i]
      pts[2 * i] = joints[q]
      pts[2 * i + 1] = joints[q + 1]
    }
    if (!solveAt().ok) {
      toggles.push({ crankDeg: deg, reason: 'singular' })
      continue
    }
    const amplification = Math.max(largestConnection(rhs[nc], n), largestConnection(rhs[nc + 1], n))
    if (amplification > input.amplificationLimit) {
      toggles.push({ crankDeg: deg, reason: 'force-amplification', amplification })
      continue
    }
    const i = count
    crankDeg[i] = deg
    const moved = placeFlat(cell, e, r, th - VW_STEP, names, before, 0, flat) && placeFlat(cell, e, r, th + VW_STEP, names, after, 0, flat)
    let min = Infinity
    for (let w = 0; w < nw; w++) {
      const [v, p, q] = tri[w]
      const vx = joints[jo + 2 * v]
      const vy = joints[jo + 2 * v + 1]
      const ux = joints[jo + 2 * p] - vx
      const uy = joints[jo + 2 * p + 1] - vy
      const wx = joints[jo + 2 * q] - vx
      const wy = joints[jo + 2 * q + 1] - vy
      const c = (ux * wx + uy * wy) / (mag(ux, uy) * mag(wx, wy))
      const g = Math.acos(Math.min(1, Math.max(-1, c))) / DEG
      const t = Math.min(g, 180 - g)
      angles[i * nw + w] = t
      min = Math.min(min, t)
    }
    minAngle[i] = min
    for (let q = 0; q < nc; q++) {
      const cs = cases[q]
      const lc = loads[q]
      const x = rhs[q]
      const fo = i * np
      endForcesInto(model, lc, x, cs.endForces, fo)
      const torque = x[n - 1] * model.lc
      cs.torque[i] = torque
      for (let b = 0; b < nl; b++) memberForcesInto(model, pts, b, lc.weightPerMm, cs.endForces, fo, torque, cs.members, (i * nl + b) * MEMBER_FIELDS)
      const f = cs.endForces
      for (let jp = 0; jp < njp; jp++) {
        cs.pinPoint[i * njp + jp] = pinPointInto(f, fo, model.jointPoints[jp].points, top)
        cs.pinMagnitude[i * njp + jp] = top[0]
      }
      for (let g = 0; g < grounds.length; g++) {
        const points = groundPoints[g]
        let rx = 0
        let ry = 0
        for (let u = 0; u < points.length; u++) {
          rx += f[fo + 2 * points[u]]
          ry += f[fo + 2 * points[u] + 1]
        }
        const k = (i * grounds.length + g) * 3
        cs.reactions[k] = rx
        cs.reactions[k + 1] = ry
        cs.reactions[k + 2] = mag(rx, ry)
      }
      cs.residual[i] = equilibriumResidualAt(model, pts, lc.weightPerMm, f, fo, torque)
      if (moved) {
        virtualWorkInto(model, before, after, index, lc, vw)
        const scale = Math.max(Math.abs(torque), Math.abs(vw[0]), vw[1])
        cs.vwTorque[i] = vw[0]
        cs.vwError[i] = scale > 0 ? Math.abs(torque - vw[0]) / scale : 0
      } else {
        cs.vwTorque[i] = torque
        cs.vwError[i] = 0
      }
    }
    count++
  }
  return { model, count, crankDeg, jointNames: names, joints, angleNames, angles, minAngle, grounds, cases, toggles }
}

/** Joints of position i as the cells give them: a fresh object of fresh points. */
export function jointsAt(s: SweepArrays, i: number): Record<string, Point> {
  const out: Record<string, Point> = {}
  const o = i * 2 * s.jointNames.length
  for (let k = 0; k < s.jointNames.length; k++) out[s.jointNames[k]] = { x: s.joints[o + 2 * k], y: s.joints[o + 2 * k + 1] }
  return out
}

/** MemberForces of link b at position i of case c. */
export function membersAt(s: SweepArrays, c: CaseArrays, i: number, b: number): MemberForces {
  const m = c.members
  const k = (i * s.model.links.length + b) * MEMBER_FIELDS
  return { axialMid: m[k], axialMax: m[k + 1], axialMin: m[k + 2], moment: m[k + 3], eye: m[k + 4], eyeAt: m[k + 5], across: m[k + 6] }
}

/** The PositionResult of position i of case c (joints shared when the caller passes them). */
export function positionAt(s: SweepArrays, c: CaseArrays, i: number, joints: Record<string, Point> = jointsAt(s, i)): PositionResult {
  const model = s.model
  const nl = model.links.length
  const linkForces: Record<string, number> = {}
  const linkMoments: Record<string, number> = {}
  const weighted = !!c.loads.weightPerMm
  for (let b = 0; b < nl; b++) {
    const l = model.links[b]
    const k = (i * nl + b) * MEMBER_FIELDS
    const m = c.members
    linkForces[l.name] = l.kind === 'beam' ? (m[k + 1] >= -m[k + 2] ? m[k + 1] : m[k + 2]) : m[k]
    if (l.kind !== 'bar' || weighted) linkMoments[l.name] = m[k + 3]
  }
  const np = 2 * model.pointCount
  const njp = model.jointPoints.length
  const pinForces: Record<string, Force> = {}
  for (let jp = 0; jp < njp; jp++) {
    const k = i * np + 2 * c.pinPoint[i * njp + jp]
    pinForces[model.jointPoints[jp].joint] = { x: c.endForces[k], y: c.endForces[k + 1], magnitude: c.pinMagnitude[i * njp + jp] }
  }
  const reactions: Record<string, Force> = {}
  for (let g = 0; g < s.grounds.length; g++) {
    const k = (i * s.grounds.length + g) * 3
    reactions[s.grounds[g]] = { x: c.reactions[k], y: c.reactions[k + 1], magnitude: c.reactions[k + 2] }
  }
  const transmissionAngles: Record<string, number> = {}
  const nw = s.angleNames.length
  for (let w = 0; w < nw; w++) transmissionAngles[s.angleNames[w]] = s.angles[i * nw + w]
  return {
    crankDeg: s.crankDeg[i],
    tracer: { ...joints.T },
    joints,
    linkForces,
    pinForces,
    reactions,
    driveTorque: c.torque[i],
    linkMoments,
    transmissionAngleDeg: s.minAngle[i],
    transmissionAngles,
  }
}

/** A case sample without its per-link internals: what the report and the result read. */
export type PositionSample = Omit<CaseSample, 'members'>

/** SweepOutput without the per-link internals. */
export interface SweepPositions {
  model: LinkageModel
  cases: { name: string; samples: PositionSample[] }[]
  toggles: ToggleFlag[]
}

/**
 * The objects of the stable output shape, built once from the flat sweep: per case, per kept
 * position, the PositionResult (the joints object shared by the cases, as each position places the
 * mechanism once) and the checks; with `members`, the per-link internals as well.
 */
export function sampleObjects(s: SweepArrays, withMembers: true): SweepOutput
export function sampleObjects(s: SweepArrays, withMembers: false): SweepPositions
export function sampleObjects(s: SweepArrays, withMembers: boolean): SweepPositions {
  const cases = s.cases.map((c) => ({ name: c.name, samples: new Array<CaseSample | PositionSample>(s.count) }))
  const names = s.model.links.map((l) => l.name)
  for (let i = 0; i < s.count; i++) {
    const joints = jointsAt(s, i)
    for (let q = 0; q < s.cases.length; q++) {
      const c = s.cases[q]
      const position = positionAt(s, c, i, joints)
      if (withMembers) {
        const members: Record<string, MemberForces> = {}
        for (let b = 0; b < names.length; b++) members[names[b]] = membersAt(s, c, i, b)
        cases[q].samples[i] = { position, members, residual: c.residual[i], vwTorque: c.vwTorque[i], vwError: c.vwError[i] }
      } else {
        cases[q].samples[i] = { position, residual: c.residual[i], vwTorque: c.vwTorque[i], vwError: c.vwError[i] }
      }
    }
  }
  return { model: s.model, cases, toggles: s.toggles }
}

/** The sweep with every CaseSample object: sweepArrays, then the objects built from it. */
export function runSweep(input: SweepInput): SweepOutput {
  return sampleObjects(sweepArrays(input), true)
}
