/**
 * The eye of a link checked for the pin RESULTANT in its worst direction over the stroke, on all
 * three bases, with partial factors other than 1 (so a factor that multiplies instead of divides
 * changes the result) and an eye whose end distance a is SMALLER than its side distance c (the
 * existing eye-resultant test has c < a; together they tell min(a, c) from max(a, c) and from a or c alone).
 *
 * Eye used throughout: flat 60 × 10 bar of test material Bar300 (f_y 300, f_u 450 MPa), pin d = 20,
 * hole d0 = 21, end distance a = 12 mm, side distance c = (w − d0)/2 = (60 − 21)/2 = 19.5 mm.
 *
 * Sources: EN 1993-1-8:2005 §3.13.1 Table 3.9 (type A: a ≥ F γM0/(2 t f_y) + 2d0/3, c ≥ F γM0/(2 t f_y) + d0/3;
 * type B: t ≥ 0.7 √(F γM0/f_y), d0 ≤ 2.5 t); AISC 360-16 §D5.1 Eq. D5-1 (P_n = F_u 2 t b_e, b_e = 2t + 0.63 in ≤ b),
 * Eq. D5-2 (P_n = 0.6 F_u A_sf, A_sf = 2t(a + d/2)), §J7(a) Eq. J7-1 (R_n = 1.8 F_y A_pb), φ = 0.75 / Ω = 2.00;
 * allowable stress: two shear planes of length a (common practice), Ssy = 0.577 Sy (distortion energy,
 * Shigley's Mechanical Engineering Design, ch. 5). That a force which may point across the link has to
 * be checked with the distance in the force direction, i.e. the smaller of a and c, is the reading of
 * Table 3.9 the library applies (lib/checks/bases/en1993-link.ts) — the rule "distance in the direction of
 * the force" is common practice for eyes loaded off their axis.
 */
import { describe, expect, it } from 'vitest'
import { checkComponent, checksInputSchema, runChecks } from '@/lib/checks'
import type { LoadCaseEnvelope } from '@/lib/contract'
import { HAND_MATERIALS, expectPrinted, near, type Checked, type Item, type StepLike } from './_hand'

const EN = { kind: 'en1993', gammaM0: 1.1, gammaM1: 1.15, gammaM2: 1.3, gammaM6ser: 1.05 }
const LRFD = { kind: 'aisc360', method: 'LRFD' }
const ASD = { kind: 'aisc360', method: 'ASD' }
const ALLOW = { kind: 'allowable', factorOfSafety: 2.4 }
const T39 = 'EN 1993-1-8:2005 §3.13.1 Table 3.9'

const eye = { thickness: 10, width: 60, pinDiameter: 20, holeDiameter: 21, edgeAlong: 12 }
const link = (extra: object = {}) => ({ section: { shape: 'flat', width: 60, thickness: 10 }, material: 'Bar300', eye: { ...eye, ...extra }, length: 500 })

const last = (id: string) => id.split('.').pop() as string
function index(r: { checks: Item[]; steps: StepLike[] }): Checked {
  return { c: Object.fromEntries(r.checks.map((x) => [last(x.stepId), x])), s: Object.fromEntries(r.steps.map((x) => [last(x.id), x])), all: r }
}

function run(basis: object, forces: { tension?: number; compression?: number; moment?: number; eye?: number; across?: boolean }, extra: object = {}, factors = { load: 1, dynamic: 1 }): Checked {
  const input = checksInputSchema.parse({ basis, factors, materials: HAND_MATERIALS, links: { L: link(extra) } })
  return index(checkComponent(input, 'L', { kind: 'link', ...forces }) as never)
}

