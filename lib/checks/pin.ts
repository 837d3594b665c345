/**
 * Mechanics of a pin that every basis shares: the bending moment from the
 * plate arrangement and the bearing force each plate passes to the pin.
 * The bases only differ in the resistances they compare these with.
 */
import type { ResolvedJoint, ResolvedPlate } from './resolve'
import { fmt } from './spec'

export interface PinMoment {
  /** Lever arm such that M = F · lever, mm. */
  lever: number
  formula: string
  substituted: (F: number) => string
  source: string
  /** The reference alone, as the package prints it. */
  ref: string
}

/**
 * Double shear: EN 1993-1-8 Fig. 3.11 / Table 3.10, M = F/8 (b + 4c + 2a),
 * which is the mid-span moment with uniform bearing over each plate.
 * Single shear: no code formula; uniform bearing cannot balance a lap joint,
 * so the couple F·(t1/2 + c + t2/2) between the bearing resultants is taken,
 * an upper bound for a pin held in either plate — common practice.
 */
export function pinMoment(j: ResolvedJoint): PinMoment {
  const c = j.gap
  if (j.arrangement === 'double') {
    const b = j.plates[0].thickness
    const a = j.plates[1].thickness
    return {
      lever: (b + 4 * c + 2 * a) / 8,
      formula: 'M_{Ed} = \\frac{F_{Ed}}{8}\\left(b + 4c + 2a\\right)',
      substituted: (F) => `M_{Ed} = \\frac{${fmt(F)}}{8}\\left(${fmt(b)} + 4 \\cdot ${fmt(c)} + 2 \\cdot ${fmt(a)}\\right)`,
      source: 'EN 1993-1-8:2005 Fig. 3.11 (fork with middle plate b, outer plates a, gaps c)',
      ref: 'EN 1993-1-8:2005 Fig. 3.11',
    }
  }
  const t1 = j.plates[0].thickness
  const t2 = j.plates[1].thickness
  return {
    lever: t1 / 2 + c + t2 / 2,
    formula: 'M = F\\left(\\frac{t_1}{2} + c + \\frac{t_2}{2}\\right)',
    substituted: (F) => `M = ${fmt(F)}\\left(\\frac{${fmt(t1)}}{2} + ${fmt(c)} + \\frac{${fmt(t2)}}{2}\\right)`,
    source: 'single shear: couple between the bearing resultants — common practice',
    ref: 'couple between the bearing resultants (single shear) — common practice',
  }
}

export interface PlateBearing<T> {
  plate: ResolvedPlate
  force: number
  result: T
  utilisation: number
}

/** Runs a per-plate bearing rule and returns the plate with the highest utilisation. */
export function worstPlate<T>(
  j: ResolvedJoint,
  F: number,
  rule: (p: ResolvedPlate, force: number) => { result: T; demand: number; capacity: number },
): PlateBearing<T> & { demand: number; capacity: number } {
  let worst: (PlateBearing<T> & { demand: number; capacity: number }) | null = null
  for (const p of j.plates) {
    const force = F * p.share
    const r = rule(p, force)
    const u = r.capacity > 0 ? r.demand / r.capacity : Number.POSITIVE_INFINITY
    if (!worst || u > worst.utilisation) worst = { plate: p, force, result: r.result, utilisation: u, demand: r.demand, capacity: r.capacity }
  }
  if (!worst) throw new Error(`joint ${j.name} has no plates`)
  return worst
}

/** fy for bearing: the weaker of pin and plate, since either can yield at the contact. */
export function bearingFy(j: ResolvedJoint, p: ResolvedPlate): number {
  return Math.min(j.pin.fy, p.fy)
}

export function plateLabel(j: ResolvedJoint, p: ResolvedPlate): string {
  const n = j.arrangement === 'double' && p.share < 1 ? ' (each of two)' : ''
  return `${p.role}${n}, t = ${fmt(p.thickness)} mm, ${p.band}`
}
