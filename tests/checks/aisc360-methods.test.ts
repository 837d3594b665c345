/**
 * AISC 360-16, LRFD (φ R_n) and ASD (R_n/Ω), for every check of a pin and a link,
 * against hand calculations written out in the comments. φ and Ω as in the
 * specification: §D5.1 and §J7 φ 0.75 / Ω 2.00; §D2(a), §E1 and §F1 φ 0.90 / Ω 1.67.
 * E = 29 000 ksi taken as 200 000 MPa (AISC 360-16 §E3 symbols — common practice);
 * the test material's own E (210 000) is not the one §E3 uses here.
 * b_e = 2t + 0.63 in (§D5.1(a)); 0.63 in = 16.002 mm. Pin shear is by analogy with
 * §J3.6 (F_nv = 0.563 F_u — from memory, as the library says).
 */
import { describe, expect, it } from 'vitest'
import { expectPrinted, linkCase, near, pinCase } from './_hand'

const ASD = { kind: 'aisc360', method: 'ASD' }
const LRFD = { kind: 'aisc360', method: 'LRFD' }
const fork = { pinDiameter: 20, holeDiameter: 20.5, pinMaterial: 'Pin400', middle: { thickness: 10, material: 'Plate250' }, outer: { thickness: 4, material: 'Plate250' }, gap: 2 }

describe('AISC 360-16 pin, ASD: R_n/Ω', () => {
  // d = 20 (Pin400: Fy 400, Fu 600), fork: middle 10 mm, outers 4 mm (Plate250: Fy 250), c = 2, F = 10 kN
  //   A = 314.16 mm², S = π·20³/32 = 785.40 mm³, Z = 20³/6 = 1333.3 mm³
  //   shear: R_n = 2·0.563·600·314.16 = 212 246 N → /2.00 = 106 123 N
  //   bearing (J7-1): outer R_n = 1.8·250·20·4 = 36 000 → /2.00 = 18 000 vs F/2 = 5 000 → 0.2778 (governs);
  //                   middle 1.8·250·20·10 = 90 000 → 45 000 vs 10 000 → 0.2222
  //   bending (F11.1): M = 10 000/8·(10 + 4·2 + 2·4) = 32 500 N·mm;
  //     M_n = min(400·1333.3, 1.6·400·785.40) = min(533 333, 502 655) = 502 655 → /1.67 = 300 991 N·mm
  const run = () => pinCase(ASD, fork, 10000)
  it('shear Ω = 2.00', () => {
    const { c, s } = run()
    near(c.shear.capacity, 106123.0, 1e-6)
    expectPrinted(s.shear, [2, 0.563, 600, 314.2, 212200, 2, 106100])
    expect(c.shear.clause).toBe('not a D5/J7 provision: shear by analogy with §J3.6, F_nv = 0.563 F_u (threads excluded; Commentary J3.6 — from memory), Ω = 2')
  })
  it('bearing Ω = 2.00, the thin outer plate governs with half the force', () => {
    const { c, s } = run()
    near(c.bearing.demand, 5000, 1e-12)
    near(c.bearing.capacity, 18000, 1e-12)
    expectPrinted(s.bearing, [1.8, 250, 20, 4, 36000, 36000, 2, 18000, 5000])
    expect(c.bearing.clause).toBe('AISC 360-16 §J7(a), Eq. J7-1, Ω = 2 (F_y the lower of pin and plate)')
  })
  it('bending Ω = 1.67, M_n limited to 1.6 F_y S for a solid round', () => {
    const { c, s } = run()
    near(c.bending.demand, 32500, 1e-12)
    near(c.bending.capacity, 300990.91, 1e-7)
    expectPrinted(s.bending, [10000, 8, 10, 4, 2, 2, 4, 32500, 502700, 502700, 1.67, 301000])
    expect(c.bending.clause).toBe('AISC 360-16 §F11.1 (solid round: M_n = F_y Z ≤ 1.6 F_y S_x), Ω = 1.67; moment from EN 1993-1-8:2005 Fig. 3.11 (fork with middle plate b, outer plates a, gaps c)')
  })
})

