/**
 * Kinematics of the toleranced mechanism. With link lengths off their nominal values the cell no
 * longer inverts exactly, so the closed forms of lib/linkage/cells do not apply; instead the
 * mechanism is taken apart into dyads (two links meeting at an unknown pin, each with one known
 * point: the pin is an intersection of two circles) solved in order from the ground and the crank,
 * keeping at every position the branch the nominal mechanism is on. Each link is a rigid body whose
 * pin points are given in its own frame (x along its axis from its first point, nominal points at
 * (station, 0)); tolerances move those points along the axis, clearances move the pin within its
 * hole. Everything runs on flat Float64Arrays compiled once, so a Monte Carlo run allocates nothing
 * per sample.
 */
import { linkageOf, placeAt } from '@/lib/linkage/crank'
import type { InversorCell } from '@/lib/linkage/cells/cell'
import { DEG, type Vec } from '@/lib/linkage/vec'

/** The engine's model of a mechanism (lib/mechanisms `getMechanism(id).model(geometry)`). */
export interface MechanismModelLike {
  cell: InversorCell
  crank: number
  offset: number
}

const OP_CRANK = 0
const OP_DYAD = 1
const OP_PLACE = 2

/** How a variable moves the mechanism. */
export type Effect =
  /** Adds the value to the local x (along the axis) of body point `point`. */
  | { mode: 'axial'; point: number }
  /** Adds the value to the x of ground joint `joint` (the frame dimension O–C). */
  | { mode: 'ground'; joint: number }
  /** Adds value × dirs[2p], dirs[2p + 1] to the local point at position p (a pin pushed by its force). */
  | { mode: 'direction'; point: number; dirs: Float64Array }

export interface CompiledLinkage {
  /** Crank angles of the positions, degrees. */
  anglesDeg: Float64Array
  cos: Float64Array
  sin: Float64Array
  joints: string[]
  /** Per body (link, crank last): name, first flat point index, point names, nominal stations. */
  bodies: { name: string; first: number; points: string[]; stations: number[]; kind: string }[]
  /** Nominal local coordinates of every body point (x at 2i, y at 2i + 1). */
  baseLocal: Float64Array
  /** Nominal world coordinates of ground joints (others zero). */
  baseGround: Float64Array
  groundJoints: Int32Array
  program: Int32Array
  dyads: number
  /** Branch of each dyad at each position: +1 when the pin lies left of the known point X → Y. */
  signs: Int8Array
  tracer: number
  /** Nominal joint positions from the cell's closed form, per position. */
  nominal: Record<string, Vec>[]
  /** Nominal angle of each body's axis (first point → last), radians, per position: [p * bodies + b]. */
  bodyAngles: Float64Array
  /** Largest nominal link length, mm: the scale of the mechanism. */
  scale: number
}

/** Positions spread evenly over the working range, ends included. */
export function anglesOver(fromDeg: number, toDeg: number, count: number): number[] {
  if (count < 3) throw new Error('the tolerance analysis needs at least 3 positions')
  return Array.from({ length: count }, (_, i) => fromDeg + ((toDeg - fromDeg) * i) / (count - 1))
}

/**
 * Compiles the mechanism (cell links, crank CP, ground O and C) into a dyad program and checks it
 * reproduces the closed-form positions. Throws when a position is out of the cell's reach or the
 * linkage cannot be solved by dyads.
 */
