/**
 * EN 1993-1-8:2005 §3.13 (Tables 3.9, 3.10, eq. 3.15–3.16) and EN 1993-1-1 §6.2.3,
 * §6.3.1: worked examples built from the clauses, the clause text checked against a
 * stored extract of EN 1993-1-8:2005 Table 3.10. Material values from the library
 * (C45+QT, S355) are "from memory" — see lib/checks/materials.ts.
 */
import { describe, expect, it } from 'vitest'
import example from '@/examples/checks-en1993.json'
import { checksInputSchema, checkComponent, runChecksCli } from '@/lib/checks'

const byKey = (checks: { stepId: string }[]) => Object.fromEntries(checks.map((c) => [c.stepId.split('.').pop() as string, c])) as Record<string, (typeof checks)[number] & { demand: number; capacity: number; utilisation: number; pass: boolean; governing: boolean }>

describe('EN 1993-1-8 Table 3.10 — fork pin (examples/checks-en1993.json)', () => {
  // d = 36 mm C45+QT (16 < d ≤ 40: fyp 430, fup 650); middle b = 20 mm S355 (16 < t ≤ 40: fy 345);
  // outer a = 12 mm S355 (t ≤ 16: fy 355); c = 2 mm; F = 200 kN × γ_load 1.35 = 270 kN.
  //   A = π·36²/4 = 1017.88 mm²; Fv,Rd = 0.6·1017.88·650/1.25 = 317 577 N per plane; 2 planes 635 154 N
  //   Fb,Rd (middle) = 1.5·20·36·min(430, 345)/1.0 = 372 600 N vs 270 000 → 0.7246 (governs)
  //   Fb,Rd (outer)  = 1.5·12·36·355 = 230 040 N vs 135 000 → 0.5869
  //   M_Ed = 270 000/8·(20 + 4·2 + 2·12) = 1 755 000 N·mm; Wel = π·36³/32 = 4580.44 mm³
  //   M_Rd = 1.5·4580.44·430 = 2 954 384 N·mm → 0.5940
  //   combined: 0.5940² + (135 000/317 577)² = 0.3529 + 0.1807 = 0.5336
  // Run inside each test (not while collecting), so mutation testing sees which tests cover the checks.
  const run = () => {
    const r = runChecksCli(example)
    if (!r.ok) throw new Error(JSON.stringify(r.issues))
    return byKey(r.result.checks)
  }
  it('shear, bearing, bending, combined', () => {
    const c = run()
    expect(c.shear.capacity).toBeCloseTo(635154, -1)
    expect(c.bearing.capacity).toBeCloseTo(372600, 3)
    expect(c.bearing.utilisation).toBeCloseTo(0.7246, 4)
    expect(c.bending.demand).toBeCloseTo(1755000, 3)
    expect(c.bending.capacity).toBeCloseTo(2954384, -1)
    expect(c['shear-bending'].demand).toBeCloseTo(0.5336, 3)
    expect(c.bearing.governing).toBe(true)
    expect(Object.values(c).every((x) => x.pass)).toBe(true)
  })
  it('a non-replaceable pin has no serviceability checks', () => {
    const c = run()
    expect(c['bearing-ser']).toBeUndefined()
  })
  it('fails in bearing at 300 kN × 1.35 = 405 kN > 372.6 kN', () => {
    const f = runChecksCli({ ...example, component: { joint: 'P', force: 300000 } })
    if (!f.ok) throw new Error('unexpected')
    const x = byKey(f.result.checks)
    expect(x.bearing.pass).toBe(false)
    expect(x.bearing.utilisation).toBeCloseTo(405000 / 372600, 4)
  })
})