describe('AISC 360-16 pin, LRFD, single shear', () => {
  // Lap joint: plate 1 = 10 mm, plate 2 = 4 mm (each takes the whole F), one shear plane, F = 10 kN
  //   shear: 0.75·1·0.563·600·314.16 = 79 592 N
  //   bearing: plate 2: 0.75·1.8·250·20·4 = 27 000 vs 10 000 → 0.3704 (governs); plate 1: 67 500 → 0.148
  //   M = 10 000·(10/2 + 2 + 4/2) = 90 000 N·mm; φM_n = 0.9·502 655 = 452 389 N·mm
  const run = () => pinCase(LRFD, { ...fork, arrangement: 'single' }, 10000)
  it('φ = 0.75 / 0.90 and the lap-joint couple', () => {
    const { c, s } = run()
    near(c.shear.capacity, 79592.25, 1e-6)
    expectPrinted(s.shear, [1, 0.563, 600, 314.2, 0.75, 106100, 79590])
    expect(c.shear.check).toBe('Pin shear (1 shear plane)')
    near(c.bearing.demand, 10000, 1e-12)
    near(c.bearing.capacity, 27000, 1e-12)
    expectPrinted(s.bearing, [1.8, 250, 20, 4, 36000, 0.75, 36000, 27000, 10000])
    expect(s.bearing.note).toMatch(/governing plate: plate 2, t = 4 mm/)
    near(c.bending.demand, 90000, 1e-12)
    near(c.bending.capacity, 452389.34, 1e-7)
    expectPrinted(s.bending, [10000, 10, 2, 2, 4, 2, 90000, 502700, 0.9, 502700, 452400])
    expect(c.bending.clause).toMatch(/^AISC 360-16 §F11\.1 \(solid round: M_n = F_y Z ≤ 1\.6 F_y S_x\), φ = 0\.9; moment from single shear/)
    expect(c.shear.clause).toMatch(/, φ = 0\.75$/)
    expect(c.bearing.clause).toBe('AISC 360-16 §J7(a), Eq. J7-1, φ = 0.75 (F_y the lower of pin and plate)')
  })
})