export function compileLinkage(model: MechanismModelLike, anglesDeg: number[]): CompiledLinkage {
  const { cell, crank: r, offset: e } = model
  const def = linkageOf(cell, e, r)
  const nominal = anglesDeg.map((a) => {
    const j = placeAt(cell, e, r, a * DEG)
    if (!j) throw new Error(`crank angle ${a}° is outside the reach of the cell: the tolerance analysis needs a working range the nominal mechanism reaches`)
    return j
  })
  const joints = Object.keys(nominal[0])
  const jIndex = new Map(joints.map((j, i) => [j, i]))
  // Crank last, as in linkageOf.
  const links = def.links
  const bodies: CompiledLinkage['bodies'] = []
  let first = 0
  for (const l of links) {
    bodies.push({ name: l.name, first, points: l.points, stations: l.stations, kind: l.kind })
    first += l.points.length
  }
  const nPts = first
  const baseLocal = new Float64Array(2 * nPts)
  for (const b of bodies) b.stations.forEach((s, k) => (baseLocal[2 * (b.first + k)] = s))
  const baseGround = new Float64Array(2 * joints.length)
  const groundJoints = Int32Array.from(Object.keys(def.ground), (g) => jIndex.get(g)!)
  for (const [g, p] of Object.entries(def.ground)) {
    baseGround[2 * jIndex.get(g)!] = p.x
    baseGround[2 * jIndex.get(g)! + 1] = p.y
  }
  const pointOf = (b: number, joint: string) => bodies[b].first + bodies[b].points.indexOf(joint)

  const prog: number[] = []
  const dyadDefs: { x: string; y: string; j: string }[] = []
  const known = new Set(Object.keys(def.ground))
  const placed = new Set<number>()
  const crankBody = links.findIndex((l) => l.name === def.crank)
  const cb = bodies[crankBody]
  const pivot = cb.points[0]
  const rest = cb.points.filter((j) => j !== pivot)
  prog.push(OP_CRANK, jIndex.get(pivot)!, pointOf(crankBody, pivot), rest.length, ...rest.flatMap((j) => [pointOf(crankBody, j), jIndex.get(j)!]))
  rest.forEach((j) => known.add(j))
  placed.add(crankBody)
  const allJoints = new Set(bodies.flatMap((b) => b.points))
  while ([...allJoints].some((j) => !known.has(j)) || placed.size < bodies.length) {
    // A body with two known pins: place the rest of it.
    const b = bodies.findIndex((body, i) => !placed.has(i) && body.points.filter((j) => known.has(j)).length >= 2)
    if (b >= 0) {
      const [ji, jj] = bodies[b].points.filter((j) => known.has(j))
      const others = bodies[b].points.filter((j) => j !== ji && j !== jj)
      if (others.length > 0) prog.push(OP_PLACE, jIndex.get(ji)!, pointOf(b, ji), jIndex.get(jj)!, pointOf(b, jj), others.length, ...others.flatMap((j) => [pointOf(b, j), jIndex.get(j)!]))
      others.forEach((j) => known.add(j))
      placed.add(b)
      continue
    }
    // A dyad: an unknown pin on two bodies that each have a known pin.
    let found = false
    for (const j of allJoints) {
      if (known.has(j)) continue
      const with1 = bodies.map((body, i) => ({ i, x: body.points.includes(j) ? body.points.find((p) => p !== j && known.has(p)) : undefined })).filter((c) => c.x !== undefined)
      if (with1.length < 2) continue
      const [b1, b2] = with1
      prog.push(OP_DYAD, jIndex.get(b1.x!)!, pointOf(b1.i, b1.x!), pointOf(b1.i, j), jIndex.get(b2.x!)!, pointOf(b2.i, b2.x!), pointOf(b2.i, j), jIndex.get(j)!, dyadDefs.length)
      dyadDefs.push({ x: b1.x!, y: b2.x!, j })
      known.add(j)
      found = true
      break
    }
    if (!found) throw new Error(`the ${cell.mechanism} linkage cannot be solved by dyads from its ground and crank; the tolerance analysis does not cover it yet`)
  }
  const n = anglesDeg.length
  const signs = new Int8Array(n * dyadDefs.length)
  nominal.forEach((jt, p) => {
    dyadDefs.forEach((d, k) => {
      const X = jt[d.x]
      const Y = jt[d.y]
      const J = jt[d.j]
      const c = (Y.x - X.x) * (J.y - X.y) - (Y.y - X.y) * (J.x - X.x)
      signs[p * dyadDefs.length + k] = c >= 0 ? 1 : -1
    })
  })
  const bodyAngles = new Float64Array(n * bodies.length)
  nominal.forEach((jt, p) => {
    bodies.forEach((b, i) => {
      const a = jt[b.points[0]]
      const z = jt[b.points[b.points.length - 1]]
      bodyAngles[p * bodies.length + i] = Math.atan2(z.y - a.y, z.x - a.x)
    })
  })
  return {
    anglesDeg: Float64Array.from(anglesDeg),
    cos: Float64Array.from(anglesDeg, (a) => Math.cos(a * DEG)),
    sin: Float64Array.from(anglesDeg, (a) => Math.sin(a * DEG)),
    joints,
    bodies,
    baseLocal,
    baseGround,
    groundJoints,
    program: Int32Array.from(prog),
    dyads: dyadDefs.length,
    signs,
    tracer: jIndex.get('T')!,
    nominal,
    bodyAngles,
    scale: Math.max(...bodies.map((b) => b.stations[b.stations.length - 1]), e),
  }
}

/** Scratch arrays for `solvePositions`; one per concurrent evaluation. */
export interface Scratch {
  local: Float64Array
  localS: Float64Array
  world: Float64Array
}

export function scratchFor(c: CompiledLinkage): Scratch {
  return { local: new Float64Array(c.baseLocal.length), localS: new Float64Array(c.baseLocal.length), world: new Float64Array(2 * c.joints.length) }
}

/**
 * The tracer at every position for one set of variable values. Returns false when the perturbed
 * mechanism does not assemble at some position (two circles that do not meet); the positions
 * solved before it are written.
 */