describe('EN 1993-1-8 Table 3.9 for the resultant in its worst direction, γM0 = 1.1', () => {
  // F_Ed = 24 000 N (the eye force), γM0 = 1.1:
  //   F γM0/(2 t f_y) = 24 000 · 1.1/(2 · 10 · 300) = 26 400/6000 = 4.4 mm
  //   a_req = 4.4 + 2 · 21/3 = 4.4 + 14 = 18.4 mm > a = 12 → fails, u = 18.4/12 = 1.53333
  //   across: c_req = 4.4 + 14 = 18.4 ≤ c = 19.5 → u = 0.943590
  //   along:  c_req = 4.4 + 21/3 = 11.4 ≤ 19.5 → u = 0.584615
  it('type A, force across the link: c takes the 2d0/3 rule', () => {
    const { c, s } = run(EN, { tension: 10000, compression: 8000, eye: 24000, across: true })
    near(c['eye-end'].demand, 18.4, 1e-12)
    expect(c['eye-end'].capacity).toBe(12)
    expect(c['eye-end'].pass).toBe(false)
    near(c['eye-end'].utilisation, 18.4 / 12, 1e-12)
    near(c['eye-side'].demand, 18.4, 1e-12)
    near(c['eye-side'].capacity, 19.5, 1e-12)
    near(c['eye-side'].utilisation, 0.9435897, 1e-6)
    expect(c['eye-side'].pass).toBe(true)
    expectPrinted(s['eye-end'], [24000, 1.1, 2, 10, 300, 2, 21, 3, 18.4, 12])
    expectPrinted(s['eye-side'], [4.4, 2, 21, 3, 18.4, 60, 21, 2, 19.5])
    expect(c['eye-end'].clause).toBe(`${T39} type A: a ≥ F_Ed γM0/(2 t f_y) + 2d0/3`)
    expect(c['eye-side'].clause).toBe(`${T39} type A: c ≥ F_Ed γM0/(2 t f_y) + 2d0/3 (force across the link)`)
    expect(s['eye-side'].source).toBe(`${T39}, type A`)
    expect(c['eye-side'].check).toBe('Eye side distance c for the pin force in its worst direction (Table 3.9 type A)')
  })
  it('type A, force along the link: c takes the d0/3 rule', () => {
    const { c, s } = run(EN, { tension: 10000, compression: 8000, eye: 24000, across: false })
    near(c['eye-side'].demand, 11.4, 1e-12)
    near(c['eye-side'].utilisation, 0.5846154, 1e-6)
    near(c['eye-end'].demand, 18.4, 1e-12)
    expectPrinted(s['eye-side'], [4.4, 21, 3, 11.4, 60, 21, 2, 19.5])
    expect(c['eye-side'].clause).toBe(`${T39} type A: c ≥ F_Ed γM0/(2 t f_y) + d0/3`)
    expect(c['eye-side'].check).toBe('Eye side distance c (Table 3.9 type A)')
    // the working prints the d0/3 rule as such: c_req = 4.4 + 21/3
    expect(s['eye-side'].substituted).toContain('c_{req} = 4.4 + \\frac{21}{3} = 11.4')
    // a force given directly names no pin
    expect(s['eye-end'].note).toContain("the largest pin force on the link's eyes, in N;")
  })
  it('the eye is sized for the factored eye force: 20 000 × 1.35 × 1.1 = 29 700 N', () => {
    // 29 700 · 1.1/6000 = 5.445 mm; a_req = 5.445 + 14 = 19.445 mm; across c_req = 19.445 ≤ 19.5 → u = 0.997179
    const { c } = run(EN, { tension: 9000, eye: 20000, across: true }, {}, { load: 1.35, dynamic: 1.1 })
    near(c['eye-end'].demand, 19.445, 1e-12)
    near(c['eye-side'].utilisation, 19.445 / 19.5, 1e-12)
    expect(c['eye-side'].pass).toBe(true)
  })
  it('without an eye force the eye is sized for the larger axial force', () => {
    // N = max(10 000, 14 000) = 14 000: 14 000 · 1.1/6000 = 2.566667; a_req = 16.566667; c_req = 9.566667
    const { c } = run(EN, { tension: 10000, compression: 14000 })
    near(c['eye-end'].demand, 14000 * 1.1 / 6000 + 14, 1e-12)
    near(c['eye-side'].demand, 14000 * 1.1 / 6000 + 7, 1e-12)
  })
  it('type B: t ≥ 0.7 √(F γM0/f_y) for the resultant, d0 ≤ 2.5 t', () => {
    // t_req = 0.7 · √(24 000 · 1.1/300) = 0.7 · √88 = 0.7 · 9.380832 = 6.566582 mm ≤ 10 → u = 0.6566582
    // d0 = 21 ≤ 2.5 · 10 = 25 mm → met
    const { c, s } = run(EN, { tension: 10000, eye: 24000, across: true }, { table39Type: 'B' })
    near(c['eye-thickness'].demand, 6.5665822, 1e-7)
    expect(c['eye-thickness'].capacity).toBe(10)
    expectPrinted(s['eye-thickness'], [0.7, 24000, 1.1, 300, 6.567, 10])
    expect(c['eye-hole'].demand).toBe(21)
    expect(c['eye-hole'].capacity).toBe(25)
    expect(c['eye-hole'].kind).toBe('detailing')
    expect(s['eye-hole'].value).toBe('met')
    expect(c['eye-thickness'].clause).toBe(`${T39} type B: t ≥ 0.7 sqrt(F_Ed γM0 / f_y)`)
    expect(c['eye-hole'].clause).toBe(`${T39} type B: d0 ≤ 2.5 t`)
    expect(c['eye-end']).toBeUndefined()
  })
  it('type B hole rule met and printed to nearest: d0 = 21.374 ≤ 2.5 · 10 = 25 mm, shown 21.37', () => {
    const { c, s } = run(EN, { tension: 1000 }, { table39Type: 'B', holeDiameter: 21.374, pinDiameter: 21 })
    expect(c['eye-hole'].pass).toBe(true)
    expect(s['eye-hole'].substituted).toBe('21.37\\ \\text{mm} \\le 2.5 \\cdot 10 = 25\\ \\text{mm}')
  })
  it('type B hole rule not met: d0 = 27 > 2.5 · 10 = 25', () => {
    const { c, s } = run(EN, { tension: 1000 }, { table39Type: 'B', holeDiameter: 27, pinDiameter: 26 })
    expect(c['eye-hole'].pass).toBe(false)
    expect(s['eye-hole'].value).toBe('not met')
  })
})

