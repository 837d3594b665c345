/**
 * A four-bar A B C D: ground pivots A (driven link) and D, driven link AB (length a), coupler BC (b)
 * carrying the tracer T, rocker DC (c). Positions by circle–circle intersection on one assembly
 * branch; statics from the equilibrium of the three moving bodies.
 */
import type { Point } from '@/lib/contract'
import { add, circleCircle, cross, norm, perp, scale, sub } from './geometry'

export interface FourBar {
  A: Point
  D: Point
  /** Driven link AB, coupler BC, rocker DC, mm. */
  a: number
  b: number
  c: number
  /** Tracer in the coupler's frame: `along` from B towards C, `across` to the left of B→C, mm. */
  tracer: { along: number; across: number }
  /** Assembly branch: the side of the directed line B → D on which C lies (fixed over the motion). */
  branch: 1 | -1
}

export interface FourBarPose {
  theta: number
  A: Point
  B: Point
  C: Point
  D: Point
  T: Point
  /** Distance of C from the line B D, mm: zero at a toggle of the driven link (coupler and rocker in line). */
  h: number
}

/** Position at driven-link angle θ (rad, from +x, counter-clockwise); null where the loop cannot close. */
export function poseAt(m: FourBar, theta: number): FourBarPose | null {
  const B = add(m.A, { x: m.a * Math.cos(theta), y: m.a * Math.sin(theta) })
  const hit = circleCircle(B, m.b, m.D, m.c, m.branch)
  if (!hit) return null
  const C = hit.point
  const e = scale(sub(C, B), 1 / m.b)
  const T = add(B, add(scale(e, m.tracer.along), scale(perp(e), m.tracer.across)))
  return { theta, A: m.A, B, C, D: m.D, T, h: hit.h }
}

/** The branch on which the given assembly (B, C) lies. */
export function branchOf(B: Point, C: Point, D: Point): 1 | -1 {
  return cross(sub(D, B), sub(C, B)) >= 0 ? 1 : -1
}

export interface FourBarStatics {
  /** Torque the drive applies to the driven link AB, N·mm, counter-clockwise positive. */
  torque: number
  /** Force the driven link applies to the coupler at B, N. */
  atB: Point
  /** Axial force of the rocker DC (a two-force member), N, tension positive. */
  rocker: number
  /** Driven link AB: force along it (tension positive) and across it, N. */
  crankAxial: number
  crankShear: number
  /** Resultant pin forces, N. */
  pins: { A: number; B: number; C: number; D: number }
  /** sin of the transmission angle between coupler BC and rocker DC (0: in line, statics singular). */
  sinMu: number
}

/**
 * Statics with a load F applied to the coupler at the tracer T (N) and the drive torque on AB.
 * Coupler (pins B, C and the tracer: a three-point body): the rocker, a two-force member, pulls C
 * towards D with its tension N; moments about B give N, the force balance the pin force at B.
 * Driven link AB: moments about A give the torque τ = (B − A) × F_B (it is not a two-force member).
 */
export function staticsAt(m: FourBar, p: FourBarPose, F: Point): FourBarStatics {
  const uCD = scale(sub(p.D, p.C), 1 / m.c) // from C towards D
  const BC = sub(p.C, p.B)
  const BT = sub(p.T, p.B)
  // Σ M_B = BC × (N uCD) + BT × F = 0
  const den = cross(BC, uCD)
  const N = -cross(BT, F) / den
  const atB = scale(add(F, scale(uCD, N)), -1) // Σ F = atB + N uCD + F = 0
  const torque = cross(sub(p.B, p.A), atB)
  const eAB = scale(sub(p.B, p.A), 1 / m.a)
  // Force on AB at B is −atB; tension pulls B away from A.
  const onCrankAtB = scale(atB, -1)
  const crankAxial = onCrankAtB.x * eAB.x + onCrankAtB.y * eAB.y
  const crankShear = cross(eAB, onCrankAtB)
  const fB = norm(atB)
  return {
    torque,
    atB,
    rocker: N,
    crankAxial,
    crankShear,
    pins: { A: fB, B: fB, C: Math.abs(N), D: Math.abs(N) },
    sinMu: Math.abs(den) / m.b,
  }
}
