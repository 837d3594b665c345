/**
 * EN 1993 with partial factors other than 1. The recommended γM0 = γM1 = 1.0
 * hide a factor that multiplies instead of divides, or that is left out; national
 * annexes set values such as γM0 = 1.1 (from memory). The values here are
 * deliberately all different (γM0 1.1, γM1 1.15, γM2 1.3, γM6,ser 1.05 — not any
 * one annex's set) so that a factor in the wrong place, or one factor used for
 * another, changes a result.
 *
 * Sources: EN 1993-1-8:2005 §3.13 Table 3.9, Table 3.10, eq. 3.14–3.16 (the clause
 * text checked against a stored extract of Table 3.10, see en1993.test.ts);
 * EN 1993-1-1:2005 §6.2.1(7), §6.2.3, §6.2.5, §6.3.1. Every number below is a
 * hand calculation written out in the comments; test materials have round values.
 */
import { describe, expect, it } from 'vitest'
import { expectPrinted, linkCase, near, pinCase } from './_hand'

const EN = { kind: 'en1993', gammaM0: 1.1, gammaM1: 1.15, gammaM2: 1.3, gammaM6ser: 1.05 }
const T310 = 'EN 1993-1-8:2005 §3.13.2 Table 3.10'

describe('EN 1993-1-8 Table 3.10, fork pin, γM0 1.1, γM2 1.3, γM6,ser 1.05', () => {
  // Pin d = 20 mm (Pin400: fyp 400, fup 600), hole d0 = 20.5; middle plate b = 10 mm and
  // outer plates a = 4 mm (Plate250: fy 250, E 200 000); gap c = 2 mm; replaceable.
  // Envelope force 15 kN × γ_load 1.5 × γ_dyn 1.2 → F_Ed = 27 000 N; F_Ed,ser = 15 000 × 1.2 = 18 000 N.
  //   A = π·20²/4 = 314.16 mm²; W_el = π·20³/32 = 785.40 mm³
  //   shear:   F_v,Rd = 0.6·314.16·600/1.3 = 86 998 N per plane; 2 planes 173 996 N
  //   bearing: middle 1.5·10·20·250/1.1 = 68 182 N vs 27 000 → 0.396
  //            outer  1.5·4·20·250/1.1  = 27 273 N vs 13 500 → 0.495  (governs with half the force)
  //   bending: M_Ed = 27 000/8·(10 + 4·2 + 2·4) = 87 750 N·mm; M_Rd = 1.5·785.40·400/1.1 = 428 399 → 0.2048
  //   combined: (87 750/428 399)² + (13 500/86 998)² = 0.041956 + 0.024080 = 0.066036
  //   ser. bearing: middle 0.6·10·20·250/1.05 = 28 571 vs 18 000 → 0.630
  //                 outer  0.6·4·20·250/1.05  = 11 429 vs 9 000  → 0.7875 (governs)
  //   contact (eq. 3.15/3.16): outer 0.591·√(200 000·9 000·0.5/(20²·4)) = 0.591·750 = 443.25 MPa,
  //            middle 0.591·√(200 000·18 000·0.5/(20²·10)) = 396.46; f_h,Rd = 2.5·250/1.05 = 595.24 → 0.7447
  //   ser. bending: M = 18 000/8·26 = 58 500; M_Rd,ser = 0.8·785.40·400/1.05 = 239 359 → 0.2444
  const run = () =>
    pinCase(
      EN,
      { pinDiameter: 20, holeDiameter: 20.5, pinMaterial: 'Pin400', middle: { thickness: 10, material: 'Plate250' }, outer: { thickness: 4, material: 'Plate250' }, gap: 2 },
      15000,
      { load: 1.5, dynamic: 1.2 },
    )

  it('design force: envelope × load × dynamic factor', () => {
    const { c, s } = run()
    expectPrinted(s.force, [15000, 1.5, 1.2, 27000])
    expect(c.shear.loadCase).toBe('direct')
  })
  it('shear: n · 0.6 A f_up / γM2', () => {
    const { c, s } = run()
    near(c.shear.demand, 27000)
    near(c.shear.capacity, 173995.9, 1e-6)
    expectPrinted(s.shear, [27000, 2, 0.6, 314.2, 600, 1.3, 174000])
  })
  it('bearing: 1.5 t d f_y / γM0, the outer plate governs with half the force', () => {
    const { c, s } = run()
    near(c.bearing.demand, 13500)
    near(c.bearing.capacity, 30000 / 1.1, 1e-9)
    near(c.bearing.utilisation, 0.495, 1e-9)
    expect(s.bearing.note).toMatch(/outer plate \(each of two\), t = 4 mm/)
    expectPrinted(s.bearing, [13500, 1.5, 4, 20, 250, 1.1, 27270])
  })
  it('bending: M_Ed = F/8 (b + 4c + 2a), M_Rd = 1.5 W_el f_yp / γM0', () => {
    const { c, s } = run()
    near(c.bending.demand, 87750, 1e-12)
    near(c.bending.capacity, 428398.998, 1e-8)
    expectPrinted(s.bending, [27000, 8, 10, 4, 2, 2, 4, 87750, 1.5, 785.4, 400, 1.1, 428400])
  })
  it('shear and bending combined: squares of both ratios', () => {
    const { c, s } = run()
    near(c['shear-bending'].demand, 0.0660359, 1e-5)
    expect(c['shear-bending'].capacity).toBe(1)
    // printed: [M_Ed/M_Rd]^2 + [F_v,Ed/F_v,Rd]^2 with F_v,Ed = F/2 and F_v,Rd per plane
    expectPrinted(s['shear-bending'], [87750, 428400, 2, 13500, 87000, 2, 0.06604])
  })
  it('serviceability bearing: 0.6 t d f_y / γM6,ser on the service force (no load factor)', () => {
    const { c, s } = run()
    near(c['bearing-ser'].demand, 9000, 1e-12)
    near(c['bearing-ser'].capacity, 12000 / 1.05, 1e-9)
    expect(s['bearing-ser'].note).toMatch(/outer plate/)
    expectPrinted(s['bearing-ser'], [9000, 0.6, 4, 20, 250, 1.05, 11430])
  })
  it('contact stress: 0.591 √(E F (d0 − d)/(d² t)) ≤ 2.5 f_y / γM6,ser', () => {
    const { c, s } = run()
    near(c['contact-ser'].demand, 443.25, 1e-9)
    near(c['contact-ser'].capacity, 625 / 1.05, 1e-9)
    expect(s['contact-ser'].note).toMatch(/outer plate/)
    expectPrinted(s['contact-ser'], [0.591, 200000, 9000, 20.5, 20, 20, 2, 4, 443.3, 2.5, 250, 1.05, 595.2])
  })
  it('serviceability bending: 0.8 W_el f_yp / γM6,ser', () => {
    const { c, s } = run()
    near(c['bending-ser'].demand, 58500, 1e-12)
    near(c['bending-ser'].capacity, 239359.44, 1e-8)
    expectPrinted(s['bending-ser'], [58500, 0.8, 785.4, 400, 1.05, 239400])
  })
  it('every check passes here, and the governing one is the outer plate at serviceability', () => {
    const { c } = run()
    expect(Object.values(c).every((x) => x.pass)).toBe(true)
    expect(Object.values(c).filter((x) => x.governing).map((x) => x.stepId)).toEqual(['chk.pin.J.bearing-ser'])
  })
  it('clauses name Table 3.10 and the formula with its factor', () => {
    const { c } = run()
    expect(c.shear.clause).toBe(`${T310}: F_v,Rd = 0.6 A f_up / γM2 per shear plane`)
    expect(c.bearing.clause).toBe(`${T310}: F_b,Rd = 1.5 t d f_y / γM0 (f_y the lower of pin and plate)`)
    expect(c.bending.clause).toBe(`${T310}: M_Rd = 1.5 W_el f_yp / γM0; EN 1993-1-8:2005 Fig. 3.11 (fork with middle plate b, outer plates a, gaps c)`)
    expect(c['shear-bending'].clause).toBe(`${T310}: [M_Ed/M_Rd]² + [F_v,Ed/F_v,Rd]² ≤ 1`)
    const ser = 'EN 1993-1-8:2005 §3.13.2(3), Table 3.10 (replaceable pin)'
    expect(c['bearing-ser'].clause).toBe(`${ser}: F_b,Rd,ser = 0.6 t d f_y / γM6,ser`)
    expect(c['contact-ser'].clause).toBe(`${ser}: σ_h,Ed = 0.591 sqrt(E F_Ed,ser (d0 − d)/(d² t)) ≤ f_h,Rd = 2.5 f_y / γM6,ser`)
    expect(c['bending-ser'].clause).toBe(`${ser}: M_Rd,ser = 0.8 W_el f_yp / γM6,ser`)
  })
  it('the middle plate governs when the outer plates are thick enough (each carries F/2)', () => {
    // outer 8 mm: 1.5·8·20·250/1.1 = 54 545 vs 13 500 → 0.2475; middle 68 182 vs 27 000 → 0.396
    const m = pinCase(EN, { pinDiameter: 20, holeDiameter: 20.5, pinMaterial: 'Pin400', middle: { thickness: 10, material: 'Plate250' }, outer: { thickness: 8, material: 'Plate250' }, gap: 2 }, 15000, { load: 1.5, dynamic: 1.2 })
    near(m.c.bearing.demand, 27000, 1e-12)
    near(m.c.bearing.utilisation, 0.396, 1e-9)
    expect(m.s.bearing.note).toMatch(/governing plate: middle plate, t = 10 mm/)
  })
  it('fails when the pin force exceeds the governing resistance', () => {
    // serviceability bearing of the outer plate: 11 429 N at F_ser/2 → F_ser > 22 857 N, envelope > 19 048 N
    const f = pinCase(EN, { pinDiameter: 20, holeDiameter: 20.5, pinMaterial: 'Pin400', middle: { thickness: 10, material: 'Plate250' }, outer: { thickness: 4, material: 'Plate250' }, gap: 2 }, 19100, { load: 1.5, dynamic: 1.2 })
    expect(f.c['bearing-ser'].pass).toBe(false)
    expect(f.s['bearing-ser'].verdict).toBe('fail')
    expect(f.c.bearing.pass).toBe(true)
  })
})