describe('AISC 360-16 §D5.1 for the resultant in its worst direction, a < c', () => {
  // b_e = 2t + 0.63 in = 20 + 16.002 = 36.002 mm, so b_e = b (the smaller actual distance) here.
  // Across: the distance in the force direction is min(a, c) = 12: b_e = 12, A_sf = 2·10·(12 + 10) = 440 mm²
  //   D5-1: P_n = 450 · 2 · 10 · 12 = 108 000 N → φP_n = 81 000; P_n/Ω = 54 000
  //   D5-2: P_n = 0.6 · 450 · 440 = 118 800 N → φP_n = 89 100; P_n/Ω = 59 400
  // Along: b = c = 19.5 → D5-1 P_n = 450 · 20 · 19.5 = 175 500 → φP_n = 131 625; A_sf still with a = 12
  it('LRFD across: b_e and A_sf from min(a, c) = a; the demand is the eye force', () => {
    const { c, s } = run(LRFD, { tension: 10000, compression: 8000, eye: 24000, across: true })
    near(c['tensile-rupture'].capacity, 81000, 1e-12)
    expect(c['tensile-rupture'].demand).toBe(24000)
    near(c['shear-rupture'].capacity, 89100, 1e-12)
    expect(c['shear-rupture'].demand).toBe(24000)
    expectPrinted(s['tensile-rupture'], [2, 10, 16, 12, 12, 450, 2, 10, 12, 0.75, 108000, 81000, 24000, 81000])
    expectPrinted(s['shear-rupture'], [2, 10, 12, 20, 2, 440, 0.75, 118800, 89100, 24000, 89100])
    expect(c['tensile-rupture'].check).toBe('Tensile rupture of the eye for the pin force in its worst direction')
    expect(c['shear-rupture'].check).toBe('Shear rupture of the eye for the pin force in its worst direction')
    expect(s['tensile-rupture'].note).toMatch(/min\(a, c\) = 12 mm/)
  })
  it('LRFD along: b_e from c, the demand is the tension', () => {
    const { c } = run(LRFD, { tension: 10000, compression: 8000, eye: 24000, across: false })
    near(c['tensile-rupture'].capacity, 131625, 1e-12)
    expect(c['tensile-rupture'].demand).toBe(10000)
    near(c['shear-rupture'].capacity, 89100, 1e-12)
    expect(c['shear-rupture'].demand).toBe(10000)
    expect(c['tensile-rupture'].check).toBe('Tensile rupture on the net effective area')
    expect(c['shear-rupture'].check).toBe('Shear rupture of the eye end')
  })
  it('ASD across: Ω = 2.00', () => {
    const { c } = run(ASD, { tension: 10000, eye: 24000, across: true })
    near(c['tensile-rupture'].capacity, 54000, 1e-12)
    near(c['shear-rupture'].capacity, 59400, 1e-12)
    expect(c['tensile-rupture'].clause).toBe('AISC 360-16 §D5.1(a), Eq. D5-1, Ω = 2; b_e = 2t + 0.63 in (2t + 16 mm) ≤ actual')
  })
  it('§D5.2 rules keep b_e from the side distance c (they are geometry, not a force direction)', () => {
    // b_e = min(36.002, 19.5) = 19.5: a ≥ 1.33 · 19.5 = 25.935 > 12 (not met); w ≥ 2 · 19.5 + 20 = 59 ≤ 60 (met)
    const { c } = run(LRFD, { tension: 10000, eye: 24000, across: true })
    near(c['d52-extension'].demand, 25.935, 1e-12)
    expect(c['d52-extension'].pass).toBe(false)
    near(c['d52-width'].demand, 59, 1e-12)
    expect(c['d52-width'].pass).toBe(true)
  })
})

