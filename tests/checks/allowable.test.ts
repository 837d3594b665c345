/**
 * Allowable-stress basis: plain mechanics, hand calculations below. Shear yield
 * Ssy = 0.577 Sy is the distortion-energy result (Shigley's Mechanical Engineering
 * Design, ch. 5). C45+QT and S355 values from the library ("from memory").
 */
import { describe, expect, it } from 'vitest'
import example from '@/examples/checks-allowable.json'
import { checkComponent, checksInputSchema, runChecksCli } from '@/lib/checks'

const byKey = <T extends { stepId: string }>(checks: T[]) => Object.fromEntries(checks.map((c) => [c.stepId.split('.').pop() as string, c]))

describe('allowable stress — pin (examples/checks-allowable.json)', () => {
  // d = 20 mm C45+QT (16 < d ≤ 40: fy 430), fork: middle 10 mm, outers 6 mm S355 (fy 355), c = 1, FoS 2, F = 20 kN
  //   τ = 20 000/(2·314.16) = 31.83 MPa ≤ 0.577·430/2 = 124.06 → 0.2566
  //   bearing middle: 20 000/(20·10) = 100 MPa ≤ min(430, 355)/2 = 177.5 → 0.5634 (governs)
  //   bearing outer:  10 000/(20·6) = 83.3 MPa → 0.4695
  //   M = 20 000/8·(10 + 4 + 12) = 65 000 N·mm; σ = 65 000/785.40 = 82.76 ≤ 215 → 0.3849
  it('matches the hand calculation', () => {
    const r = runChecksCli(example)
    if (!r.ok) throw new Error(JSON.stringify(r.issues))
    const c = byKey(r.result.checks)
    expect(c.shear.demand).toBeCloseTo(31.83, 2)
    expect(c.shear.capacity).toBeCloseTo(124.055, 3)
    expect(c.bearing.utilisation).toBeCloseTo(0.5634, 4)
    expect(c.bearing.governing).toBe(true)
    expect(c.bending.demand).toBeCloseTo(82.76, 2)
  })
  it('fails in bearing at 40 kN (200 MPa > 177.5 MPa)', () => {
    const r = runChecksCli({ ...example, component: { joint: 'A', force: 40000 } })
    if (!r.ok) throw new Error('unexpected')
    expect(byKey(r.result.checks).bearing.pass).toBe(false)
  })
  it('single shear: M = F (t1/2 + c + t2/2)', () => {
    const r = runChecksCli({ ...example, joints: { A: { arrangement: 'single' } } })
    if (!r.ok) throw new Error(JSON.stringify(r.issues))
    // plates default to middle/outer: M = 20 000·(5 + 1 + 3) = 180 000 N·mm; τ = 20 000/314.16 = 63.66
    const c = byKey(r.result.checks)
    expect(c.bending.demand).toBeCloseTo(180000 / 785.398, 2)
    expect(c.shear.demand).toBeCloseTo(63.66, 2)
  })
})

describe("allowable stress — link buckling, Shigley's column example (from memory, see buckling.test.ts)", () => {
  // Round d = 20 mm, l = 350 mm, Sy = 500 MPa, E = 207 GPa, n = 4, P = 22 kN:
  //   Johnson P_cr = 350.10·314.16 = 109 987 N; allowable 27 497 N → 22 000/27 497 = 0.800
  const input = checksInputSchema.parse({
    basis: { kind: 'allowable', factorOfSafety: 4 },
    materials: { Sy500: { fy: 500, fu: 600, E: 207000, source: "Shigley's column example data (from memory)" } },
    links: { R: { section: { shape: 'round', diameter: 20 }, material: 'Sy500', eye: { thickness: 20, width: 40, pinDiameter: 10, holeDiameter: 10.1 }, length: 350 } },
  })
  it('passes at 22 kN with the Johnson load', () => {
    const c = byKey(checkComponent(input, 'R', { kind: 'link', compression: 22000 }).checks)
    expect(c.buckling.capacity).toBeCloseTo(109987 / 4, -1)
    expect(c.buckling.utilisation).toBeCloseTo(0.8, 2)
    expect(c.buckling.check).toMatch(/Johnson/)
  })
  it('fails at 30 kN', () => {
    const c = byKey(checkComponent(input, 'R', { kind: 'link', compression: 30000 }).checks)
    expect(c.buckling.pass).toBe(false)
  })
})

describe('US customary input — Mott column example through the CLI', () => {
  // D = 1.25 in, L = 54 in, Sy = 51 ksi, E = 30 000 ksi, FoS 3: P_a = 12 169/3 = 4056 lb
  it('capacity comes back in lbf', () => {
    const r = runChecksCli({
      units: 'US',
      basis: { kind: 'allowable', factorOfSafety: 3 },
      materials: { SAE1020CD: { fy: 51, fu: 61, E: 30000, source: 'Mott, Machine Elements in Mechanical Design, Appendix (SAE 1020 cold drawn)' } },
      links: { C: { section: { shape: 'round', diameter: 1.25 }, material: 'SAE1020CD', eye: { thickness: 1.25, width: 2.5, pinDiameter: 0.5, holeDiameter: 0.51 }, length: 54 } },
      component: { link: 'C', compression: 4000 },
    })
    if (!r.ok) throw new Error(JSON.stringify(r.issues))
    const b = byKey(r.result.checks).buckling
    expect(b.unit).toBe('lbf')
    expect(b.capacity).toBeCloseTo(4056, -1)
  })
})
