import type { Vec } from './vec'

/**
 * A planar pin-jointed linkage as data. Every link is a rigid body whose named
 * points lie on its axis (all links of the inversor cells are straight), so a
 * link is fully described by the distances of its points from its first point.
 */
export interface LinkDef {
  name: string
  /** Joint names in order along the link; the first is the body's reference point. */
  points: string[]
  /** Distance of each point from the first along the axis, mm. */
  stations: number[]
  kind: 'bar' | 'beam' | 'crank'
}

export interface LinkageDef {
  links: LinkDef[]
  /** Joints pinned to the ground, with their fixed positions. */
  ground: Record<string, Vec>
  /** The driving crank: its link (points [pivot, driven]) turned by the drive. */
  crank: string
}

/**
 * A revolute connection between two bodies at one joint. A pin shared by n
 * bodies becomes n − 1 connections to one "primary" body (the ground when the
 * pin is fixed), which is the same as treating the pin as a massless particle
 * and eliminating its two equations. Unknown: the force on `body` from the pin.
 */
export interface Connection {
  joint: string
  body: number
  /** Index of the primary body, −1 for the ground. */
  other: number
}

export interface LinkageModel extends LinkageDef {
  connections: Connection[]
  /** Body that receives loads applied at a joint (−1: ground joint). */
  primary: Record<string, number>
  /** Bodies attached to each joint. */
  attached: Record<string, number[]>
  crankIndex: number
  /** Unknowns = equations: 3 per body = 2 per connection + the drive torque. */
  size: number
  /** Characteristic length, mm, used to scale moment rows to force units. */
  lc: number
  /**
   * Flat layout of body points, for the hot loops: body b's k-th point sits at
   * index offset[b] + k of a points array (x at 2i, y at 2i + 1).
   */
  offset: number[]
  pointCount: number
  /** Per connection: index of the joint among its body's points, and among the other body's (−1: ground). */
  connBodyK: Int32Array
  connOtherK: Int32Array
  /**
   * Every joint, in order of first appearance along the links, with the flat
   * indices of the body points at it in link order: the per-position pin and
   * reaction results read these instead of searching the links each time.
   */
  jointPoints: { joint: string; points: Int32Array }[]
}

export function buildModel(def: LinkageDef): LinkageModel {
  const attached: Record<string, number[]> = {}
  def.links.forEach((link, b) => {
    for (const j of link.points) (attached[j] ??= []).push(b)
  })
  const primary: Record<string, number> = {}
  const connections: Connection[] = []
  for (const [joint, bodies] of Object.entries(attached)) {
    const isGround = joint in def.ground
    const p = isGround ? -1 : bodies[0]
    primary[joint] = p
    for (const b of bodies) if (b !== p) connections.push({ joint, body: b, other: p })
  }
  const crankIndex = def.links.findIndex((l) => l.name === def.crank)
  if (crankIndex < 0) throw new Error(`crank link ${def.crank} not found`)
  const size = 3 * def.links.length
  // A mismatch here is a wrong mechanism definition, not a user error.
  if (2 * connections.length + 1 !== size) {
    throw new Error(`linkage is not statically determinate: ${size} equations, ${2 * connections.length + 1} unknowns`)
  }
  const lengths = def.links.map((l) => l.stations[l.stations.length - 1])
  const lc = lengths.reduce((s, x) => s + x, 0) / lengths.length
  const offset: number[] = []
  let pointCount = 0
  for (const l of def.links) {
    offset.push(pointCount)
    pointCount += l.points.length
  }
  const connBodyK = Int32Array.from(connections, (c) => def.links[c.body].points.indexOf(c.joint))
  const connOtherK = Int32Array.from(connections, (c) => (c.other >= 0 ? def.links[c.other].points.indexOf(c.joint) : -1))
  const jointPoints = Object.entries(attached).map(([joint, bodies]) => ({
    joint,
    points: Int32Array.from(bodies, (b) => offset[b] + def.links[b].points.indexOf(joint)),
  }))
  return { ...def, connections, primary, attached, crankIndex, size, lc, offset, pointCount, connBodyK, connOtherK, jointPoints }
}

/** World positions of every body point, in the flat layout. */
export function pointsFromJoints(model: LinkageModel, joints: Record<string, Vec>, into?: Float64Array): Float64Array {
  const pts = into ?? new Float64Array(2 * model.pointCount)
  for (let b = 0; b < model.links.length; b++) {
    const l = model.links[b]
    for (let k = 0; k < l.points.length; k++) {
      const i = 2 * (model.offset[b] + k)
      const p = joints[l.points[k]]
      pts[i] = p.x
      pts[i + 1] = p.y
    }
  }
  return pts
}

export const linkLength = (l: LinkDef): number => l.stations[l.stations.length - 1]