describe('AISC 360-16 §J7 bearing of the eye: the larger of the axial force and the eye resultant', () => {
  // R_n = 1.8 F_y d t = 1.8 · 300 · 20 · 10 = 108 000 N → φR_n = 0.75 · 108 000 = 81 000 N; R_n/Ω = 54 000 N
  it('eye resultant larger than the axial force: the resultant bears', () => {
    const { c, s } = run(LRFD, { tension: 10000, compression: 8000, eye: 24000, across: true })
    expect(c.bearing.demand).toBe(24000)
    near(c.bearing.capacity, 81000, 1e-12)
    expectPrinted(s.bearing, [1.8, 300, 20, 10, 0.75, 108000, 81000, 24000, 81000])
    expect(s.bearing.note).toMatch(/the resultant pin force on the eye, in any direction/)
  })
  it('axial force larger than the given eye force: the axial force bears (max, not min)', () => {
    const { c } = run(ASD, { tension: 30000, compression: 8000, eye: 5000 })
    expect(c.bearing.demand).toBe(30000)
    near(c.bearing.capacity, 54000, 1e-12)
    near(c.bearing.utilisation, 30000 / 54000, 1e-12)
  })
  it('compression larger than tension and no eye force: the compression bears', () => {
    const { c } = run(ASD, { tension: 3000, compression: 41000 })
    expect(c.bearing.demand).toBe(41000)
  })
})