describe('AISC 360-16 link, ASD, flat bar: §D5, §D2, §E3 (elastic), §H1.1 (H1-1a)', () => {
  // Flat 60 × 10 (Bar300: Fy 300, Fu 450), eye t = 10, w = 60, d = 20, d0 = 21, a = 25, c = 19.5;
  // L = 500, K = 0.9; T = 40 kN, C = 20 kN, M = 150 N·m.
  //   b_e = min(2·10 + 16.002, 19.5) = 19.5
  //   D5-1: P_n = 450·2·10·19.5 = 175 500 → /2.00 = 87 750
  //   D5-2: A_sf = 2·10·(25 + 10) = 700; P_n = 0.6·450·700 = 189 000 → 94 500
  //   J7-1: R_n = 1.8·300·20·10 = 108 000 → 54 000 vs the larger axial force 40 000
  //   D2-1: P_n = 300·600 = 180 000 → /1.67 = 107 784
  //   D5.2: 1.33·19.5 = 25.935 > a = 25 (fails); 2·19.5 + 20 = 59 ≤ 60; d0 − d = 1 > 0.79375 (fails)
  //   E3: r = 10/√12 = 2.8868; KL/r = 450/2.8868 = 155.88 > 4.71√(200 000/300) = 121.61 → E3-3
  //       F_e = π²·200 000/155.88² = 81.23; F_cr = 0.877·81.23 = 71.24; P_n = 42 744 → /1.67 = 25 595
  //   H1.1: Z = 10·60²/4 = 9000, S = 6000: M_n = min(300·9000, 1.6·300·6000) = 2 700 000 → /1.67 = 1 616 766
  //         P_c = min(25 595, 107 784) = 25 595; P_r/P_c = 40 000/25 595 = 1.5628 ≥ 0.2 →
  //         H1-1a: 1.5628 + 8/9·150 000/1 616 766 = 1.5628 + 0.0825 = 1.6453 (fails)
  const flat = { section: { shape: 'flat', width: 60, thickness: 10 }, material: 'Bar300', eye: { pinDiameter: 20, holeDiameter: 21, edgeAlong: 25 }, length: 500, effectiveLengthFactor: 0.9 }
  const run = () => linkCase(ASD, flat, { tension: 40000, compression: 20000, moment: 150000 })
  it('§D5.1 (a)–(d)', () => {
    const { c, s } = run()
    near(c['tensile-rupture'].capacity, 87750, 1e-12)
    expectPrinted(s['tensile-rupture'], [2, 10, 16, 19.5, 19.5, 450, 2, 10, 19.5, 175500, 2, 87750])
    near(c['shear-rupture'].capacity, 94500, 1e-12)
    expectPrinted(s['shear-rupture'], [2, 10, 25, 20, 2, 700, 189000, 2, 94500])
    near(c.bearing.capacity, 54000, 1e-12)
    near(c.bearing.demand, 40000, 1e-12)
    expectPrinted(s.bearing, [1.8, 300, 20, 10, 108000, 2, 54000])
    near(c['gross-yielding'].capacity, 107784.43, 1e-7)
    expectPrinted(s['gross-yielding'], [300, 600, 180000, 1.67, 107800])
    // the Ω each clause states is the Ω the check used
    expect(c['tensile-rupture'].clause).toBe('AISC 360-16 §D5.1(a), Eq. D5-1, Ω = 2; b_e = 2t + 0.63 in (2t + 16 mm) ≤ actual')
    expect(c['shear-rupture'].clause).toBe('AISC 360-16 §D5.1(b), Eq. D5-2, Ω = 2; A_sf = 2t(a + d/2)')
    expect(c.bearing.clause).toBe('AISC 360-16 §D5.1(c) with §J7(a), Eq. J7-1, Ω = 2')
    expect(c['gross-yielding'].clause).toBe('AISC 360-16 §D5.1(d) with §D2(a), Eq. D2-1, Ω = 1.67')
  })
  it('§D5.2 dimensions', () => {
    const { c, s } = run()
    near(c['d52-extension'].demand, 25.935, 1e-12)
    expect(c['d52-extension'].pass).toBe(false)
    expectPrinted(s['d52-extension'], [1.33, 19.5, 25.94, 25])
    near(c['d52-width'].demand, 59, 1e-12)
    expect(c['d52-width'].capacity).toBe(60)
    expectPrinted(s['d52-width'], [2, 19.5, 20, 59, 60])
    near(c['d52-hole'].demand, 1, 1e-12)
    near(c['d52-hole'].capacity, 25.4 / 32, 1e-12)
    expect(c['d52-hole'].pass).toBe(false)
    expectPrinted(s['d52-hole'], [21, 20, 1, 0.7937])
  })
  it('§E3 elastic (E3-3) with Ω = 1.67', () => {
    const { c, s } = run()
    near(c.buckling.capacity, 25595.16, 1e-6)
    expect(c.buckling.check).toBe('Flexural buckling of the link (elastic)')
    expect(c.buckling.clause).toBe('AISC 360-16 §E3, Eq. E3-3, Ω = 1.67, E = 200 000 MPa')
    expectPrinted(s.buckling, [155.9, 81.23, 71.24, 42740, 1.67, 25600])
  })
  it('§H1.1 Eq. H1-1a: P_r/P_c + 8/9 M_r/M_c', () => {
    const { c, s } = run()
    near(c['axial-bending'].demand, 1.6452646, 1e-6)
    expect(c['axial-bending'].pass).toBe(false)
    expect(c['axial-bending'].clause).toBe('AISC 360-16 §H1.1 (Eq. H1-1a) with §F11.1 M_n = F_y Z ≤ 1.6 F_y S_x; lateral-torsional buckling not evaluated')
    expectPrinted(s['axial-bending'], [40000, 25600, 1.563, 150000, 1.617e6, 1.645])
  })
  it('§H1.1 Eq. H1-1b below P_r/P_c = 0.2: P_r/(2 P_c) + M_r/M_c', () => {
    // T = 2 kN, C = 1 kN, M = 500 N·m: 2000/25 595 = 0.078142 → 0.039071 + 500 000/1 616 766 = 0.348329
    const b = linkCase(ASD, flat, { tension: 2000, compression: 1000, moment: 500000 })
    near(b.c['axial-bending'].demand, 0.3483291, 1e-6)
    expect(b.c['axial-bending'].clause).toMatch(/^AISC 360-16 §H1\.1 \(Eq\. H1-1b\)/)
    expectPrinted(b.s['axial-bending'], [2000, 25600, 0.07814, 500000, 1.617e6, 0.3483])
  })
  it('§H1.1: at P_r/P_c = 0.2 exactly, H1-1a applies (P_r/P_c ≥ 0.2)', () => {
    // LRFD, K so small that F_cr = F_y to the last bit: P_c = 0.9·300·600 = 162 000 N = φP_n of D2-1.
    // N = 32 400 N → P_r/P_c = 0.2 exactly; M = 1 093 500 N·mm = M_c/2 (φM_n = 0.9·2 700 000 = 2 430 000)
    //   H1-1a: 0.2 + 8/9·0.45 = 0.6; H1-1b would give 0.1 + 0.45 = 0.55
    const b = linkCase(LRFD, { ...flat, effectiveLengthFactor: 1e-9 }, { tension: 32400, moment: 1093500 })
    expect(b.c.buckling.capacity).toBe(162000)
    expect(b.c['gross-yielding'].capacity).toBe(162000)
    near(b.c['axial-bending'].demand, 0.6, 1e-12)
    expect(b.c['axial-bending'].clause).toMatch(/H1-1a/)
  })
  it('without a moment there is no interaction check', () => {
    expect(linkCase(ASD, flat, { tension: 1000 }).c['axial-bending']).toBeUndefined()
  })
})

