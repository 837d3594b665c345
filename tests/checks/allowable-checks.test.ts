/**
 * Allowable-stress basis, every check with a factor of safety other than 2
 * (n_s = 2.5), against hand calculations in the comments. Plain mechanics:
 * σ = F/A, τ = F/(n A), σ = M/W; shear yield Ssy = 0.577 Sy (distortion energy,
 * Shigley's Mechanical Engineering Design, ch. 5); Euler and Johnson columns
 * (Shigley, §4-12/4-13 — section numbers from memory); eye tear-out on two shear
 * planes of length a (common practice).
 */
import { describe, expect, it } from 'vitest'
import { expectPrinted, linkCase, near, pinCase } from './_hand'

const A = { kind: 'allowable', factorOfSafety: 2.5 }
const fork = { pinDiameter: 20, holeDiameter: 20.5, pinMaterial: 'Pin400', middle: { thickness: 10, material: 'Plate250' }, outer: { thickness: 4, material: 'Plate250' }, gap: 2 }
const SHIGLEY = "Shigley's Mechanical Engineering Design"

describe('allowable stress, fork pin, n_s = 2.5', () => {
  // d = 20 (Pin400: fy 400), middle 10 mm, outers 4 mm (Plate250: fy 250), c = 2, F = 10 kN
  //   τ = 10 000/(2·314.16) = 15.915 MPa ≤ 0.577·400/2.5 = 92.32
  //   bearing: outer 5 000/(20·4) = 62.5 ≤ min(400, 250)/2.5 = 100 → 0.625 (governs); middle 10 000/(20·10) = 50 → 0.5
  //   M = 10 000/8·(10 + 4·2 + 2·4) = 32 500 N·mm; σ = 32 500/785.40 = 41.380 ≤ 400/2.5 = 160
  const run = () => pinCase(A, fork, 10000)
  it('shear with 0.577 f_y / n_s', () => {
    const { c, s } = run()
    near(c.shear.demand, 15.915494, 1e-6)
    near(c.shear.capacity, 92.32, 1e-12)
    expectPrinted(s.shear, [10000, 2, 20, 2, 4, 15.92, 0.577, 400, 2.5, 92.32])
    expect(c.shear.check).toBe('Pin shear (double shear)')
    expect(c.shear.clause).toBe(`${SHIGLEY}: τ = F/(n A), Ssy = 0.577 Sy (distortion energy)`)
  })
  it('bearing F_p/(d t) with the lower f_y', () => {
    const { c, s } = run()
    near(c.bearing.demand, 62.5, 1e-12)
    near(c.bearing.capacity, 100, 1e-12)
    expectPrinted(s.bearing, [5000, 20, 4, 62.5, 250, 2.5, 100])
    expect(c.bearing.clause).toBe('plain mechanics: σ = F/(d t) on the projected area')
  })
  it('bending M/(π d³/32)', () => {
    const { c, s } = run()
    near(c.bending.demand, 41.380285, 1e-6)
    near(c.bending.capacity, 160, 1e-12)
    expectPrinted(s.bending, [10000, 8, 10, 4, 2, 2, 4, 32500, 32500, 785.4, 41.38, 400, 2.5, 160])
    expect(c.bending.clause).toBe('EN 1993-1-8:2005 Fig. 3.11 (fork with middle plate b, outer plates a, gaps c); σ = M/(πd³/32)')
  })
  it('single shear: one plane, each plate the whole force, the lap couple', () => {
    // τ = 10 000/314.16 = 31.831; bearing plate 2: 10 000/(20·4) = 125 > 100 (fails);
    // M = 10 000·(10/2 + 2 + 4/2) = 90 000; σ = 114.59 ≤ 160
    const r = pinCase(A, { ...fork, arrangement: 'single' }, 10000)
    near(r.c.shear.demand, 31.830989, 1e-6)
    expect(r.c.shear.check).toBe('Pin shear (single shear)')
    near(r.c.bearing.demand, 125, 1e-12)
    expect(r.c.bearing.pass).toBe(false)
    expect(r.c.bearing.governing).toBe(true)
    near(r.c.bending.demand, 114.591559, 1e-6)
    expectPrinted(r.s.bending, [10000, 10, 2, 2, 4, 2, 90000, 90000, 785.4, 114.6, 400, 2.5, 160])
    expect(r.c.bending.clause).toBe('single shear: couple between the bearing resultants — common practice; σ = M/(πd³/32)')
  })
})