describe('EN 1993 link: Table 3.9, §6.2 and §6.3.1 with γM0 1.1, γM1 1.15, γM2 1.3', () => {
  // Flat 60 × 10 (Bar300: fy 300, fu 450, E 210 000), eye d = 20, d0 = 21, a = 25, c = (60 − 21)/2 = 19.5;
  // L = 500, K = 0.9; T = 40 kN, C = 20 kN, M = 150 N·m; factors 1.
  //   Table 3.9 A: F γM0/(2 t fy) = 40 000·1.1/(2·10·300) = 7.3333; a_req = 7.3333 + 2·21/3 = 21.333 ≤ 25;
  //                c_req = 7.3333 + 21/3 = 14.333 ≤ 19.5
  //   N_u,Rd = 0.9·(60 − 21)·10·450/1.3 = 121 500 N
  //   N_pl,Rd = 600·300/1.1 = 163 636 N; W_el = 10·60²/6 = 6000 mm³; M_c,Rd = 6000·300/1.1 = 1 636 364 N·mm
  //   body: 40 000/163 636 + 150 000/1 636 364 = 0.24444 + 0.09167 = 0.33611
  //   buckling: i = 10/√12 = 2.8868; L_cr = 0.9·500 = 450; λ1 = π√(210 000/300) = 83.119;
  //     λ̄ = 450/(2.8868·83.119) = 1.8754; curve c: Φ = 0.5(1 + 0.49·1.6754 + 1.8754²) = 2.6691;
  //     χ = 1/(2.6691 + √(2.6691² − 1.8754²)) = 0.21890; N_b,Rd = 0.21890·600·300/1.15 = 34 262 N
  const link = { section: { shape: 'flat', width: 60, thickness: 10 }, material: 'Bar300', eye: { pinDiameter: 20, holeDiameter: 21, edgeAlong: 25 }, length: 500, effectiveLengthFactor: 0.9 }
  const run = () => linkCase(EN, link, { tension: 40000, compression: 20000, moment: 150000 })

  it('Table 3.9 type A: a and c with F γM0/(2 t f_y)', () => {
    const { c, s } = run()
    near(c['eye-end'].demand, 21.333333, 1e-6)
    expect(c['eye-end'].capacity).toBe(25)
    near(c['eye-side'].demand, 14.333333, 1e-6)
    expect(c['eye-side'].capacity).toBe(19.5)
    expectPrinted(s['eye-end'], [40000, 1.1, 2, 10, 300, 2, 21, 3, 21.33, 25])
    expectPrinted(s['eye-side'], [7.333, 21, 3, 14.33, 60, 21, 2, 19.5])
  })
  it('net section: 0.9 A_net f_u / γM2', () => {
    const { c, s } = run()
    near(c['net-tension'].capacity, 121500, 1e-9)
    expectPrinted(s['net-tension'], [40000, 0.9, 60, 21, 10, 450, 1.3, 121500])
  })
  it('body: N/N_pl,Rd + M/M_c,Rd, both with γM0 and W_el (not W_pl)', () => {
    const { c, s } = run()
    near(c['axial-bending'].demand, 0.3361111, 1e-6)
    expectPrinted(s['axial-bending'], [40000, 163600, 150000, 1.636e6, 0.3361])
  })
  it('buckling: χ A f_y / γM1, L_cr = K L on the least radius of gyration', () => {
    const { c, s } = run()
    near(c.buckling.demand, 20000, 1e-12)
    near(c.buckling.capacity, 34262.35, 1e-6)
    expectPrinted(s.buckling, [450, 2.887, 83.12, 1.875, 2.669, 0.2189, 20000, 0.2189, 600, 300, 1.15, 34260])
  })
  it('clauses', () => {
    const { c } = run()
    const t39 = 'EN 1993-1-8:2005 §3.13.1 Table 3.9'
    expect(c['eye-end'].clause).toBe(`${t39} type A: a ≥ F_Ed γM0/(2 t f_y) + 2d0/3`)
    expect(c['eye-side'].clause).toBe(`${t39} type A: c ≥ F_Ed γM0/(2 t f_y) + d0/3`)
    expect(c['net-tension'].clause).toBe('EN 1993-1-1:2005 §6.2.3(2)b: N_u,Rd = 0.9 A_net f_u / γM2')
    expect(c['axial-bending'].clause).toBe('EN 1993-1-1:2005 §6.2.1(7) linear sum with §6.2.3 N_pl,Rd and §6.2.5 M_c,Rd = W_el f_y/γM0')
    expect(c.buckling.clause).toBe('EN 1993-1-1:2005 §6.3.1.1–6.3.1.3, curve c (α = 0.49)')
  })
  it('without a moment the body check is N/N_pl,Rd alone, keyed "axial"', () => {
    const b = linkCase(EN, { ...link, eye: { ...link.eye, table39Type: 'B' } }, { tension: 40000, compression: 20000 })
    expect(b.c['axial-bending']).toBeUndefined()
    near(b.c.axial.demand, 0.2444444, 1e-6)
    expect(b.c.axial.clause).toBe('EN 1993-1-1:2005 §6.2.3(2)a / §6.2.4: N_pl,Rd = A f_y / γM0')
    expectPrinted(b.s.axial, [40000, 163600, 0, 1.636e6, 0.2444])
    // Table 3.9 type B: t ≥ 0.7 √(F γM0/f_y) = 0.7·√(40 000·1.1/300) = 0.7·12.111 = 8.4774 mm; d0 ≤ 2.5 t = 25
    near(b.c['eye-thickness'].demand, 8.477421, 1e-6)
    expect(b.c['eye-thickness'].capacity).toBe(10)
    expect(b.c['eye-hole'].demand).toBe(21)
    expect(b.c['eye-hole'].capacity).toBe(25)
    expect(b.c['eye-end']).toBeUndefined()
    expectPrinted(b.s['eye-thickness'], [0.7, 40000, 1.1, 300, 8.477, 10])
    expectPrinted(b.s['eye-hole'], [21, 2.5, 10, 25])
    expect(b.c['eye-thickness'].clause).toBe('EN 1993-1-8:2005 §3.13.1 Table 3.9 type B: t ≥ 0.7 sqrt(F_Ed γM0 / f_y)')
    expect(b.c['eye-hole'].clause).toBe('EN 1993-1-8:2005 §3.13.1 Table 3.9 type B: d0 ≤ 2.5 t')
  })
  it('Table 3.9 is sized for the larger of tension and compression', () => {
    // C = 60 kN > T = 10 kN: a_req = 60 000·1.1/6000 + 14 = 25.0 → exactly at a = 25
    const b = linkCase(EN, link, { tension: 10000, compression: 60000 })
    near(b.c['eye-end'].demand, 25, 1e-12)
    expect(b.c['eye-end'].pass).toBe(true)
    near(b.c.axial.demand, 60000 / (600 * 300 / 1.1), 1e-12)
    near(b.c['net-tension'].demand, 10000, 1e-12)
  })
})
