import type { InversorCell } from './cells/cell'
import type { LinkageDef } from './model'
import { vec, type Vec } from './vec'

/** Crank pivot C = (e, 0); crank angle θ at C from +x, counter-clockwise. */
export const crankPoint = (e: number, r: number, thetaRad: number): Vec =>
  vec(e + r * Math.cos(thetaRad), r * Math.sin(thetaRad))

/** The whole mechanism: the cell's links plus the crank CP, pivots O and C on the ground. */
export function linkageOf(cell: InversorCell, e: number, r: number): LinkageDef {
  return {
    links: [...cell.links, { name: 'CP', points: ['C', 'P'], stations: [0, r], kind: 'crank' }],
    ground: { O: vec(0, 0), C: vec(e, 0) },
    crank: 'CP',
  }
}

export type ReachKind = 'cannot-reach' | 'beyond-reach' | 'split' | 'limited' | 'full'

/**
 * Which crank angles keep P in the cell's ring. With C = (e, 0),
 * |OP|² = e² + r² + 2er·cos θ, largest at θ = 0 (e + r) and smallest at
 * θ = 180° (|e − r|), and monotone in |θ| between, so the reachable set is
 * symmetric: |θ| ≤ θ_lim where |OP| = ρ_min, or a full turn.
 */
export function crankReach(e: number, r: number, rhoMin: number, rhoMax: number): { kind: ReachKind; limitRad: number } {
  const far = e + r
  const near = Math.abs(e - r)
  if (far < rhoMin) return { kind: 'cannot-reach', limitRad: 0 }
  if (near > rhoMax) return { kind: 'beyond-reach', limitRad: 0 }
  // Reaching the far end of the ring exactly puts the middle of the stroke on a toggle.
  if (far >= rhoMax * (1 - 1e-12)) return { kind: 'split', limitRad: 0 }
  if (near >= rhoMin) return { kind: 'full', limitRad: Math.PI }
  const c = (rhoMin * rhoMin - e * e - r * r) / (2 * e * r)
  return { kind: 'limited', limitRad: Math.acos(Math.min(1, Math.max(-1, c))) }
}

/** Every joint of cell plus crank at crank angle θ, or null where P leaves the ring. */
export function placeAt(cell: InversorCell, e: number, r: number, thetaRad: number): Record<string, Vec> | null {
  const joints = cell.place(crankPoint(e, r, thetaRad))
  if (!joints) return null
  joints.C = vec(e, 0)
  return joints
}