describe('AISC 360-16 link, LRFD, round bar: §E3 inelastic (E3-2)', () => {
  // Round Ø20 (A = 314.16, r = 5), eye t = 12, w = 50, d = 16, d0 = 16.5, a = 20 → c = 16.75; L = 300, K = 1
  //   b_e = min(2·12 + 16.002, 16.75) = 16.75; D5-1: 0.75·450·2·12·16.75 = 135 675
  //   D5-2: A_sf = 2·12·(20 + 8) = 672 → 0.75·0.6·450·672 = 136 080
  //   J7-1: 0.75·1.8·300·16·12 = 77 760 vs C = 30 kN; D2-1: 0.9·300·314.16 = 84 823
  //   E3: KL/r = 60 ≤ 121.61 → F_e = π²·200 000/60² = 548.31; F_cr = 0.658^(300/548.31)·300 = 238.60;
  //       φP_n = 0.9·238.60·314.16 = 67 462
  const run = () => linkCase(
    LRFD,
    { section: { shape: 'round', diameter: 20 }, material: 'Bar300', eye: { thickness: 12, width: 50, pinDiameter: 16, holeDiameter: 16.5, edgeAlong: 20 }, length: 300 },
    { tension: 20000, compression: 30000 },
  )
  it('D5 and D2 with φ', () => {
    const { c, s } = run()
    near(c['tensile-rupture'].capacity, 135675, 1e-12)
    near(c['shear-rupture'].capacity, 136080, 1e-12)
    near(c.bearing.capacity, 77760, 1e-12)
    near(c.bearing.demand, 30000, 1e-12)
    near(c['gross-yielding'].capacity, 84823.0, 1e-6)
    expect(c['tensile-rupture'].clause).toBe('AISC 360-16 §D5.1(a), Eq. D5-1, φ = 0.75; b_e = 2t + 0.63 in (2t + 16 mm) ≤ actual')
    expect(c['shear-rupture'].clause).toBe('AISC 360-16 §D5.1(b), Eq. D5-2, φ = 0.75; A_sf = 2t(a + d/2)')
    expect(c.bearing.clause).toBe('AISC 360-16 §D5.1(c) with §J7(a), Eq. J7-1, φ = 0.75')
    expect(c['gross-yielding'].clause).toBe('AISC 360-16 §D5.1(d) with §D2(a), Eq. D2-1, φ = 0.9')
    expectPrinted(s['gross-yielding'], [300, 314.2, 0.9, 94250, 84820])
  })
  it('E3-2 with φ = 0.90', () => {
    const { c, s } = run()
    near(c.buckling.capacity, 67461.93, 1e-6)
    expect(c.buckling.check).toBe('Flexural buckling of the link (inelastic)')
    expect(c.buckling.clause).toBe('AISC 360-16 §E3, Eq. E3-2, φ = 0.9, E = 200 000 MPa')
    expectPrinted(s.buckling, [60, 548.3, 238.6, 0.9, 74960, 67460])
  })
  it('H1.1 for a round: M_n = 1.6 F_y S governs (Z/S = 1.70 > 1.6)', () => {
    // S = π·20³/32 = 785.40, Z = 20³/6 = 1333.3: M_n = min(300·1333.3, 1.6·300·785.40) = min(400 000, 376 991) = 376 991;
    // φM_n = 0.9·376 991 = 339 292. P_c = min(67 462, 84 823) = 67 462 (buckling, φ applied);
    // T = 20 kN, C = 30 kN → P_r = 30 000: 30 000/67 462 = 0.44470 → H1-1a: 0.44470 + 8/9·100 000/339 292 = 0.70668
    const r = linkCase(
      LRFD,
      { section: { shape: 'round', diameter: 20 }, material: 'Bar300', eye: { thickness: 12, width: 50, pinDiameter: 16, holeDiameter: 16.5, edgeAlong: 20 }, length: 300 },
      { tension: 20000, compression: 30000, moment: 100000 },
    )
    near(r.c['axial-bending'].demand, 30000 / 67461.93156748924 + (8 / 9) * (100000 / (0.9 * 1.6 * 300 * 785.3981633974483)), 1e-9)
    expectPrinted(r.s['axial-bending'], [30000, 67460, 0.4447, 100000, 339300, 0.7067])
  })
  it('the §D5.2 rules and clauses', () => {
    const { c } = run()
    expect(c['d52-extension'].clause).toBe('AISC 360-16 §D5.2')
    expect(c['d52-width'].clause).toBe('AISC 360-16 §D5.2')
    expect(c['d52-hole'].clause).toBe('AISC 360-16 §D5.2 (pin providing relative movement under full load)')
    near(c['d52-extension'].demand, 1.33 * 16.75, 1e-12)
    near(c['d52-width'].demand, 2 * 16.75 + 16, 1e-12)
  })
})