describe('allowable stress tear-out toward the nearer edge, n_s = 2.4', () => {
  // τ_allow = 0.577 · 300/2.4 = 72.125 MPa
  //   across: τ = 24 000/(2 · min(12, 19.5) · 10) = 24 000/240 = 100 MPa > 72.125 → fails, u = 1.386482
  //   along:  τ = T/(2 a t) = 10 000/240 = 41.667 MPa
  it('across the link: the eye force on min(a, c) = a', () => {
    const { c, s } = run(ALLOW, { tension: 10000, compression: 8000, eye: 24000, across: true })
    near(c['tear-out'].demand, 100, 1e-12)
    near(c['tear-out'].capacity, 72.125, 1e-12)
    expect(c['tear-out'].pass).toBe(false)
    expectPrinted(s['tear-out'], [24000, 2, 12, 10, 100, 0.577, 300, 2.4, 72.12])
    expect(c['tear-out'].check).toBe('Shear tear-out of the eye for the pin force in its worst direction')
    expect(s['tear-out'].note).toMatch(/min\(a, c\) = 12 mm/)
  })
  it('along the link: the tension on a', () => {
    const { c } = run(ALLOW, { tension: 10000, compression: 8000, eye: 24000, across: false })
    near(c['tear-out'].demand, 10000 / 240, 1e-12)
    expect(c['tear-out'].check).toBe('Shear tear-out of the eye end')
  })
  it('c < a across: the side distance governs (w = 40: c = (40 − 21)/2 = 9.5; τ = 24 000/(2 · 9.5 · 10) = 126.32)', () => {
    const { c } = run(ALLOW, { tension: 10000, eye: 24000, across: true }, { width: 40 })
    near(c['tear-out'].demand, 24000 / 190, 1e-12)
  })
})

describe('the worst direction from the envelopes (runChecks)', () => {
  // One load case, link L: largest tension 10 kN at 30°, compression 8 kN at 200°, largest eye force 24 kN at
  // 95° at pin B with a component across the link. Design factors 1.35 × 1.1 = 1.485.
  const env = (eye: number, across: number): LoadCaseEnvelope[] => [
    {
      loadCase: 'LC1',
      slug: 'lc1',
      links: { L: { length: 500, maxTension: { value: 10000, crankDeg: 30 }, maxCompression: { value: -8000, crankDeg: 200 } } },
      pins: {},
      eyes: { L: { value: eye, crankDeg: 95, joint: 'B', across } },
      driveTorque: { value: 0, crankDeg: 0 },
    },
  ]
  const go = (basis: object, e: number, across: number) =>
    index(runChecks(checksInputSchema.parse({ basis, factors: { load: 1.35, dynamic: 1.1 }, materials: HAND_MATERIALS, links: { L: link() } }), env(e, across)) as never)

  it('AISC bearing and D5.1 are governed by the eye force at 95°, factored: 24 000 · 1.485 = 35 640 N', () => {
    const { c } = go(LRFD, 24000, 5000)
    near(c.bearing.demand, 35640, 1e-12)
    expect(c.bearing.crankDeg).toBe(95)
    expect(c.bearing.loadCase).toBe('LC1')
    near(c['tensile-rupture'].demand, 35640, 1e-12)
    near(c['tensile-rupture'].capacity, 81000, 1e-12) // across: b_e = min(a, c) = 12
    expect(c['tensile-rupture'].crankDeg).toBe(95)
    // the gross section is still governed by the tension at 30°
    expect(c['gross-yielding'].crankDeg).toBe(30)
  })
  it('an eye force below the axial force: bearing governed by the tension at 30°', () => {
    // the eye force 9 000 < tension 10 000: the eye demand falls back to the axial force, along the link
    const { c } = go(LRFD, 9000, 0)
    near(c.bearing.demand, 14850, 1e-12)
    expect(c.bearing.crankDeg).toBe(30)
    near(c['tensile-rupture'].capacity, 131625, 1e-12) // along: b = c = 19.5
  })
  it('EN: across from the envelope makes c take the 2d0/3 rule (F = 35 640 N, γM0 1.1)', () => {
    // 35 640 · 1.1/6000 = 6.534; c_req = 6.534 + 14 = 20.534 > 19.5 → fails, u = 1.053026
    const { c, s } = go(EN, 24000, 5000)
    expect(s['eye-end'].note).toContain("the largest pin force on the link's eyes (largest at pin B), in N")
    near(c['eye-side'].demand, 20.534, 1e-12)
    expect(c['eye-side'].pass).toBe(false)
    expect(c['eye-side'].crankDeg).toBe(95)
    // a force that never turns across (across = 0) keeps the d0/3 rule: 6.534 + 7 = 13.534
    near(go(EN, 24000, 0).c['eye-side'].demand, 13.534, 1e-12)
  })
})
