/**
 * Eyes checked for the pin force in its worst direction (issue 10).
 * EN 1993-1-8:2005 §3.13.1 Table 3.9 type A: a ≥ F γM0/(2 t f_y) + 2d0/3, c ≥ F γM0/(2 t f_y) + d0/3;
 * a force that may point at the side edge needs the first rule for c too. Hand values for the LC-001
 * crank eye before the working range was stated: F = 1704 N, t = 8 mm, f_y = 355 MPa (S355, t ≤ 16;
 * EN 10025-2 Table 7), d0 = 10.5 mm, w = 25 mm → c = 7.25 mm;
 *   F γM0/(2 t f_y) = 1704/(2·8·355) = 0.3000 mm; a-rule 0.3000 + 7.000 = 7.300 mm > c → fails, u = 1.007.
 * AISC 360-16 §D5.1(b) Eq. D5-2 with the smaller edge distance: A_sf = 2t(min(a, c) + d/2).
 */
import { describe, expect, it } from 'vitest'
import { checkComponent, checksInputSchema } from '@/lib/checks'

const input = (basis: object) =>
  checksInputSchema.parse({
    basis,
    defaults: {
      joint: { pinDiameter: 10, holeDiameter: 10.5 },
      link: { section: { shape: 'flat', width: 25, thickness: 8 }, material: 'S355', eye: { edgeAlong: 16 }, length: 100 },
    },
  })

const by = (r: ReturnType<typeof checkComponent>) => Object.fromEntries(r.checks.map((c) => [c.stepId.split('.').pop(), c]))

describe('eye loaded across the bar', () => {
  it('EN 1993-1-8 Table 3.9: the side distance fails for 1704 N that may point across the link', () => {
    const c = by(checkComponent(input({ kind: 'en1993' }), 'CP', { kind: 'link', eye: 1704, across: true, compression: 500 }))
    expect(c['eye-side'].demand).toBeCloseTo(1704 / (2 * 8 * 355) + (2 * 10.5) / 3, 9)
    expect(c['eye-side'].capacity).toBeCloseTo(7.25, 9)
    expect(c['eye-side'].utilisation).toBeCloseTo(7.3 / 7.25, 3)
    expect(c['eye-side'].pass).toBe(false)
    expect(c['eye-side'].clause).toMatch(/2d0\/3 \(force across the link\)/)
  })

  it('the same force along a two-force bar only needs the side rule c ≥ … + d0/3', () => {
    const c = by(checkComponent(input({ kind: 'en1993' }), 'CP', { kind: 'link', tension: 1704 }))
    expect(c['eye-side'].demand).toBeCloseTo(0.3 + 3.5, 9)
    expect(c['eye-side'].pass).toBe(true)
  })

  it('AISC 360-16 §D5.1(b): shear rupture takes the smaller edge distance for a force across the link', () => {
    const c = by(checkComponent(input({ kind: 'aisc360', method: 'LRFD' }), 'CP', { kind: 'link', eye: 1704, across: true }))
    // A_sf = 2·8·(min(16, 7.25) + 10/2) = 196 mm²; φ P_n = 0.75 · 0.6 · 470 · 196 = 41 454 N.
    expect(c['shear-rupture'].capacity).toBeCloseTo(0.75 * 0.6 * 470 * 196, 6)
    expect(c['shear-rupture'].demand).toBe(1704)
    expect(c['d52-width'].kind).toBe('detailing')
    expect(c['d52-width'].governing).toBe(false)
  })

  it('allowable stress: tear-out toward the nearer edge', () => {
    const c = by(checkComponent(input({ kind: 'allowable', factorOfSafety: 2 }), 'CP', { kind: 'link', eye: 1704, across: true }))
    // τ = F/(2 min(a, c) t) = 1704/(2 · 7.25 · 8) = 14.69 MPa
    expect(c['tear-out'].demand).toBeCloseTo(1704 / (2 * 7.25 * 8), 9)
  })
})