describe('EN 1993-1-8 §3.13.2(3) — replaceable pin serviceability', () => {
  // Same joint, replaceable, F_Ed,ser = 60 kN (γ_dyn 1, no load factor), d0 − d = 1 mm:
  //   Fb,Rd,ser (middle) = 0.6·20·36·345/1.0 = 149 040 N → 60 000/149 040 = 0.4026
  //   σh (middle) = 0.591·√(210 000·60 000·1/(36²·20)) = 0.591·697.22 = 412.06 MPa; fh,Rd = 2.5·345 = 862.5 → 0.4778
  //   M_Ed,ser = 60 000/8·52 = 390 000; M_Rd,ser = 0.8·4580.44·430 = 1 575 671 → 0.2475
  const input = checksInputSchema.parse({ ...example, factors: { load: 1.35, dynamic: 1 }, joints: { P: { ...example.joints.P, replaceable: true } } })
  it('bearing, contact stress and bending at serviceability', () => {
    const c = byKey(checkComponent(input, 'P', { kind: 'joint', force: 60000 }).checks)
    expect(c['bearing-ser'].capacity).toBeCloseTo(149040, 3)
    expect(c['bearing-ser'].demand).toBeCloseTo(60000, 6)
    expect(c['contact-ser'].demand).toBeCloseTo(412.06, 1)
    expect(c['contact-ser'].capacity).toBeCloseTo(862.5, 6)
    expect(c['bending-ser'].utilisation).toBeCloseTo(0.2475, 3)
  })
  it('fails serviceability bearing at 200 kN (200 000 > 149 040)', () => {
    const c = byKey(checkComponent(input, 'P', { kind: 'joint', force: 200000 }).checks)
    expect(c['bearing-ser'].pass).toBe(false)
    expect(c['bearing-ser'].governing).toBe(true)
  })
})

describe('EN 1993-1-8 Table 3.9 and EN 1993-1-1 §6.2.3 / §6.3.1 — link', () => {
  // Flat 80 × 15 S355 (t ≤ 16: fy 355, fu 470), d0 = 31, d = 30, a = 35, L = 600, K = 1;
  // T = 100 kN, C = 50 kN, factors 1.
  //   Type A: F γM0/(2 t fy) = 100 000/(2·15·355) = 9.390; a_req = 9.390 + 2·31/3 = 30.06 ≤ 35
  //           c_req = 9.390 + 31/3 = 19.72 ≤ c = (80 − 31)/2 = 24.5
  //   N_u,Rd = 0.9·(80 − 31)·15·470/1.25 = 248 724 N
  //   λ = 600/(15/√12) = 138.56; λ1 = π√(210 000/355) = 76.41; λ̄ = 1.8134; curve c, α = 0.49:
  //   Φ = 0.5(1 + 0.49·1.6134 + 1.8134²) = 2.5395; χ = 1/(Φ + √(Φ² − λ̄²)) = 0.2316
  //   N_b,Rd = 0.2316·1200·355 = 98 670 N → 50 000/98 670 = 0.507
  const base = {
    basis: { kind: 'en1993' },
    links: { L1: { section: { shape: 'flat', width: 80, thickness: 15 }, material: 'S355', eye: { pinDiameter: 30, holeDiameter: 31, edgeAlong: 35 }, length: 600 } },
  }
  it('type A geometry, net section, buckling', () => {
    const input = checksInputSchema.parse(base)
    const c = byKey(checkComponent(input, 'L1', { kind: 'link', tension: 100000, compression: 50000 }).checks)
    expect(c['eye-end'].demand).toBeCloseTo(30.057, 2)
    expect(c['eye-side'].demand).toBeCloseTo(19.724, 2)
    expect(c['eye-side'].capacity).toBeCloseTo(24.5, 9)
    expect(c['net-tension'].capacity).toBeCloseTo(248724, 0)
    expect(c.buckling.capacity).toBeCloseTo(98670, -2)
    expect(c.buckling.utilisation).toBeCloseTo(0.507, 2)
  })
  it('type B geometry: t ≥ 0.7√(F γM0/fy) = 11.75 mm, d0 ≤ 2.5 t = 37.5 mm', () => {
    const input = checksInputSchema.parse({ ...base, links: { L1: { ...base.links.L1, eye: { ...base.links.L1.eye, table39Type: 'B' } } } })
    const c = byKey(checkComponent(input, 'L1', { kind: 'link', tension: 100000 }).checks)
    expect(c['eye-thickness'].demand).toBeCloseTo(11.75, 2)
    expect(c['eye-hole'].capacity).toBeCloseTo(37.5, 9)
  })
  it('fails buckling when the link is 1.2 m long', () => {
    const input = checksInputSchema.parse({ ...base, links: { L1: { ...base.links.L1, length: 1200 } } })
    const c = byKey(checkComponent(input, 'L1', { kind: 'link', compression: 50000 }).checks)
    expect(c.buckling.pass).toBe(false)
  })
})