describe('AISC 360-16 link, ASD, tube: b_e = 2t + 0.63 in governs; H1.1 with Z of the tube', () => {
  // Tube Ø40 × 3 (d_i = 34): A = π(40² − 34²)/4 = 348.72; I = π(40⁴ − 34⁴)/64 = 60 066; r = 13.124;
  // S = 2I/D = 3003.3; Z = (40³ − 34³)/6 = 4116. Eye t = 8, w = 100, d = 20, d0 = 20.5, a = 45 → c = 39.75; L = 800.
  //   b_e = min(2·8 + 16.002, 39.75) = 32.002; D5-1: 450·2·8·32.002 = 230 414 → /2 = 115 207
  //   D5-2: A_sf = 2·8·(45 + 10) = 880 → 0.6·450·880/2 = 118 800
  //   D2-1: 300·348.72/1.67 = 62 644; D5.2: 1.33·32.002 = 42.563 ≤ 45; 2·32.002 + 20 = 84.004 ≤ 100
  //   E3: KL/r = 800/13.124 = 60.956 → F_e = 531.25, F_cr = 0.658^(300/531.25)·300 = 236.85 → 82 593/1.67 = 49 457
  //   H1.1: M_n = min(300·4116, 1.6·300·3003.3) = 1 234 800 → /1.67 = 739 401;
  //         P_r/P_c = 30 000/49 457 = 0.60658 → 0.60658 + 8/9·100 000/739 401 = 0.72680
  const run = () => linkCase(
    ASD,
    { section: { shape: 'tube', outerDiameter: 40, wall: 3 }, material: 'Bar300', eye: { thickness: 8, width: 100, pinDiameter: 20, holeDiameter: 20.5, edgeAlong: 45 }, length: 800 },
    { tension: 20000, compression: 30000, moment: 100000 },
  )
  it('checks', () => {
    const { c, s } = run()
    near(c['tensile-rupture'].capacity, 115207.2, 1e-9)
    expectPrinted(s['tensile-rupture'], [2, 8, 16, 39.75, 32, 450, 2, 8, 32, 230400, 2, 115200])
    near(c['shear-rupture'].capacity, 118800, 1e-12)
    near(c['gross-yielding'].capacity, 62643.73, 1e-6)
    near(c['d52-extension'].demand, 42.56266, 1e-6)
    near(c['d52-width'].demand, 84.004, 1e-6)
    near(c.buckling.capacity, 49457.38, 1e-6)
    near(c['axial-bending'].demand, 0.7268003, 1e-6)
    expectPrinted(s['axial-bending'], [30000, 49460, 0.6066, 100000, 739400, 0.7268])
  })
})
