/**
 * Section properties against the textbook formulas for a rectangle, a solid
 * circle and a circular tube (any strength-of-materials text, e.g. Roark's
 * Formulas for Stress and Strain, Table A.1 — common practice), worked out by hand.
 */
import { describe, expect, it } from 'vitest'
import { MATERIALS, pinProps, sectionProps } from '@/lib/checks'
import { linkCase } from './_hand'

const close = (a: number, b: number, rel = 1e-12) => expect(Math.abs(a - b)).toBeLessThanOrEqual(rel * Math.abs(b))

describe('flat bar', () => {
  it('60 × 10 (width in the plane of the mechanism)', () => {
    // A = 600; I_min = 60·10³/12 = 5000; i = √(5000/600) = 2.886751; W_el = 10·60²/6 = 6000; W_pl = 10·60²/4 = 9000
    const s = sectionProps({ shape: 'flat', width: 60, thickness: 10 })
    close(s.A, 600)
    close(s.Imin, 5000)
    close(s.rMin, 10 / Math.sqrt(12))
    close(s.Wel, 6000)
    close(s.Wpl, 9000)
    expect(s.bandSize).toBe(10)
    expect(s.solid).toBe(true)
    expect(s.label).toBe('flat 60 × 10 mm')
  })
  it('10 × 60: the least I is still about the thin direction; W about the width in the plane', () => {
    // I_min = 60·10³/12 = 5000; W_el = 60·10²/6 = 1000; W_pl = 60·10²/4 = 1500; band from the smaller size, 10
    const s = sectionProps({ shape: 'flat', width: 10, thickness: 60 })
    close(s.Imin, 5000)
    close(s.Wel, 1000)
    close(s.Wpl, 1500)
    expect(s.bandSize).toBe(10)
  })
})

describe('round bar Ø20', () => {
  it('A = πd²/4, I = πd⁴/64, i = d/4, W_el = πd³/32, W_pl = d³/6', () => {
    // A = 314.159; I = 7853.98; i = 5; W_el = 785.398; W_pl = 1333.33
    const s = sectionProps({ shape: 'round', diameter: 20 })
    close(s.A, 314.1592653589793)
    close(s.Imin, 7853.981633974483)
    close(s.rMin, 5)
    close(s.Wel, 785.3981633974483)
    close(s.Wpl, 8000 / 6)
    expect(s.bandSize).toBe(20)
    expect(s.solid).toBe(true)
    expect(s.label).toBe('round Ø20 mm')
  })
  it('pin properties are those of the solid round', () => {
    const p = pinProps(20)
    close(p.A, 314.1592653589793)
    close(p.Wel, 785.3981633974483)
    close(p.Wpl, 8000 / 6)
  })
})

describe('tube Ø40 × 3', () => {
  it('A, I, i, W_el = 2I/D, W_pl = (D³ − d_i³)/6', () => {
    // d_i = 34: A = π(1600 − 1156)/4 = 348.717; I = π(2 560 000 − 1 336 336)/64 = 60 066.5;
    // i² = (D² + d_i²)/16 = 172.25 → i = 13.1244; W_el = 2·60 066.5/40 = 3003.32; W_pl = (64 000 − 39 304)/6 = 4116
    const s = sectionProps({ shape: 'tube', outerDiameter: 40, wall: 3 })
    close(s.A, 111 * Math.PI)
    close(s.Imin, (1223664 * Math.PI) / 64)
    close(s.rMin, Math.sqrt(172.25))
    close(s.Wel, (1223664 * Math.PI) / 64 / 20)
    close(s.Wpl, 4116)
    expect(s.bandSize).toBe(3)
    expect(s.solid).toBe(false)
    expect(s.label).toBe('tube Ø40 × 3 mm')
  })
})

describe('the material band follows the section', () => {
  // EN 10025-2 Table 7, S355 (from memory): fy 355 for t ≤ 16, 345 for 16 < t ≤ 40.
  it('flat 60 × 20 S355 reads the 20 mm band (345), tube Ø100 × 8 the wall (355), round Ø30 the diameter (345)', () => {
    const body = (section: object) => linkCase({ kind: 'allowable', factorOfSafety: 1 }, { section, material: 'S355', eye: { thickness: 20, width: 60, pinDiameter: 20, holeDiameter: 21 }, length: 400 }, { tension: 1000 })
    expect(body({ shape: 'flat', width: 60, thickness: 20 }).c.axial.capacity).toBe(345)
    expect(body({ shape: 'tube', outerDiameter: 100, wall: 8 }).c.axial.capacity).toBe(355)
    expect(body({ shape: 'round', diameter: 30 }).c.axial.capacity).toBe(345)
    expect(MATERIALS.S355.bands[0]).toMatchObject({ upTo: 16, fy: 355 })
  })
})