describe('allowable stress, flat link 60 × 10, n_s = 2.5', () => {
  // Bar300 (fy 300, E 210 000), eye d = 20, d0 = 21, a = 25; L = 500, K = 0.9; T = 40 kN, C = 20 kN, M = 150 N·m
  //   net: 40 000/((60 − 21)·10) = 102.56 ≤ 300/2.5 = 120
  //   tear-out: 40 000/(2·25·10) = 80 > 0.577·300/2.5 = 69.24 (fails)
  //   buckling: KL/k = 0.9·500/2.8868 = 155.88 > (l/k)_1 = √(2π²·210 000/300) = 117.55 → Euler:
  //     σ = π²·210 000/155.88² = 85.294; P_cr = 85.294·600 = 51 176 N → /2.5 = 20 470 N
  //   body: 40 000/600 + 150 000/(10·60²/6) = 66.667 + 25 = 91.667 ≤ 120
  const flat = { section: { shape: 'flat', width: 60, thickness: 10 }, material: 'Bar300', eye: { pinDiameter: 20, holeDiameter: 21, edgeAlong: 25 }, length: 500, effectiveLengthFactor: 0.9 }
  const run = () => linkCase(A, flat, { tension: 40000, compression: 20000, moment: 150000 })
  it('net section T/((w − d0) t) ≤ f_y/n_s', () => {
    const { c, s } = run()
    near(c['net-tension'].demand, 102.564103, 1e-6)
    near(c['net-tension'].capacity, 120, 1e-12)
    expectPrinted(s['net-tension'], [40000, 60, 21, 10, 102.6, 300, 2.5, 120])
    expect(c['net-tension'].clause).toBe('plain mechanics: σ = T/((w − d0) t)')
  })
  it('tear-out T/(2 a t) ≤ 0.577 f_y/n_s', () => {
    const { c, s } = run()
    near(c['tear-out'].demand, 80, 1e-12)
    near(c['tear-out'].capacity, 69.24, 1e-12)
    expect(c['tear-out'].pass).toBe(false)
    expectPrinted(s['tear-out'], [40000, 2, 25, 10, 80, 0.577, 300, 2.5, 69.24])
    expect(c['tear-out'].clause).toBe(`two shear planes of length a; Ssy = 0.577 Sy (${SHIGLEY}) — common practice`)
  })
  it('Euler buckling above (l/k)_1, P_cr/n_s', () => {
    const { c, s } = run()
    near(c.buckling.capacity, 20470.29, 1e-6)
    expect(c.buckling.check).toBe('Buckling of the link (Euler)')
    expectPrinted(s.buckling, [0.9, 500, 2.887, 155.9, 1, 117.5, 51180, 20000, 51180, 2.5, 20470])
    expect(c.buckling.clause).toBe(`${SHIGLEY}: Euler column, Johnson parabola below (l/k)_1 = sqrt(2π²CE/Sy)`)
  })
  it('body N/A + M/W_el', () => {
    const { c, s } = run()
    near(c['axial-bending'].demand, 91.666667, 1e-6)
    near(c['axial-bending'].capacity, 120, 1e-12)
    expectPrinted(s['axial-bending'], [40000, 600, 150000, 6000, 91.67, 300, 2.5, 120])
    expect(c['axial-bending'].clause).toBe('plain mechanics: σ = N/A + M/W (largest N and M combined — conservative)')
  })
  it('a short link: Johnson parabola below (l/k)_1; no moment → "axial"', () => {
    // L = 100: KL/k = 31.177; σ = 300 − (300·31.177/(2π))²/210 000 = 289.45; P_cr = 173 669 → /2.5 = 69 468
    const r = linkCase(A, { ...flat, length: 100 }, { tension: 40000, compression: 20000 })
    near(r.c.buckling.capacity, 69467.549, 1e-6)
    expect(r.c.buckling.check).toBe('Buckling of the link (Johnson)')
    near(r.c.axial.demand, 66.666667, 1e-6)
    expect(r.c['axial-bending']).toBeUndefined()
    expectPrinted(r.s.axial, [40000, 600, 0, 6000, 66.67, 300, 2.5, 120])
  })
  it('compression larger than tension: the body takes the larger axial force', () => {
    const r = linkCase(A, flat, { tension: 5000, compression: 18000 })
    near(r.c.axial.demand, 30, 1e-12)
    near(r.c['net-tension'].demand, 5000 / 390, 1e-12)
  })
})