export function solvePositions(
  c: CompiledLinkage,
  effects: readonly Effect[],
  values: Float64Array,
  s: Scratch,
  outX: Float64Array,
  outY: Float64Array,
  /** Per-position additions to the local points (fixed pin shifts), position-major, 2 per body point. */
  offsets?: Float64Array,
): boolean {
  const { local, localS, world } = s
  const prog = c.program
  const nd = c.dyads
  localS.set(c.baseLocal)
  world.fill(0)
  let dirCount = 0
  for (let v = 0; v < effects.length; v++) {
    const ef = effects[v]
    if (ef.mode === 'axial') localS[2 * ef.point] += values[v]
    else if (ef.mode === 'direction') dirCount++
  }
  const n = c.anglesDeg.length
  const ti = 2 * c.tracer
  for (let p = 0; p < n; p++) {
    let L = localS
    if (offsets) {
      const len = localS.length
      const o = p * len
      for (let k = 0; k < len; k++) local[k] = localS[k] + offsets[o + k]
      L = local
    }
    if (dirCount > 0) {
      if (!offsets) local.set(localS)
      for (let v = 0; v < effects.length; v++) {
        const ef = effects[v]
        if (ef.mode !== 'direction') continue
        const q = 2 * ef.point
        local[q] += values[v] * ef.dirs[2 * p]
        local[q + 1] += values[v] * ef.dirs[2 * p + 1]
      }
      L = local
    }
    for (let g = 0; g < c.groundJoints.length; g++) {
      const j = 2 * c.groundJoints[g]
      world[j] = c.baseGround[j]
      world[j + 1] = c.baseGround[j + 1]
    }
    for (let v = 0; v < effects.length; v++) {
      const ef = effects[v]
      if (ef.mode === 'ground') world[2 * ef.joint] += values[v]
    }
    const ct = c.cos[p]
    const st = c.sin[p]
    let i = 0
    while (i < prog.length) {
      const op = prog[i]
      if (op === OP_CRANK) {
        const jp = 2 * prog[i + 1]
        const qp = 2 * prog[i + 2]
        const count = prog[i + 3]
        for (let k = 0; k < count; k++) {
          const q = 2 * prog[i + 4 + 2 * k]
          const j = 2 * prog[i + 5 + 2 * k]
          const lx = L[q] - L[qp]
          const ly = L[q + 1] - L[qp + 1]
          world[j] = world[jp] + ct * lx - st * ly
          world[j + 1] = world[jp + 1] + st * lx + ct * ly
        }
        i += 4 + 2 * count
      } else if (op === OP_DYAD) {
        const jx = 2 * prog[i + 1]
        const qx = 2 * prog[i + 2]
        const qj1 = 2 * prog[i + 3]
        const jy = 2 * prog[i + 4]
        const qy = 2 * prog[i + 5]
        const qj2 = 2 * prog[i + 6]
        const jj = 2 * prog[i + 7]
        const sign = c.signs[p * nd + prog[i + 8]]
        let ax = L[qj1] - L[qx]
        let ay = L[qj1 + 1] - L[qx + 1]
        const r1sq = ax * ax + ay * ay
        ax = L[qj2] - L[qy]
        ay = L[qj2 + 1] - L[qy + 1]
        const r2sq = ax * ax + ay * ay
        const X0 = world[jx]
        const X1 = world[jx + 1]
        const dx = world[jy] - X0
        const dy = world[jy + 1] - X1
        const d2 = dx * dx + dy * dy
        const d = Math.sqrt(d2)
        const a = (r1sq - r2sq + d2) / (2 * d)
        const h2 = r1sq - a * a
        if (!(h2 >= 0)) return false
        const h = sign * Math.sqrt(h2)
        const ux = dx / d
        const uy = dy / d
        world[jj] = X0 + a * ux - h * uy
        world[jj + 1] = X1 + a * uy + h * ux
        i += 9
      } else {
        const ji = 2 * prog[i + 1]
        const qi = 2 * prog[i + 2]
        const jj = 2 * prog[i + 3]
        const qj = 2 * prog[i + 4]
        const count = prog[i + 5]
        const lx = L[qj] - L[qi]
        const ly = L[qj + 1] - L[qi + 1]
        const wx = world[jj] - world[ji]
        const wy = world[jj + 1] - world[ji + 1]
        // Rotation taking the body's local i → j onto the world's i → j (pure rotation, normalised).
        const m = 1 / Math.sqrt((lx * lx + ly * ly) * (wx * wx + wy * wy))
        const cr = (lx * wx + ly * wy) * m
        const sr = (lx * wy - ly * wx) * m
        for (let k = 0; k < count; k++) {
          const q = 2 * prog[i + 6 + 2 * k]
          const j = 2 * prog[i + 7 + 2 * k]
          const px = L[q] - L[qi]
          const py = L[q + 1] - L[qi + 1]
          world[j] = world[ji] + cr * px - sr * py
          world[j + 1] = world[ji + 1] + sr * px + cr * py
        }
        i += 6 + 2 * count
      }
    }
    outX[p] = world[ti]
    outY[p] = world[ti + 1]
  }
  return true
}
