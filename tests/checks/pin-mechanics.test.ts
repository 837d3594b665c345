/**
 * The pin mechanics every basis shares (lib/checks/pin.ts): the bending lever
 * of a fork (EN 1993-1-8:2005 Fig. 3.11, M = F/8 (b + 4c + 2a)) and of a lap
 * joint (couple between the bearing resultants, common practice), the plate
 * that governs bearing (highest utilisation, not highest force) and f_y for
 * bearing (the weaker of pin and plate, Table 3.10 note).
 */
import { describe, expect, it } from 'vitest'
import { bearingFy, pinMoment, plateLabel, worstPlate } from '@/lib/checks/pin'
import type { ResolvedJoint, ResolvedPlate } from '@/lib/checks/resolve'
import { MATERIALS } from '@/lib/checks'
import { near, pinCase } from './_hand'

const plate = (role: string, thickness: number, fy: number, share: number): ResolvedPlate => ({
  role,
  thickness,
  material: MATERIALS.S355,
  fy,
  fu: 470,
  band: `S355, test band`,
  share,
})

const joint = (arrangement: 'single' | 'double', plates: ResolvedPlate[], gap: number, pinFy = 430): ResolvedJoint => ({
  name: 'J',
  d: 20,
  d0: 20.5,
  pin: { material: MATERIALS['C45+QT'], fy: pinFy, fu: 650, band: 'C45+QT, test band' },
  arrangement,
  shearPlanes: arrangement === 'double' ? 2 : 1,
  plates,
  gap,
  replaceable: false,
})

describe('pin bending lever', () => {
  it('fork: (b + 4c + 2a)/8 — b = 12, c = 3, a = 5: (12 + 12 + 10)/8 = 4.25 mm', () => {
    const m = pinMoment(joint('double', [plate('middle plate', 12, 355, 1), plate('outer plate', 5, 355, 0.5)], 3))
    near(m.lever, 4.25, 1e-15)
    expect(m.substituted(1000)).toBe('M_{Ed} = \\frac{1000}{8}\\left(12 + 4 \\cdot 3 + 2 \\cdot 5\\right)')
    expect(m.source).toBe('EN 1993-1-8:2005 Fig. 3.11 (fork with middle plate b, outer plates a, gaps c)')
  })
  it('fork without gaps: (b + 2a)/8', () => {
    near(pinMoment(joint('double', [plate('middle plate', 12, 355, 1), plate('outer plate', 5, 355, 0.5)], 0)).lever, 22 / 8, 1e-15)
  })
  it('lap joint: t1/2 + c + t2/2 — t1 = 12, c = 3, t2 = 5: 6 + 3 + 2.5 = 11.5 mm', () => {
    const m = pinMoment(joint('single', [plate('plate 1', 12, 355, 1), plate('plate 2', 5, 355, 1)], 3))
    near(m.lever, 11.5, 1e-15)
    expect(m.substituted(1000)).toBe('M = 1000\\left(\\frac{12}{2} + 3 + \\frac{5}{2}\\right)')
    expect(m.source).toBe('single shear: couple between the bearing resultants — common practice')
  })
})

describe('governing plate', () => {
  const j = joint('double', [plate('middle plate', 10, 355, 1), plate('outer plate', 4, 355, 0.5)], 0)
  const rule = (p: ResolvedPlate, F: number) => ({ result: p.role, demand: F, capacity: 100 * p.thickness })
  it('is the one with the highest demand/capacity, even when it carries less force', () => {
    // middle: 1000/1000 = 1.0 ; outer: 500/400 = 1.25 → outer, with half the force
    const w = worstPlate(j, 1000, rule)
    expect(w.plate.role).toBe('outer plate')
    expect(w.force).toBe(500)
    expect(w.demand).toBe(500)
    expect(w.capacity).toBe(400)
    near(w.utilisation, 1.25, 1e-15)
    expect(w.result).toBe('outer plate')
  })
  it('a tie keeps the first plate listed', () => {
    const tie = joint('double', [plate('middle plate', 10, 355, 1), plate('outer plate', 5, 355, 0.5)], 0)
    expect(worstPlate(tie, 1000, rule).plate.role).toBe('middle plate')
  })
  it('a plate without capacity governs (utilisation infinite)', () => {
    const w = worstPlate(j, 1000, (p, F) => ({ result: 0, demand: F, capacity: p.role === 'outer plate' ? 0 : 1e9 }))
    expect(w.plate.role).toBe('outer plate')
    expect(w.utilisation).toBe(Number.POSITIVE_INFINITY)
    // even with no force on it (0/0 would be NaN and never govern)
    const z = worstPlate(j, 0, (p, F) => ({ result: 0, demand: F, capacity: p.role === 'outer plate' ? 0 : 1e9 }))
    expect(z.plate.role).toBe('outer plate')
    expect(z.utilisation).toBe(Number.POSITIVE_INFINITY)
  })
  it('a joint without plates is an internal error', () => {
    expect(() => worstPlate(joint('double', [], 0), 1000, rule)).toThrow('joint J has no plates')
  })
})

describe('bearing f_y', () => {
  it('is the lower of pin and plate', () => {
    expect(bearingFy(joint('double', [], 0, 430), plate('p', 10, 355, 1))).toBe(355)
    expect(bearingFy(joint('double', [], 0, 300), plate('p', 10, 355, 1))).toBe(300)
  })
  it('a pin weaker than the plates sets the bearing resistance (EN: 1.5 t d f_y/γM0)', () => {
    // pin of Plate250 steel (fy 250) in Bar300 plates (fy 300): middle 10 mm: 1.5·10·20·250/1.0 = 75 000 N
    const r = pinCase({ kind: 'en1993' }, { pinDiameter: 20, holeDiameter: 20.2, pinMaterial: 'Plate250', middle: { thickness: 10, material: 'Bar300' }, outer: { thickness: 8, material: 'Bar300' }, replaceable: false }, 10000)
    near(r.c.bearing.capacity, 75000, 1e-12)
  })
})

describe('plate label', () => {
  it('marks the outer plates of a fork as each of two', () => {
    expect(plateLabel(joint('double', [], 0), plate('outer plate', 4, 355, 0.5))).toBe('outer plate (each of two), t = 4 mm, S355, test band')
    expect(plateLabel(joint('double', [], 0), plate('middle plate', 10, 355, 1))).toBe('middle plate, t = 10 mm, S355, test band')
    expect(plateLabel(joint('single', [], 0), plate('plate 2', 4, 355, 1))).toBe('plate 2, t = 4 mm, S355, test band')
    // "each of two" belongs to the fork's outer plates only, whatever share a lap plate is given
    expect(plateLabel(joint('single', [], 0), plate('plate 2', 4, 355, 0.5))).toBe('plate 2, t = 4 mm, S355, test band')
  })
})
